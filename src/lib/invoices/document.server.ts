/**
 * The balance invoice as a printed document, in the quote's house style: our
 * identifiers under the letterhead, who is billed and where, the lines, the tax
 * breakdown, the deposit already paid and the balance due.
 */
import { formatDate, formatMoney } from '../platform/format';
import { appUrl } from '../platform/links';
import { pdfmake } from '../platform/pdf/fonts';
import { formatBp } from '~/lib/quotes';
import { COPPER, heading, letterhead, priceLines, printedDocument, SOFT, text, totalsColumn, type Node } from '~/lib/quotes/index.server';
import type { InvoiceView } from './view.server';

/** Our registration number and tax id as the letterhead prints them; a blank one is left out. */
export function firmIdentifiers(row: { registrationNumber: string; taxId: string }): string[] {
  return [
    ...(row.registrationNumber ? [`Company registration ${row.registrationNumber}`] : []),
    ...(row.taxId ? [`VAT / tax id ${row.taxId}`] : []),
  ];
}

export function invoiceDocument(view: InvoiceView): object {
  const { invoice, quote } = view;
  const money = (minor: number) => formatMoney(minor, invoice.currency);
  const paid = invoice.state === 'paid';

  const facts: [string, string][] = [
    ['Issued', formatDate(invoice.issuedAt)],
    ['Quote', quote.number],
    ...(invoice.purchaseOrder ? ([['Your PO', invoice.purchaseOrder]] as [string, string][]) : []),
    ['Due', paid ? `Paid ${formatDate(invoice.paidAt)}` : 'On receipt'],
  ];
  const title: Node = {
    margin: [0, 22, 0, 0],
    columns: [
      {
        width: '*',
        stack: [
          { text: 'Invoice for the balance', color: SOFT, bold: true, fontSize: 10 },
          { text: invoice.number, fontSize: 20, bold: true, margin: [0, 2, 0, 6] },
          text(view.brief.title, { fontSize: 11, bold: true }),
        ],
      },
      {
        width: 190,
        table: { widths: [70, '*'], body: facts.map(([k, v]) => [text(k, { color: SOFT }), text(v, { bold: true, alignment: 'right' })]) },
        layout: 'noBorders',
      },
    ],
  };

  const address = invoice.billingAddress
    .split('\n')
    .map((l) => l.trim())
    .filter(Boolean);
  const billed: Node = {
    margin: [0, 14, 0, 0],
    stack: [
      { text: 'Billed to', color: SOFT, fontSize: 8.5, bold: true },
      text(view.client.company ? `${view.client.name}, ${view.client.company}` : view.client.name, { bold: true }),
      ...(address.length ? address : ['No billing address given']).map((l) => text(l)),
      text(view.client.email, { color: SOFT }),
    ],
  };

  const totals = totalsColumn([
    { label: 'Net', value: money(invoice.netMinor) },
    { label: `Tax (${formatBp(invoice.taxRateBp)})`, value: money(invoice.taxMinor) },
    { label: 'Gross', value: money(invoice.grossMinor), strong: true, ruled: true },
    { label: 'Deposit paid', value: `− ${money(invoice.depositPaidMinor)}` },
    { label: paid ? 'Balance (paid)' : 'Balance due', value: money(invoice.balanceMinor), strong: true, ruled: true },
  ]);

  const pageUrl = appUrl(`/quotes/${quote.id}`);
  const pay: Node = {
    margin: [0, 18, 0, 0],
    unbreakable: true,
    stack: [
      { text: paid ? 'Paid — thank you' : 'Pay the balance', style: 'h2', margin: [0, 0, 0, 4] },
      text(
        paid
          ? `The balance of ${money(invoice.balanceMinor)} was received on ${formatDate(invoice.paidAt)}. This invoice is settled.`
          : `Pay the balance of ${money(invoice.balanceMinor)} online on the quote's page; a receipt follows by e-mail.`,
      ),
      { text: pageUrl, link: pageUrl, color: COPPER, decoration: 'underline', margin: [0, 4, 0, 0] },
    ],
  };

  return printedDocument({
    title: `Invoice ${invoice.number} — ${view.brief.title}`,
    subject: 'Invoice for the balance of a DC supply rail design',
    footer: `Invoice ${invoice.number}`,
    date: invoice.issuedAt,
    content: [
      ...letterhead(firmIdentifiers(invoice)),
      title,
      billed,
      heading('Work delivered'),
      priceLines(view.lines, invoice.currency),
      totals,
      pay,
    ],
  });
}

export async function renderInvoicePdf(view: InvoiceView): Promise<Buffer> {
  return pdfmake.createPdf(invoiceDocument(view)).getBuffer();
}
