/** The demo scenario is seeded through the same transition tables as real use, with its own dates. */
import { asc, eq } from 'drizzle-orm';
import { expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { brief, briefMessage, invoice, payment, quote, stateChange } from '../../../src/lib/platform/db/schema';

test('the demo’s paid quote went draft → sent → accepted → deposit-paid, in time order, with a paid deposit', async () => {
  const { db, client } = connect(inject('databaseUrl'));
  try {
    const [paid] = await db.select().from(brief).where(eq(brief.title, 'Soil-moisture node, 3.3 V from one Li-ion cell'));
    const [row] = await db
      .select()
      .from(quote)
      .where(eq(quote.briefId, paid?.id ?? ''));
    expect(row?.state).toBe('deposit-paid');
    const history = await db
      .select()
      .from(stateChange)
      .where(eq(stateChange.subjectId, row?.id ?? ''))
      .orderBy(asc(stateChange.createdAt));
    expect(history.map((h) => `${h.fromState ?? '∅'}→${h.toState}`)).toEqual([
      '∅→draft',
      'draft→sent',
      'sent→accepted',
      'accepted→deposit-paid',
    ]);
    expect(row?.sentAt?.getTime()).toBe(history[1]?.createdAt.getTime());
    expect(row?.acceptedAt?.getTime()).toBe(history[2]?.createdAt.getTime());
    const deposits = await db
      .select()
      .from(payment)
      .where(eq(payment.quoteId, row?.id ?? ''));
    expect(deposits).toHaveLength(1);
    expect(deposits[0]).toMatchObject({ kind: 'deposit', state: 'paid', amountMinor: row?.depositMinor });
    expect(deposits[0]?.paidAt?.getTime()).toBe(history[3]?.createdAt.getTime());
  } finally {
    client.close();
  }
});

test('the demo has a quote the client declined with a reason, and its brief back in review', async () => {
  const { db, client } = connect(inject('databaseUrl'));
  try {
    const [plc] = await db.select().from(brief).where(eq(brief.title, 'PLC I/O card, 5 V at 1.5 A from the 24 V bus'));
    expect(plc?.state).toBe('in-review');
    const [declined] = await db
      .select()
      .from(quote)
      .where(eq(quote.briefId, plc?.id ?? ''));
    expect(declined?.state).toBe('declined');
    expect(declined?.declineReason).toContain('36 V');
    const briefHistory = await db
      .select()
      .from(stateChange)
      .where(eq(stateChange.subjectId, plc?.id ?? ''))
      .orderBy(asc(stateChange.createdAt));
    expect(briefHistory.map((h) => h.toState).slice(-2)).toEqual(['quoted', 'in-review']);
  } finally {
    client.close();
  }
});

test('the demo’s quoted brief has a question from its client and the engineer’s answer', async () => {
  const { db, client } = connect(inject('databaseUrl'));
  try {
    const [bench] = await db.select().from(brief).where(eq(brief.title, 'Bench meter analog front-end, quiet 12 V'));
    const thread = await db
      .select()
      .from(briefMessage)
      .where(eq(briefMessage.briefId, bench?.id ?? ''))
      .orderBy(asc(briefMessage.createdAt));
    expect(thread.map((m) => m.authorId === bench?.ownerId)).toEqual([true, false]);
  } finally {
    client.close();
  }
});

test('the demo has a brief sent back to its client, with the request in the history and the thread', async () => {
  const { db, client } = connect(inject('databaseUrl'));
  try {
    const [sent] = await db.select().from(brief).where(eq(brief.title, 'Drive controller logic, 3.3 V from the 48 V bus'));
    expect(sent?.state).toBe('changes-requested');
    const history = await db
      .select()
      .from(stateChange)
      .where(eq(stateChange.subjectId, sent?.id ?? ''))
      .orderBy(asc(stateChange.createdAt));
    expect(history.at(-1)).toMatchObject({ fromState: 'submitted', toState: 'changes-requested' });
    expect(history.at(-1)?.note).toContain('regenerative braking');
    const thread = await db
      .select()
      .from(briefMessage)
      .where(eq(briefMessage.briefId, sent?.id ?? ''));
    expect(thread.map((m) => m.body)).toEqual([history.at(-1)?.note]);
  } finally {
    client.close();
  }
});

test('the demo has a job paid in full: delivered, its balance invoiced with the PO and billing address, and paid', async () => {
  const { db, client } = connect(inject('databaseUrl'));
  try {
    const [job] = await db.select().from(brief).where(eq(brief.title, 'Field logger, 5 V from a 12 V lead-acid battery'));
    expect(job?.state).toBe('paid-in-full');
    const moves = await db
      .select()
      .from(stateChange)
      .where(eq(stateChange.subjectId, job?.id ?? ''))
      .orderBy(asc(stateChange.createdAt));
    expect(moves.slice(-2).map((m) => `${m.fromState}→${m.toState}`)).toEqual(['in-design→delivered', 'delivered→paid-in-full']);
    const [row] = await db
      .select()
      .from(quote)
      .where(eq(quote.briefId, job?.id ?? ''));
    const [issued] = await db
      .select()
      .from(invoice)
      .where(eq(invoice.quoteId, row?.id ?? ''));
    expect(issued).toMatchObject({
      state: 'paid',
      purchaseOrder: 'FS-PO-2231',
      grossMinor: row?.totalMinor,
      depositPaidMinor: row?.depositMinor,
    });
    expect(issued?.number).toMatch(/^INV-\d{4}-\d{4}$/);
    expect(issued?.billingAddress).toContain('12 Orchard Row');
    const paid = await db
      .select()
      .from(payment)
      .where(eq(payment.quoteId, row?.id ?? ''));
    expect(paid.map((p) => [p.kind, p.state, p.amountMinor])).toEqual([
      ['deposit', 'paid', row?.depositMinor],
      ['balance', 'paid', issued?.balanceMinor],
    ]);
  } finally {
    client.close();
  }
});
