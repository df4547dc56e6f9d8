/**
 * Which state a payment may move to from which: a pending checkout ends paid,
 * failed or expired, and a paid one can be refunded. A late "expired"
 * from the provider can therefore never undo a payment, while a checkout we
 * stopped waiting for that the provider then confirms as paid still counts.
 * Money taken on a checkout that cannot count (its quote's deposit is paid
 * already, or the acceptance lapsed) is given straight back: pending or
 * expired → refunded, never passing through paid. Browser-safe.
 */
import type { PaymentState } from '../platform/db/schema';

const PAYMENT_MOVES: Record<PaymentState, readonly PaymentState[]> = {
  pending: ['paid', 'failed', 'expired', 'refunded'],
  paid: ['refunded'],
  failed: [],
  expired: ['paid', 'refunded'],
  refunded: [],
};

export function canMovePayment(from: PaymentState, to: PaymentState): boolean {
  return PAYMENT_MOVES[from].includes(to);
}
