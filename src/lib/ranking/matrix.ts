/**
 * The ranking read across: one column per way to build the rail (the pick first), one row per
 * quality, each cell with its figure and how it stands against the other buildable ways in its row
 * (browser-safe, pure). Blocked ways are not compared: they carry no score, no standing and no
 * figure they could not have.
 */
import type { Evaluation, Option, TopologyId } from '../engine/types';
import { formatSi } from '../engine/units';
import { formatMoney } from '../platform/format';
import { fixText, heatsinkNeed, thetaText, toleranceText, type HeatsinkNeed } from '../review/figures';
import { feasibilityOf, percent, TOPOLOGY_NAMES, type Feasibility } from '../review/option-words';

/** How a cell stands in its row: among the buildable ways, or `apart` when it is not compared. */
export type Standing = 'best' | 'between' | 'worst' | 'alone' | 'apart';

export interface MatrixCell {
  text: string;
  /** A second line: the figure's context (share, limit, rule). */
  note: string | null;
  standing: Standing;
}

export type RowKey = 'meets' | 'score' | 'loss' | 'hottest' | 'parts' | 'cost' | 'noise' | 'yield';

export interface MatrixRow {
  key: RowKey;
  label: string;
  /** What "better" means in this row, said once beside its label. */
  better: string;
  cells: MatrixCell[];
}

export interface MatrixColumn {
  topology: TopologyId;
  name: string;
  pick: boolean;
  feasibility: Feasibility;
  /** Null for a blocked way: it is not ranked. */
  score: number | null;
  /** Blockers of a blocked way, or cautions of a buildable one, in the engine's words. */
  reasons: string[];
  /** What would clear each blocker, with its cost where known. */
  fixes: string[];
}

export interface RankingMatrix {
  columns: MatrixColumn[];
  rows: MatrixRow[];
}

export interface MatrixContext {
  /** Output voltage × highest load current, W: what the losses are a share of. */
  railPowerW: number;
  rippleLimitVpp: number;
  /** Null where prices are not shown (the client's wizard): the cost row is left out. */
  currency: string | null;
}

/** The pick first, then the engine's order (buildable ways best first, then blocked ones). */
export function columnOrder(result: Evaluation): Option[] {
  const pick = result.options.find((o) => o.topology === result.recommended);
  return pick ? [pick, ...result.options.filter((o) => o !== pick)] : [...result.options];
}

/** Ripple at least this far under the limit counts as the same (the engine's noise score saturates there too). */
const NOISE_MARGIN_CAP_DB = 60;

/** Margin of the output ripple under the brief's limit, dB; positive is under. */
export function noiseMarginDb(rippleVpp: number, limitVpp: number): number {
  const floor = limitVpp * 10 ** (-NOISE_MARGIN_CAP_DB / 20);
  return 20 * Math.log10(limitVpp / Math.max(rippleVpp, floor));
}

/** The part closest to its junction limit, by kelvin of margin; null for a design without a junction. */
export function tightestJunction(option: Pick<Option, 'junctions'>): Option['junctions'][number] | null {
  let tightest: Option['junctions'][number] | null = null;
  for (const j of option.junctions) if (!tightest || j.tjMaxC - j.tjC < tightest.tjMaxC - tightest.tjC) tightest = j;
  return tightest;
}

interface Quality {
  key: RowKey;
  label: string;
  better: string;
  /** Higher is better; null where the way has no such figure. Read only for buildable ways. */
  value: (o: Option, ctx: MatrixContext) => number | null;
  cell: (o: Option, ctx: MatrixContext) => { text: string; note: string | null };
}

const MEETS_TEXT: Record<Feasibility, string> = { feasible: 'Yes', caution: 'With caution', blocked: 'No' };
const MEETS_ORDER: Record<Feasibility, number> = { feasible: 2, caution: 1, blocked: 0 };

function lossCell(o: Option, ctx: MatrixContext) {
  const loss = o.dissipation.totalMaxW;
  const share = ctx.railPowerW > 0 ? loss / ctx.railPowerW : null;
  const shareText = share === null ? null : share <= 1 ? `${percent(share, share < 0.1 ? 1 : 0)} of the` : `${share.toPrecision(2)} × the`;
  return { text: formatSi(loss, 'W'), note: shareText ? `${shareText} rail’s ${formatSi(ctx.railPowerW, 'W')}` : null };
}

function heatsinkNote(need: HeatsinkNeed): string | null {
  if (need.kind === 'none') return null;
  if (need.kind === 'needed') return 'on a heatsink';
  return need.kind === 'theta' ? `on a heatsink, ${thetaText(need.thetaSaCW)}` : 'no heatsink is good enough';
}

function hottestCell(o: Option) {
  const j = tightestJunction(o);
  const heatsink = heatsinkNote(heatsinkNeed(o));
  if (!j) return { text: 'No part runs hot', note: heatsink };
  if (j.beyondLimit) return { text: `${j.ref} beyond its ${j.tjMaxC} °C limit`, note: heatsink };
  const margin = `${Math.round(j.tjMaxC - j.tjC)} K under its ${j.tjMaxC} °C limit`;
  return { text: `${j.ref} ${Math.round(j.tjC)} °C`, note: heatsink ? `${margin}; ${heatsink}` : margin };
}

function noiseCell(o: Option, ctx: MatrixContext) {
  const ripple = `${formatSi(o.outputRippleVpp, 'Vpp')} of ${formatSi(ctx.rippleLimitVpp, 'Vpp')}`;
  // A blocked design stops before its ripple is worked out; zero then is no figure at all.
  if (o.outputRippleVpp === 0 && !o.feasible) return { text: 'Not worked out', note: 'the design stops before this figure' };
  if (o.outputRippleVpp === 0) return { text: 'No ripple of its own', note: `limit ${formatSi(ctx.rippleLimitVpp, 'Vpp')}` };
  const db = noiseMarginDb(o.outputRippleVpp, ctx.rippleLimitVpp);
  if (db >= 0) return { text: `${db.toFixed(0)} dB under`, note: ripple };
  return { text: `${(-db).toFixed(1)} dB over`, note: ripple };
}

const QUALITIES: Quality[] = [
  {
    key: 'meets',
    label: 'Meets the brief',
    better: 'can it be built as briefed',
    value: (o) => MEETS_ORDER[feasibilityOf(o)],
    cell: (o) => ({ text: MEETS_TEXT[feasibilityOf(o)], note: null }),
  },
  {
    key: 'score',
    label: 'Score',
    better: 'of 100, from what matters most; higher is better',
    value: (o) => o.score,
    cell: (o) => ({ text: !o.feasible || o.score === null ? 'Not scored' : o.score.toFixed(1), note: null }),
  },
  {
    key: 'loss',
    label: 'Power lost',
    better: 'at the worst corner; lower is better',
    value: (o) => -o.dissipation.totalMaxW,
    cell: lossCell,
  },
  {
    key: 'hottest',
    label: 'Hottest part',
    better: 'the part nearest its junction limit; more margin is better',
    value: (o) => {
      const j = tightestJunction(o);
      return j ? j.tjMaxC - j.tjC : null;
    },
    cell: hottestCell,
  },
  {
    key: 'parts',
    label: 'Parts',
    better: 'fewer is better',
    value: (o) => -o.partCount,
    cell: (o) => ({ text: String(o.partCount), note: null }),
  },
  {
    key: 'cost',
    label: 'Parts cost',
    better: 'lower is better',
    value: (o) => -o.costCents,
    cell: (o, ctx) => ({ text: ctx.currency === null ? '' : formatMoney(o.costCents, ctx.currency), note: null }),
  },
  {
    key: 'noise',
    label: 'Noise margin',
    better: 'ripple under the brief’s limit; more is better',
    value: (o, ctx) => noiseMarginDb(o.outputRippleVpp, ctx.rippleLimitVpp),
    cell: noiseCell,
  },
  {
    key: 'yield',
    label: 'Tolerance yield',
    better: 'boards inside the output band; higher is better',
    value: (o) => o.monteCarlo.fractionInTolerance,
    cell: (o) => ({ text: percent(o.monteCarlo.fractionInTolerance, 1), note: toleranceText(o) }),
  },
];

/** Best, worst or between among the values of the buildable ways; ties share the better standing. */
function standings(values: (number | null)[], compared: boolean[]): Standing[] {
  const present = values.filter((v, k): v is number => compared[k]! && v !== null);
  const max = Math.max(...present);
  const min = Math.min(...present);
  return values.map((v, k) => {
    if (!compared[k] || v === null) return 'apart';
    if (present.length === 1) return 'alone';
    if (v === max) return 'best';
    return v === min ? 'worst' : 'between';
  });
}

export function rankingMatrix(result: Evaluation, ctx: MatrixContext): RankingMatrix {
  const options = columnOrder(result);
  const columns: MatrixColumn[] = options.map((o) => ({
    topology: o.topology,
    name: TOPOLOGY_NAMES[o.topology],
    pick: o.topology === result.recommended,
    feasibility: feasibilityOf(o),
    score: o.feasible ? o.score : null,
    reasons: o.issues.filter((i) => i.severity === (o.feasible ? 'caution' : 'blocker')).map((i) => i.message),
    fixes: o.feasible ? [] : o.fixes.map((f) => (ctx.currency === null ? f.message : fixText(f, ctx.currency))),
  }));
  // The meets row compares every way (a blocked one is the worst answer); the figures compare only buildable ones.
  const shown = QUALITIES.filter((q) => q.key !== 'cost' || ctx.currency !== null);
  const rows = shown.map((q): MatrixRow => {
    const compared = options.map((o) => q.key === 'meets' || o.feasible);
    const values = options.map((o) => q.value(o, ctx));
    const marks = standings(values, compared);
    return {
      key: q.key,
      label: q.label,
      better: q.better,
      cells: options.map((o, k) => ({ ...q.cell(o, ctx), standing: marks[k]! })),
    };
  });
  return { columns, rows };
}
