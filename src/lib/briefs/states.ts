/** The states of a brief (docs/product.md, moves in docs/states.md): browser-safe, so forms and islands share them with the database. */
export const BRIEF_STATES = [
  'draft',
  'submitted',
  'changes-requested',
  'in-review',
  'quoted',
  'accepted',
  'deposit-paid',
  'in-design',
  'delivered',
  'paid-in-full',
  'declined',
  'expired',
  'cancelled',
] as const;
export type BriefState = (typeof BRIEF_STATES)[number];
