import { simpleParser, type AddressObject } from 'mailparser';

export interface MailAddress {
  address: string;
  name: string;
}

export interface StoredAttachment {
  filename: string | null;
  contentType: string;
  size: number;
  contentId: string | null;
  disposition: string | null;
  contentBase64: string;
}

/** One received message as kept on disk: the parsed fields plus the exact bytes received. */
export interface StoredMessage {
  id: string;
  receivedAt: string;
  /** The SMTP envelope: who the sending server said it was from and delivered it to (Bcc included). */
  envelope: { from: string | null; to: string[] };
  messageId: string | null;
  from: MailAddress | null;
  to: MailAddress[];
  cc: MailAddress[];
  replyTo: MailAddress[];
  subject: string;
  date: string | null;
  text: string | null;
  html: string | null;
  attachments: StoredAttachment[];
  /** The whole message as received (.eml), base64 so every byte survives JSON. */
  rawBase64: string;
}

export interface AttachmentSummary {
  index: number;
  filename: string | null;
  contentType: string;
  size: number;
}

export interface MessageSummary {
  id: string;
  receivedAt: string;
  from: MailAddress | null;
  to: MailAddress[];
  subject: string;
  date: string | null;
  attachments: AttachmentSummary[];
}

function addresses(field: AddressObject | AddressObject[] | undefined): MailAddress[] {
  const objects = field === undefined ? [] : Array.isArray(field) ? field : [field];
  const flat: MailAddress[] = [];
  const visit = (entries: AddressObject['value']) => {
    for (const entry of entries) {
      if (entry.group) visit(entry.group);
      else if (entry.address) flat.push({ address: entry.address, name: entry.name });
    }
  };
  for (const object of objects) visit(object.value);
  return flat;
}

export async function parseMessage(
  raw: Buffer,
  meta: { id: string; receivedAt: Date; envelope: StoredMessage['envelope'] },
): Promise<StoredMessage> {
  // cid: links stay as sent, so the HTML shows what the sender wrote rather than inlined data URLs.
  const mail = await simpleParser(raw, { keepCidLinks: true, skipTextToHtml: true });
  return {
    id: meta.id,
    receivedAt: meta.receivedAt.toISOString(),
    envelope: meta.envelope,
    messageId: mail.messageId ?? null,
    from: addresses(mail.from)[0] ?? null,
    to: addresses(mail.to),
    cc: addresses(mail.cc),
    replyTo: addresses(mail.replyTo),
    subject: mail.subject ?? '',
    date: mail.date ? mail.date.toISOString() : null,
    text: mail.text ?? null,
    html: typeof mail.html === 'string' ? mail.html : null,
    attachments: mail.attachments.map((attachment) => ({
      filename: attachment.filename ?? null,
      contentType: attachment.contentType,
      size: attachment.size,
      contentId: attachment.contentId ?? null,
      disposition: attachment.contentDisposition ?? null,
      contentBase64: attachment.content.toString('base64'),
    })),
    rawBase64: raw.toString('base64'),
  };
}

export function summarise(message: StoredMessage): MessageSummary {
  return {
    id: message.id,
    receivedAt: message.receivedAt,
    from: message.from,
    to: message.to,
    subject: message.subject,
    date: message.date,
    attachments: message.attachments.map((attachment, index) => ({
      index,
      filename: attachment.filename,
      contentType: attachment.contentType,
      size: attachment.size,
    })),
  };
}
