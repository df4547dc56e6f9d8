// Property tests (fast-check) on ordinary briefs: a requirement made easier never blocks an option
// that met the harder one, and a harder requirement never makes an option cheaper to the search.
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema, type Evaluation, type RailSpecInput, type TopologyId } from '~/lib/engine/index.ts';
import { LOSS_CENTS_PER_W } from '~/lib/engine/topologies/switcher.ts';
import type { Option } from '~/lib/engine/types.ts';
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
    output: {
      ...spec.output,
      tolerance: Math.min(0.5, spec.output.tolerance * (1 + k.t)),
      iMax: toward(spec.output.iMax, spec.output.iTyp),
    },
    noise: { class: spec.noise.class, maxRippleVpp: Math.min(100, spec.noise.maxRippleVpp * (1 + k.r)) },
    thermal: { ...spec.thermal, ambientMaxC: Math.max(-40, spec.thermal.ambientMaxC - k.a) },
  };
}

const SWITCHERS = new Set<TopologyId>(['buck', 'boost', 'buck-boost']);

/**
 * What a design search minimises, ¢: the parts cost, and for a switcher also LOSS_CENTS_PER_W per
 * watt lost at the nominal corner (a lossier, cheaper stage is not "cheaper" to the search).
 */
function searchCost(o: Option, spec: RailSpecInput): number {
  if (!SWITCHERS.has(o.topology)) return o.costCents;
  const pOut = spec.output.v * (spec.output.iTyp ?? 0);
  const loss = o.efficiency.nominal > 0 ? pOut * (1 / o.efficiency.nominal - 1) : 0;
  return o.costCents + LOSS_CENTS_PER_W * loss;
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
          // 1 %: the searches size inductors and capacitors from the requirement itself (a ripple
          // ratio of the highest load), so the candidates move a little with it; anything beyond
          // that is a search that misses a cheaper design it could have kept.
          const [tc, lc] = [searchCost(t, brief.spec), searchCost(l, brief.spec)];
          if (t.feasible && l.feasible && tc < 0.99 * lc) cheaper.push(`${id}: ${tc.toFixed(1)} ¢ tight, ${lc.toFixed(1)} ¢ loose`);
        }
        expect({ brief: brief.id, lost, cheaper }).toEqual({ brief: brief.id, lost: [], cheaper: [] });
      }),
      { numRuns: 30, seed: 20261203 },
    );
  });
});

describe('the output capacitor and the feedback grade are chosen together', () => {
  // up-3v3-12v-100ma with its ripple limit ×5.5: a 6.8 µF electrolytic meets the looser ripple, but
  // its ripple leaves the 1 % divider no room in the band, so 0.5 % resistors follow. The ceramic
  // sized for the room the 1 % grade leaves is cheaper in total, and the looser brief must find it.
  test('a looser ripple limit never makes the boost dearer', () => {
    const brief = CORPUS.find((b) => b.id === 'up-3v3-12v-100ma')!;
    const base = railSpecSchema.parse(brief.spec);
    const cost = (maxRippleVpp: number) => {
      const boost = evaluate({ ...base, noise: { ...base.noise, maxRippleVpp } }).options.find((o) => o.topology === 'boost')!;
      expect(boost.feasible).toBe(true);
      return searchCost(boost, brief.spec);
    };
    expect(cost(base.noise.maxRippleVpp * 5.5)).toBeLessThanOrEqual(cost(base.noise.maxRippleVpp));
  });
});
