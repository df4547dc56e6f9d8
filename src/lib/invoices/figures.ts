/**
 * The balance invoice's arithmetic and its number. Pure and browser-safe: all
 * money is integer minor units, rounded once where the quote rounds it.
 */
import { quoteTotals, type QuoteLineInput } from '~/lib/quotes';

export interface InvoiceFigures {
  netMinor: number;
  taxMinor: number;
  grossMinor: number;
  depositPaidMinor: number;
  /** What is left to pay: the gross less the deposit already paid, never below nothing. */
  balanceMinor: number;
}

/**
 * Net from the lines, tax at the agreed rate on the net (rounded half away from
 * zero, as on the quote), gross, and the deposit already paid deducted.
 */
export function invoiceFigures(
  lines: readonly Pick<QuoteLineInput, 'quantityMilli' | 'unitPriceMinor'>[],
  taxRateBp: number,
  depositPaidMinor: number,
): InvoiceFigures {
  const { subtotalMinor, taxMinor, totalMinor } = quoteTotals(lines, taxRateBp, 0);
  return {
    netMinor: subtotalMinor,
    taxMinor,
    grossMinor: totalMinor,
    depositPaidMinor,
    balanceMinor: Math.max(0, totalMinor - depositPaidMinor),
  };
}

/** Invoices are numbered per year in a sequence of their own, apart from quotes: INV-2026-0001. */
export function formatInvoiceNumber(year: number, sequence: number): string {
  return `INV-${year}-${String(sequence).padStart(4, '0')}`;
}

/** The PDF's file name, in downloads and e-mail attachments alike. */
export function invoicePdfName(number: string): string {
  return `Railwright-invoice-${number}.pdf`;
}
