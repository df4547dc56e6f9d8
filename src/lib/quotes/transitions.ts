/**
 * Which state a quote may move to from which. Every move goes through this
 * table (sending, withdrawal by a newer quote, acceptance, expiry, the paid deposit), so no path sets a
 * state that the product does not know how to leave (a decline ends a quote). Browser-safe.
 */
import type { QuoteState } from '../platform/db/schema';

const QUOTE_MOVES: Record<QuoteState, readonly QuoteState[]> = {
  draft: ['sent'],
  sent: ['accepted', 'declined', 'expired', 'withdrawn'],
  // An acceptance whose deposit never came lapses with the quote's validity, so the brief can be quoted afresh.
  accepted: ['deposit-paid', 'expired'],
  'deposit-paid': [],
  declined: [],
  expired: [],
  withdrawn: [],
};

export function canMoveQuote(from: QuoteState, to: QuoteState): boolean {
  return QUOTE_MOVES[from].includes(to);
}
