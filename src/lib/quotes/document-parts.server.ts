/**
 * The pieces every printed document of the consultancy is made of (the quote,
 * the balance invoice): the letterhead, the price lines, a totals column and
 * the page itself with its footer. pdfmake document descriptions.
 */
import { formatMoney } from '../platform/format';
import { BASE_FAMILY, runs } from '../platform/pdf/fonts';
import { FIRM } from './firm';
import { formatQuantity } from './pricing';
import type { QuoteLineRow } from './core.server';
import type { Row } from './view.server';

export const INK = '#1e2329';
export const SOFT = '#4a525c';
export const FAINT = '#6b7380';
export const COPPER = '#86421b';
export const RULE = '#e4dfd6';

export type Node = Record<string, unknown> | string;

export const text = (value: string, style: Record<string, unknown> = {}): Node => ({ text: runs(value), ...style });

export function heading(title: string): Node {
  return { text: runs(title), style: 'h2', margin: [0, 18, 0, 6] };
}

/** Label–value pairs as a ruled two-column table. */
export function pairs(rows: Row[]): Node {
  return {
    table: { widths: [150, '*'], body: rows.map((r) => [text(r.label, { color: SOFT, bold: true }), text(r.value)]) },
    layout: {
      hLineWidth: (i: number) => (i === 0 ? 0 : 0.5),
      vLineWidth: () => 0,
      hLineColor: () => RULE,
      paddingLeft: () => 0,
      paddingTop: () => 4,
      paddingBottom: () => 4,
    },
  };
}

/** A table with a strong rule under its header row and faint rules between the others. */
export const ledger = {
  hLineWidth: (i: number, node: { table: { body: unknown[] } }) => (i === 1 ? 1.2 : i === 0 || i === node.table.body.length ? 0 : 0.5),
  vLineWidth: () => 0,
  hLineColor: (i: number) => (i === 1 ? INK : RULE),
  paddingLeft: (i: number) => (i === 0 ? 0 : 6),
  paddingRight: () => 0,
  paddingTop: () => 4,
  paddingBottom: () => 4,
};

/** The firm's name and line on the left, its address on the right (with more lines, such as its identifiers), and a copper rule. */
export function letterhead(extraLines: readonly string[] = []): Node[] {
  return [
    {
      columns: [
        {
          width: '*',
          stack: [
            { text: FIRM.name, fontSize: 22, bold: true, color: COPPER, characterSpacing: 0.3 },
            { text: FIRM.line, color: SOFT, margin: [0, 2, 0, 0] },
          ],
        },
        {
          width: 'auto',
          stack: [...FIRM.address, FIRM.email, ...extraLines].map((line) => text(line, { color: SOFT, fontSize: 8.5, alignment: 'right' })),
        },
      ],
    },
    { canvas: [{ type: 'line', x1: 0, y1: 8, x2: 499, y2: 8, lineWidth: 1.5, lineColor: COPPER }] },
  ];
}

/** The priced lines: description, quantity, unit, unit price, amount. */
export function priceLines(lines: readonly QuoteLineRow[], currency: string): Node {
  const money = (minor: number) => formatMoney(minor, currency);
  return {
    table: {
      headerRows: 1,
      widths: ['*', 44, 34, 70, 74],
      body: [
        ['Description', 'Qty', 'Unit', 'Unit price', 'Amount'].map((h, i) => ({
          text: h,
          bold: true,
          color: SOFT,
          alignment: i === 0 || i === 2 ? 'left' : 'right',
        })),
        ...lines.map((l) => [
          text(l.description),
          { text: formatQuantity(l.quantityMilli), alignment: 'right' },
          text(l.unit),
          { text: money(l.unitPriceMinor), alignment: 'right' },
          { text: money(l.totalMinor), alignment: 'right' },
        ]),
      ],
    },
    layout: ledger,
  };
}

export interface TotalsRow {
  label: string;
  value: string;
  strong?: boolean;
  /** A rule above the row, as above a total. */
  ruled?: boolean;
}

/** Label and figure pairs in a right-hand column under the price lines. */
export function totalsColumn(rows: readonly TotalsRow[]): Node {
  return {
    margin: [0, 8, 0, 0],
    columns: [
      { width: '*', text: '' },
      {
        width: 250,
        table: {
          widths: ['*', 90],
          body: rows.map((r) => [
            { text: r.label, alignment: 'right', bold: r.strong, color: r.strong ? INK : SOFT },
            { text: r.value, alignment: 'right', bold: r.strong, fontSize: r.strong ? 11 : 9.5 },
          ]),
        },
        layout: {
          hLineWidth: (i: number) => (rows[i]?.ruled ? 1.2 : 0),
          vLineWidth: () => 0,
          hLineColor: () => INK,
          paddingTop: () => 3,
          paddingBottom: () => 3,
        },
      },
    ],
  };
}

export interface PageFrame {
  /** The document's title in the PDF's properties. */
  title: string;
  subject: string;
  /** What the footer names beside the page number, e.g. "Quote RW-2026-0007". */
  footer: string;
  /** The document's date in its properties, so the same document renders to the same bytes. */
  date: Date;
  content: Node[];
}

/** An A4 document in the house type, with the firm and the document named in every page's footer. */
export function printedDocument(frame: PageFrame): object {
  return {
    pageSize: 'A4',
    pageMargins: [48, 44, 48, 56],
    info: { title: frame.title, author: FIRM.name, subject: frame.subject, creator: FIRM.name, creationDate: frame.date },
    // Contextual alternates change nothing in the text but double the time to set it.
    defaultStyle: { font: BASE_FAMILY, fontFeatures: { calt: false }, fontSize: 9.5, lineHeight: 1.25, color: INK },
    styles: { h2: { fontSize: 13, bold: true, color: INK }, h3: { fontSize: 10.5, bold: true, color: INK } },
    footer: (page: number, pages: number) => ({
      margin: [48, 18, 48, 0],
      columns: [
        { text: `${FIRM.name} · ${frame.footer}`, color: FAINT, fontSize: 8 },
        { text: `Page ${page} of ${pages}`, color: FAINT, fontSize: 8, alignment: 'right' },
      ],
    }),
    content: frame.content,
  };
}
