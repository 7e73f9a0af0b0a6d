/**
 * The server's log lines. Row data and SQL parameters never reach the log: an error is described by
 * its class, PostgreSQL code, table and constraint and the first line of its message with quoted
 * values replaced. Repeated failures of one kind (a database that is away, polled every half second)
 * are written once per 30 s.
 */
const lastLogged = new Map<string, number>();

export function logFailure(where: string, err: unknown, everyMs = 30_000): void {
  const now = Date.now();
  if (everyMs > 0 && now - (lastLogged.get(where) ?? -Infinity) < everyMs) return;
  lastLogged.set(where, now);
  console.error(`[parallax] ${where} failed: ${describeForLog(err)}`);
}

/**
 * A line for the server log that names what failed without the data: no SQL parameters, no row
 * values, no key values from a constraint's detail. The PostgreSQL error code, the constraint and the
 * table, and the first line of the message with quoted values replaced, are enough to find the cause.
 */
export function describeForLog(err: unknown): string {
  const parts: string[] = [];
  for (let e = err as Record<string, unknown> | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
    const name = (e.constructor as { name?: string } | undefined)?.name ?? 'Error';
    const message = typeof e.message === 'string' ? safeMessage(e.message) : '';
    const where = ['code', 'table', 'column', 'constraint', 'routine'].filter((k) => typeof e![k] === 'string').map((k) => `${k}=${e![k]}`);
    parts.push([name, message, ...where].filter(Boolean).join(' '));
  }
  // Only the frames: the stack's first lines repeat the message, parameters included.
  const stack = (err as { stack?: string } | undefined)?.stack?.split('\n').map((l) => l.trim()).filter((l) => l.startsWith('at ')).slice(0, 3).join(' | ');
  return parts.join(' <- ') + (stack ? ` @ ${stack}` : '');
}

function safeMessage(message: string): string {
  const first = message.split('\n')[0];
  // Drizzle: "Failed query: <sql>\nparams: …": the statement refers to values as $1, $2; the parameters line is dropped.
  if (first.startsWith('Failed query:')) return first.replace(/'[^']*'/g, "'…'").slice(0, 300);
  // The driver's own messages quote the offending value ('invalid input syntax …: "abc"', 'Key (email)=(…)').
  return first.replace(/"[^"]*"/g, '"…"').replace(/'[^']*'/g, "'…'").replace(/=\(.*?\)/g, '=(…)').slice(0, 300);
}
