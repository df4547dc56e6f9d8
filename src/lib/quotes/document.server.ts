/**
 * The quote as a printed document: letterhead, who it is for, the rail asked
 * for, the design proposed, its cautions, the price, the terms and where to
 * accept. A pdfmake document description built from the quote view alone.
 */
import { formatDate, formatMoney } from '../platform/format';
import { formatBp, formatQuantity } from './pricing';
import { FIRM } from './firm';
import { SAFETY_NOTE, type QuoteView, type Row } from './view.server';
import { BASE_FAMILY, runs } from '../platform/pdf/fonts';

const INK = '#1e2329';
const SOFT = '#4a525c';
const FAINT = '#6b7380';
const COPPER = '#86421b';
const RULE = '#e4dfd6';
const WARN = '#8a5a00';
const WARN_BG = '#fcf4e2';

type Node = Record<string, unknown> | string;

const text = (value: string, style: Record<string, unknown> = {}): Node => ({ text: runs(value), ...style });

function heading(title: string): Node {
  return { text: runs(title), style: 'h2', margin: [0, 18, 0, 6] };
}

/** Rows kept on one page with their heading; longer blocks may break (a page holds about this many). */
const KEEP_TOGETHER_ROWS = 18;
/** About how many characters of body text fill a line across the page. */
const CHARACTERS_PER_LINE = 110;

/** A heading with the block it introduces, kept together when short so no heading ends a page alone. */
function section(title: Node, block: Node, rows: number): Node {
  return { stack: [title, block], unbreakable: rows <= KEEP_TOGETHER_ROWS };
}

/** Label–value pairs as a ruled two-column table. */
function pairs(rows: Row[]): Node {
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

const ledger = {
  hLineWidth: (i: number, node: { table: { body: unknown[] } }) => (i === 1 ? 1.2 : i === 0 || i === node.table.body.length ? 0 : 0.5),
  vLineWidth: () => 0,
  hLineColor: (i: number) => (i === 1 ? INK : RULE),
  paddingLeft: (i: number) => (i === 0 ? 0 : 6),
  paddingRight: () => 0,
  paddingTop: () => 4,
  paddingBottom: () => 4,
};

/** The drawing's box on its landscape A4 page, pt: the width between the margins, and room left for the part list. */
const DRAWING_WIDTH = 746;
const DRAWING_HEIGHT = 270;

/**
 * The drawing as the PDF's SVG renderer needs it: each label's characters set in the Manrope
 * subset that has them (the SVG names one family for all its text).
 */
function pdfSvg(svg: string): string {
  return svg.replace(
    /(<text [^>]*>)([^<]*)(<\/text>)/g,
    (_, open: string, body: string, close: string) =>
      open +
      runs(body)
        .map((r) => (typeof r === 'string' ? r : `<tspan font-family="${r.font}">${r.text}</tspan>`))
        .join('') +
      close,
  );
}

export interface QuoteDocumentOptions {
  /** The client's quote page, where it is accepted and the deposit paid. */
  quoteUrl: string;
  now?: Date;
}

export function quoteDocument(view: QuoteView, options: QuoteDocumentOptions): object {
  const { quote } = view;
  const money = (minor: number) => formatMoney(minor, quote.currency);
  const issued = quote.sentAt ?? options.now ?? new Date();
  const draft = quote.state === 'draft';

  const header: Node = {
    columns: [
      {
        width: '*',
        stack: [
          { text: FIRM.name, fontSize: 22, bold: true, color: COPPER, characterSpacing: 0.3 },
          { text: FIRM.line, color: SOFT, margin: [0, 2, 0, 0] },
        ],
      },
      { width: 'auto', stack: [...FIRM.address, FIRM.email].map((line) => text(line, { color: SOFT, fontSize: 8.5, alignment: 'right' })) },
    ],
  };

  const title: Node = {
    margin: [0, 22, 0, 0],
    columns: [
      {
        width: '*',
        stack: [
          { text: draft ? 'Draft quote — not yet sent' : 'Quote', color: draft ? WARN : SOFT, bold: true, fontSize: 10 },
          { text: quote.number, fontSize: 20, bold: true, margin: [0, 2, 0, 6] },
          text(view.brief.title, { fontSize: 11, bold: true }),
        ],
      },
      {
        width: 190,
        table: {
          widths: [70, '*'],
          body: [
            ['Issued', formatDate(issued)],
            ['Valid until', formatDate(quote.validUntil)],
            ['Design', `Revision ${view.revision.number}`],
            ['Units', String(quote.quantity)],
          ].map(([k, v]) => [text(k ?? '', { color: SOFT }), text(v ?? '', { bold: true, alignment: 'right' })]),
        },
        layout: 'noBorders',
      },
    ],
  };

  const client: Node = {
    margin: [0, 14, 0, 0],
    stack: [
      { text: 'Prepared for', color: SOFT, fontSize: 8.5, bold: true },
      text(view.client.company ? `${view.client.name}, ${view.client.company}` : view.client.name, { bold: true }),
      text(view.client.email, { color: SOFT }),
    ],
  };

  const design = view.design;
  const designPart: Node[] = design
    ? [
        heading('The design we propose'),
        text(`${design.topologyName}${design.feasible ? '' : ' (kept for comparison: it does not meet every requirement of the brief)'}`, {
          bold: true,
          fontSize: 11,
          margin: [0, 0, 0, 4],
        }),
        pairs(design.figures),
        text('The schematic and the part list are at the end of this quote.', { color: SOFT, margin: [0, 6, 0, 0] }),
      ]
    : [
        heading('The design we propose'),
        text('The design of this revision could not be read; ask the consultancy for the design summary.'),
      ];

  // The drawing on a landscape page of its own, with the part list under it.
  const drawingPart: Node[] = design
    ? [
        {
          text: runs('Schematic'),
          style: 'h2',
          margin: [0, 0, 0, 6],
          pageBreak: 'before',
          pageOrientation: 'landscape',
        },
        { svg: pdfSvg(design.schematic), fit: [DRAWING_WIDTH, DRAWING_HEIGHT], margin: [0, 0, 0, 8] },
        // The list may run onto the next page: the drawing and the start of the list stay together.
        { text: 'Part list', style: 'h3', margin: [0, 4, 0, 4] },
        {
          table: {
            headerRows: 1,
            widths: [32, '*', 80, 150, 24],
            body: [
              ['Ref', 'Part', 'Value', 'Rating', 'Qty'].map((h, i) => ({
                text: h,
                bold: true,
                color: SOFT,
                alignment: i === 4 ? 'right' : 'left',
              })),
              ...design.parts.map((p) => [
                text(p.ref, { bold: true }),
                text(p.part),
                text(p.value),
                text(p.rating),
                { text: String(p.quantity), alignment: 'right' },
              ]),
            ],
          },
          layout: ledger,
          fontSize: 8,
        },
      ]
    : [];

  const safety: Node = {
    margin: [0, 16, 0, 0],
    unbreakable: true,
    table: {
      widths: ['*'],
      body: [
        [
          {
            fillColor: WARN_BG,
            margin: [8, 6, 8, 8],
            stack: [
              { text: 'Safety', bold: true, color: WARN, fontSize: 11, margin: [0, 0, 0, 4] },
              ...(design?.cautions.length ? [{ ul: design.cautions.map((c) => text(c)), margin: [0, 0, 0, 6] }] : []),
              text(SAFETY_NOTE, { color: INK }),
            ],
          },
        ],
      ],
    },
    layout: {
      hLineWidth: () => 0,
      vLineWidth: (i: number) => (i === 0 ? 2.5 : 0),
      vLineColor: () => WARN,
      paddingLeft: () => 0,
      paddingRight: () => 0,
      paddingTop: () => 0,
      paddingBottom: () => 0,
    },
  };

  const lines: Node = {
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
        ...view.lines.map((l) => [
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

  const totalsRow = (label: string, value: string, strong = false) => [
    { text: label, alignment: 'right', bold: strong, color: strong ? INK : SOFT },
    { text: value, alignment: 'right', bold: strong, fontSize: strong ? 11 : 9.5 },
  ];
  const totals: Node = {
    margin: [0, 8, 0, 0],
    columns: [
      { width: '*', text: '' },
      {
        width: 250,
        table: {
          widths: ['*', 90],
          body: [
            totalsRow('Subtotal', money(quote.subtotalMinor)),
            totalsRow(`Tax (${formatBp(quote.taxRateBp)})`, money(quote.taxMinor)),
            totalsRow('Total', money(quote.totalMinor), true),
            totalsRow(`Deposit on acceptance (${formatBp(quote.depositBp)})`, money(quote.depositMinor), true),
          ],
        },
        layout: {
          hLineWidth: (i: number) => (i === 2 ? 1.2 : 0),
          vLineWidth: () => 0,
          hLineColor: () => INK,
          paddingTop: () => 3,
          paddingBottom: () => 3,
        },
      },
    ],
  };

  const termLines = quote.terms
    .split('\n')
    .map((t) => t.trim())
    .filter(Boolean);
  const terms: Node[] = termLines.length ? [heading('Terms'), { ol: termLines.map((t) => text(t)), color: SOFT }] : [];

  const accept: Node = {
    margin: [0, 18, 0, 0],
    stack: [
      { text: 'Accept and pay the deposit', style: 'h2', margin: [0, 0, 0, 4] },
      text(
        `Accept this quote online by ${formatDate(quote.validUntil)}. Once accepted, the deposit of ${money(quote.depositMinor)} is paid on the same page and design work is scheduled.`,
      ),
      { text: options.quoteUrl, link: options.quoteUrl, color: COPPER, decoration: 'underline', margin: [0, 4, 0, 0] },
    ],
  };
  // The terms and where to accept read as one closing block: moved whole to the next page rather
  // than split so that a last page holds a stray line or two.
  const closingRows = termLines.reduce((n, t) => n + Math.ceil(t.length / CHARACTERS_PER_LINE), 0) + 6;

  return {
    pageSize: 'A4',
    pageMargins: [48, 44, 48, 56],
    info: {
      title: `Quote ${quote.number} — ${view.brief.title}`,
      author: FIRM.name,
      subject: 'Quote for a DC supply rail design',
      creator: FIRM.name,
    },
    // Contextual alternates change nothing in a quote's text but double the time to set it.
    defaultStyle: { font: BASE_FAMILY, fontFeatures: { calt: false }, fontSize: 9.5, lineHeight: 1.25, color: INK },
    styles: { h2: { fontSize: 13, bold: true, color: INK }, h3: { fontSize: 10.5, bold: true, color: INK } },
    footer: (page: number, pages: number) => ({
      margin: [48, 18, 48, 0],
      columns: [
        { text: `${FIRM.name} · Quote ${quote.number}`, color: FAINT, fontSize: 8 },
        { text: `Page ${page} of ${pages}`, color: FAINT, fontSize: 8, alignment: 'right' },
      ],
    }),
    content: [
      header,
      { canvas: [{ type: 'line', x1: 0, y1: 8, x2: 499, y2: 8, lineWidth: 1.5, lineColor: COPPER }] },
      title,
      client,
      ...(quote.clientNote
        ? [section(heading('A note from us'), text(quote.clientNote), Math.ceil(quote.clientNote.length / CHARACTERS_PER_LINE) + 1)]
        : []),
      section(heading('The rail you asked for'), pairs(view.requirements), view.requirements.length),
      ...designPart,
      safety,
      section(heading('Price'), { stack: [lines, totals] }, view.lines.length + 4),
      { stack: [...terms, accept], unbreakable: closingRows <= KEEP_TOGETHER_ROWS },
      ...drawingPart,
    ],
  };
}
