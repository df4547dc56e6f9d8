/** An invoice read once for every place that shows it: the PDF, the e-mail, the quote pages and the API. */
import { and, eq, inArray, type SQL } from 'drizzle-orm';
import { quoteLines } from '~/lib/quotes/index.server';
import { db } from '../platform/db';
import type { DbOrTx } from '../platform/db/connect';
import { brief, clientProfile, invoice, quote, user, type InvoiceRow, type QuoteLineRow, type QuoteRow } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';

export type { InvoiceRow };

export interface InvoiceView {
  invoice: InvoiceRow;
  quote: QuoteRow;
  lines: QuoteLineRow[];
  brief: { id: string; title: string; ownerId: string };
  client: { name: string; email: string; company: string | null };
}

async function viewWhere(tx: DbOrTx, where: SQL): Promise<InvoiceView | null> {
  const [row] = await tx
    .select({
      invoice,
      quote,
      brief: { id: brief.id, title: brief.title, ownerId: brief.ownerId },
      client: { name: user.name, email: user.email, company: clientProfile.company },
    })
    .from(invoice)
    .innerJoin(quote, eq(quote.id, invoice.quoteId))
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .innerJoin(user, eq(user.id, brief.ownerId))
    .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
    .where(where)
    .limit(1);
  return row ? { ...row, lines: await quoteLines(tx, row.quote.id) } : null;
}

export function invoiceView(tx: DbOrTx, invoiceId: string): Promise<InvoiceView | null> {
  return viewWhere(tx, eq(invoice.id, invoiceId));
}

/** The invoice of a quote, if one was issued. */
export function invoiceOfQuote(tx: DbOrTx, quoteId: string): Promise<InvoiceView | null> {
  return viewWhere(tx, eq(invoice.quoteId, quoteId));
}

/** The invoice if the viewer may see it (staff, or the client whose brief it is), else null → 404. */
export async function findInvoiceFor(viewer: SignedInUser, invoiceId: string): Promise<InvoiceView | null> {
  const view = await invoiceView(db, invoiceId);
  if (!view) return null;
  return isStaff(viewer) || view.brief.ownerId === viewer.id ? view : null;
}

/** Marks an issued invoice paid, conditional on its state read; null when it was paid already. */
export async function markInvoicePaid(tx: DbOrTx, row: InvoiceRow, paidAt: Date): Promise<InvoiceRow | null> {
  if (row.state !== 'issued') return null;
  const [updated] = await tx
    .update(invoice)
    .set({ state: 'paid', paidAt, updatedAt: new Date() })
    .where(and(eq(invoice.id, row.id), eq(invoice.state, 'issued')))
    .returning();
  return updated ?? null;
}

/** The invoice as the API answers it. */
export function invoiceJson({ invoice, quote }: InvoiceView) {
  return {
    id: invoice.id,
    number: invoice.number,
    state: invoice.state,
    quoteId: quote.id,
    quoteNumber: quote.number,
    currency: invoice.currency,
    taxRateBp: invoice.taxRateBp,
    netMinor: invoice.netMinor,
    taxMinor: invoice.taxMinor,
    grossMinor: invoice.grossMinor,
    depositPaidMinor: invoice.depositPaidMinor,
    balanceMinor: invoice.balanceMinor,
    purchaseOrder: invoice.purchaseOrder,
    issuedAt: invoice.issuedAt.toISOString(),
    paidAt: invoice.paidAt?.toISOString() ?? null,
    pdf: `/api/v1/invoices/${invoice.id}/pdf`,
  };
}

/** The invoices of several quotes at once, by quote id (for lists). */
export async function invoicesOfQuotes(quoteIds: readonly string[]): Promise<Map<string, InvoiceRow>> {
  if (quoteIds.length === 0) return new Map();
  const rows = await db
    .select()
    .from(invoice)
    .where(inArray(invoice.quoteId, [...quoteIds]));
  return new Map(rows.map((row) => [row.quoteId, row]));
}
