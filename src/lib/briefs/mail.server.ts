import { eq, inArray } from 'drizzle-orm';
import type { DbOrTx } from '../platform/db/connect';
import { clientProfile, user } from '../platform/db/schema';
import type { BriefRow } from './briefs.server';
import { appUrl } from '../platform/links';
import type { OutgoingMail } from '../platform/mail/transport';

/** The mail telling every engineer that a brief arrived (or came back with changes), and the client that it reached us; read inside the submitting transaction. */
export async function submittedMails(tx: DbOrTx, row: BriefRow, resubmitted = false): Promise<OutgoingMail[]> {
  const [staff, owner] = await Promise.all([
    tx
      .select({ email: user.email })
      .from(user)
      .where(inArray(user.role, ['engineer'])),
    tx
      .select({ name: user.name, email: user.email, company: clientProfile.company })
      .from(user)
      .leftJoin(clientProfile, eq(clientProfile.userId, user.id))
      .where(eq(user.id, row.ownerId))
      .limit(1),
  ]);
  const who = owner[0] ? `${owner[0].name}${owner[0].company ? ` (${owner[0].company})` : ''}` : 'A client';
  const summary = row.summary as { topology?: string } | null;
  const notices: OutgoingMail[] = staff.map(({ email }) => ({
    kind: 'brief-submitted',
    to: email,
    subject: `${resubmitted ? 'Brief resubmitted' : 'New brief'}: ${row.title}`,
    text: [
      resubmitted
        ? `${who} changed the supply brief “${row.title}” as asked and submitted it again; the review shows what changed.`
        : `${who} submitted a supply brief: ${row.title}.`,
      summary?.topology
        ? `The engine's first pick is ${summary.topology}; review it before anything is promised.`
        : 'No option is feasible as briefed; it needs an engineer’s look.',
      '',
      `Open it: ${appUrl(`/desk/briefs/${row.id}`)}`,
    ].join('\n'),
    relatedId: row.id,
  }));
  const client = owner[0];
  if (!client) return notices;
  const received: OutgoingMail = {
    kind: 'brief-received',
    to: client.email,
    subject: `We received your brief: ${row.title}`,
    text: [
      `Dear ${client.name},`,
      '',
      resubmitted
        ? `Thank you for the changes to “${row.title}”. An engineer looks at the brief again and writes to you.`
        : `Thank you for your brief “${row.title}”. An engineer reviews it and writes to you with a quote or a question.`,
      '',
      `Its page, with any messages: ${appUrl(`/briefs/${row.id}`)}`,
    ].join('\n'),
    relatedId: row.id,
  };
  return [...notices, received];
}

/** A message in a brief's thread, e-mailed to each reader on the other side with the link to answer it. */
export function messageMails(
  row: BriefRow,
  authorName: string,
  body: string,
  readers: readonly { name: string; email: string }[],
  link: string,
  attachmentNames: readonly string[] = [],
): OutgoingMail[] {
  return readers.map((reader) => ({
    kind: 'brief-message',
    to: reader.email,
    subject: `Message on “${row.title}” from ${authorName}`,
    text: [
      `Dear ${reader.name},`,
      '',
      `${authorName} wrote on the brief “${row.title}”:`,
      '',
      ...body.split('\n').map((line) => `  ${line}`),
      '',
      ...(attachmentNames.length ? [`Attached (open them on the page): ${attachmentNames.join(', ')}`, ''] : []),
      `Read and answer it here: ${link}`,
    ].join('\n'),
    relatedId: row.id,
  }));
}

/** Tells the client that an engineer sent their brief back, with what should change and the link to edit it. */
export function changesRequestedMail(
  row: BriefRow,
  owner: { name: string; email: string },
  engineerName: string,
  request: string,
): OutgoingMail {
  return {
    kind: 'brief-changes-requested',
    to: owner.email,
    subject: `Changes requested: ${row.title}`,
    text: [
      `Dear ${owner.name},`,
      '',
      `${engineerName} looked at your brief “${row.title}” and asks for a change before it can be quoted:`,
      '',
      ...request.split('\n').map((line) => `  ${line}`),
      '',
      `Edit the brief and submit it again here: ${appUrl(`/briefs/new?draft=${row.id}`)}`,
      `Or answer on the brief's page: ${appUrl(`/briefs/${row.id}#messages`)}`,
    ].join('\n'),
    relatedId: row.id,
  };
}
