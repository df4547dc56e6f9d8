/**
 * The rule for quoting a design that does not meet the brief: it may be quoted (a client may
 * accept a shortfall), but only with the engineer's reason, which stays on the quote for the
 * consultancy. Browser-safe.
 */
import { z } from 'zod';
import type { FieldIssue } from '../platform/outcome';

export const infeasibleReasonField = z.string().trim().max(1_000, 'Keep the reason under 1 000 characters.').optional();

/** The reason to keep on the quote (none for a feasible design), or the issue to answer when it is missing. */
export function infeasibleReasonFor(
  revision: { number: number; feasible: boolean },
  reason: string | undefined,
): { ok: true; reason: string | null } | { ok: false; issue: FieldIssue } {
  if (revision.feasible) return { ok: true, reason: null };
  const given = reason?.trim() ?? '';
  if (given) return { ok: true, reason: given };
  return {
    ok: false,
    issue: {
      path: 'infeasibleReason',
      message: `The design of revision ${revision.number} does not meet the brief. Say why it is quoted all the same, or choose a feasible revision.`,
    },
  };
}

/** The quote's first history entry when its design does not meet the brief. */
export const infeasibleDraftNote = (revisionNumber: number, reason: string) =>
  `Drafted from revision ${revisionNumber}, whose design does not meet the brief: ${reason}`;
