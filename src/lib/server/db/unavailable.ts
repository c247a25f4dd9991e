/**
 * Recognises a failure that means "the database cannot be reached right now" (refused or lost
 * connection, server shutting down or starting up, connection timeout), as opposed to a bug or bad
 * data. Such failures are an outage: answered 503 with Retry-After, never a crash. Pure: no pool here,
 * so the HTTP edge can use it without opening connections.
 */

/** Seconds a client is asked to wait before trying again while the database is away. */
export const RETRY_AFTER_SECONDS = 5;

/** Socket-level codes of a connection that could not be made or was lost. */
const SOCKET_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ECONNABORTED",
  "EPIPE",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "ENOTFOUND",
  "EAI_AGAIN",
]);

/**
 * PostgreSQL SQLSTATEs: class 08 (connection exception), 57P01 admin shutdown, 57P02 crash shutdown,
 * 57P03 cannot connect now (starting up or shutting down), 53300 too many connections.
 */
const SQLSTATE = /^(08[0-9A-Z]{3}|57P0[123]|53300)$/;

/** Messages node-postgres and pg-pool use for lost or impossible connections (they carry no code). */
const MESSAGES = [
  /connection terminated/i,
  /timeout exceeded when trying to connect/i,
  /client has encountered a connection error/i,
  /the database system is (shutting down|starting up|in recovery mode)/i,
  /terminating connection due to/i,
  /query read timeout/i,
];

export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (depth > 6 || !err || typeof err !== "object") return false;
  const e = err as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
  if (typeof e.code === "string" && (SOCKET_CODES.has(e.code) || SQLSTATE.test(e.code))) return true;
  if (typeof e.message === "string" && MESSAGES.some((m) => m.test(e.message as string))) return true;
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}
