// Property tests (fast-check): any valid brief gives a finite, deterministic, ordered answer whose
// feasible options hold the rail's tolerance; any invalid brief is rejected with field paths.
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { railSpecIssues, railSpecSchema, evaluate, type RailSpecInput, type Evaluation } from '~/lib/engine/index.ts';
import { impossibleFigures } from './corpus/impossible.ts';

const voltage = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });

/** Valid briefs across the product's range: 1–1500 V in, 0.5 V–3 kV out, µA to tens of A. */
const validBrief: fc.Arbitrary<RailSpecInput> = fc
  .record({
    vNom: voltage(1, 1500),
    spreadLo: fc.double({ min: 0, max: 0.4, noNaN: true }),
    spreadHi: fc.double({ min: 0, max: 0.4, noNaN: true }),
    ripple: fc.double({ min: 0, max: 0.2, noNaN: true }),
    source: fc.constantFrom('battery', 'adapter', 'rectified', 'bus' as const),
    vOutRatio: fc.double({ min: 0.02, max: 3, noNaN: true }),
    tolerance: fc.double({ min: 0.005, max: 0.5, noNaN: true }),
    iMax: fc.double({ min: 1e-4, max: 20, noNaN: true }),
    typFraction: fc.double({ min: 0, max: 1, noNaN: true }),
    minFraction: fc.double({ min: 0, max: 1, noNaN: true }),
    noiseClass: fc.constantFrom('digital', 'sensor', 'precision', 'rf' as const),
    ambient: fc.double({ min: -40, max: 125, noNaN: true }),
    airflow: fc.constantFrom('enclosed', 'still-air', 'forced-air' as const),
    draws: fc.integer({ min: 100, max: 1500 }),
    seed: fc.integer({ min: 0, max: 0xffffffff }),
  })
  .map((r) => {
    const vMin = r.vNom * (1 - r.spreadLo);
    const vMax = Math.min(1500, r.vNom * (1 + r.spreadHi));
    const iTyp = r.iMax * r.typFraction;
    return {
      input: { vMin, vNom: r.vNom, vMax: Math.max(vMax, r.vNom), rippleVpp: vMin * r.ripple, source: r.source },
      output: {
        v: Math.min(5000, Math.max(0.5, r.vNom * r.vOutRatio)),
        tolerance: r.tolerance,
        iMin: iTyp * r.minFraction,
        iTyp,
        iMax: r.iMax,
      },
      noise: { class: r.noiseClass },
      thermal: { ambientMaxC: r.ambient, airflow: r.airflow },
      overrides: { mcDraws: r.draws, seed: r.seed },
    };
  });

function nonFinitePaths(value: unknown, path = ''): string[] {
  if (typeof value === 'number') return Number.isFinite(value) ? [] : [path];
  if (Array.isArray(value)) return value.flatMap((v, k) => nonFinitePaths(v, `${path}[${k}]`));
  if (value !== null && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => nonFinitePaths(v, `${path}.${k}`));
  return [];
}

describe('any valid brief', () => {
  test('gives finite numbers, the same JSON twice, feasible options first, and feasible ranges inside the tolerance', () => {
    fc.assert(
      fc.property(validBrief, (input) => {
        const brief = railSpecSchema.parse(input);
        const a: Evaluation = evaluate(brief);
        expect(nonFinitePaths(a)).toEqual([]);
        // No negative rise, θSA, power or voltage on the (positive) rail; no temperature past a limit.
        expect(impossibleFigures(a, brief)).toEqual([]);
        expect(JSON.stringify(evaluate(brief))).toBe(JSON.stringify(a));
        const flags = a.options.map((o) => o.feasible);
        expect(flags).toEqual([...flags].sort((x, y) => Number(y) - Number(x)));
        expect(a.recommended).toBe(a.options[0]!.feasible ? a.options[0]!.topology : null);
        const lo = brief.output.v * (1 - brief.output.tolerance);
        const hi = brief.output.v * (1 + brief.output.tolerance);
        for (const o of a.options) {
          if (!o.feasible) {
            expect(o.score).toBeNull();
            expect(o.issues.some((i) => i.severity === 'blocker')).toBe(true);
            continue;
          }
          expect(o.score).toBeGreaterThanOrEqual(0);
          expect(o.score).toBeLessThanOrEqual(100);
          // Worst case inside the band, or (statistical rule) the ±3σ spread inside it with a caution.
          if (o.tolerance.rule === 'worst-case') {
            expect(o.vOutRange.min).toBeGreaterThanOrEqual(lo);
            expect(o.vOutRange.max).toBeLessThanOrEqual(hi);
          } else {
            expect(o.issues.map((i) => i.code)).toContain('tolerance-statistical');
          }
          expect(o.outputRippleVpp).toBeLessThanOrEqual(brief.noise.maxRippleVpp);
        }
      }),
      { numRuns: 80, seed: 20261202 },
    );
  });
});

/** A brief as plain sections of fields, to break one field at a time. */
interface Sections {
  input: { vMin?: number; vNom: number; vMax?: number; source?: string; extra?: number };
  output: { v?: number; tolerance?: number; iMin?: number; iTyp: number; iMax?: number };
  noise: { class?: string };
  thermal: { ambientMaxC?: number };
  weights?: unknown;
  overrides?: unknown;
}
type Mutation = { path: string; apply: (b: Sections) => void };
const mutations: Mutation[] = [
  { path: 'input.vMin', apply: (b) => (b.input.vMin = -1) },
  { path: 'input.vMin', apply: (b) => (b.input.vMin = Number.NaN) },
  { path: 'input.vMax', apply: (b) => (b.input.vMax = Number.POSITIVE_INFINITY) },
  { path: 'input.vMin', apply: (b) => (b.input.vMin = b.input.vNom * 2) },
  { path: 'input.source', apply: (b) => (b.input.source = 'mains') },
  { path: 'input.extra', apply: (b) => (b.input.extra = 1) },
  { path: 'output.v', apply: (b) => (b.output.v = 0) },
  { path: 'output.tolerance', apply: (b) => (b.output.tolerance = 0.6) },
  { path: 'output.iMin', apply: (b) => (b.output.iMin = b.output.iTyp + 1) },
  { path: 'output.iMax', apply: (b) => delete b.output.iMax },
  { path: 'noise.class', apply: (b) => (b.noise.class = 'loud') },
  { path: 'thermal.ambientMaxC', apply: (b) => (b.thermal.ambientMaxC = 200) },
  { path: 'weights', apply: (b) => (b.weights = { efficiency: 0, heat: 0, partCount: 0, noise: 0, cost: 0 }) },
  { path: 'weights.cost', apply: (b) => (b.weights = { cost: -1 }) },
  { path: 'overrides.mcDraws', apply: (b) => (b.overrides = { mcDraws: 200_000 }) },
  { path: 'unknown', apply: (b) => Object.assign(b, { unknown: true }) },
];

describe('any invalid brief', () => {
  test('is rejected with the failing field named by a dot path', () => {
    fc.assert(
      fc.property(validBrief, fc.constantFrom(...mutations), (input, mutation) => {
        const broken = structuredClone(input) as unknown as Sections;
        mutation.apply(broken);
        const result = railSpecSchema.safeParse(broken);
        expect(result.success).toBe(false);
        if (result.success) return;
        const issues = railSpecIssues(result.error);
        expect(issues.map((i) => i.path)).toContain(mutation.path);
        for (const i of issues) expect(i.message.length).toBeGreaterThan(10);
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  test('messages are in plain words', () => {
    const r = railSpecSchema.safeParse({
      input: { vMin: 14, vNom: 12, vMax: 15, source: 'adapter' },
      output: { v: 5, tolerance: 0.05, iMin: 0, iTyp: 0.1, iMax: 0.2 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    });
    expect(r.success).toBe(false);
    if (!r.success) {
      expect(railSpecIssues(r.error)).toEqual([
        { path: 'input.vMin', message: 'The lowest input voltage must not exceed the nominal one.' },
      ]);
    }
  });

  test('defaults fill the optional fields: ripple 0, the noise class limit, the default weights', () => {
    const b = railSpecSchema.parse({
      input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
      output: { v: 5, tolerance: 0.05, iMin: 0, iTyp: 0.1, iMax: 0.2 },
      noise: { class: 'precision' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    });
    expect(b.input.rippleVpp).toBe(0);
    expect(b.noise.maxRippleVpp).toBe(0.001);
    expect(b.weights.efficiency).toBeGreaterThan(0);
  });
});
