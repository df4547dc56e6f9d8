/** The one way a brief changes state: checked against who may move it, conditional, recorded. */
import { and, eq } from 'drizzle-orm';
import { canMove, type Actor } from './transitions';
import type { Transaction } from '../platform/db/connect';
import { brief, stateChange, type BriefRow, type BriefState } from '../platform/db/schema';

export type MoveOutcome = { ok: true; row: BriefRow } | { ok: false; reason: 'wrong_state'; message: string };

/**
 * Moves a brief to a new state and records who did it, inside the caller's
 * transaction. The update is conditional on the state read, so two racing
 * moves cannot both win.
 */
export async function moveBrief(
  tx: Transaction,
  row: BriefRow,
  to: BriefState,
  actor: Actor,
  actorId: string | null,
  note = '',
  extra: Partial<typeof brief.$inferInsert> = {},
): Promise<MoveOutcome> {
  if (!canMove(row.state, to, actor)) {
    return { ok: false, reason: 'wrong_state', message: `A brief that is ${row.state} cannot move to ${to}.` };
  }
  const [updated] = await tx
    .update(brief)
    .set({ state: to, updatedAt: new Date(), ...extra })
    .where(and(eq(brief.id, row.id), eq(brief.state, row.state)))
    .returning();
  if (!updated) return { ok: false, reason: 'wrong_state', message: 'The brief changed state meanwhile; reload and try again.' };
  await tx.insert(stateChange).values({ subjectType: 'brief', subjectId: row.id, fromState: row.state, toState: to, actorId, note });
  return { ok: true, row: updated };
}
