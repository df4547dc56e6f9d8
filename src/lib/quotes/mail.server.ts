/** The e-mail that carries a quote to its client: plain text first, a simple HTML twin, the PDF attached. */
import { formatDate, formatMoney } from '../platform/format';
import { formatBp } from './pricing';
import type { OutgoingMail } from '../platform/mail/transport';
import { quotePdfName } from './render.server';
import { FIRM } from './firm';
import type { QuoteView } from './view.server';

const escape = (value: string) => value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function quoteMail(view: QuoteView, pdf: Buffer, quoteUrl: string): OutgoingMail {
  const { quote } = view;
  const money = (minor: number) => formatMoney(minor, quote.currency);
  const design = view.design ? `${view.design.topologyName}, revision ${view.revision.number}` : `revision ${view.revision.number}`;
  const figures: [string, string][] = [
    ['Design', design],
    ['Total', `${money(quote.totalMinor)} including ${formatBp(quote.taxRateBp)} tax`],
    ['Deposit on acceptance', `${money(quote.depositMinor)} (${formatBp(quote.depositBp)})`],
    ['Valid until', formatDate(quote.validUntil)],
  ];
  const cautionLine = view.design?.cautions.length
    ? 'The design carries safety cautions; they are set out in the quote. Please read them before anyone builds or tests the rail.'
    : 'The quote sets out the safety points that apply to every supply rail; please read them before anyone builds or tests it.';

  const text = [
    `Dear ${view.client.name},`,
    '',
    `Thank you for your brief “${view.brief.title}”. Our quote ${quote.number} is attached as a PDF.`,
    '',
    ...(quote.clientNote ? [quote.clientNote, ''] : []),
    ...figures.map(([label, value]) => `${label}: ${value}`),
    '',
    cautionLine,
    '',
    'You can read the quote, download it again and accept it here:',
    quoteUrl,
    '',
    'Once you accept, the deposit is paid on the same page and we schedule the design work. If anything in the brief has changed, reply to this e-mail and we will revise the quote.',
    '',
    'Kind regards,',
    `${FIRM.name} — ${FIRM.line}`,
    ...FIRM.address,
  ].join('\n');

  const html = `<!doctype html><html><body style="margin:0;padding:24px;background:#faf8f4;font-family:Manrope,Helvetica,Arial,sans-serif;color:#1e2329;font-size:15px;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;border:1px solid #e4dfd6;border-radius:8px;padding:28px">
<p style="margin:0 0 18px;font-size:20px;font-weight:800;color:#86421b">${escape(FIRM.name)}</p>
<p>Dear ${escape(view.client.name)},</p>
<p>Thank you for your brief “${escape(view.brief.title)}”. Our quote <strong>${escape(quote.number)}</strong> is attached as a PDF.</p>
${quote.clientNote ? `<p style="white-space:pre-line;border-left:3px solid #e4dfd6;padding-left:12px">${escape(quote.clientNote)}</p>` : ''}
<table style="border-collapse:collapse;width:100%;margin:12px 0 18px">${figures
    .map(
      ([label, value]) =>
        `<tr><td style="padding:6px 0;border-bottom:1px solid #e4dfd6;color:#4a525c">${escape(label)}</td><td style="padding:6px 0;border-bottom:1px solid #e4dfd6;text-align:right;font-weight:700">${escape(value)}</td></tr>`,
    )
    .join('')}</table>
<p style="background:#fcf4e2;border-left:3px solid #8a5a00;padding:10px 12px">${escape(cautionLine)}</p>
<p style="margin:22px 0"><a href="${escape(quoteUrl)}" style="background:#86421b;color:#ffffff;text-decoration:none;font-weight:700;padding:10px 18px;border-radius:6px">Open the quote</a></p>
<p>Once you accept, the deposit is paid on the same page and we schedule the design work. If anything in the brief has changed, reply to this e-mail and we will revise the quote.</p>
<p>Kind regards,<br>${escape(FIRM.name)} — ${escape(FIRM.line)}<br><span style="color:#6b7380">${FIRM.address.map(escape).join('<br>')}</span></p>
</div></body></html>`;

  return {
    kind: 'quote',
    to: view.client.email,
    subject: `Quote ${quote.number}: ${view.brief.title}`,
    text,
    html,
    attachments: [{ filename: quotePdfName(quote.number), content: pdf, contentType: 'application/pdf' }],
    relatedId: quote.id,
  };
}

/** The client as an engineer knows them: name, and company where there is one. */
const clientLabel = (view: QuoteView) => (view.client.company ? `${view.client.name} (${view.client.company})` : view.client.name);

/** Tells the engineer who drafted a quote that the client declined it, with the client's reason and the brief's link. */
export function declinedMail(view: QuoteView, engineer: { name: string; email: string }, reason: string, briefUrl: string): OutgoingMail {
  const who = clientLabel(view);
  return {
    kind: 'quote-declined',
    to: engineer.email,
    subject: `Quote ${view.quote.number} declined: ${view.brief.title}`,
    text: [
      `${who} declined quote ${view.quote.number} for “${view.brief.title}”.`,
      '',
      'Their reason:',
      ...reason.split('\n').map((line) => `  ${line}`),
      '',
      'The brief is back in review: revise the design and send a fresh quote, or decline the brief.',
      `Open it: ${briefUrl}`,
    ].join('\n'),
    relatedId: view.quote.id,
  };
}

/** Tells the engineer who drafted a quote that the client accepted it (with their purchase order, if given). */
export function acceptedMail(view: QuoteView, engineer: { email: string }, purchaseOrder: string | null, quoteUrl: string): OutgoingMail {
  const who = clientLabel(view);
  return {
    kind: 'quote-accepted',
    to: engineer.email,
    subject: `Quote ${view.quote.number} accepted: ${view.brief.title}`,
    text: [
      `${who} accepted quote ${view.quote.number} for “${view.brief.title}”.`,
      ...(purchaseOrder ? [`Their purchase order: ${purchaseOrder}`] : []),
      'The deposit is paid next, on the quote page; you are e-mailed when it arrives.',
      '',
      `The quote: ${quoteUrl}`,
    ].join('\n'),
    relatedId: view.quote.id,
  };
}
