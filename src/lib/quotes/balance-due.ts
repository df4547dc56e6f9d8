/**
 * What a client still owes on a quote: its total less what they have paid towards it. Until a
 * balance invoice exists the only payment towards a quote is its deposit. Every list and page
 * that shows a balance reads it from here. Browser-safe.
 */
export interface AmountsPaid {
  totalMinor: number;
  /** The deposit actually received (0 until it is paid), not the deposit asked for. */
  depositPaidMinor: number;
}

export function balanceDue({ totalMinor, depositPaidMinor }: AmountsPaid): number {
  return Math.max(0, totalMinor - depositPaidMinor);
}
