/**
 * What a client still owes on a quote: its total less what they have paid towards it, the deposit
 * and, once the balance invoice is paid, the balance. A quote nobody is bound
 * by (a draft, an offer not yet taken, one declined, expired or withdrawn) has no balance. Every
 * list and page that shows a balance reads it from here.
 */
import type { QuoteState } from '../platform/db/schema';

export interface AmountsPaid {
  state: QuoteState;
  totalMinor: number;
  /** The deposit actually received (0 until it is paid), not the deposit asked for. */
  depositPaidMinor: number;
  /** The balance payment received against the invoice (0 until it is paid). */
  balancePaidMinor?: number;
}

const UNBOUND: ReadonlySet<QuoteState> = new Set(['draft', 'sent', 'declined', 'expired', 'withdrawn']);

/** The balance in minor units, or null when the quote binds no one to pay anything. */
export function balanceDue({ state, totalMinor, depositPaidMinor, balancePaidMinor = 0 }: AmountsPaid): number | null {
  if (UNBOUND.has(state)) return null;
  return Math.max(0, totalMinor - depositPaidMinor - balancePaidMinor);
}
