import { eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import { moveBrief } from '~/lib/briefs/index.server';
import { moveQuote } from '~/lib/quotes/index.server';
import { db } from '../platform/db';
import { brief, payment, quote, webhookEvent } from '../platform/db/schema';
import { movePayment } from './moves.server';
import { sendReceipt } from './receipt.server';

export type WebhookOutcome = 'duplicate' | 'ignored' | 'unknown-session' | 'already-paid' | 'deposit-paid' | 'expired' | 'not-paid';

/**
 * Applies one verified provider event. The event id is recorded in the same
 * transaction as its effect, so a replay finds the row and changes nothing, and
 * a crash leaves either both or neither.
 */
export async function applyPaymentEvent(event: Stripe.Event): Promise<WebhookOutcome> {
  const outcome = await db.transaction(async (tx) => {
    const recorded = await tx
      .insert(webhookEvent)
      .values({ id: event.id, type: event.type, outcome: 'pending' })
      .onConflictDoNothing()
      .returning();
    if (recorded.length === 0) return { result: 'duplicate' as const };

    const finish = async (result: WebhookOutcome, paidPaymentId?: string) => {
      await tx.update(webhookEvent).set({ outcome: result }).where(eq(webhookEvent.id, event.id));
      return { result, paidPaymentId };
    };

    if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.expired') return finish('ignored');
    const session = event.data.object;
    const [found] = await tx.select().from(payment).where(eq(payment.checkoutSessionId, session.id)).limit(1);
    if (!found) return finish('unknown-session');

    if (event.type === 'checkout.session.expired') {
      // A late "expired" never undoes a payment that completed: the table has no move from paid to expired.
      return finish((await movePayment(tx, found, 'expired')) ? 'expired' : 'ignored');
    }

    if (session.payment_status !== 'paid') return finish('not-paid');
    if (found.state === 'paid') return finish('already-paid');
    const paymentIntent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
    if (!(await movePayment(tx, found, 'paid', { paidAt: new Date(), paymentIntentId: paymentIntent }))) return finish('ignored');

    const [quoteRow] = await tx.select().from(quote).where(eq(quote.id, found.quoteId)).limit(1);
    if (quoteRow && (await moveQuote(tx, quoteRow, 'deposit-paid', null, {}, `Payment ${paymentIntent ?? session.id}`))) {
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, quoteRow.briefId)).limit(1);
      if (briefRow && briefRow.state === 'accepted')
        await moveBrief(tx, briefRow, 'deposit-paid', 'system', null, 'Deposit received online');
    }
    return finish('deposit-paid', found.id);
  });
  if (outcome.result === 'deposit-paid' && outcome.paidPaymentId) await sendReceipt(outcome.paidPaymentId);
  return outcome.result;
}
