/**
 * The notice e-mails a person may turn off, by role, in the words of the account page.
 * Receipts, quotes and account mail are not listed: they always go. Browser-safe.
 */
import { z } from 'zod';
import type { Role } from '../platform/auth/roles';

export interface NotificationKind {
  kind: string;
  label: string;
  roles: readonly Role[];
}

export const NOTIFICATION_KINDS: readonly NotificationKind[] = [
  { kind: 'brief-received', label: 'Your brief reached us', roles: ['client'] },
  { kind: 'brief-changes-requested', label: 'An engineer asks you to change a brief', roles: ['client'] },
  { kind: 'brief-message', label: 'A new message on a brief', roles: ['client', 'engineer', 'admin'] },
  { kind: 'brief-submitted', label: 'A brief was submitted or resubmitted', roles: ['engineer'] },
  { kind: 'quote-accepted', label: 'A client accepted your quote', roles: ['engineer', 'admin'] },
  { kind: 'quote-declined', label: 'A client declined your quote', roles: ['engineer', 'admin'] },
  { kind: 'deposit-paid', label: 'A deposit on your quote was paid', roles: ['engineer', 'admin'] },
  { kind: 'balance-paid', label: 'The balance of your invoice was paid', roles: ['engineer', 'admin'] },
];

export const notificationKindsFor = (role: Role) => NOTIFICATION_KINDS.filter((k) => k.roles.includes(role));

/** The account page's form: a ticked box sends `on`; an unticked one sends nothing. */
export const notificationFormSchema = z.object(
  Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k.kind, z.literal('on').optional()])) as Record<
    string,
    z.ZodOptional<z.ZodLiteral<'on'>>
  >,
);
