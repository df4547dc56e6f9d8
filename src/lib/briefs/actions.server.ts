/**
 * What clients and staff do to briefs: create, edit a draft, submit, move
 * between states. Each action is one transaction; routes only translate.
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { railSpecIssues, railSpecSchema, evaluate } from '../engine';
import { summarise } from './summary';
import type { BriefState } from './states';
import type { CreateBrief } from './requests';
import { moveBrief } from './moves.server';
import type { BriefRow } from './briefs.server';
import { currentCatalog } from '~/lib/catalog/index.server';
import { db } from '../platform/db';
import { brief, briefFile, briefMessage, briefSpecVersion, stateChange, user } from '../platform/db/schema';
import { uploadStore } from './file-store.server';
import type { DbOrTx } from '../platform/db/connect';
import { invalidInput, notYours, refuse, succeed, type Outcome } from '../platform/outcome';
import type { SignedInUser } from '../platform/http/guard';
import { changesRequestedMail, submittedMails } from './mail.server';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail } from '../platform/mail/outbox';

/** Keeps the spec as submitted, numbered after the brief's earlier submissions. */
async function recordSpecVersion(tx: DbOrTx, briefId: string, spec: unknown, at: Date) {
  const [last] = await tx
    .select({ n: sql<number>`coalesce(max(${briefSpecVersion.number}), 0)` })
    .from(briefSpecVersion)
    .where(eq(briefSpecVersion.briefId, briefId));
  await tx.insert(briefSpecVersion).values({ briefId, number: Number(last?.n ?? 0) + 1, spec, createdAt: at });
}

/** Full check of a spec at submission; issue paths are prefixed with `spec.` as the body has them. */
async function validateForSubmission(spec: unknown) {
  const parsed = railSpecSchema.safeParse(spec);
  if (!parsed.success) {
    return { ok: false as const, issues: railSpecIssues(parsed.error).map((i) => ({ ...i, path: i.path ? `spec.${i.path}` : 'spec' })) };
  }
  const result = evaluate(parsed.data, await currentCatalog());
  return { ok: true as const, spec: parsed.data, result };
}

export async function createBrief(owner: SignedInUser, body: CreateBrief): Promise<Outcome<BriefRow>> {
  const checked = body.submit ? await validateForSubmission(body.spec) : null;
  if (checked && !checked.ok) return invalidInput('invalid_brief', checked.issues);
  const now = new Date();
  const { row, queued } = await db.transaction(async (tx) => {
    const [created] = await tx
      .insert(brief)
      .values({
        ownerId: owner.id,
        title: body.title,
        notes: body.notes,
        spec: checked?.ok ? checked.spec : body.spec,
        state: checked?.ok ? 'submitted' : 'draft',
        ...(checked?.ok ? { submittedAt: now, recommendedTopology: checked.result.recommended, summary: summarise(checked.result) } : {}),
      })
      .returning();
    if (!created) throw new Error('Insert returned no row');
    await tx
      .insert(stateChange)
      .values({ subjectType: 'brief', subjectId: created.id, fromState: null, toState: 'draft', actorId: owner.id });
    if (checked?.ok)
      await tx
        .insert(stateChange)
        .values({ subjectType: 'brief', subjectId: created.id, fromState: 'draft', toState: 'submitted', actorId: owner.id });
    if (!checked?.ok) return { row: created, queued: [] };
    await recordSpecVersion(tx, created.id, checked.spec, now);
    return { row: created, queued: await enqueueMail(tx, await submittedMails(tx, created)) };
  });
  await deliverQueuedMail(queued);
  return succeed(row);
}

interface DraftEdit {
  title?: string | undefined;
  spec?: Record<string, unknown> | undefined;
  notes?: string | undefined;
  submit?: boolean | undefined;
  state?: 'cancelled' | undefined;
}

/** The owner edits a draft (or a brief sent back for changes), submits it, or cancels a brief not yet taken into review. */
export async function editOwnBrief(owner: SignedInUser, row: BriefRow, edit: DraftEdit): Promise<Outcome<BriefRow>> {
  const changesContent = edit.title !== undefined || edit.spec !== undefined || edit.notes !== undefined || edit.submit === true;
  if (changesContent && row.state !== 'draft' && row.state !== 'changes-requested') {
    return refuse('wrong-state', 'Only a draft can be changed. This brief has been submitted; write to the consultancy to change it.');
  }
  if (edit.state === 'cancelled') {
    const moved = await db.transaction((tx) => moveBrief(tx, row, 'cancelled', 'owner', owner.id));
    return moved.ok ? succeed(moved.row) : refuse('wrong-state', moved.message);
  }
  const spec = edit.spec ?? (row.spec as Record<string, unknown>);
  const checked = edit.submit ? await validateForSubmission(spec) : null;
  if (checked && !checked.ok) return invalidInput('invalid_brief', checked.issues);

  const result = await db.transaction(async (tx) => {
    const [updated] = await tx
      .update(brief)
      .set({
        ...(edit.title !== undefined ? { title: edit.title } : {}),
        ...(edit.notes !== undefined ? { notes: edit.notes } : {}),
        spec: checked?.ok ? checked.spec : spec,
        updatedAt: new Date(),
      })
      .where(eq(brief.id, row.id))
      .returning();
    if (!updated) throw new Error('Update returned no row');
    if (!checked?.ok) return { ok: true as const, row: updated, queued: [] };
    const resubmitted = row.state === 'changes-requested';
    const now = new Date();
    const moved = await moveBrief(tx, updated, 'submitted', 'owner', owner.id, resubmitted ? 'Resubmitted with changes' : '', {
      submittedAt: now,
      recommendedTopology: checked.result.recommended,
      summary: summarise(checked.result),
    });
    if (!moved.ok) return moved;
    await recordSpecVersion(tx, row.id, checked.spec, now);
    // The engineers' notice is queued with the submission: both happen, or neither.
    return { ...moved, queued: await enqueueMail(tx, await submittedMails(tx, moved.row, resubmitted)) };
  });
  if (!result.ok) return refuse('wrong-state', result.message);
  await deliverQueuedMail(result.queued);
  return succeed(result.row);
}

/**
 * The owner deletes a draft for good: the row, its history and its files (rows and bytes). Nobody
 * else has seen a draft, so nothing is kept; a submitted brief is withdrawn instead.
 */
export async function deleteDraft(owner: SignedInUser, row: BriefRow): Promise<Outcome<{ id: string }>> {
  if (row.ownerId !== owner.id) return notYours();
  if (row.state !== 'draft') return refuse('wrong-state', 'Only a draft can be deleted; withdraw a submitted brief on its page instead.');
  const storageKeys = await db.transaction(async (tx) => {
    const files = await tx.select({ key: briefFile.storageKey }).from(briefFile).where(eq(briefFile.briefId, row.id));
    // Conditional on the state read: a draft submitted meanwhile is not deleted.
    const [gone] = await tx
      .delete(brief)
      .where(and(eq(brief.id, row.id), eq(brief.state, 'draft')))
      .returning({ id: brief.id });
    if (!gone) return null;
    await tx.delete(stateChange).where(and(eq(stateChange.subjectType, 'brief'), eq(stateChange.subjectId, row.id)));
    return files.map((f) => f.key);
  });
  if (!storageKeys)
    return refuse('wrong-state', 'This draft was submitted meanwhile, so it was not deleted; withdraw it on its page instead.');
  await Promise.all(storageKeys.map((key) => uploadStore.remove(key)));
  return succeed({ id: row.id });
}

/** An engineer or admin moves a brief along (into review, declined, in design…). */
export async function moveAsStaff(staff: SignedInUser, row: BriefRow, to: BriefState, note: string): Promise<Outcome<BriefRow>> {
  if (to === 'changes-requested') return requestChanges(staff, row, note);
  const moved = await db.transaction((tx) => moveBrief(tx, row, to, 'staff', staff.id, note));
  return moved.ok ? succeed(moved.row) : refuse('wrong-state', moved.message);
}

/**
 * Sends a brief back to its client with what should change: the request is recorded with the
 * move, posted in the brief's thread, and e-mailed to the client (with the link to edit it)
 * through the outbox, all in one transaction.
 */
async function requestChanges(staff: SignedInUser, row: BriefRow, request: string): Promise<Outcome<BriefRow>> {
  const body = request.trim();
  if (!body) return invalidInput('invalid_move', [{ path: 'note', message: 'Say what the client should change.' }]);
  const result = await db.transaction(async (tx) => {
    const moved = await moveBrief(tx, row, 'changes-requested', 'staff', staff.id, body);
    if (!moved.ok) return moved;
    await tx.insert(briefMessage).values({ briefId: row.id, authorId: staff.id, body });
    const [owner] = await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.id, row.ownerId)).limit(1);
    const queued = owner ? await enqueueMail(tx, [changesRequestedMail(moved.row, owner, staff.name, body)]) : [];
    return { ...moved, queued };
  });
  if (!result.ok) return refuse('wrong-state', result.message);
  await deliverQueuedMail(result.queued);
  return succeed(result.row);
}

/** What the engineer asked to change, as recorded with the latest move back to the client. */
export async function changeRequestOf(briefId: string): Promise<string | null> {
  const [move] = await db
    .select({ note: stateChange.note })
    .from(stateChange)
    .where(and(eq(stateChange.subjectType, 'brief'), eq(stateChange.subjectId, briefId), eq(stateChange.toState, 'changes-requested')))
    .orderBy(desc(stateChange.createdAt))
    .limit(1);
  return move?.note ?? null;
}

/** The brief's submitted specs, oldest first. */
export async function specVersionsOf(briefId: string) {
  return db
    .select({ number: briefSpecVersion.number, spec: briefSpecVersion.spec, createdAt: briefSpecVersion.createdAt })
    .from(briefSpecVersion)
    .where(eq(briefSpecVersion.briefId, briefId))
    .orderBy(briefSpecVersion.number);
}
