import type { PaymentIntent, Refund, SessionRecord } from './objects.ts';

/** Everything the stand-in knows, in memory: a restart starts from nothing, like a fresh test account. */
export class FakeState {
  readonly sessions = new Map<string, SessionRecord>();
  readonly paymentIntents = new Map<string, PaymentIntent>();
  readonly refunds = new Map<string, Refund>();

  refundedAmount(paymentIntentId: string): number {
    let total = 0;
    for (const refund of this.refunds.values()) {
      if (refund.payment_intent === paymentIntentId) total += refund.amount;
    }
    return total;
  }
}
