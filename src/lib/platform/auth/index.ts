import { config } from '../config';
import { db } from '../db';
import { mailer } from '../mail/mailer';
import { createAuth } from './create-auth';
import { passwordResetMail } from './reset-mail';

const baseURL = config.publicBaseUrl ?? 'http://localhost:4321';

export const auth = createAuth({
  db,
  secret: config.authSecret,
  baseURL,
  production: config.production,
  sendResetPassword: async (to, token) => {
    await mailer.send(passwordResetMail(to, passwordLink(token)));
  },
});

/** The page where a reset or invitation token chooses a password. */
export function passwordLink(token: string): string {
  const link = new URL('/reset-password', baseURL);
  link.searchParams.set('token', token);
  return link.toString();
}
