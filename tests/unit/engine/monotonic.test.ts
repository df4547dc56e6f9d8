// Property tests (fast-check) on ordinary briefs: a requirement made easier never blocks an option
// that met the harder one, and a harder requirement never makes an option cheaper.
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema, type Evaluation, type RailSpecInput, type TopologyId } from '~/lib/engine/index.ts';
import { CORPUS } from './corpus/briefs.ts';

interface Loosening {
  /** Tolerance ×(1 + t), ripple limit ×(1 + r), ambient −a K, highest load and input range pulled towards nominal by l. */
  t: number;
  r: number;
  a: number;
  l: number;
}

const loosening: fc.Arbitrary<Loosening> = fc.record({
  t: fc.double({ min: 0, max: 1, noNaN: true }),
  r: fc.double({ min: 0, max: 9, noNaN: true }),
  a: fc.double({ min: 0, max: 20, noNaN: true }),
  l: fc.double({ min: 0, max: 0.5, noNaN: true }),
});

function loosen(base: RailSpecInput, k: Loosening): RailSpecInput {
  const spec = railSpecSchema.parse(base);
  const toward = (v: number, nominal: number) => v + (nominal - v) * k.l;
  return {
    ...base,
    input: { ...spec.input, vMin: toward(spec.input.vMin, spec.input.vNom), vMax: toward(spec.input.vMax, spec.input.vNom) },
    output: { ...spec.output, tolerance: Math.min(0.5, spec.output.tolerance * (1 + k.t)), iMax: toward(spec.output.iMax, spec.output.iTyp) },
    noise: { class: spec.noise.class, maxRippleVpp: Math.min(100, spec.noise.maxRippleVpp * (1 + k.r)) },
    thermal: { ...spec.thermal, ambientMaxC: Math.max(-40, spec.thermal.ambientMaxC - k.a) },
  };
}

const byTopology = (e: Evaluation) => new Map(e.options.map((o) => [o.topology, o] as const));
const briefs = fc.constantFrom(...CORPUS);

describe('requirements and feasibility move together', () => {
  test('loosening a requirement never turns a feasible option infeasible; tightening never makes one cheaper', () => {
    fc.assert(
      fc.property(briefs, loosening, (brief, k) => {
        const tight = byTopology(evaluate(railSpecSchema.parse(brief.spec)));
        const loose = byTopology(evaluate(railSpecSchema.parse(loosen(brief.spec, k))));
        const lost: TopologyId[] = [];
        const cheaper: string[] = [];
        for (const [id, t] of tight) {
          const l = loose.get(id)!;
          if (t.feasible && !l.feasible) lost.push(id);
          if (t.feasible && l.feasible && t.costCents < l.costCents) cheaper.push(`${id}: ${t.costCents} ¢ tight, ${l.costCents} ¢ loose`);
        }
        expect({ brief: brief.id, lost, cheaper }).toEqual({ brief: brief.id, lost: [], cheaper: [] });
      }),
      { numRuns: 30, seed: 20261203 },
    );
  });
});
