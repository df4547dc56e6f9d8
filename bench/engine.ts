/** In-process engine timings: full evaluations and one large Monte Carlo. */
import { performance } from 'node:perf_hooks';
import { evaluate } from '../src/lib/engine/evaluate';
import { makeContext } from '../src/lib/engine/context';
import { defaultCatalog } from '../src/lib/engine/catalog';
import { designLinear } from '../src/lib/engine/topologies/linear';
import { extremeValues, monteCarlo } from '../src/lib/engine/tolerance';
import { BENCH_BRIEFS } from './briefs';

export const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

export function engineMedianMs(runs = 280): number {
  for (let i = 0; i < 60; i++) evaluate(BENCH_BRIEFS[i % BENCH_BRIEFS.length]!);
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const brief = BENCH_BRIEFS[i % BENCH_BRIEFS.length]!;
    const t = performance.now();
    evaluate(brief);
    times.push(performance.now() - t);
  }
  return median(times);
}

/** 100 000 draws through one design's output model (the linear regulator of the 24 V controller). */
export function engineMc100kMs(runs = 30): number {
  const brief = BENCH_BRIEFS[3]!;
  const design = designLinear(makeContext(brief, defaultCatalog));
  const band = { lo: brief.output.v * (1 - brief.output.tolerance), hi: brief.output.v * (1 + brief.output.tolerance) };
  const range = extremeValues(design.output);
  for (let i = 0; i < 5; i++) monteCarlo(design.output, 100_000, i, band, range);
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    monteCarlo(design.output, 100_000, 1000 + i, band, range);
    times.push(performance.now() - t);
  }
  return median(times);
}

/** Evaluations done in this process in `seconds`, cycling the briefs (the engine is synchronous: one thread). */
export function engineRuns(seconds: number): number {
  const end = performance.now() + seconds * 1000;
  let n = 0;
  while (performance.now() < end) {
    evaluate(BENCH_BRIEFS[n % BENCH_BRIEFS.length]!);
    n++;
  }
  return n;
}
