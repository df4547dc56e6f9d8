// Output-setting divider of a regulator: Vout = Vref·(1 + R2/R1) + Iadj·R2.
// R1 sits across the reference (role feedback-lower), R2 carries Vout − Vref (role feedback-upper).
import type { ResistorGrade } from '../catalog.ts';
import type { SeriesName } from '../eseries.ts';
import { seriesRange, snap } from '../eseries.ts';
import { formatSi } from '../units.ts';
import { atLeast } from '../design.ts';
import { TupleMemo } from './tuple-memo.ts';
import {
  analyseTolerance,
  relativeParam,
  toleranceVerdict,
  type ToleranceModel,
  type ToleranceParam,
  type ToleranceRule,
  type ToleranceSummary,
} from '../tolerance.ts';

export interface Divider {
  r1: number;
  r2: number;
  /** Output with the snapped values and typical reference and adjust current. */
  vOut: number;
  /** Current through R1 (Vref / R1). */
  iDivider: number;
}

export function dividerVout(vRef: number, r1: number, r2: number, iAdj: number): number {
  return vRef * (1 + r2 / r1) + iAdj * r2;
}

/**
 * R1 is the largest series value not above Vref / iDivider (so the divider alone carries at least
 * that current), R2 solves the equation for the target, both snapped, then Vout is recomputed.
 */
export function designDivider(
  vTarget: number,
  vRef: number,
  iAdj: number,
  iDividerMin: number,
  series: SeriesName,
  r1Forced: number | undefined,
  r2Forced: number | undefined,
): Divider {
  const r1 = r1Forced ?? snap(atLeast(vRef / atLeast(iDividerMin, 1e-9), 1e-3), series, 'down');
  const r2Ideal = (vTarget - vRef) / (vRef / r1 + iAdj);
  const r2 = r2Forced ?? snap(atLeast(r2Ideal, 1e-3), series, 'nearest');
  return { r1, r2, vOut: dividerVout(vRef, r1, r2, iAdj), iDivider: vRef / r1 };
}

/** Spreads of one divider design: relative half-widths, each a box the parts stay inside. */
export interface DividerSpread {
  /** Initial reference accuracy at 25 °C. */
  vRefTolerance: number;
  /** Reference drift over the temperature swing (ppm/K × K). */
  vRefDrift: number;
  /** Resistor tolerance plus TCR over the temperature swing. */
  resistor: number;
  iAdjMin: number;
  iAdjMax: number;
  iAdjTyp: number;
  /** Further multiplicative spreads of the output (line and load regulation), nominal 1. */
  extra: readonly ToleranceParam[];
}

/** Extreme-value / Monte Carlo model: Vout = (Vref·drift·(1 + R2/R1) + Iadj·R2) · Π extra. */
export function dividerOutputModel(vRef: number, divider: Divider, spread: DividerSpread): ToleranceModel {
  const { r1, r2 } = divider;
  const params: ToleranceParam[] = [
    relativeParam('Vref', vRef, spread.vRefTolerance),
    relativeParam('Vref drift', 1, spread.vRefDrift),
    relativeParam('R1', r1, spread.resistor),
    relativeParam('R2', r2, spread.resistor),
    { name: 'Iadj', nominal: spread.iAdjTyp, lo: spread.iAdjMin, hi: spread.iAdjMax },
    ...spread.extra,
  ];
  const n = params.length;
  return {
    params,
    // Rises with Vref, its drift, R2 (while Vref/R1 + Iadj > 0), Iadj (R2 ≥ 0) and every positive factor; falls with R1.
    monotone: params.map((_p, j) => (j === 2 ? -1 : 1)),
    f: (x: Float64Array) => {
      let v = x[0]! * x[1]! * (1 + x[3]! / x[2]!) + x[4]! * x[3]!;
      for (let j = 5; j < n; j += 1) v *= x[j]!;
      return v;
    },
    batch: ({ u, lo, span }, out) => {
      const [u0, u1, u2, u3, u4] = u as [Float64Array, Float64Array, Float64Array, Float64Array, Float64Array];
      const [l0, l1, l2, l3, l4] = lo as unknown as [number, number, number, number, number];
      const [s0, s1, s2, s3, s4] = span as unknown as [number, number, number, number, number];
      // Line and load regulation, the usual two further factors, ride in the same pass.
      const fused = n >= 7 ? 7 : 5;
      if (fused === 7) {
        const [u5, u6] = [u[5]!, u[6]!];
        const [l5, l6, s5, s6] = [lo[5]!, lo[6]!, span[5]!, span[6]!];
        for (let i = 0; i < out.length; i += 1) {
          const r2 = l3 + s3 * u3[i]!;
          const v = (l0 + s0 * u0[i]!) * (l1 + s1 * u1[i]!) * (1 + r2 / (l2 + s2 * u2[i]!)) + (l4 + s4 * u4[i]!) * r2;
          out[i] = v * (l5 + s5 * u5[i]!) * (l6 + s6 * u6[i]!);
        }
      } else {
        for (let i = 0; i < out.length; i += 1) {
          const r2 = l3 + s3 * u3[i]!;
          out[i] = (l0 + s0 * u0[i]!) * (l1 + s1 * u1[i]!) * (1 + r2 / (l2 + s2 * u2[i]!)) + (l4 + s4 * u4[i]!) * r2;
        }
      }
      for (let j = fused; j < n; j += 1) {
        const column = u[j]!;
        const l = lo[j]!;
        const s = span[j]!;
        for (let i = 0; i < out.length; i += 1) out[i]! *= l + s * column[i]!;
      }
    },
  };
}

/** The reference, both resistors and the adjust current, without drift or regulation terms. */
export function dividerModel(
  vRef: number,
  vRefTolerance: number,
  divider: Divider,
  resistorTolerance: number,
  iAdjMin: number,
  iAdjMax: number,
  iAdjTyp: number,
): ToleranceModel {
  return dividerOutputModel(vRef, divider, {
    vRefTolerance,
    vRefDrift: 0,
    resistor: resistorTolerance,
    iAdjMin,
    iAdjMax,
    iAdjTyp,
    extra: [],
  });
}

/** A nominal error below this fraction is finer than any resistor grade (0.1 %): such pairs count as equal. */
const PAIR_GOOD_ENOUGH = 5e-4;

/**
 * The pair (R1, R2) from one series whose nominal output lies closest to the target, with the
 * divider current between iMin and iMax; among pairs within 0.05 % the larger R1 (the smaller
 * current) wins. Both resistors are searched: snapping R2 alone leaves up to half a series step.
 */
export function bestPair(
  vTarget: number,
  vRef: number,
  iAdj: number,
  iMin: number,
  iMax: number,
  series: SeriesName,
  r1Forced?: number,
  r2Forced?: number,
): Divider {
  const hiR1 = vRef / atLeast(iMin, 1e-12);
  const r1s = r1Forced !== undefined ? [r1Forced] : seriesRange(series, vRef / atLeast(Math.max(iMax, iMin), 1e-12), hiR1);
  if (r1s.length === 0) r1s.push(snap(atLeast(hiR1, 1e-3), series, 'down'));
  const r2Of = (r1: number) => atLeast((vTarget - vRef) / (vRef / r1 + iAdj), 1e-3);
  // The series members around every ideal R2, listed once: a bisection then brackets each ideal.
  const ideals = r1s.map(r2Of);
  const members = seriesRange(series, snap(Math.min(...ideals), series, 'down'), snap(Math.max(...ideals), series, 'up'));
  const bracket = (value: number): number[] => {
    let lo = 0;
    let hi = members.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (members[mid]! < value) lo = mid + 1;
      else hi = mid;
    }
    return [members[Math.max(0, lo - 1)]!, members[Math.min(members.length - 1, lo)]!];
  };
  let best: Divider | null = null;
  let bestErr = Number.POSITIVE_INFINITY;
  for (const r1 of r1s) {
    const r2s = r2Forced !== undefined ? [r2Forced] : members.length > 0 ? bracket(r2Of(r1)) : [snap(r2Of(r1), series, 'nearest')];
    for (const r2 of r2s) {
      const vOut = dividerVout(vRef, r1, r2, iAdj);
      const err = Math.max(Math.abs(vOut - vTarget), PAIR_GOOD_ENOUGH * Math.abs(vTarget));
      // Relative slack keeps the choice stable against rounding between equal errors.
      if (err < bestErr * (1 - 1e-9) || (err <= bestErr * (1 + 1e-9) && best !== null && r1 > best.r1)) {
        best = { r1, r2, vOut, iDivider: vRef / r1 };
        bestErr = err;
      }
    }
  }
  // Only a non-finite target leaves nothing compared; the caller reports the target itself.
  return best ?? { r1: r1s[0]!, r2: r1s[0]!, vOut: 2 * vRef, iDivider: vRef / r1s[0]! };
}

export interface ReferenceGrade {
  tolerance: number;
  extraCents: number;
}

export interface DividerSearchInput {
  vTarget: number;
  vRef: number;
  /** Reference selections, the standard one first (extraCents 0). */
  refGrades: readonly ReferenceGrade[];
  vRefDriftPpmK: number;
  /** Current out of the adjust or feedback pin into R2 (negative for a bias current into the pin). */
  iAdjTyp: number;
  iAdjMin: number;
  iAdjMax: number;
  /** Divider current range through R1. */
  iDividerMin: number;
  iDividerMax: number;
  band: { lo: number; hi: number };
  rule: ToleranceRule;
  /** Largest departure from 25 °C (see temperatureSwingK). */
  tempSwingK: number;
  /** Line and load regulation as multiplicative spreads, nominal 1. */
  extra?: readonly ToleranceParam[];
  /** Resistor grades from the catalog; the search keeps the cheapest that meets the band. */
  grades: readonly ResistorGrade[];
  /** Half the output ripple, kept clear of the band's edges. */
  marginV?: number;
  /** Engineer's forced values. */
  r1Forced?: number;
  r2Forced?: number;
  /** Engineer's forced series: only grades stocked in it are tried. */
  series?: SeriesName;
}

export interface DividerDesign extends Divider {
  grade: ResistorGrade;
  series: SeriesName;
  refTolerance: number;
  /** Extra cost of this choice over the standard reference and the cheapest grade (two resistors). */
  extraCents: number;
  model: ToleranceModel;
  summary: ToleranceSummary;
  verdict: 'worst-case' | 'statistical' | 'fails';
  /** One sentence: what was chosen and why. */
  why: string;
}

export interface DividerSearchResult {
  /** Cheapest choice that meets the band (worst case first at equal cost); the tightest when none does. */
  pick: DividerDesign;
  /** A choice at the pick's cost that meets the band in the worst case, when the pick only meets it statistically (null if none at that cost). */
  worstCasePick: DividerDesign | null;
}

/** bestPair is pure, so its answers are kept across searches; the memo is emptied when it grows past this. */
const PAIR_MEMO_SIZE = 512;
const pairs = new TupleMemo<Readonly<Divider>>(PAIR_MEMO_SIZE);

const pct = (x: number) => `±${Number((x * 100).toPrecision(2))} %`;

/** Resistor grade × reference grade, each with its best pair; a handful of candidates, each analysed analytically. */
/** A grade no cheaper, no tighter and no steadier than another is never the better choice. */
function dominated(g: ResistorGrade, grades: readonly ResistorGrade[]): boolean {
  return grades.some(
    (h) =>
      h !== g &&
      h.extraCents <= g.extraCents &&
      h.tolerance <= g.tolerance &&
      h.tcrPpmK <= g.tcrPpmK &&
      (h.tolerance < g.tolerance || h.tcrPpmK < g.tcrPpmK || h.extraCents < g.extraCents),
  );
}

/** The grades worth trying, cheapest first (loosest first at equal cost); worked out once per catalog list and series. */
const gradePools = new WeakMap<readonly ResistorGrade[], Map<SeriesName | undefined, readonly ResistorGrade[]>>();
function gradePool(all: readonly ResistorGrade[], series: SeriesName | undefined): readonly ResistorGrade[] {
  let bySeries = gradePools.get(all);
  if (!bySeries) {
    bySeries = new Map();
    gradePools.set(all, bySeries);
  }
  let pool = bySeries.get(series);
  if (!pool) {
    const grades = all
      .filter((g) => (series === undefined ? !dominated(g, all) : g.series === series || (series === 'E96' && g.series === 'E192')))
      .sort((a, b) => a.extraCents - b.extraCents || b.tolerance - a.tolerance);
    pool = grades.length > 0 ? grades : all.slice(0, 1);
    bySeries.set(series, pool);
  }
  return pool;
}

export function searchDivider(input: DividerSearchInput): DividerSearchResult {
  const pool = gradePool(input.grades, input.series);
  // This search's pairs by series: its grades share a few series.
  const found = new Map<SeriesName, Readonly<Divider>>();
  const pairFor = (series: SeriesName) => {
    let pair = found.get(series);
    if (pair) return pair;
    // Several classes and topologies ask for the same divider: each distinct question is searched once.
    const { vTarget, vRef, iAdjTyp, iDividerMin, iDividerMax, r1Forced, r2Forced } = input;
    pair = pairs.get([vTarget, vRef, iAdjTyp, iDividerMin, iDividerMax, series, r1Forced, r2Forced], () =>
      Object.freeze(bestPair(vTarget, vRef, iAdjTyp, iDividerMin, iDividerMax, series, r1Forced, r2Forced)),
    );
    found.set(series, pair);
    return pair;
  };
  const design = (grade: ResistorGrade, ref: ReferenceGrade): DividerDesign => {
    // A forced E96 request keeps E96 values even in a finer grade.
    const series: SeriesName = input.series === 'E96' ? 'E96' : grade.series;
    const pair = pairFor(series);
    const spread: DividerSpread = {
      vRefTolerance: ref.tolerance,
      vRefDrift: input.vRefDriftPpmK * 1e-6 * input.tempSwingK,
      resistor: grade.tolerance + grade.tcrPpmK * 1e-6 * input.tempSwingK,
      iAdjMin: input.iAdjMin,
      iAdjMax: input.iAdjMax,
      iAdjTyp: input.iAdjTyp,
      extra: input.extra ?? [],
    };
    const model = dividerOutputModel(input.vRef, pair, spread);
    const summary = analyseTolerance(model);
    const verdict = toleranceVerdict(summary, input.band, input.rule, input.marginV ?? 0);
    return {
      ...pair,
      grade,
      series,
      refTolerance: ref.tolerance,
      extraCents: 2 * grade.extraCents + ref.extraCents,
      model,
      summary,
      verdict,
      why: '',
    };
  };
  // Written only for the designs handed back: text is the dearest part of a candidate.
  const explain = (d: DividerDesign): DividerDesign => {
    const view = d.verdict === 'statistical' ? '3σ' : 'worst case';
    const range = d.verdict === 'statistical' ? d.summary.statistical : d.summary.worstCase;
    const why =
      `${d.series} ${formatSi(d.r1, 'Ω', 3)} / ${formatSi(d.r2, 'Ω', 3)} (${d.grade.label}) with the ${pct(d.refTolerance)} reference: ` +
      `${range.min.toFixed(4)}–${range.max.toFixed(4)} V ${view}` +
      (d.verdict === 'fails' ? `, outside ${input.band.lo.toFixed(4)}–${input.band.hi.toFixed(4)} V` : '') +
      `; the largest term is ${d.summary.contributions[0]?.name ?? 'Vref'}.`;
    return { ...d, why };
  };
  // Combinations cheapest first; the search stops at the first cost level that passes (worst case preferred there).
  const combos = pool.flatMap((grade) => input.refGrades.map((ref) => ({ grade, ref, cents: 2 * grade.extraCents + ref.extraCents })));
  // The pool is cheapest first already: with one reference grade the combinations are in order.
  if (input.refGrades.length > 1) combos.sort((a, b) => a.cents - b.cents);
  const candidates: DividerDesign[] = [];
  let passedAt: number | null = null;
  for (const c of combos) {
    if (passedAt !== null && c.cents > passedAt) break;
    const d = design(c.grade, c.ref);
    candidates.push(d);
    if (d.verdict !== 'fails' && passedAt === null) passedAt = c.cents;
  }
  const rank = (d: DividerDesign) => (d.verdict === 'worst-case' ? 0 : 1);
  const passing = candidates.filter((d) => d.verdict !== 'fails').sort((a, b) => a.extraCents - b.extraCents || rank(a) - rank(b));
  const width = (d: DividerDesign) => {
    const r = input.rule === 'statistical' ? d.summary.statistical : d.summary.worstCase;
    return Math.max(input.band.lo - r.min, r.max - input.band.hi);
  };
  const pick = passing[0] ?? candidates.slice().sort((a, b) => width(a) - width(b) || a.extraCents - b.extraCents)[0]!;
  const worstCasePick = pick.verdict === 'statistical' ? (passing.find((d) => d.verdict === 'worst-case') ?? null) : null;
  return { pick: explain(pick), worstCasePick: worstCasePick && explain(worstCasePick) };
}
