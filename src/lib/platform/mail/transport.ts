import nodemailer, { type Transporter } from 'nodemailer';
import type { Database } from '../db/connect';
import { mailLog } from '../db/schema';
import { withoutSecrets } from './redact';

export interface OutgoingMail {
  kind: string;
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
  relatedId?: string;
}

export type MailResult = { ok: true; messageId: string } | { ok: false; error: string };

export interface Mailer {
  send(mail: OutgoingMail): Promise<MailResult>;
}

/**
 * Sends over SMTP (a real server in production, the local catcher in
 * development and tests) and records every attempt, sent or failed, in the mail log
 * (its body without one-time tokens).
 */
export function createMailer(db: Database, smtpUrl: string, from: string): Mailer {
  let transport: Transporter | undefined;
  return {
    async send(mail) {
      // Bounded waits: a send ends (sent or failed) well within the outbox's 60 s claim.
      transport ??= nodemailer.createTransport({ url: smtpUrl, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 });
      const attachmentName = mail.attachments?.[0]?.filename ?? null;
      try {
        const info = await transport.sendMail({
          from,
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          ...(mail.html ? { html: mail.html } : {}),
          ...(mail.attachments ? { attachments: mail.attachments } : {}),
        });
        const messageId = String(info.messageId ?? '');
        await db.insert(mailLog).values({
          kind: mail.kind,
          toAddress: mail.to,
          subject: mail.subject,
          bodyText: withoutSecrets(mail.text),
          attachmentName,
          state: 'sent',
          messageId,
          relatedId: mail.relatedId ?? null,
        });
        return { ok: true, messageId };
      } catch (err) {
        const error = err instanceof Error ? err.message : String(err);
        await db.insert(mailLog).values({
          kind: mail.kind,
          toAddress: mail.to,
          subject: mail.subject,
          bodyText: withoutSecrets(mail.text),
          attachmentName,
          state: 'failed',
          error,
          relatedId: mail.relatedId ?? null,
        });
        return { ok: false, error };
      }
    },
  };
}
