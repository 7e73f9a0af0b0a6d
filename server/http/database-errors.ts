/**
 * Errors that mean "the database is not answering" rather than "this request is wrong": the server
 * refusing or dropping connections (a restart, an administrator ending sessions, a network fault) or
 * a connection that could not be made in time. Drizzle wraps the driver's error, so the whole cause
 * chain is searched.
 */
const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'EAI_AGAIN', 'EHOSTUNREACH', 'ENETUNREACH']);
/** SQLSTATE class 08 (connection exception), 57P01–57P03 (shut down, crash, cannot connect now), 53300 (too many connections). */
const SQLSTATE = /^(08\d{3}|57P0[123]|53300)$/;
const MESSAGES = [
  /Connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /Client has encountered a connection error/i,
  /Connection refused/i,
  /the database system is (starting up|shutting down|in recovery mode)/i,
  /terminating connection/i,
];

export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as { code?: unknown; message?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 5; e = e.cause as typeof e, depth++) {
    const code = typeof e.code === 'string' ? e.code : '';
    if (NETWORK_CODES.has(code) || SQLSTATE.test(code)) return true;
    if (typeof e.message === 'string' && MESSAGES.some((m) => m.test(e!.message as string))) return true;
    if (Array.isArray((e as { errors?: unknown[] }).errors) && (e as { errors: unknown[] }).errors.some(isDatabaseUnavailable)) return true;
  }
  return false;
}

/** Seconds a client should wait before trying again while the database is away. */
export const RETRY_AFTER_SECONDS = 5;
