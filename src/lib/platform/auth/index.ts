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
    const link = new URL('/reset-password', baseURL);
    link.searchParams.set('token', token);
    await mailer.send(passwordResetMail(to, link.toString()));
  },
});
