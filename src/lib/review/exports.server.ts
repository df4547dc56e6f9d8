/**
 * Exports of a saved revision: the chosen design as a SPICE netlist, its part
 * list as CSV and its schematic as SVG. All read the revision's stored result,
 * never a re-run.
 */
import { and, desc, eq, isNotNull } from 'drizzle-orm';
import Papa from 'papaparse';
import { toSpiceNetlist, type Evaluation, type Option, type SpiceCorner } from '../engine';
import { chosenOption } from './compare';
import { componentValue } from './figures';
import { ROLE_NAMES, TYPICAL_NOTE } from './words';
import { TOPOLOGY_NAMES } from './option-words';
import { currentCatalog } from '~/lib/catalog/index.server';
import { db } from '../platform/db';
import { brief, designRevision, quote, rateCard } from '../platform/db/schema';
import { isStaff, type SignedInUser } from '../platform/http/guard';
import { drawSchematic, railFiguresOf } from '~/lib/schematic';
import type { RailSpec } from '../engine/rail-spec';

export async function findRevisionWithBrief(id: string) {
  const [row] = await db
    .select({ revision: designRevision, briefTitle: brief.title, ownerId: brief.ownerId })
    .from(designRevision)
    .innerJoin(brief, eq(brief.id, designRevision.briefId))
    .where(eq(designRevision.id, id))
    .limit(1);
  return row ?? null;
}

export type RevisionWithBrief = NonNullable<Awaited<ReturnType<typeof findRevisionWithBrief>>>;

/** Staff see every revision's drawing; a client sees one of their own brief's once a quote for that revision has been sent. */
export async function drawingVisibleTo(viewer: SignedInUser, found: RevisionWithBrief): Promise<boolean> {
  if (isStaff(viewer)) return true;
  if (found.ownerId !== viewer.id) return false;
  const [sent] = await db
    .select({ id: quote.id })
    .from(quote)
    .where(and(eq(quote.revisionId, found.revision.id), isNotNull(quote.sentAt)))
    .limit(1);
  return sent !== undefined;
}

/** The design last quoted to the brief's owner, drawn: the revision of the newest sent quote. */
export async function quotedDrawing(
  briefId: string,
): Promise<{ svg: string; revisionNumber: number; parts: { ref: string; part: string; value: string }[] } | null> {
  const [row] = await db
    .select({ revision: designRevision })
    .from(quote)
    .innerJoin(designRevision, eq(designRevision.id, quote.revisionId))
    .where(and(eq(quote.briefId, briefId), isNotNull(quote.sentAt)))
    .orderBy(desc(quote.sentAt))
    .limit(1);
  const option = row ? chosenOption({ topology: row.revision.topology, result: row.revision.result as Evaluation }) : null;
  if (!row || !option) return null;
  return {
    svg: drawSchematic(option, railFiguresOf(row.revision.input as RailSpec), 'quoted-drawing').svg,
    revisionNumber: row.revision.number,
    parts: option.components.map((c) => ({ ref: c.ref, part: c.part, value: componentValue(c) })),
  };
}

export type SchematicOutcome = { ok: true; svg: string } | { ok: false; message: string };

/** The revision's chosen design drawn as a standalone SVG document. */
export function revisionSchematic(found: RevisionWithBrief): SchematicOutcome {
  const option = chosenOf(found);
  if (!option) return { ok: false, message: 'This revision holds no design for its chosen topology.' };
  const { svg } = drawSchematic(option, railFiguresOf(found.revision.input as RailSpec));
  return { ok: true, svg: `<?xml version="1.0" encoding="UTF-8"?>\n${svg}\n` };
}

/** The currency parts costs are kept in: the rate card's. */
export async function partsCurrency(): Promise<string> {
  const [row] = await db.select({ currency: rateCard.currency }).from(rateCard).limit(1);
  return row?.currency ?? 'EUR';
}

export function chosenOf(found: RevisionWithBrief): Option | null {
  return chosenOption({ topology: found.revision.topology, result: found.revision.result as Evaluation });
}

/** The netlist describes the nominal input at the typical load: the point an engineer measures first. */
export function nominalCorner(input: unknown): SpiceCorner {
  const brief = input as { input: { vNom: number }; output: { iTyp: number } };
  return { vIn: brief.input.vNom, iOut: brief.output.iTyp };
}

export function exportFileName(title: string, number: number, extension: string): string {
  const slug = title
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, ' ')
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '-')
    .slice(0, 60);
  return `${slug || 'brief'}-rev${number}.${extension}`;
}

const ASCII_FOR: Record<string, string> = {
  '—': '-',
  '–': '-',
  '−': '-',
  '½': '1/2',
  '·': '*',
  '²': '^2',
  θ: 'theta',
  '°': 'deg',
  Ω: 'ohm',
  µ: 'u',
  '’': "'",
  '“': '"',
  '”': '"',
  '≤': '<=',
  '≥': '>=',
  '×': 'x',
  '…': '...',
};

/** One ASCII line: the simulator reads its deck byte by byte, and other characters change how it parses. */
function deckLine(text: string): string {
  return text.replace(/[\r\n]+/g, ' ').replace(/[^\x20-\x7e]/g, (c) => ASCII_FOR[c] ?? c.normalize('NFKD').replace(/[^\x20-\x7e]/g, ''));
}

export type NetlistOutcome = { ok: true; text: string } | { ok: false; message: string };

export async function revisionNetlist(found: RevisionWithBrief): Promise<NetlistOutcome> {
  const option = chosenOf(found);
  if (!option) return { ok: false, message: 'This revision holds no design for its chosen topology.' };
  const corner = nominalCorner(found.revision.input);
  const body = toSpiceNetlist(option, corner, await currentCatalog());
  const header = [
    `* Railwright - ${found.briefTitle}, revision ${found.revision.number}: ${TOPOLOGY_NAMES[option.topology]}`,
    `* Device models use typical parameters (${TYPICAL_NOTE}).`,
    ...option.cautions.map((c) => `* CAUTION: ${c.message}`),
  ].map(deckLine);
  return { ok: true, text: `${header.join('\n')}\n${body}` };
}

/** A figure for a spreadsheet cell: four significant figures, so no binary float noise; '' when absent. */
function cell(value: number | null | undefined): number | '' {
  return value === null || value === undefined ? '' : Number(value.toPrecision(4));
}

/**
 * The chosen parts as CSV for a spreadsheet: numeric columns in SI units (four significant
 * figures) beside a readable value with its prefix and unit ("64 µF"). A UTF-8 byte-order mark
 * leads, so spreadsheet programs read Ω and µ as UTF-8.
 */
export function partListCsv(option: Option, currency: string): string {
  const dissipation = new Map(option.dissipation.parts.map((p) => [p.ref, p]));
  const rows = option.components.map((c) => ({
    ref: c.ref,
    role: ROLE_NAMES[c.role],
    part: c.part,
    value: cell(c.value),
    unit: c.unit ?? '',
    value_text: componentValue(c),
    quantity: c.quantity,
    rating_w: cell(c.ratingW),
    rating_v: cell(c.ratingV),
    tolerance: cell(c.tolerance),
    worst_w: cell(dissipation.get(c.ref)?.maxW),
    fault_w: cell(dissipation.get(c.ref)?.faultW),
    cost_minor: c.costCents,
    currency,
  }));
  // Part labels come from the editable catalog: a cell that looks like a formula is neutralised.
  return Papa.BYTE_ORDER_MARK + Papa.unparse(rows, { escapeFormulae: true, newline: '\r\n' }) + '\r\n';
}
