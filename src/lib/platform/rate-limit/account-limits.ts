import { config } from '../config';
import { db } from '../db';
import { accountKey, consumeRate, RATE_RULES, stricter, type RateVerdict } from './limiter';

const ALLOWED: RateVerdict = { allowed: true };

/** Counts an account creation from this address. */
export function limitSignUp(address: string): Promise<RateVerdict> {
  if (config.rateLimitDisabled) return Promise.resolve(ALLOWED);
  return consumeRate(db, `sign-up:ip:${address}`, RATE_RULES.signUpPerAddress);
}

/** Counts a reset request for this e-mail (whether or not it has an account) and from this address. */
export async function limitPasswordReset(address: string, email: string): Promise<RateVerdict> {
  if (config.rateLimitDisabled) return ALLOWED;
  const perAddress = await consumeRate(db, `reset:ip:${address}`, RATE_RULES.resetPerAddress);
  const perAccount = await consumeRate(db, `reset:account:${accountKey(email)}`, RATE_RULES.resetPerAccount);
  return stricter(perAddress, perAccount);
}
