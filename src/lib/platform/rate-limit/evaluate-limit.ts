import { config } from '../config';
import { db } from '../db';
import { consumeRate, RATE_RULES, type RateVerdict } from './limiter';

export function limitEvaluate(address: string): Promise<RateVerdict> {
  if (config.rateLimitDisabled) return Promise.resolve({ allowed: true });
  return consumeRate(db, `evaluate:${address}`, RATE_RULES.evaluatePerAddress);
}
