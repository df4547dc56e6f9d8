/**
 * Everything a quote shows, read once and worded once: the PDF, the client's
 * quote page, the builder and the API all present this view.
 */
import { eq } from 'drizzle-orm';
import type { RailSpec } from '../engine/rail-spec';
import { agreedRequirementOf } from '~/lib/review';
import type { Evaluation, Option } from '../engine/types';
import { formatKPerW, formatSi } from '../engine/units';
import { chosenOption, TOPOLOGY_NAMES, percent } from '~/lib/review';
import { ES1_DC_LIMIT_V } from '../engine/cautions';
import { drawSchematic, railFiguresOf, type RailFigures } from '~/lib/schematic';
import { brief, clientProfile, designRevision, quote, user, type QuoteState } from '../platform/db/schema';
import { quoteLines, type QuoteLineRow, type QuoteRow } from './core.server';
import type { DbOrTx } from '../platform/db/connect';

/** Said wherever a design is shown, whatever its own cautions. */
export const SAFETY_NOTE =
  'The figures are typical values — confirm against the chosen part’s data before building. ' +
  `Supply rails can carry hazardous voltage (above ${ES1_DC_LIMIT_V} V DC), keep stored energy in capacitors after power is removed, and run hot enough to burn. ` +
  'Build and test under qualified supervision, and defer to local electrical codes and licensed practice.';

export interface Row {
  label: string;
  value: string;
}

export interface PartRow {
  ref: string;
  part: string;
  value: string;
  rating: string;
  quantity: number;
}

export interface DesignSummary {
  topologyName: string;
  feasible: boolean;
  figures: Row[];
  parts: PartRow[];
  cautions: string[];
  /** The design drawn (SVG): the quote page and the PDF show it. */
  schematic: string;
}

/** A sent quote past its validity reads as expired, whether or not anyone has marked it. */
export function stateAt(row: Pick<QuoteRow, 'state' | 'validUntil'>, now = new Date()): QuoteState {
  return row.state === 'sent' && row.validUntil.getTime() < now.getTime() ? 'expired' : row.state;
}

const SOURCES: Record<string, string> = { battery: 'battery', adapter: 'mains adapter', rectified: 'rectified mains', bus: 'DC bus' };
const AIRFLOW: Record<string, string> = { enclosed: 'enclosed, no airflow', 'still-air': 'still air', 'forced-air': 'forced air' };

const tolerancePct = (t: number) => `${(t * 100).toLocaleString('en-GB', { maximumFractionDigits: 2 })} %`;

/**
 * The rail the design meets. Where the engineer and the client agreed to depart from the brief
 * (see agreed-requirement.ts), the row says so and keeps the brief's figure beside it.
 */
export function requirementRows(spec: RailSpec, briefed: unknown = spec): Row[] {
  const { input, output, noise, thermal } = spec;
  const agreed = agreedRequirementOf(briefed, spec);
  const was = (text: string) => ` — agreed with the client (brief: ${text})`;
  const original = briefed as RailSpec;
  const outputChanged = agreed.outputV !== undefined || agreed.tolerance !== undefined;
  const ambientC = spec.overrides.ambientC;
  return [
    {
      label: 'Input supply',
      value: `${formatSi(input.vMin, 'V')} to ${formatSi(input.vMax, 'V')}, nominal ${formatSi(input.vNom, 'V')} (${SOURCES[input.source] ?? input.source})`,
    },
    { label: 'Input ripple', value: input.rippleVpp > 0 ? formatSi(input.rippleVpp, 'Vpp') : 'none stated' },
    {
      label: 'Output',
      value: `${formatSi(output.v, 'V')} ± ${tolerancePct(output.tolerance)}${outputChanged ? was(`${formatSi(original.output.v, 'V')} ± ${tolerancePct(original.output.tolerance)}`) : ''}`,
    },
    {
      label: 'Load current',
      value: `${formatSi(output.iMin, 'A')} min, ${formatSi(output.iTyp, 'A')} typical, ${formatSi(output.iMax, 'A')} max`,
    },
    {
      label: 'Ripple limit',
      value: `${formatSi(noise.maxRippleVpp, 'Vpp')} (${noise.class} load)${agreed.maxRippleVpp !== undefined ? was(formatSi(original.noise.maxRippleVpp, 'Vpp')) : ''}`,
    },
    {
      label: 'Ambient',
      value:
        ambientC !== undefined && ambientC !== thermal.ambientMaxC
          ? `up to ${ambientC} °C, ${AIRFLOW[thermal.airflow] ?? thermal.airflow}${was(`${thermal.ambientMaxC} °C`)}`
          : `up to ${thermal.ambientMaxC} °C, ${AIRFLOW[thermal.airflow] ?? thermal.airflow}`,
    },
  ];
}

function partValue(c: Option['components'][number]): string {
  return c.value !== null && c.unit ? formatSi(c.value, c.unit) : '—';
}

function partRating(c: Option['components'][number]): string {
  const parts = [
    c.ratingV !== null ? formatSi(c.ratingV, 'V') : null,
    c.ratingW !== null ? formatSi(c.ratingW, 'W') : null,
    c.tolerance !== null ? `±${percent(c.tolerance, c.tolerance < 0.01 ? 1 : 0)}` : null,
  ];
  return parts.filter(Boolean).join(', ') || '—';
}

export function designSummary(option: Option, rail: RailFigures): DesignSummary {
  const hottest = [...option.junctions].sort((a, b) => b.tjC - a.tjC)[0];
  const figures: Row[] = [
    { label: 'Efficiency', value: `${percent(option.efficiency.nominal)} nominal, ${percent(option.efficiency.worst)} worst case` },
    { label: 'Output over all corners', value: `${formatSi(option.vOutRange.min, 'V', 4)} to ${formatSi(option.vOutRange.max, 'V', 4)}` },
    { label: 'Output ripple', value: formatSi(option.outputRippleVpp, 'Vpp') },
    { label: 'Worst-case dissipation', value: formatSi(option.dissipation.totalMaxW, 'W') },
    {
      label: 'Heatsink',
      value: option.heatsink.required
        ? `needed${option.heatsink.maxThetaSaCW !== null ? `, at most ${formatKPerW(option.heatsink.maxThetaSaCW)}` : ''}`
        : 'not needed',
    },
    ...(hottest
      ? [
          {
            label: 'Hottest part',
            value: hottest.beyondLimit
              ? `${hottest.ref} beyond its ${Math.round(hottest.tjMaxC)} °C limit`
              : `${hottest.ref} at about ${Math.round(hottest.tjC)} °C (limit ${Math.round(hottest.tjMaxC)} °C)`,
          },
        ]
      : []),
    {
      label: 'Tolerance check',
      value: `${percent(option.monteCarlo.fractionInTolerance, 1)} of ${option.monteCarlo.draws.toLocaleString('en-GB')} simulated builds within tolerance`,
    },
    { label: 'Parts', value: String(option.partCount) },
  ];
  return {
    topologyName: TOPOLOGY_NAMES[option.topology],
    feasible: option.feasible,
    figures,
    parts: option.components.map((c) => ({ ref: c.ref, part: c.part, value: partValue(c), rating: partRating(c), quantity: c.quantity })),
    cautions: option.cautions.map((c) => c.message),
    schematic: drawSchematic(option, rail, 'design-schematic').svg,
  };
}

export interface QuoteView {
  quote: QuoteRow;
  state: QuoteState;
  lines: QuoteLineRow[];
  brief: { id: string; title: string; state: string; ownerId: string };
  client: { name: string; email: string; company: string | null };
  revision: { id: string; number: number; topology: string; note: string };
  requirements: Row[];
  design: DesignSummary | null;
}

export async function loadQuoteView(db: DbOrTx, quoteId: string, now = new Date()): Promise<QuoteView | null> {
  const [found] = await db
    .select({ quote, brief, revision: designRevision, client: { name: user.name, email: user.email, company: clientProfile.company } })
    .from(quote)
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .innerJoin(designRevision, eq(designRevision.id, quote.revisionId))
    .innerJoin(user, eq(user.id, brief.ownerId))
    .leftJoin(clientProfile, eq(clientProfile.userId, brief.ownerId))
    .where(eq(quote.id, quoteId))
    .limit(1);
  if (!found) return null;
  const lines = await quoteLines(db, quoteId);
  const option = chosenOption({ topology: found.revision.topology, result: found.revision.result as Evaluation });
  return {
    quote: found.quote,
    state: stateAt(found.quote, now),
    lines,
    brief: { id: found.brief.id, title: found.brief.title, state: found.brief.state, ownerId: found.brief.ownerId },
    client: found.client,
    revision: { id: found.revision.id, number: found.revision.number, topology: found.revision.topology, note: found.revision.note },
    requirements: requirementRows(found.revision.input as RailSpec, found.brief.spec),
    design: option ? designSummary(option, railFiguresOf(found.revision.input as RailSpec)) : null,
  };
}
