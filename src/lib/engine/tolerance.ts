// Output-voltage spread: extreme-value analysis over the parts' tolerance bands and a seeded
// Monte Carlo with uniform draws inside the same bands (typed arrays: this runs 10⁴–10⁵ times).
import type { MonteCarloResult } from './types.ts';

export interface ToleranceParam {
  name: string;
  nominal: number;
  lo: number;
  hi: number;
}

export interface ToleranceModel {
  params: readonly ToleranceParam[];
  /** Output voltage for a parameter vector in `params` order. */
  f: (x: Float64Array) => number;
  /** The same over columns of draws (one column per parameter), written into `out`: a tight loop per model. */
  batch: (columns: readonly Float64Array[], out: Float64Array) => void;
}

export const HISTOGRAM_BINS = 20;

// One reusable work area: allocating and zeroing megabytes per evaluation would cost more than
// the draws themselves. Its contents never outlive a call, so results stay pure.
let scratch = new Float64Array(0);
function scratchFor(length: number): Float64Array {
  if (scratch.length < length) scratch = new Float64Array(length);
  return scratch;
}

export function nominalValue(model: ToleranceModel): number {
  return model.f(Float64Array.from(model.params, (p) => p.nominal));
}

/** Smallest and largest output over every vertex of the tolerance box (2ⁿ combinations). */
export function extremeValues(model: ToleranceModel): { min: number; max: number } {
  const n = model.params.length;
  const x = new Float64Array(n);
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

/** Seeded Monte Carlo of the output; the histogram spans [rangeMin, rangeMax] in equal bins. */
export function monteCarlo(
  model: ToleranceModel,
  draws: number,
  seed: number,
  band: { lo: number; hi: number },
  range: { min: number; max: number },
): MonteCarloResult {
  const n = model.params.length;
  const buffer = scratchFor((n + 1) * draws);
  const columns: Float64Array[] = [];
  // mulberry32, a small seeded generator, inlined: this loop is the engine's hot spot. Column by
  // column, so each parameter's draws come from consecutive numbers of one seeded stream.
  let state = seed >>> 0;
  for (let j = 0; j < n; j += 1) {
    const p = model.params[j]!;
    const span = p.hi - p.lo;
    const column = buffer.subarray(j * draws, (j + 1) * draws);
    for (let i = 0; i < draws; i += 1) {
      state = (state + 0x6d2b79f5) >>> 0;
      let t = state;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      column[i] = p.lo + span * (((t ^ (t >>> 14)) >>> 0) / 4294967296);
    }
    columns.push(column);
  }
  const out = buffer.subarray(n * draws, (n + 1) * draws);
  model.batch(columns, out);
  let sum = 0;
  let inside = 0;
  for (let i = 0; i < draws; i += 1) {
    const v = out[i]!;
    sum += v;
    if (v >= band.lo && v <= band.hi) inside += 1;
  }
  const mean = sum / draws;
  let squares = 0;
  const counts = new Int32Array(HISTOGRAM_BINS);
  const width = range.max - range.min;
  const perBin = width > 0 ? HISTOGRAM_BINS / width : 0;
  for (let i = 0; i < draws; i += 1) {
    const v = out[i]!;
    squares += (v - mean) * (v - mean);
    const k = Math.floor((v - range.min) * perBin);
    counts[k < 0 ? 0 : k >= HISTOGRAM_BINS ? HISTOGRAM_BINS - 1 : k]! += 1;
  }
  return {
    draws,
    seed,
    mean,
    sigma: draws > 1 ? Math.sqrt(squares / (draws - 1)) : 0,
    fractionInTolerance: inside / draws,
    histogram: { min: range.min, max: range.max, counts: Array.from(counts) },
  };
}
