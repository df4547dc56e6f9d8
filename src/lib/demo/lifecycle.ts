import type { BriefState } from '../platform/db/schema';

interface Step {
  from: BriefState | null;
  to: BriefState;
  by: 'client' | 'staff';
  /** Kept with the move, as an engineer's reason is. */
  note?: string;
}

/** The main line of a brief's life, and who takes each step. */
const MAIN_LINE: Step[] = [
  { from: null, to: 'draft', by: 'client' },
  { from: 'draft', to: 'submitted', by: 'client' },
  { from: 'submitted', to: 'in-review', by: 'staff' },
  { from: 'in-review', to: 'quoted', by: 'staff' },
  { from: 'quoted', to: 'accepted', by: 'client' },
  { from: 'accepted', to: 'deposit-paid', by: 'client' },
  { from: 'deposit-paid', to: 'in-design', by: 'staff' },
  { from: 'in-design', to: 'delivered', by: 'staff' },
  { from: 'delivered', to: 'paid-in-full', by: 'client' },
];

/** The recorded history of a demo brief that has reached `state` along the main line. */
export function lifecycleTo(state: BriefState): Step[] {
  const end = MAIN_LINE.findIndex((s) => s.to === state);
  if (end < 0) throw new Error(`The demo scenario only uses main-line states, not ${state}`);
  return MAIN_LINE.slice(0, end + 1);
}

/** The recorded history of a demo brief whose quote the client declined: quoted, then back in review. */
export function declinedLifecycle(): Step[] {
  return [...lifecycleTo('quoted'), { from: 'quoted', to: 'in-review', by: 'client' }];
}

/** The recorded history of a demo brief an engineer sent back to its client, with the request. */
export function changesRequestedLifecycle(request: string): Step[] {
  return [...lifecycleTo('submitted'), { from: 'submitted', to: 'changes-requested', by: 'staff', note: request }];
}
