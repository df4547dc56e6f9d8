import { eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import { db } from '../platform/db';
import { payment, webhookEvent } from '../platform/db/schema';
import { movePayment } from './moves.server';
import { sessionReport } from './event-checks';
import { afterSettle, settlePaidSession, type SettleResult } from './settle.server';

export type WebhookOutcome = 'duplicate' | 'ignored' | 'expired' | SettleResult['result'];

/**
 * Applies one verified provider event. The event id is recorded in the same
 * transaction as its effect, so a replay finds the row and changes nothing, and
 * a crash leaves either both or neither. A completed checkout is applied
 * through the same path as the quote page's check (settle.server.ts).
 */
export async function applyPaymentEvent(event: Stripe.Event): Promise<WebhookOutcome> {
  const outcome = await db.transaction(async (tx) => {
    const recorded = await tx
      .insert(webhookEvent)
      .values({ id: event.id, type: event.type, outcome: 'pending' })
      .onConflictDoNothing()
      .returning();
    if (recorded.length === 0) return { result: 'duplicate' as const };

    const finish = async <T extends { result: WebhookOutcome }>(settled: T) => {
      await tx.update(webhookEvent).set({ outcome: settled.result }).where(eq(webhookEvent.id, event.id));
      return settled;
    };

    if (event.type === 'checkout.session.completed') return finish(await settlePaidSession(tx, sessionReport(event.data.object)));
    if (event.type !== 'checkout.session.expired') return finish({ result: 'ignored' as const });
    const [found] = await tx.select().from(payment).where(eq(payment.checkoutSessionId, event.data.object.id)).limit(1);
    if (!found) return finish({ result: 'unknown-session' as const });
    // A late "expired" never undoes a payment that completed: the table has no move from paid to expired.
    return finish({ result: (await movePayment(tx, found, 'expired')) ? ('expired' as const) : ('ignored' as const) });
  });
  if (outcome.result === 'deposit-paid' || outcome.result === 'balance-paid' || outcome.result === 'refund-due') {
    try {
      await afterSettle(outcome);
    } catch (error) {
      // A refund that did not go out leaves the event unrecorded, so the provider's retry tries the refund again.
      if (outcome.result === 'refund-due') await db.delete(webhookEvent).where(eq(webhookEvent.id, event.id));
      throw error;
    }
  }
  return outcome.result;
}
