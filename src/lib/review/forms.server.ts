/**
 * The review page's plain forms (move the state, add an internal note): they
 * work without JavaScript and go through the same checks as the API.
 */
import { z } from 'zod';
import { staffBriefPatchSchema } from '~/lib/briefs';
import { BRIEF_STATE_LOOK, lookOf } from '../../components/ui/state-look';
import type { moveAsStaff } from '~/lib/briefs/index.server';
import type { BriefRow } from '~/lib/briefs/index.server';
import type { SignedInUser } from '../platform/http/guard';
import { addNote, noteRequestSchema } from '~/lib/briefs/index.server';
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';

export const reviewFormSchema = z.discriminatedUnion(
  'intent',
  [
    staffBriefPatchSchema.extend({ intent: z.literal('move'), confirm: z.literal('yes').optional() }),
    noteRequestSchema.extend({ intent: z.literal('note') }),
  ],
  { error: 'This form is not one the page knows; reload the page and try again.' },
);

export const DECLINE_CONFIRMATION =
  'Declining closes the brief and the client is told: tick “Yes, decline this brief” to confirm. Nothing was changed.';

export const DONE_MESSAGES = {
  moved: 'State changed; the history below records it.',
  noted: 'Note added. Notes stay inside the consultancy.',
} as const;

/**
 * `move` is the staff move with its consequences: the page passes the one that also
 * invoices the balance when the design is delivered (a domain this one cannot import).
 */
export async function handleReviewForm(
  staff: SignedInUser,
  row: BriefRow,
  fields: z.infer<typeof reviewFormSchema>,
  move: typeof moveAsStaff,
): Promise<Outcome<keyof typeof DONE_MESSAGES>> {
  if (fields.intent === 'note') {
    await addNote(row.id, staff.id, fields.body);
    return succeed('noted');
  }
  // Declining ends the client's brief: it takes a second, deliberate tick, so a slip of the list cannot do it.
  if (fields.state === 'declined' && fields.confirm !== 'yes')
    return invalidInput('confirm-decline', [{ path: 'confirm', message: DECLINE_CONFIRMATION }]);
  const moved = await move(staff, row, fields.state, fields.note);
  if (moved.ok) return succeed('moved');
  if (moved.kind === 'invalid') return moved;
  return refuse('wrong-state', `${moved.message} It is now ${lookOf(BRIEF_STATE_LOOK, row.state).label.toLowerCase()}.`);
}
