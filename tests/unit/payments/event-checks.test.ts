import type Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { matchesPayment, readableEvent, sessionReport, signedInFuture, SIGNATURE_TOLERANCE_S } from '~/lib/payments/event-checks';

const NOW_MS = Date.UTC(2026, 11, 3, 12, 0, 0);
const nowS = NOW_MS / 1000;

describe('the signature time', () => {
  it('refuses a timestamp further ahead of our clock than the tolerance, and allows ordinary skew', () => {
    expect(signedInFuture(`t=${nowS + SIGNATURE_TOLERANCE_S + 1},v1=ab`, NOW_MS)).toBe(true);
    expect(signedInFuture(`t=${nowS + 3600},v1=ab,v0=cd`, NOW_MS)).toBe(true);
    expect(signedInFuture(`t=${nowS + 30},v1=ab`, NOW_MS)).toBe(false);
    expect(signedInFuture(`t=${nowS - 3600},v1=ab`, NOW_MS)).toBe(false);
    // No timestamp at all is the SDK's to refuse, as a header that does not verify.
    expect(signedInFuture('v1=ab', NOW_MS)).toBe(false);
  });
});

describe('the event shape', () => {
  const event = (fields: object) => fields as Stripe.Event;

  it('takes an event with its id, type and data object', () => {
    expect(readableEvent(event({ id: 'evt_1', type: 'checkout.session.completed', data: { object: { id: 'cs_1' } } })).ok).toBe(true);
  });

  it('refuses a signed event without id or data as invalid input, not a server fault', () => {
    for (const broken of [
      { type: 'checkout.session.completed', data: { object: { id: 'cs_1' } } },
      { id: 'evt_1', type: 'checkout.session.completed' },
      { id: 'evt_1', type: 'checkout.session.completed', data: {} },
      { id: 'evt_1', type: 'checkout.session.completed', data: { object: null } },
      { id: '', type: 'x', data: { object: { id: 'cs_1' } } },
    ]) {
      const read = readableEvent(event(broken));
      expect(read.ok).toBe(false);
      if (!read.ok) expect(read.kind).toBe('invalid');
    }
  });
});

describe('a paid session against the stored payment', () => {
  const session = (fields: object) => ({ id: 'cs_1', object: 'checkout.session', ...fields }) as Stripe.Checkout.Session;
  const stored = { amountMinor: 36_000, currency: 'GBP' };

  it('matches only the same amount and currency (currency in either case)', () => {
    const report = sessionReport(session({ payment_status: 'paid', amount_total: 36_000, currency: 'gbp', payment_intent: 'pi_1' }));
    expect(report).toEqual({ id: 'cs_1', paid: true, amountMinor: 36_000, currency: 'gbp', paymentIntentId: 'pi_1' });
    expect(matchesPayment(report, stored)).toBe(true);
    expect(matchesPayment({ ...report, amountMinor: 100 }, stored)).toBe(false);
    expect(matchesPayment({ ...report, currency: 'usd' }, stored)).toBe(false);
    expect(matchesPayment({ ...report, amountMinor: null, currency: null }, stored)).toBe(false);
  });

  it('counts a session as paid when its payment intent succeeded, even before the session says so', () => {
    const report = sessionReport(
      session({
        payment_status: 'unpaid',
        status: 'open',
        amount_total: 1,
        currency: 'gbp',
        payment_intent: { id: 'pi_2', status: 'succeeded' },
      }),
    );
    expect(report.paid).toBe(true);
    expect(report.paymentIntentId).toBe('pi_2');
    expect(sessionReport(session({ payment_status: 'unpaid', payment_intent: null })).paid).toBe(false);
  });
});
