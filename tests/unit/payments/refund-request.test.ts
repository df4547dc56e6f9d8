import { describe, expect, test } from 'vitest';
import { refundFormSchema, refundRequestSchema } from '../../../src/lib/payments/refund-request';

describe('a staff refund request', () => {
  test('needs a reason, trimmed, under 500 characters', () => {
    expect(refundRequestSchema.parse({ reason: '  Work stopped  ' })).toEqual({ reason: 'Work stopped' });
    expect(refundRequestSchema.safeParse({ reason: '   ' }).success).toBe(false);
    expect(refundRequestSchema.safeParse({}).success).toBe(false);
    expect(refundRequestSchema.safeParse({ reason: 'x'.repeat(501) }).success).toBe(false);
  });

  test('the desk form also needs the deliberate tick, and says so on the confirm field', () => {
    const unticked = refundFormSchema.safeParse({ intent: 'refund', paymentId: 'p1', reason: 'Work stopped' });
    expect(unticked.success).toBe(false);
    expect(unticked.error?.issues[0]?.path).toEqual(['confirm']);
    expect(unticked.error?.issues[0]?.message).toContain('Tick “Yes, refund”');
    expect(refundFormSchema.safeParse({ intent: 'refund', paymentId: 'p1', reason: 'Work stopped', confirm: 'yes' }).success).toBe(true);
  });
});
