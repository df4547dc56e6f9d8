/**
 * The quote as a printed document: letterhead, who it is for, the rail asked
 * for, the design proposed, its cautions, the price, the terms and where to
 * accept. A pdfmake document description built from the quote view alone.
 */
import { formatDate, formatMoney } from '../platform/format';
import { formatBp } from './pricing';
import { SAFETY_NOTE, type QuoteView } from './view.server';
import { runs } from '../platform/pdf/fonts';
import {
  COPPER,
  heading,
  INK,
  ledger,
  letterhead,
  pairs,
  priceLines,
  printedDocument,
  SOFT,
  text,
  totalsColumn,
  type Node,
} from './document-parts.server';

const WARN = '#8a5a00';
const WARN_BG = '#fcf4e2';

/** Rows kept on one page with their heading; longer blocks may break (a page holds about this many). */
const KEEP_TOGETHER_ROWS = 18;
/** About how many characters of body text fill a line across the page. */
const CHARACTERS_PER_LINE = 110;

/** A heading with the block it introduces, kept together when short so no heading ends a page alone. */
function section(title: Node, block: Node, rows: number): Node {
  return { stack: [title, block], unbreakable: rows <= KEEP_TOGETHER_ROWS };
}

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

  const lines = priceLines(view.lines, quote.currency);
  const totals = totalsColumn([
    { label: 'Subtotal', value: money(quote.subtotalMinor) },
    { label: `Tax (${formatBp(quote.taxRateBp)})`, value: money(quote.taxMinor) },
    { label: 'Total', value: money(quote.totalMinor), strong: true, ruled: true },
    { label: `Deposit on acceptance (${formatBp(quote.depositBp)})`, value: money(quote.depositMinor), strong: true },
  ]);

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

  return printedDocument({
    title: `Quote ${quote.number} — ${view.brief.title}`,
    subject: 'Quote for a DC supply rail design',
    footer: `Quote ${quote.number}`,
    date: issued,
    content: [
      ...letterhead(),
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
  });
}
