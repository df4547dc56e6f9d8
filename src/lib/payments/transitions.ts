/**
 * Which state a payment may move to from which: a pending checkout ends paid,
 * failed or expired, and only a paid one can be refunded. A late "expired"
 * from the provider can therefore never undo a payment, while a checkout we
 * stopped waiting for that the provider then confirms as paid still counts.
 * Browser-safe.
 */
import type { PaymentState } from '../platform/db/schema';

const PAYMENT_MOVES: Record<PaymentState, readonly PaymentState[]> = {
  pending: ['paid', 'failed', 'expired'],
  paid: ['refunded'],
  failed: [],
  expired: ['paid'],
  refunded: [],
};

export function canMovePayment(from: PaymentState, to: PaymentState): boolean {
  return PAYMENT_MOVES[from].includes(to);
}
