import { randomBytes } from 'node:crypto';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { MessageStore, startMailCatcher, type MailCatcher, type MessageSummary, type StoredMessage } from '../../../mail-catcher/index.ts';

let dir: string;
let catcher: MailCatcher;

const pdf = Buffer.concat([Buffer.from('%PDF-1.7\n'), randomBytes(40_000), Buffer.from('\n%%EOF\n')]);

async function api<T>(path: string, init?: RequestInit): Promise<T> {
  const response = await fetch(`${catcher.apiUrl}${path}`, init);
  expect(response.ok, `${init?.method ?? 'GET'} ${path} answered ${response.status}`).toBe(true);
  return (await response.json()) as T;
}

function sendQuote(subject = 'Your quote Q-2026-0007 from Railwright') {
  return nodemailer.createTransport(catcher.smtpUrl).sendMail({
    from: 'Railwright Quotes <quotes@railwright.test>',
    to: ['Ada Client <client@demo.railwright.test>', 'buyer@demo.railwright.test'],
    cc: 'engineer@demo.railwright.test',
    bcc: 'archive@railwright.test',
    subject,
    text: 'Dear Ada,\n\nyour quote totals £1,234.50.\n',
    html: '<p>Dear Ada,</p><p>your quote totals <strong>£1,234.50</strong>.</p>',
    attachments: [{ filename: 'Q-2026-0007.pdf', content: pdf, contentType: 'application/pdf' }],
  });
}

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'railwright-mail-'));
  catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, dir });
});

afterAll(async () => {
  await catcher.close();
  await rm(dir, { recursive: true, force: true });
});

beforeEach(async () => {
  await api('/messages', { method: 'DELETE' });
});

describe('the mail catcher', () => {
  it('stores a message with its PDF attachment, answering only once it is readable', async () => {
    const info = await sendQuote();
    const storedId = /stored as (\S+)/.exec(info.response)?.[1];

    const list = await api<MessageSummary[]>('/messages');
    expect(list).toHaveLength(1);
    const [summary] = list;
    expect(summary?.id).toBe(storedId);
    expect(summary).toMatchObject({
      subject: 'Your quote Q-2026-0007 from Railwright',
      from: { address: 'quotes@railwright.test', name: 'Railwright Quotes' },
      to: [
        { address: 'client@demo.railwright.test', name: 'Ada Client' },
        { address: 'buyer@demo.railwright.test', name: '' },
      ],
      attachments: [{ index: 0, filename: 'Q-2026-0007.pdf', contentType: 'application/pdf', size: pdf.length }],
    });

    const message = await api<StoredMessage>(`/messages/${storedId}`);
    expect(message.text).toBe('Dear Ada,\n\nyour quote totals £1,234.50.\n');
    expect(message.html).toContain('<strong>£1,234.50</strong>');
    expect(message.cc).toEqual([{ address: 'engineer@demo.railwright.test', name: '' }]);
    expect(message.envelope.from).toBe('quotes@railwright.test');
    expect(message.envelope.to).toContain('archive@railwright.test');
    expect(message.messageId).toBe(info.messageId);
    expect(Date.parse(message.date ?? '')).not.toBeNaN();
    expect(Buffer.from(message.attachments[0]?.contentBase64 ?? '', 'base64').equals(pdf)).toBe(true);

    const attachment = await fetch(`${catcher.apiUrl}/messages/${storedId}/attachments/0`);
    expect(attachment.headers.get('content-type')).toBe('application/pdf');
    expect(attachment.headers.get('content-disposition')).toContain('Q-2026-0007.pdf');
    expect(Buffer.from(await attachment.arrayBuffer()).equals(pdf)).toBe(true);

    const raw = await fetch(`${catcher.apiUrl}/messages/${storedId}/raw`);
    expect(raw.headers.get('content-type')).toBe('message/rfc822');
    expect(await raw.text()).toMatch(/^Subject: Your quote Q-2026-0007 from Railwright\r$/m);
  });

  it('accepts a sender that logs in', async () => {
    const transport = nodemailer.createTransport({
      host: '127.0.0.1',
      port: catcher.smtpPort,
      secure: false,
      auth: { user: 'app', pass: 'anything' },
    });
    await transport.sendMail({
      from: 'app@railwright.test',
      to: 'client@demo.railwright.test',
      subject: 'Password reset',
      text: 'Reset it.',
    });
    const list = await api<MessageSummary[]>('/messages');
    expect(list.map((message) => message.subject)).toEqual(['Password reset']);
  });

  it('lists newest first and filters by recipient', async () => {
    await sendQuote('first');
    await sendQuote('second');
    await nodemailer
      .createTransport(catcher.smtpUrl)
      .sendMail({ from: 'a@railwright.test', to: 'other@example.test', subject: 'third', text: '3' });
    expect((await api<MessageSummary[]>('/messages')).map((message) => message.subject)).toEqual(['third', 'second', 'first']);
    expect((await api<MessageSummary[]>('/messages?to=Other@Example.test')).map((message) => message.subject)).toEqual(['third']);
    expect((await api<MessageSummary[]>('/messages?to=archive@railwright.test')).map((message) => message.subject)).toEqual([
      'second',
      'first',
    ]);
  });

  it('keeps messages across a restart, readable from the folder by any process', async () => {
    await sendQuote('kept');
    await catcher.close();
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, dir });
    expect((await api<MessageSummary[]>('/messages')).map((message) => message.subject)).toEqual(['kept']);
    const fromDisk = await new MessageStore(dir).list();
    expect(fromDisk.map((message) => message.subject)).toEqual(['kept']);
  });

  it('clears everything on DELETE /messages, and deletes one message by id', async () => {
    await sendQuote('one');
    await sendQuote('two');
    const [newest] = await api<MessageSummary[]>('/messages');
    expect(await api(`/messages/${newest?.id}`, { method: 'DELETE' })).toEqual({ deleted: 1 });
    expect((await api<MessageSummary[]>('/messages')).map((message) => message.subject)).toEqual(['one']);
    expect(await api('/messages', { method: 'DELETE' })).toEqual({ deleted: 1 });
    expect(await api<MessageSummary[]>('/messages')).toEqual([]);
    expect((await readdir(dir)).filter((name) => name.endsWith('.json'))).toEqual([]);
  });

  it('answers 404 with what exists for an unknown message or attachment', async () => {
    await sendQuote();
    const [summary] = await api<MessageSummary[]>('/messages');
    const missingAttachment = await fetch(`${catcher.apiUrl}/messages/${summary?.id}/attachments/1`);
    expect(missingAttachment.status).toBe(404);
    expect(((await missingAttachment.json()) as { error: string }).error).toContain('has 1 attachment');
    const missingMessage = await fetch(`${catcher.apiUrl}/messages/0000000000000-0000-000000`);
    expect(missingMessage.status).toBe(404);
    const traversal = await fetch(`${catcher.apiUrl}/messages/..%2F..%2Fetc%2Fpasswd`);
    expect(traversal.status).toBe(404);
  });
});

describe('the size limit', () => {
  it('refuses a message over the limit with 552 and stores nothing', async () => {
    const smallDir = await mkdtemp(join(tmpdir(), 'railwright-mail-small-'));
    const small = await startMailCatcher({ smtpPort: 0, httpPort: 0, dir: smallDir, sizeLimit: 10_000 });
    try {
      const sending = nodemailer.createTransport(small.smtpUrl).sendMail({
        from: 'a@railwright.test',
        to: 'b@railwright.test',
        subject: 'too big',
        attachments: [{ filename: 'big.bin', content: randomBytes(20_000) }],
      });
      await expect(sending).rejects.toMatchObject({ responseCode: 552 });
      expect(await new MessageStore(smallDir).list()).toEqual([]);
    } finally {
      await small.close();
      await rm(smallDir, { recursive: true, force: true });
    }
  });
});
