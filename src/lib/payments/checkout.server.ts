import { and, count, eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { brief, payment, quote, type QuoteRow } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { appUrl } from '../platform/links';
import { movePayment } from './moves.server';
import { paymentProvider, PaymentsNotConfigured } from './provider.server';
import { refuse, succeed, type Outcome } from '../platform/outcome';

export type CheckoutOutcome = Outcome<{ url: string }>;

/** The quote if this client owns it and it has been sent (drafts stay with the consultancy), else null → 404. */
export async function findQuoteForPayer(viewer: SignedInUser, quoteId: string): Promise<QuoteRow | null> {
  if (isStaff(viewer)) return null;
  const [row] = await db
    .select({ quote })
    .from(quote)
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .where(and(eq(quote.id, quoteId), eq(brief.ownerId, viewer.id)))
    .limit(1);
  return row && row.quote.state !== 'draft' ? row.quote : null;
}

/**
 * Opens a hosted checkout for the quote's deposit. The amount comes from the
 * stored quote; an open session for the same quote is reused so a double click
 * cannot start two payments.
 */
export async function startDepositCheckout(viewer: SignedInUser, quoteId: string, now = new Date()): Promise<CheckoutOutcome> {
  const row = await findQuoteForPayer(viewer, quoteId);
  if (!row) return refuse('not-found', 'No such quote.');
  if (row.state === 'deposit-paid') return refuse('wrong-state', 'The deposit for this quote is already paid.');
  if (row.state !== 'accepted') return refuse('wrong-state', 'Accept the quote first; the deposit is paid on an accepted quote.');
  if (row.validUntil.getTime() < now.getTime()) return refuse('wrong-state', 'This quote has expired; ask the consultancy for a new one.');
  if (row.depositMinor <= 0) return refuse('wrong-state', 'This quote asks for no deposit.');
  try {
    return succeed({ url: await openDepositSession(viewer, row) });
  } catch (error) {
    if (error instanceof PaymentsNotConfigured) return refuse('unavailable', error.message, { code: 'payments_not_configured' });
    return refuse('upstream-failed', 'The payment service did not answer; try again in a minute.', {
      code: 'payment_provider_unavailable',
    });
  }
}

/** The hosted page's address: the open session of this quote if there is one, else a new session. */
async function openDepositSession(viewer: SignedInUser, row: QuoteRow): Promise<string> {
  const provider = paymentProvider();
  const [pending] = await db
    .select()
    .from(payment)
    .where(and(eq(payment.quoteId, row.id), eq(payment.kind, 'deposit'), eq(payment.state, 'pending')))
    .limit(1);
  if (pending) {
    const session = await provider.checkout.sessions.retrieve(pending.checkoutSessionId);
    if (session.status === 'open' && session.url) return session.url;
    await movePayment(db, pending, 'expired');
  }

  const [attempts] = await db.select({ n: count() }).from(payment).where(eq(payment.quoteId, row.id));
  const quotePage = appUrl(`/quotes/${row.id}`);
  const session = await provider.checkout.sessions.create(
    {
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: row.currency.toLowerCase(),
            unit_amount: row.depositMinor,
            product_data: { name: `Deposit for quote ${row.number}` },
          },
        },
      ],
      customer_email: viewer.email,
      client_reference_id: row.id,
      metadata: { quoteId: row.id, quoteNumber: row.number, briefId: row.briefId },
      success_url: `${quotePage}?payment=returned&session={CHECKOUT_SESSION_ID}`,
      cancel_url: `${quotePage}?payment=cancelled`,
    },
    // Same quote and attempt → same session, even if this request is retried.
    { idempotencyKey: `deposit:${row.id}:${attempts?.n ?? 0}` },
  );
  if (!session.url) throw new Error('The payment provider returned a session without a page address.');
  await db
    .insert(payment)
    .values({
      quoteId: row.id,
      kind: 'deposit',
      checkoutSessionId: session.id,
      amountMinor: row.depositMinor,
      currency: row.currency,
      state: 'pending',
    })
    .onConflictDoNothing();
  return session.url;
}
