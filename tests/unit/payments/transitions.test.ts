import { describe, expect, it } from 'vitest';
import { canMovePayment } from '~/lib/payments';
import { canMoveQuote } from '~/lib/quotes';
import { canMove } from '~/lib/briefs';

describe('payment moves', () => {
  it('a late "expired" never undoes a paid payment', () => {
    expect(canMovePayment('paid', 'expired')).toBe(false);
    expect(canMovePayment('pending', 'expired')).toBe(true);
  });

  it('a checkout we stopped waiting for still counts once the provider confirms it paid', () => {
    expect(canMovePayment('expired', 'paid')).toBe(true);
  });

  it('a paid payment can be refunded, and money taken on a checkout that cannot count goes straight back', () => {
    expect(canMovePayment('paid', 'refunded')).toBe(true);
    expect(canMovePayment('pending', 'refunded')).toBe(true);
    expect(canMovePayment('expired', 'refunded')).toBe(true);
    expect(canMovePayment('failed', 'refunded')).toBe(false);
    expect(canMovePayment('refunded', 'paid')).toBe(false);
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
  });

  it('an acceptance whose deposit never came lapses, and its brief goes back to review for a fresh quote', () => {
    expect(canMoveQuote('accepted', 'expired')).toBe(true);
    expect(canMoveQuote('deposit-paid', 'expired')).toBe(false);
    expect(canMove('accepted', 'in-review', 'system')).toBe(true);
    expect(canMove('accepted', 'in-review', 'owner')).toBe(false);
    expect(canMove('deposit-paid', 'in-review', 'system')).toBe(false);
  });

  it('only a sent quote is withdrawn (by a newer one), and a withdrawn quote goes nowhere', () => {
    expect(canMoveQuote('sent', 'withdrawn')).toBe(true);
    expect(canMoveQuote('accepted', 'withdrawn')).toBe(false);
    expect(canMoveQuote('withdrawn', 'accepted')).toBe(false);
    expect(canMoveQuote('withdrawn', 'sent')).toBe(false);
  });
});
