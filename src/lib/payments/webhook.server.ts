import { eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import { moveBrief } from '~/lib/briefs/index.server';
import { db } from '../platform/db';
import { brief, payment, quote, stateChange, webhookEvent } from '../platform/db/schema';
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
      // A late "expired" never undoes a payment that completed.
      if (found.status !== 'pending') return finish('ignored');
      await tx.update(payment).set({ status: 'expired' }).where(eq(payment.id, found.id));
      return finish('expired');
    }

    if (session.payment_status !== 'paid') return finish('not-paid');
    if (found.status === 'paid') return finish('already-paid');
    const paymentIntent = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
    await tx.update(payment).set({ status: 'paid', paidAt: new Date(), paymentIntentId: paymentIntent }).where(eq(payment.id, found.id));

    const [quoteRow] = await tx.select().from(quote).where(eq(quote.id, found.quoteId)).limit(1);
    if (quoteRow && quoteRow.status !== 'deposit-paid') {
      await tx.update(quote).set({ status: 'deposit-paid', updatedAt: new Date() }).where(eq(quote.id, quoteRow.id));
      await tx.insert(stateChange).values({
        subjectType: 'quote',
        subjectId: quoteRow.id,
        fromStatus: quoteRow.status,
        toStatus: 'deposit-paid',
        note: `Payment ${paymentIntent ?? session.id}`,
      });
      const [briefRow] = await tx.select().from(brief).where(eq(brief.id, quoteRow.briefId)).limit(1);
      if (briefRow && briefRow.status === 'accepted')
        await moveBrief(tx, briefRow, 'deposit-paid', 'system', null, 'Deposit received online');
    }
    return finish('deposit-paid', found.id);
  });
  if (outcome.result === 'deposit-paid' && outcome.paidPaymentId) await sendReceipt(outcome.paidPaymentId);
  return outcome.result;
}
