// Shunt rails: a Zener's voltage drift over temperature, and the precision shunt reference that
// makes a tight shunt rail possible (Vout = Vref·(1 + R2/R1) + Iref·R2, the three-terminal shunt
// reference's output equation — common practice).
import { describe, expect, test } from 'vitest';
import { assemble } from '~/lib/engine/assemble.ts';
import { defaultCatalog } from '~/lib/engine/catalog.ts';
import { makeContext } from '~/lib/engine/context.ts';
import { railSpecSchema } from '~/lib/engine/rail-spec.ts';
import { designShunt } from '~/lib/engine/topologies/shunt.ts';
import { zenerTempco } from '~/lib/engine/zeners.ts';

describe('Zener temperature coefficient (fit to data-sheet curves, from memory)', () => {
  test('negative below about 5.5 V, near zero there, about +0.1 %/K at high voltage', () => {
    expect(zenerTempco(3.3)).toBeCloseTo(0.001 * (1 - 5.5 / 3.3), 12); // −0.067 %/K
    expect(zenerTempco(5.5)).toBe(0);
    expect(zenerTempco(100)).toBeCloseTo(0.001 * (1 - 0.055), 12);
  });
});

describe('12 V → 5 V ±2 %, 5 mA shunt rail', () => {
  const spec = railSpecSchema.parse({
    input: { vMin: 11.4, vNom: 12, vMax: 12.6, source: 'adapter' },
    output: { v: 5, tolerance: 0.02, iMin: 0.001, iTyp: 0.0025, iMax: 0.005 },
    noise: { class: 'precision' },
    thermal: { ambientMaxC: 40, airflow: 'still-air' },
  });
  const ctx = makeContext(spec, defaultCatalog);
  const option = assemble(designShunt(ctx), ctx, 3);
  const ref = defaultCatalog.shuntReferences[0]!;
  test('a Zener cannot hold ±2 %; the precision shunt reference does', () => {
    expect(option.feasible).toBe(true);
    expect(option.label).toContain(ref.label);
  });
  test('its output by hand from the divider it chose', () => {
    const r1 = option.components.find((c) => c.role === 'feedback-lower')!.value!;
    const r2 = option.components.find((c) => c.role === 'feedback-upper')!.value!;
    const vOut = ref.vRefV * (1 + r2 / r1) + (ref.iRefA / 2) * r2;
    expect(option.trace.find((t) => t.id === 'shunt.vout')!.result.value).toBeCloseTo(vOut, 12);
    expect(Math.abs(vOut - 5) / 5).toBeLessThan(0.005);
  });
});

describe('the shunt reference’s series resistor', () => {
  // Rs = (vInTrough − Vout,max)/(iOutMax + IKmin + Idiv), snapped down (common practice): Vout,max is
  // the highest output the cheapest grades reach, so widening the band cannot lower it.
  const rsAt = (tolerance: number) => {
    const spec = railSpecSchema.parse({
      input: { vMin: 4.75, vNom: 5, vMax: 5.25, rippleVpp: 0.05, source: 'adapter' },
      output: { v: 3.3, tolerance, iMin: 0.0001, iTyp: 0.0005, iMax: 0.001 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    });
    const ctx = makeContext(spec, defaultCatalog);
    return assemble(designShunt(ctx), ctx, 3).components.find((c) => c.role === 'series-resistor')!.value!;
  };
  test('a looser tolerance never makes it smaller (and dearer)', () => {
    expect(rsAt(0.0615)).toBeGreaterThanOrEqual(rsAt(0.05));
    expect(rsAt(0.1)).toBeGreaterThanOrEqual(rsAt(0.05));
  });
});
