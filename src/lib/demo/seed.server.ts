import { count, eq } from 'drizzle-orm';
import type { Auth } from '../platform/auth/create-auth';
import type { Database, Transaction } from '../platform/db/connect';
import { summarise } from '~/lib/briefs';
import { railSpecSchema } from '../engine/rail-spec';
import { defaultCatalog } from '../engine/catalog';
import { evaluate } from '../engine/evaluate';
import { catalogToRows } from '~/lib/catalog';
import {
  account,
  brief,
  briefMessage,
  briefSpecVersion,
  clientProfile,
  designRevision,
  deviceClass,
  payment,
  rateCard,
  stateChange,
  user,
  type QuoteRow,
  type QuoteState,
} from '../platform/db/schema';
import { draftQuote, moveQuote } from '~/lib/quotes/index.server';
import { movePayment } from '~/lib/payments/index.server';
import { markInvoicePaid, recordInvoice } from '~/lib/invoices/index.server';
import { DEMO_BRIEFS, DEMO_PASSWORD, DEMO_PEOPLE, DEMO_RATE_CARD, type DemoBrief } from './scenario';
import { changesRequestedLifecycle, declinedLifecycle, lifecycleTo } from './lifecycle';
import { DAY_MS } from '../platform/time';

/** A paid demo payment of the quote, recorded through the payment's transition table as in use. */
async function seedPaidPayment(tx: Transaction, row: QuoteRow, kind: 'deposit' | 'balance', amountMinor: number, paidAt: Date) {
  const reference = `${kind === 'deposit' ? '' : 'b'}${row.id.slice(0, 8)}`;
  const [pending] = await tx
    .insert(payment)
    .values({ quoteId: row.id, kind, checkoutSessionId: `cs_demo_${reference}`, amountMinor, currency: row.currency, createdAt: paidAt })
    .returning();
  if (!pending || !(await movePayment(tx, pending, 'paid', { paidAt, paymentIntentId: `pi_demo_${reference}` })))
    throw new Error(`Demo ${kind} for quote ${row.number} could not be recorded`);
}

/**
 * The quote of a demo brief, drafted the way the quote builder drafts one, then
 * taken as far as the scenario says: sent, accepted with its deposit paid (and
 * on to its balance invoiced and paid), or declined.
 */
async function seedQuote(
  tx: Transaction,
  p: {
    briefId: string;
    finalState: DemoBrief['state'];
    revisionId: string;
    engineerId: string;
    ownerId: string;
    plan: NonNullable<DemoBrief['quote']>;
    declineReason: string;
    purchaseOrder: string | null;
    at: Date;
  },
) {
  // Drafting needs a brief still under review; the scenario's state is restored right after.
  await tx.update(brief).set({ state: 'in-review' }).where(eq(brief.id, p.briefId));
  const drafted = await draftQuote(tx, { revisionId: p.revisionId, createdBy: p.engineerId, now: p.at });
  if (!drafted.ok) throw new Error(`Demo quote could not be drafted: ${drafted.message}`);
  await tx.update(brief).set({ state: p.finalState }).where(eq(brief.id, p.briefId));
  // Every later step goes through the quote's and the payment's transition tables, as in use.
  let row = drafted.value;
  const move = async (to: QuoteState, actorId: string | null, at: Date, extra: Partial<QuoteRow> = {}, note = '') => {
    const moved = await moveQuote(tx, row, to, actorId, extra, note, at);
    if (!moved) throw new Error(`Demo quote ${row.number} cannot move from ${row.state} to ${to}`);
    row = moved;
  };
  const sentAt = new Date(p.at.getTime() + 3_600_000);
  await move('sent', p.engineerId, sentAt, { sentAt });
  if (p.plan === 'sent') return;
  if (p.plan === 'declined') {
    await move('declined', p.ownerId, new Date(sentAt.getTime() + DAY_MS), { declineReason: p.declineReason }, p.declineReason);
    return;
  }
  const acceptedAt = new Date(sentAt.getTime() + DAY_MS);
  const paidAt = new Date(acceptedAt.getTime() + 600_000);
  await move('accepted', p.ownerId, acceptedAt, { acceptedAt, purchaseOrder: p.purchaseOrder });
  await seedPaidPayment(tx, row, 'deposit', row.depositMinor, paidAt);
  await move('deposit-paid', null, paidAt);
  if (p.plan !== 'paid-in-full') return;
  // Delivered two weeks after the deposit, the balance paid three days later.
  const deliveredAt = new Date(paidAt.getTime() + 14 * DAY_MS);
  const balancePaidAt = new Date(deliveredAt.getTime() + 3 * DAY_MS);
  const issued = await recordInvoice(tx, row, p.ownerId, deliveredAt);
  await seedPaidPayment(tx, row, 'balance', issued.balanceMinor, balancePaidAt);
  if (!(await markInvoicePaid(tx, issued, balancePaidAt))) throw new Error(`Demo invoice ${issued.number} could not be marked paid`);
}

/**
 * Seeds the demo scenario into an empty database, all in one transaction.
 * Returns false (and writes nothing) when the database already has people.
 */
export async function seedDemo(db: Database, auth: Auth, now = Date.now()): Promise<boolean> {
  const [existing] = await db.select({ n: count() }).from(user);
  if ((existing?.n ?? 0) > 0) return false;

  const context = await auth.$context;
  const passwordHash = await context.password.hash(DEMO_PASSWORD);
  const ids = new Map(DEMO_PEOPLE.map((p) => [p.key, crypto.randomUUID()]));
  const idOf = (key: string) => {
    const id = ids.get(key);
    if (!id) throw new Error(`Demo scenario names an unknown person: ${key}`);
    return id;
  };
  const engineerId = idOf('engineer');

  await db.transaction(async (tx) => {
    for (const person of DEMO_PEOPLE) {
      const id = idOf(person.key);
      const joined = new Date(now - 40 * DAY_MS);
      await tx.insert(user).values({
        id,
        name: person.name,
        email: person.email,
        emailVerified: true,
        role: person.role,
        createdAt: joined,
        updatedAt: joined,
      });
      await tx.insert(account).values({
        id: crypto.randomUUID(),
        accountId: id,
        providerId: 'credential',
        userId: id,
        password: passwordHash,
        createdAt: joined,
        updatedAt: joined,
      });
      if (person.company)
        await tx.insert(clientProfile).values({ userId: id, company: person.company, billingAddress: person.billingAddress ?? '' });
    }
    await tx.insert(rateCard).values({ ...DEMO_RATE_CARD, updatedBy: idOf('admin') });
    await tx.insert(deviceClass).values(catalogToRows(defaultCatalog));

    for (const item of DEMO_BRIEFS) {
      const ownerId = idOf(item.owner);
      const briefId = crypto.randomUUID();
      const submittedAt = item.submittedDaysAgo === undefined ? null : new Date(now - item.submittedDaysAgo * DAY_MS);
      const createdAt = new Date((submittedAt?.getTime() ?? now - DAY_MS) - 2 * 3_600_000);
      // Submitted briefs carry the engine's verdict, as they would after a real submission.
      const spec = submittedAt ? railSpecSchema.parse(item.spec) : item.spec;
      const result = submittedAt ? evaluate(railSpecSchema.parse(item.spec), defaultCatalog) : null;
      await tx.insert(brief).values({
        id: briefId,
        ownerId,
        title: item.title,
        state: item.state,
        spec,
        notes: item.notes,
        submittedAt,
        recommendedTopology: result?.recommended ?? null,
        summary: result ? summarise(result) : null,
        createdAt,
        updatedAt: createdAt,
      });
      if (result && item.revisionNote && result.recommended) {
        const revisionId = crypto.randomUUID();
        const revisedAt = new Date((submittedAt?.getTime() ?? now) + 4 * 3_600_000);
        await tx.insert(designRevision).values({
          id: revisionId,
          briefId,
          number: 1,
          authorId: engineerId,
          topology: result.recommended,
          weights: railSpecSchema.parse(item.spec).weights,
          overrides: railSpecSchema.parse(item.spec).overrides,
          input: spec,
          result,
          note: item.revisionNote,
          createdAt: revisedAt,
        });
        if (item.quote)
          await seedQuote(tx, {
            briefId,
            finalState: item.state,
            revisionId,
            engineerId,
            ownerId,
            plan: item.quote,
            declineReason: item.declineReason ?? '',
            purchaseOrder: item.purchaseOrder ?? null,
            at: new Date(revisedAt.getTime() + DAY_MS),
          });
      }
      for (const [index, message] of (item.messages ?? []).entries())
        await tx.insert(briefMessage).values({
          briefId,
          authorId: message.by === 'client' ? ownerId : engineerId,
          body: message.body,
          createdAt: new Date((submittedAt?.getTime() ?? now) + 2 * DAY_MS + index * 3 * 3_600_000),
        });
      if (submittedAt) await tx.insert(briefSpecVersion).values({ briefId, number: 1, spec, createdAt: submittedAt });
      if (item.changeRequest)
        await tx.insert(briefMessage).values({
          briefId,
          authorId: engineerId,
          body: item.changeRequest,
          createdAt: new Date((submittedAt?.getTime() ?? now) + 5 * 3_600_000),
        });
      const steps = item.changeRequest
        ? changesRequestedLifecycle(item.changeRequest)
        : item.quote === 'declined'
          ? declinedLifecycle()
          : lifecycleTo(item.state);
      let at = submittedAt?.getTime() ?? createdAt.getTime();
      for (const [index, step] of steps.entries()) {
        await tx.insert(stateChange).values({
          subjectType: 'brief',
          subjectId: briefId,
          fromState: step.from,
          toState: step.to,
          actorId: step.by === 'client' ? ownerId : engineerId,
          note: step.note ?? '',
          createdAt: new Date(at),
        });
        at += (index + 1) * 3_600_000 * 5;
      }
    }
  });
  return true;
}
