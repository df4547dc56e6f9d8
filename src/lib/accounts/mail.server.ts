import { ROLE_LABELS, type Role } from '../platform/auth/roles';
import type { OutgoingMail } from '../platform/mail/transport';

/** An invitation waits longer than a reset link: the person may not read mail the same day. */
export const INVITE_LINK_SECONDS = 3 * 24 * 60 * 60;
export const INVITE_LINK_DAYS = INVITE_LINK_SECONDS / 86_400;

/** The invitation an admin sends: its link chooses the first password and then stops working. */
export function inviteMail(to: { email: string; name: string }, role: Role, invitedBy: string, link: string): OutgoingMail {
  return {
    kind: 'invitation',
    to: to.email,
    subject: 'You are invited to Railwright',
    text: [
      `Hello ${to.name},`,
      '',
      `${invitedBy} has made you a Railwright account (${ROLE_LABELS[role].toLowerCase()}) with this e-mail address.`,
      `Open this link within ${INVITE_LINK_DAYS} days to choose your password; it works once:`,
      '',
      link,
      '',
      'After that, sign in with this address and the password you chose.',
      'If you were not expecting this, ignore this message; nobody can use the account without the link.',
      '',
      '— Railwright',
    ].join('\n'),
  };
}
