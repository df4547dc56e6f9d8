import type { OutgoingMail } from '../mail/transport';

export function passwordResetMail(to: { email: string; name: string }, url: string): OutgoingMail {
  return {
    kind: 'password-reset',
    to: to.email,
    subject: 'Reset your Railwright password',
    text: [
      `Hello ${to.name},`,
      '',
      'Someone (we hope you) asked to reset the password of your Railwright account.',
      'Open this link within one hour to choose a new password:',
      '',
      url,
      '',
      'If you did not ask for this, ignore this message; your password stays as it is.',
      '',
      '— Railwright',
    ].join('\n'),
  };
}
