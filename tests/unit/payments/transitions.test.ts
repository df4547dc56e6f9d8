import { describe, expect, it } from 'vitest';
import { canMovePayment } from '~/lib/payments';
import { canMoveQuote } from '~/lib/quotes';

describe('payment moves', () => {
  it('a late "expired" never undoes a paid payment', () => {
    expect(canMovePayment('paid', 'expired')).toBe(false);
    expect(canMovePayment('pending', 'expired')).toBe(true);
  });

  it('a checkout we stopped waiting for still counts once the provider confirms it paid', () => {
    expect(canMovePayment('expired', 'paid')).toBe(true);
  });

  it('only a paid payment is refunded', () => {
    expect(canMovePayment('paid', 'refunded')).toBe(true);
    expect(canMovePayment('pending', 'refunded')).toBe(false);
  });
});

describe('quote moves', () => {
  it('a deposit is paid only on an accepted quote', () => {
    expect(canMoveQuote('accepted', 'deposit-paid')).toBe(true);
    expect(canMoveQuote('sent', 'deposit-paid')).toBe(false);
    expect(canMoveQuote('expired', 'deposit-paid')).toBe(false);
  });

  it('only a sent quote is accepted or lapses', () => {
    expect(canMoveQuote('sent', 'accepted')).toBe(true);
    expect(canMoveQuote('sent', 'expired')).toBe(true);
    expect(canMoveQuote('draft', 'accepted')).toBe(false);
    expect(canMoveQuote('accepted', 'expired')).toBe(false);
  });

  it('only a sent quote is withdrawn (by a newer one), and a withdrawn quote goes nowhere', () => {
    expect(canMoveQuote('sent', 'withdrawn')).toBe(true);
    expect(canMoveQuote('accepted', 'withdrawn')).toBe(false);
    expect(canMoveQuote('withdrawn', 'accepted')).toBe(false);
    expect(canMoveQuote('withdrawn', 'sent')).toBe(false);
  });
});
