// Telling "PostgreSQL cannot be reached right now" apart from every other error, so requests are answered 503, not 500.
/** SQLSTATEs of a server shutting down, starting up or gone, and of connections it dropped. */
const unavailableStates = new Set(['57P01', '57P02', '57P03', '08000', '08001', '08003', '08004', '08006']);
const unreachableCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND']);
const unavailableMessages = [
  'Connection terminated',
  'Query read timeout',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error and is not queryable',
  'Timeout acquiring a connection',
];

export function databaseUnavailable(error: unknown, depth = 0): boolean {
  if (!error || typeof error !== 'object' || depth > 4) return false;
  const { code, name, message, errors, cause } = error as {
    code?: string;
    name?: string;
    message?: string;
    errors?: unknown[];
    cause?: unknown;
  };
  if (name === 'KnexTimeoutError') return true;
  if (code && (unavailableStates.has(code) || unreachableCodes.has(code))) return true;
  if (message && unavailableMessages.some((m) => message.includes(m))) return true;
  // A refused connection to a name with several addresses arrives as an AggregateError; wrappers keep the cause.
  if (Array.isArray(errors) && errors.some((e) => databaseUnavailable(e, depth + 1))) return true;
  return databaseUnavailable(cause, depth + 1);
}
