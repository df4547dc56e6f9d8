// Output-voltage spread: extreme-value analysis over the parts' tolerance bands and a seeded
// Monte Carlo with uniform draws inside the same bands (typed arrays: this runs 10⁴–10⁵ times).
import type { MonteCarloResult } from './types.ts';

export interface ToleranceParam {
  name: string;
  nominal: number;
  lo: number;
  hi: number;
}

/** Uniform numbers per parameter and each parameter's band, as a Monte Carlo hands them to a model. */
export interface Draws {
  u: readonly Float64Array[];
  lo: Float64Array;
  span: Float64Array;
}

export interface ToleranceModel {
  params: readonly ToleranceParam[];
  /** Output voltage for a parameter vector in `params` order. */
  f: (x: Float64Array) => number;
  /**
   * The same over many draws, written into `out`: parameter j of draw i is lo[j] + span[j]·u[j][i]
   * with u[j][i] uniform in [0, 1). A tight loop per model that reads the seeded stream in place
   * instead of a copy of every column.
   */
  batch: (draws: Draws, out: Float64Array) => void;
  /** When the output rises (+1) or falls (−1) with each parameter over its whole band, the extremes sit at two vertices. */
  monotone?: readonly (1 | -1)[];
}

export const HISTOGRAM_BINS = 20;

// One reusable work area: allocating and zeroing megabytes per evaluation would cost more than
// the draws themselves. Its contents never outlive a call, so results stay pure.
let scratch = new Float64Array(0);
function scratchFor(length: number): Float64Array {
  if (scratch.length < length) scratch = new Float64Array(length);
  return scratch;
}

/**
 * Writes lo + span·u for the numbers u in [0, 1) at positions start, start + 1, … of the seeded
 * mulberry32 stream (a small, well-mixed generator, inlined: this is the engine's hot loop). Its
 * state is a counter, so any stretch of the stream starts at seed + start·step.
 */
function drawUniform(target: Float64Array, seed: number, start: number, lo: number, span: number): void {
  let state = ((seed >>> 0) + Math.imul(start, 0x6d2b79f5)) >>> 0;
  for (let i = 0; i < target.length; i += 1) {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    target[i] = lo + span * (((t ^ (t >>> 14)) >>> 0) / 4294967296);
  }
}

// Every evaluation with the same seed draws the same uniform numbers (each topology has its own
// seed), so the start of a seed's stream is generated once and kept, for a handful of seeds.
const KEPT_STREAM_LENGTH = 1 << 17;
const KEPT_STREAMS = 8;
const streams = new Map<number, Float64Array>();

function keptStream(seed: number): Float64Array {
  let u = streams.get(seed);
  if (!u) {
    u = new Float64Array(KEPT_STREAM_LENGTH);
    drawUniform(u, seed, 0, 0, 1);
    if (streams.size >= KEPT_STREAMS) streams.clear();
    streams.set(seed, u);
  }
  return u;
}

export function nominalValue(model: ToleranceModel): number {
  const x = new Float64Array(model.params.length);
  for (let j = 0; j < x.length; j += 1) x[j] = model.params[j]!.nominal;
  return model.f(x);
}

/** Smallest and largest output over every vertex of the tolerance box (2ⁿ combinations). */
export function extremeValues(model: ToleranceModel): { min: number; max: number } {
  const n = model.params.length;
  const x = new Float64Array(n);
  const signs = model.monotone;
  if (signs && signs.length === n) {
    for (let j = 0; j < n; j += 1) x[j] = signs[j]! > 0 ? model.params[j]!.lo : model.params[j]!.hi;
    const min = model.f(x);
    for (let j = 0; j < n; j += 1) x[j] = signs[j]! > 0 ? model.params[j]!.hi : model.params[j]!.lo;
    return { min, max: model.f(x) };
  }
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let mask = 0; mask < 1 << n; mask += 1) {
    for (let j = 0; j < n; j += 1) {
      const p = model.params[j]!;
      x[j] = mask & (1 << j) ? p.hi : p.lo;
    }
    const v = model.f(x);
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

export type ToleranceRule = 'statistical' | 'worst-case';

/** Reference temperature of initial tolerances, °C (data-sheet convention). */
export const REFERENCE_TEMPERATURE_C = 25;
/** Coldest ambient assumed when the brief gives only the hottest: indoor equipment (common practice). */
export const COLD_AMBIENT_C = 0;
/** Statistical acceptance: the ±3σ interval inside the band, a yield of at least 99.73 % (normal model). */
export const SIGMA_LIMIT = 3;

/** Largest departure from 25 °C a part sees between the cold ambient and the hot ambient plus its own rise. */
export function temperatureSwingK(ambientMaxC: number, selfRiseK = 0): number {
  return Math.max(ambientMaxC + Math.max(0, selfRiseK) - REFERENCE_TEMPERATURE_C, REFERENCE_TEMPERATURE_C - COLD_AMBIENT_C, 0);
}

/** A relative band ±rel about a nominal, as a parameter. */
export function relativeParam(name: string, nominal: number, rel: number): ToleranceParam {
  return { name, nominal, lo: nominal * (1 - rel), hi: nominal * (1 + rel) };
}

export interface ToleranceSummary {
  nominal: number;
  worstCase: { min: number; max: number };
  /** First-order mean and root-sum-square sigma, each parameter uniform over its band (as the Monte Carlo draws). */
  mean: number;
  sigma: number;
  /** mean ± 3σ, never wider than the worst case. */
  statistical: { min: number; max: number };
  /** Each parameter's half-swing of the output, largest first: what to tighten. */
  readonly contributions: { name: string; halfSwing: number }[];
}

/** A summary whose ranked contributions are listed on first reading: a search reads them only for the design it keeps. */
class Summary implements ToleranceSummary {
  private ranked: { name: string; halfSwing: number }[] | null = null;
  constructor(
    readonly nominal: number,
    readonly worstCase: { min: number; max: number },
    readonly mean: number,
    readonly sigma: number,
    readonly statistical: { min: number; max: number },
    private readonly params: readonly ToleranceParam[],
    private readonly halfSwings: Float64Array,
  ) {}
  get contributions(): { name: string; halfSwing: number }[] {
    this.ranked ??= this.params.map((p, j) => ({ name: p.name, halfSwing: this.halfSwings[j]! })).sort((a, b) => b.halfSwing - a.halfSwing);
    return this.ranked;
  }
}

/**
 * Worst case over the box's vertices and a root-sum-square sigma from one-at-a-time swings about
 * the box centre: 2ⁿ + 2n + 2 evaluations, cheap enough to run for every candidate of a search.
 */
export function analyseTolerance(model: ToleranceModel): ToleranceSummary {
  const worstCase = extremeValues(model);
  const n = model.params.length;
  // One vector for every evaluation: each swing moves one coordinate off the centre and puts it back.
  const x = new Float64Array(n);
  for (let j = 0; j < n; j += 1) x[j] = (model.params[j]!.lo + model.params[j]!.hi) / 2;
  const mean = model.f(x);
  const halfSwings = new Float64Array(n);
  let variance = 0;
  for (let j = 0; j < n; j += 1) {
    const p = model.params[j]!;
    const centre = x[j]!;
    x[j] = p.hi;
    const up = model.f(x);
    x[j] = p.lo;
    const half = Math.abs(up - model.f(x)) / 2;
    x[j] = centre;
    halfSwings[j] = half;
    // A uniform band of half-width a has σ = a/√3.
    variance += (half * half) / 3;
  }
  const sigma = Math.sqrt(variance);
  return new Summary(
    nominalValue(model),
    worstCase,
    mean,
    sigma,
    { min: Math.max(worstCase.min, mean - SIGMA_LIMIT * sigma), max: Math.min(worstCase.max, mean + SIGMA_LIMIT * sigma) },
    model.params,
    halfSwings,
  );
}

/** Which view puts the output inside the band: the worst case, only the 3σ interval (when the rule allows it), or neither. */
export function toleranceVerdict(
  summary: ToleranceSummary,
  band: { lo: number; hi: number },
  rule: ToleranceRule,
  marginV = 0,
): 'worst-case' | 'statistical' | 'fails' {
  const inside = (r: { min: number; max: number }) => r.min - marginV >= band.lo && r.max + marginV <= band.hi;
  if (inside(summary.worstCase)) return 'worst-case';
  return rule === 'statistical' && inside(summary.statistical) ? 'statistical' : 'fails';
}

/** Seeded Monte Carlo of the output; the histogram spans [rangeMin, rangeMax] in equal bins. */
export function monteCarlo(
  model: ToleranceModel,
  draws: number,
  seed: number,
  band: { lo: number; hi: number },
  range: { min: number; max: number },
): MonteCarloResult {
  const n = model.params.length;
  const lo = new Float64Array(n);
  const span = new Float64Array(n);
  for (let j = 0; j < n; j += 1) {
    lo[j] = model.params[j]!.lo;
    span[j] = model.params[j]!.hi - lo[j]!;
  }
  // Parameter j takes the numbers j·draws, j·draws + 1, … of the seed's stream: straight from the
  // kept stream when it is long enough, else generated (a large Monte Carlo does not keep them).
  const kept = n * draws <= KEPT_STREAM_LENGTH ? keptStream(seed) : null;
  const buffer = scratchFor((kept ? 1 : n + 1) * draws);
  const u: Float64Array[] = [];
  for (let j = 0; j < n; j += 1) {
    if (kept) u.push(kept.subarray(j * draws, (j + 1) * draws));
    else {
      const column = buffer.subarray((j + 1) * draws, (j + 2) * draws);
      drawUniform(column, seed, j * draws, 0, 1);
      u.push(column);
    }
  }
  const out = buffer.subarray(0, draws);
  model.batch({ u, lo, span }, out);
  // One pass over the outputs. Sums run about the first draw so the squares do not cancel.
  const shift = draws > 0 ? out[0]! : 0;
  let sum = 0;
  let squares = 0;
  let inside = 0;
  const counts = new Int32Array(HISTOGRAM_BINS);
  const { min } = range;
  const width = range.max - min;
  const perBin = width > 0 ? HISTOGRAM_BINS / width : 0;
  const lastBin = HISTOGRAM_BINS - 1;
  const { lo: bandLo, hi: bandHi } = band;
  for (let i = 0; i < draws; i += 1) {
    const v = out[i]!;
    const d = v - shift;
    sum += d;
    squares += d * d;
    // Branch-free count: the draws fall either side of the band's edges at random.
    inside += Number(v >= bandLo) & Number(v <= bandHi);
    const k = Math.floor((v - min) * perBin);
    counts[k < 0 ? 0 : k > lastBin ? lastBin : k]! += 1;
  }
  const mean = shift + sum / draws;
  const variance = draws > 1 ? Math.max(0, (squares - (sum * sum) / draws) / (draws - 1)) : 0;
  return {
    draws,
    seed,
    mean,
    sigma: Math.sqrt(variance),
    fractionInTolerance: inside / draws,
    histogram: { min: range.min, max: range.max, counts: Array.from(counts) },
  };
}
