/**
 * What clients and staff do to briefs: create, edit a draft, submit, move
 * between states. Each action is one transaction; routes only translate.
 */
import { eq } from 'drizzle-orm';
import { railSpecIssues, railSpecSchema, evaluate } from '../engine';
import { summarise } from './summary';
import type { BriefState } from './states';
import type { CreateBrief } from './requests';
import { moveBrief } from './moves.server';
import type { BriefRow } from './briefs.server';
import { currentCatalog } from '~/lib/catalog/index.server';
import { db } from '../platform/db';
import { brief, stateChange } from '../platform/db/schema';
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';
import type { SignedInUser } from '../platform/http/guard';
import { submittedMails } from './mail.server';
import { deliverQueuedMail } from '../platform/mail/mailer';
import { enqueueMail } from '../platform/mail/outbox';

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
    return { row: created, queued: checked?.ok ? await enqueueMail(tx, await submittedMails(tx, created)) : [] };
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

/** The owner edits a draft, submits it, or cancels a brief not yet taken into review. */
export async function editOwnBrief(owner: SignedInUser, row: BriefRow, edit: DraftEdit): Promise<Outcome<BriefRow>> {
  const changesContent = edit.title !== undefined || edit.spec !== undefined || edit.notes !== undefined || edit.submit === true;
  if (changesContent && row.state !== 'draft') {
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
    const moved = await moveBrief(tx, updated, 'submitted', 'owner', owner.id, '', {
      submittedAt: new Date(),
      recommendedTopology: checked.result.recommended,
      summary: summarise(checked.result),
    });
    // The engineers' notice is queued with the submission: both happen, or neither.
    return moved.ok ? { ...moved, queued: await enqueueMail(tx, await submittedMails(tx, moved.row)) } : moved;
  });
  if (!result.ok) return refuse('wrong-state', result.message);
  await deliverQueuedMail(result.queued);
  return succeed(result.row);
}

/** An engineer or admin moves a brief along (into review, declined, in design…). */
export async function moveAsStaff(staff: SignedInUser, row: BriefRow, to: BriefState, note: string): Promise<Outcome<BriefRow>> {
  const moved = await db.transaction((tx) => moveBrief(tx, row, to, 'staff', staff.id, note));
  return moved.ok ? succeed(moved.row) : refuse('wrong-state', moved.message);
}
