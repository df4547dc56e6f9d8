import { config } from '../config';
import { db } from '../db';
import { createMailer } from './transport';

export const mailer = createMailer(db, config.smtpUrl, config.mailFrom);
