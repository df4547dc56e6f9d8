import { sql } from 'drizzle-orm';
import type { Database } from '../db/connect';

export interface RateRule {
  /** Most requests allowed in one window. */
  max: number;
  windowMs: number;
}

export type RateVerdict = { allowed: true } | { allowed: false; retryAfterSeconds: number };

/**
 * Fixed-window counter in the database, so every app instance behind a proxy
 * shares one count. One atomic upsert per call: no read-then-write race.
 */
export async function consumeRate(db: Database, key: string, rule: RateRule, now = Date.now()): Promise<RateVerdict> {
  const windowStart = now - (now % rule.windowMs);
  const rows = await db.all<{ count: number; window_start: number }>(sql`
    INSERT INTO rate_limit (key, window_start, count) VALUES (${key}, ${windowStart}, 1)
    ON CONFLICT (key) DO UPDATE SET
      count = CASE WHEN rate_limit.window_start < ${windowStart} THEN 1 ELSE rate_limit.count + 1 END,
      window_start = CASE WHEN rate_limit.window_start < ${windowStart} THEN ${windowStart} ELSE rate_limit.window_start END
    RETURNING count, window_start`);
  const row = rows[0];
  if (!row || row.count <= rule.max) return { allowed: true };
  return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil((row.window_start + rule.windowMs - now) / 1000)) };
}

/**
 * Gives back one counted call of the window `now` falls in (a sign-in that
 * turned out correct), so only misses use up the limit.
 */
export async function refundRate(db: Database, key: string, rule: RateRule, now: number): Promise<void> {
  const windowStart = now - (now % rule.windowMs);
  await db.run(sql`UPDATE rate_limit SET count = count - 1 WHERE key = ${key} AND window_start = ${windowStart} AND count > 0`);
}

/** One account's key whatever case or spaces the e-mail was typed with. */
export const accountKey = (email: string) => email.trim().toLowerCase();

/** The stricter of two verdicts: refused if either refuses, with the longer wait. */
export function stricter(a: RateVerdict, b: RateVerdict): RateVerdict {
  if (a.allowed) return b;
  if (b.allowed) return a;
  return { allowed: false, retryAfterSeconds: Math.max(a.retryAfterSeconds, b.retryAfterSeconds) };
}

export const RATE_RULES = {
  /** Failed sign-ins per e-mail, from any address: enough for typing mistakes, too few for guessing. */
  signInPerAccount: { max: 8, windowMs: 10 * 60_000 },
  /** Failed sign-ins per address across all e-mails: stops one machine trying many accounts. */
  signInPerAddress: { max: 40, windowMs: 10 * 60_000 },
  /** Generous enough for a wizard re-ranking as someone types; stops a script hammering the engine. */
  evaluatePerAddress: { max: 600, windowMs: 60_000 },
  /** New accounts per address: an office signs up its people, a script filling the table is stopped. */
  signUpPerAddress: { max: 50, windowMs: 60 * 60_000 },
  /** Reset e-mails per e-mail address: a lost first message can be asked for again, an inbox is not flooded. */
  resetPerAccount: { max: 3, windowMs: 60 * 60_000 },
  /** Reset requests per address across all e-mails. */
  resetPerAddress: { max: 20, windowMs: 60 * 60_000 },
} satisfies Record<string, RateRule>;
