import { and, count, eq } from 'drizzle-orm';
import { db } from '../platform/db';
import { brief, payment, quote, type QuoteRow } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { appUrl } from '../platform/links';
import { movePayment } from './moves.server';
import { paymentProvider, PaymentsNotConfigured } from './provider.server';
import { checkPendingPayment } from './reconcile.server';
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

/** Opens a hosted checkout for the quote's deposit. The amount comes from the stored quote. */
export async function startDepositCheckout(viewer: SignedInUser, quoteId: string, now = new Date()): Promise<CheckoutOutcome> {
  const row = await findQuoteForPayer(viewer, quoteId);
  if (!row) return refuse('not-found', 'No such quote.');
  if (row.state === 'deposit-paid') return refuse('wrong-state', 'The deposit for this quote is already paid.');
  if (row.state !== 'accepted') return refuse('wrong-state', 'Accept the quote first; the deposit is paid on an accepted quote.');
  if (row.validUntil.getTime() < now.getTime()) return refuse('wrong-state', 'This quote has expired; ask the consultancy for a new one.');
  if (row.depositMinor <= 0) return refuse('wrong-state', 'This quote asks for no deposit.');
  return openOrReuseCheckout(viewer, row, { kind: 'deposit', amountMinor: row.depositMinor, name: `Deposit for quote ${row.number}` });
}

/** What one checkout is for: its kind, the amount asked and the line the provider's page shows. */
export interface CheckoutPurpose {
  kind: 'deposit' | 'balance';
  amountMinor: number;
  name: string;
}

/**
 * A pending checkout of the same kind is asked about first: an open one is
 * reused (a double click cannot start two payments), a paid or completed one is
 * applied and never replaced, and only one the provider expired gives way to a
 * new session.
 */
export async function openOrReuseCheckout(viewer: SignedInUser, row: QuoteRow, purpose: CheckoutPurpose): Promise<CheckoutOutcome> {
  try {
    const pending = await checkPendingPayment(row.id, purpose.kind);
    if (pending.kind === 'received') {
      return refuse('wrong-state', `Your ${purpose.kind} payment was received and is being confirmed; nothing more to pay.`, {
        code: `${purpose.kind}_received`,
      });
    }
    if (pending.kind === 'open') return succeed({ url: pending.url });
    if (pending.kind === 'stale') await movePayment(db, pending.payment, 'expired');
    return succeed({ url: await openSession(viewer, row, purpose) });
  } catch (error) {
    if (error instanceof PaymentsNotConfigured) return refuse('unavailable', error.message, { code: 'payments_not_configured' });
    return refuse('upstream-failed', 'The payment service did not answer; try again in a minute.', {
      code: 'payment_provider_unavailable',
    });
  }
}

/** The query the quote page reads on the client's return from the provider's page: `payment` for the deposit, `balance` for the balance. */
const RETURN_PARAMETER = { deposit: 'payment', balance: 'balance' } as const;

/** A new hosted checkout session for the quote, recorded as a pending payment; its page's address. */
async function openSession(viewer: SignedInUser, row: QuoteRow, purpose: CheckoutPurpose): Promise<string> {
  const provider = paymentProvider();
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
            unit_amount: purpose.amountMinor,
            product_data: { name: purpose.name },
          },
        },
      ],
      customer_email: viewer.email,
      client_reference_id: row.id,
      metadata: { quoteId: row.id, quoteNumber: row.number, briefId: row.briefId, kind: purpose.kind },
      success_url: `${quotePage}?${RETURN_PARAMETER[purpose.kind]}=returned&session={CHECKOUT_SESSION_ID}`,
      cancel_url: `${quotePage}?${RETURN_PARAMETER[purpose.kind]}=cancelled`,
    },
    // Same quote, purpose and attempt → same session, even if this request is retried.
    { idempotencyKey: `${purpose.kind}:${row.id}:${attempts?.n ?? 0}` },
  );
  if (!session.url) throw new Error('The payment provider returned a session without a page address.');
  await db
    .insert(payment)
    .values({
      quoteId: row.id,
      kind: purpose.kind,
      checkoutSessionId: session.id,
      amountMinor: purpose.amountMinor,
      currency: row.currency,
      state: 'pending',
    })
    .onConflictDoNothing();
  return session.url;
}
