/** Where to go after signing in: only a path inside this app (never "//elsewhere" or a full URL). */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next.startsWith('/sign-in') || next.startsWith('/set-password')) return '/';
  return next;
}
