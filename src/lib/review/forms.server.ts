/**
 * The review page's plain forms (move the state, add an internal note): they
 * work without JavaScript and go through the same checks as the API.
 */
import { staffBriefPatchSchema } from '~/lib/briefs';
import { BRIEF_STATE_LOOK, lookOf } from '../../components/ui/state-look';
import { moveAsStaff } from '~/lib/briefs/index.server';
import type { BriefRow } from '~/lib/briefs/index.server';
import type { SignedInUser } from '../platform/http/guard';
import { addNote, noteRequestSchema } from '~/lib/briefs/index.server';

export type FormOutcome = { ok: true; done: 'moved' | 'noted' } | { ok: false; status: 400 | 409; message: string };

export const DONE_MESSAGES = {
  moved: 'State changed; the history below records it.',
  noted: 'Note added. Notes stay inside the consultancy.',
} as const;

export async function handleReviewForm(staff: SignedInUser, row: BriefRow, fields: Record<string, string>): Promise<FormOutcome> {
  if (fields.intent === 'move') {
    const parsed = staffBriefPatchSchema.safeParse({ status: fields.status, note: fields.note ?? '' });
    if (!parsed.success) return { ok: false, status: 400, message: parsed.error.issues[0]?.message ?? 'Choose one of the offered states.' };
    const moved = await moveAsStaff(staff, row, parsed.data.status, parsed.data.note);
    if (moved.ok) return { ok: true, done: 'moved' };
    return {
      ok: false,
      status: 409,
      message: `${'message' in moved ? moved.message : ''} It is now ${lookOf(BRIEF_STATE_LOOK, row.status).label.toLowerCase()}.`.trim(),
    };
  }
  if (fields.intent === 'note') {
    const parsed = noteRequestSchema.safeParse({ body: fields.body ?? '' });
    if (!parsed.success) return { ok: false, status: 400, message: parsed.error.issues[0]?.message ?? 'Write something in the note.' };
    await addNote(row.id, staff.id, parsed.data.body);
    return { ok: true, done: 'noted' };
  }
  return { ok: false, status: 400, message: 'This form is not one the page knows; reload the page and try again.' };
}
