import pino from 'pino';

/** Structured server logs (one JSON object a line) for whatever collects the process's output. */
export const log = pino({ base: { app: 'railwright' }, level: process.env.LOG_LEVEL ?? 'info' });

/** A short reference a person can quote; the same id is in the log line with the details. */
export function newErrorId(): string {
  return crypto.randomUUID().slice(0, 8);
}

/** Logs an unexpected failure and returns its reference. */
export function logFailure(error: unknown, context: Record<string, unknown>): string {
  const errorId = newErrorId();
  log.error({ err: error, errorId, ...context }, 'request failed');
  return errorId;
}
