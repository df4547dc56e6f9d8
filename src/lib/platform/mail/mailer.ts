import { config } from './config';
import { db } from './db';
import { createMailer } from './mail';

export const mailer = createMailer(db, config.smtpUrl, config.mailFrom);
