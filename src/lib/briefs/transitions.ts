/**
 * Who may move a brief from which state to which. Shared by the API, the
 * pages (to offer only the moves that will be accepted) and the tests.
 */
import type { BriefState } from './states';

export type Actor = 'owner' | 'staff' | 'system';

const MOVES: Record<Actor, Partial<Record<BriefState, readonly BriefState[]>>> = {
  owner: {
    draft: ['submitted', 'cancelled'],
    submitted: ['cancelled'],
    // Sent back by an engineer: the owner edits it in the wizard and submits it again.
    'changes-requested': ['submitted', 'cancelled'],
  },
  staff: {
    submitted: ['in-review', 'changes-requested', 'declined', 'cancelled'],
    'in-review': ['changes-requested', 'declined', 'cancelled'],
    quoted: ['in-review', 'expired', 'cancelled'],
    'deposit-paid': ['in-design'],
    'in-design': ['delivered'],
  },
  // Moves made by the product itself: sending a quote, a client's acceptance, a paid deposit, a lapsed acceptance, a paid balance.
  system: {
    'in-review': ['quoted'],
    // A declined quote sends the brief back to review: the engineer revises and quotes again, or declines the brief.
    quoted: ['accepted', 'expired', 'in-review'],
    // Back to review when the accepted quote lapses unpaid: the engineer sends a fresh quote.
    accepted: ['deposit-paid', 'in-review'],
    // The balance invoiced on delivery is paid.
    delivered: ['paid-in-full'],
  },
};

export function canMove(from: BriefState, to: BriefState, actor: Actor): boolean {
  return MOVES[actor][from]?.includes(to) ?? false;
}

export function movesFor(from: BriefState, actor: Actor): readonly BriefState[] {
  return MOVES[actor][from] ?? [];
}
