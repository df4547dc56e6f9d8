// Every trace entry that states a formula recomputes from its own printed inputs: the printed
// equation, evaluated over the printed inputs, gives the printed result. Entries that are not
// closed formulas (a minimum over corners, a search, a table look-up) are marked `selection` and
// are left out here on purpose.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema, topologyIds, type Option, type TraceEntry } from '~/lib/engine/index.ts';
import { CORPUS } from './corpus/briefs.ts';
import { evaluateEquation } from './trace-formula.ts';

describe('the formula evaluator', () => {
  test('reads the trace syntax: names with commas and Unicode, implicit 2π, √, ², ^, min/max, definitions after the equation', () => {
    expect(
      evaluateEquation('θSA,max = ((Tj,max − margin − Ta)/P − θJC − θCS)/kair', {
        'Tj,max': 150,
        margin: 25,
        Ta: 40,
        P: 10,
        θJC: 1.5,
        θCS: 0.5,
        kair: 1.3,
      }),
    ).toBeCloseTo((8.5 - 2) / 1.3, 12);
    expect(evaluateEquation('ΔV = ΔI/(2π·fc·Cout) + ΔI·ESR', { ΔI: 1, fc: 1e4, Cout: 1e-5, ESR: 0.01 })).toBeCloseTo(
      1 / (2 * Math.PI * 0.1) + 0.01,
      12,
    );
    expect(
      evaluateEquation('D = M·√(K/(1 − M)), M = Vout/Vin, K = 2·L·fsw·Iout/Vout', { Vout: 5, Vin: 10, L: 1e-5, fsw: 1e5, Iout: 0.1 }),
    ).toBeCloseTo(0.5 * Math.sqrt(0.04 / 0.5), 12);
    expect(evaluateEquation('ΔVout = ΔVin·rz/(Rb + rz)·10^(−PSRR/20)', { ΔVin: 1, rz: 10, Rb: 90, PSRR: 20 })).toBeCloseTo(0.01, 12);
    expect(evaluateEquation('Pmax = max(0, (Tj,max − Ta)/(θJA·kair))', { 'Tj,max': 125, Ta: 150, θJA: 50, kair: 1 })).toBe(0);
    expect(evaluateEquation('|H| = √(ESR² + Xc²) / √(ESR² + (XL − Xc)²)', { ESR: 3, Xc: 4, XL: 4 })).toBeCloseTo(5 / 3, 12);
  });

  test('refuses text that is not a formula', () => {
    expect(() => evaluateEquation('Ipk = max(IL + ΔIL/2) at Vin,min and vInMax', { IL: 1, ΔIL: 0.2 })).toThrow();
    expect(() => evaluateEquation('Output deviation for the load step', {})).toThrow();
  });
});

/** Entries the common assembly writes for every topology; the rest belong to the topology's designer. */
const COMMON = /^(efficiency|dissipation|vout|enclosure)\.|^[A-Z]{1,3}\d{1,3}\.(tj|plimit|thetasa)$/;

function mismatch(e: TraceEntry): string | null {
  const inputs = Object.fromEntries(Object.entries(e.inputs).map(([k, q]) => [k, q.value]));
  let computed: number;
  try {
    computed = evaluateEquation(e.equation, inputs);
  } catch (err) {
    return `${e.id}: "${e.equation}" is not an evaluable formula (${(err as Error).message}); write it as one or record it with trace.select`;
  }
  const tol = 1e-6 * Math.max(Math.abs(computed), Math.abs(e.result.value)) + 1e-12;
  if (Math.abs(computed - e.result.value) <= tol) return null;
  return `${e.id}: "${e.equation}" over its inputs gives ${computed}, the entry prints ${e.result.value} ${e.result.unit}`;
}

// Every corpus brief, each option's trace: the mismatches grouped by who writes the entry.
const options: Option[] = CORPUS.flatMap((b) => evaluate(railSpecSchema.parse(b.spec)).options);

function mismatchesOf(pick: (o: Option, e: TraceEntry) => boolean): string[] {
  const seen = new Set<string>();
  let checked = 0;
  for (const o of options) {
    for (const e of o.trace) {
      if (e.kind !== 'formula' || !pick(o, e)) continue;
      checked += 1;
      const m = mismatch(e);
      // One line per entry kind: the same step fails the same way on many briefs.
      if (m !== null)
        seen.add(
          `${o.topology} ${m.replace(/gives .*/, 'disagrees with its result').replace(/ is not an evaluable formula \(.*\); /, ' is not an evaluable formula; ')}`,
        );
    }
  }
  // A group with nothing to recompute would pass without checking anything.
  if (checked === 0) seen.add('no formula entry was checked');
  return [...seen].sort();
}

describe('trace entries recompute from their printed inputs', () => {
  test('the common assembly (efficiency, dissipation, output range, enclosure, junction and heatsink steps)', () => {
    expect(mismatchesOf((_o, e) => COMMON.test(e.id))).toEqual([]);
  });
  test.each(topologyIds.map((id) => [id]))('the %s designer', (id) => {
    expect(mismatchesOf((o, e) => o.topology === id && !COMMON.test(e.id))).toEqual([]);
  });
});
