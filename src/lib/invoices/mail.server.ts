/** The e-mail that carries the balance invoice to the client, its PDF attached. */
import { formatMoney } from '../platform/format';
import { appUrl } from '../platform/links';
import type { OutgoingMail } from '../platform/mail/transport';
import { FIRM, formatBp } from '~/lib/quotes';
import { invoicePdfName } from './figures';
import type { InvoiceView } from './view.server';

export function invoiceMail(view: InvoiceView, pdf: Buffer): OutgoingMail {
  const { invoice, quote } = view;
  const money = (minor: number) => formatMoney(minor, invoice.currency);
  return {
    kind: 'balance-invoice',
    to: view.client.email,
    subject: `Invoice ${invoice.number}: balance of ${money(invoice.balanceMinor)} for ${view.brief.title}`,
    text: [
      `Dear ${view.client.name},`,
      '',
      `The design for “${view.brief.title}” is delivered. Our invoice ${invoice.number} for the balance of quote ${quote.number} is attached as a PDF.`,
      '',
      `Net:           ${money(invoice.netMinor)}`,
      `Tax (${formatBp(invoice.taxRateBp)}):   ${money(invoice.taxMinor)}`,
      `Gross:         ${money(invoice.grossMinor)}`,
      `Deposit paid:  ${money(invoice.depositPaidMinor)}`,
      `Balance due:   ${money(invoice.balanceMinor)}`,
      ...(invoice.purchaseOrder ? [`Your PO:       ${invoice.purchaseOrder}`] : []),
      '',
      'Pay the balance online, and download the invoice again, here:',
      appUrl(`/quotes/${quote.id}`),
      '',
      'Kind regards,',
      `${FIRM.name} — ${FIRM.line}`,
      ...FIRM.address,
    ].join('\n'),
    attachments: [{ filename: invoicePdfName(invoice.number), content: pdf, contentType: 'application/pdf' }],
    relatedId: quote.id,
  };
}
