import { config } from '../config';
import { db } from '../db';
import { logFailure } from '../log';
import { deliverDueMail, startOutboxWorker, type OutboxWorker } from './outbox';
import { createMailer } from './transport';

export const mailer = createMailer(db, config.smtpUrl, config.mailFrom);

let worker: OutboxWorker | null = null;

/** Started by the boot module once the tables exist; polls the outbox on this instance. */
export function startMailOutbox(): void {
  worker ??= startOutboxWorker(db, mailer, (error) => logFailure(error, { task: 'mail outbox' }));
}

/** Delivers mail just queued (after its transaction committed); the poller retries what the mail server refused. */
export async function deliverQueuedMail(ids: readonly string[]): Promise<void> {
  if (ids.length > 0) await deliverDueMail(db, mailer, { ids });
}
