/**
 * Delivering a design issues its balance invoice: the brief's move to
 * delivered, the invoice with the next number of the year, and its e-mail with
 * the PDF attached are one transaction, so the invoice is issued and mailed
 * exactly once or not at all.
 */
import { and, eq, sql, sum } from 'drizzle-orm';
import { moveAsStaff, moveBrief, type BriefRow } from '~/lib/briefs/index.server';
import type { BriefState } from '~/lib/briefs';
import { quoteLines, readRateCard } from '~/lib/quotes/index.server';
import { db } from '../platform/db';
import type { Transaction } from '../platform/db/connect';
import { clientProfile, invoice, payment, quote, type InvoiceRow, type QuoteRow } from '../platform/db/schema';
import type { SignedInUser } from '../platform/http/guard';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail } from '../platform/mail/outbox';
import { refuse, succeed, type Outcome } from '../platform/outcome';
import { renderInvoicePdf } from './document.server';
import { formatInvoiceNumber, invoiceFigures } from './figures';
import { invoiceMail } from './mail.server';
import { invoiceView } from './view.server';

class Refused extends Error {}

/** An engineer or admin moves a brief; marking its design delivered issues the balance invoice with the move. */
export function moveBriefAsStaff(staff: SignedInUser, row: BriefRow, to: BriefState, note: string): Promise<Outcome<BriefRow>> {
  return to === 'delivered' ? deliverDesign(staff, row, note) : moveAsStaff(staff, row, to, note);
}

async function nextSequence(tx: Transaction, year: number): Promise<number> {
  const [last] = await tx
    .select({ n: sql<number>`coalesce(max(${invoice.sequence}), 0)` })
    .from(invoice)
    .where(eq(invoice.year, year));
  return Number(last?.n ?? 0) + 1;
}

/**
 * Records the invoice for the balance of a quote whose deposit is paid, inside the caller's
 * transaction: the next number of the year, the figures, and the client's billing address,
 * PO and our identifiers as they stand now.
 */
export async function recordInvoice(tx: Transaction, paidQuote: QuoteRow, ownerId: string, now: Date): Promise<InvoiceRow> {
  const [deposit] = await tx
    .select({ paid: sum(payment.amountMinor) })
    .from(payment)
    .where(and(eq(payment.quoteId, paidQuote.id), eq(payment.kind, 'deposit'), eq(payment.state, 'paid')));
  const [profile] = await tx
    .select({ billingAddress: clientProfile.billingAddress })
    .from(clientProfile)
    .where(eq(clientProfile.userId, ownerId));
  const card = await readRateCard(tx);
  const figures = invoiceFigures(await quoteLines(tx, paidQuote.id), paidQuote.taxRateBp, Number(deposit?.paid ?? 0));
  const year = now.getUTCFullYear();
  const sequence = await nextSequence(tx, year);
  const [issued] = await tx
    .insert(invoice)
    .values({
      quoteId: paidQuote.id,
      number: formatInvoiceNumber(year, sequence),
      year,
      sequence,
      currency: paidQuote.currency,
      taxRateBp: paidQuote.taxRateBp,
      ...figures,
      purchaseOrder: paidQuote.purchaseOrder,
      billingAddress: profile?.billingAddress ?? '',
      registrationNumber: card?.registrationNumber ?? '',
      taxId: card?.taxId ?? '',
      issuedAt: now,
    })
    .onConflictDoNothing({ target: invoice.quoteId })
    .returning();
  if (!issued) throw new Refused('This quote is invoiced already.');
  return issued;
}

/** Issues the invoice and queues its e-mail, the PDF attached, in the caller's transaction; the queued mail ids. */
async function issueInvoice(tx: Transaction, paidQuote: QuoteRow, ownerId: string, now: Date): Promise<string[]> {
  const view = await invoiceView(tx, (await recordInvoice(tx, paidQuote, ownerId, now)).id);
  if (!view) throw new Error('The invoice just issued could not be read back.');
  return enqueueMail(tx, [invoiceMail(view, await renderInvoicePdf(view))], now);
}

/** The design is delivered: the brief moves on and the balance of its paid quote is invoiced and e-mailed. */
export async function deliverDesign(staff: SignedInUser, row: BriefRow, note: string, now = new Date()): Promise<Outcome<BriefRow>> {
  try {
    const { moved, queued } = await db.transaction(async (tx) => {
      const moved = await moveBrief(tx, row, 'delivered', 'staff', staff.id, note);
      if (!moved.ok) throw new Refused(moved.message);
      const [paidQuote] = await tx
        .select()
        .from(quote)
        .where(and(eq(quote.briefId, row.id), eq(quote.state, 'deposit-paid')))
        .limit(1);
      if (!paidQuote) throw new Refused('This brief has no quote with a paid deposit, so there is no balance to invoice.');
      return { moved: moved.row, queued: await issueInvoice(tx, paidQuote, row.ownerId, now) };
    });
    await deliverQueuedMail(queued);
    return succeed(moved);
  } catch (error) {
    if (error instanceof Refused) return refuse('wrong-state', error.message);
    throw error;
  }
}
