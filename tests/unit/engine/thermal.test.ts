// Thermal figures a practitioner checks by hand: the enclosure's inside air, the heatsink budget
// with its airflow factor, and what is said (never a temperature) when a part would pass its limit.
import { describe, expect, test } from 'vitest';
import { defaultCatalog, evaluate, railSpecSchema, type Option, type RailSpecInput } from '~/lib/engine/index.ts';
import { AIR_RHO_CP_J_M3K, ENCLOSURE_K_W_M2K, enclosureRise, maxSinkTheta, powerAtLimit } from '~/lib/engine/thermal.ts';
import { makeContext } from '~/lib/engine/context.ts';

const bus: RailSpecInput = {
  input: { vMin: 22, vNom: 24, vMax: 26, source: 'bus' },
  output: { v: 5, tolerance: 0.05, iMin: 0.01, iTyp: 0.1, iMax: 0.2 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 40, airflow: 'still-air' },
};
const linearOf = (input: RailSpecInput): Option => evaluate(railSpecSchema.parse(input)).options.find((o) => o.topology === 'linear')!;
const entry = (o: Option, id: string) => o.trace.find((t) => t.id === id);

describe('enclosure air rise: steady heat balance P = (k·A + ρ·cp·V̇)·ΔT', () => {
  test('hand example: 5 W in a painted metal box of 0.1 m², sealed and with a 10 m³/h fan', () => {
    // k = 5.5 W/(m²·K) for painted sheet metal (IEC TR 60890, from memory): ΔT = 5/(5.5·0.1) = 9.09 K.
    const sealed = railSpecSchema.parse({
      ...bus,
      thermal: { ambientMaxC: 40, airflow: 'enclosed', enclosure: { surfaceCm2: 1000, otherW: 3 } },
    });
    expect(ENCLOSURE_K_W_M2K.metal).toBe(5.5);
    expect(enclosureRise(sealed, 2)!.riseK).toBeCloseTo(5 / 0.55, 9);
    // ρ·cp of air ≈ 1.2 kg/m³ × 1005 J/(kg·K) (common practice); 10 m³/h = 2.78 l/s carries 3.35 W/K: ΔT = 5/(0.55 + 3.35) = 1.28 K.
    const fanned = railSpecSchema.parse({
      ...bus,
      thermal: { ambientMaxC: 40, airflow: 'forced-air', enclosure: { surfaceCm2: 1000, otherW: 3, fanFlowM3h: 10 } },
    });
    expect(enclosureRise(fanned, 2)!.riseK).toBeCloseTo(5 / (0.55 + (AIR_RHO_CP_J_M3K * 10) / 3600), 9);
    // Without an enclosure in the brief there is no rise to add.
    expect(enclosureRise(railSpecSchema.parse(bus), 2)).toBeNull();
    // Every designer already works in the box warmed by the other 3 W: 40 + 3/0.55 °C.
    expect(makeContext(sealed, defaultCatalog)).toMatchObject({ roomC: 40, ambientC: 40 + 3 / 0.55 });
  });

  test('every part is rated at the inside air: the linear regulator’s ambient is the room plus the rise its own loss and the rest cause', () => {
    const boxed = linearOf({ ...bus, thermal: { ambientMaxC: 40, airflow: 'enclosed', enclosure: { surfaceCm2: 600, otherW: 3 } } });
    const rise = entry(boxed, 'enclosure.rise')!;
    // (P + 3 W)/(5.5 · 0.06 m²), P the option's own worst dissipation.
    expect(rise.inputs.P!.value).toBeCloseTo(boxed.dissipation.totalMaxW, 12);
    expect(rise.result.value).toBeCloseTo((boxed.dissipation.totalMaxW + 3) / (5.5 * 0.06), 9);
    const tj = entry(boxed, 'U1.tj')!;
    expect(tj.inputs.Ta!.value).toBeCloseTo(40 + rise.result.value, 9);
    expect(boxed.issues.map((i) => i.code)).toContain('enclosure');
    // An older brief without the enclosure still parses and sees the room's air.
    expect(entry(linearOf(bus), 'U1.tj')!.inputs.Ta!.value).toBe(40);
  });
});

describe('heatsink budget θSA,max = ((Tj,max − margin − Ta)/P − θJC − θCS)/k', () => {
  test('the airflow factor the sink is derated by is in the figure and in its trace', () => {
    const o = linearOf({ ...bus, thermal: { ambientMaxC: 40, airflow: 'enclosed' } });
    const step = entry(o, 'U1.thetasa')!;
    expect(step.equation).toContain('/kair');
    expect(step.inputs.kair!.value).toBe(defaultCatalog.thermal.airflowFactor.enclosed);
    const i = Object.fromEntries(Object.entries(step.inputs).map(([k, q]) => [k, q.value]));
    expect(step.result.value).toBeCloseTo(((i['Tj,max']! - i.margin! - i.Ta!) / i.P! - i.θJC! - i.θCS!) / i.kair!, 12);
    expect(o.heatsink.maxThetaSaCW).toBeCloseTo(step.result.value, 12);
  });

  test('no negative θSA exists: when θJC + θCS alone spend the budget, the answer is null and the words say no heatsink is good enough', () => {
    expect(maxSinkTheta(100, 40, 50, 1.5, 0.5, 1)).toBeNull();
    const o = linearOf({ ...bus, output: { ...bus.output, iTyp: 0.5, iMax: 1 } });
    expect(o.heatsink.maxThetaSaCW).toBeNull();
    expect(o.issues.find((i) => i.code === 'heatsink')!.message).toMatch(/no heatsink is good enough \(needs < 0 K\/W/);
  });
});

describe('a heatsink beyond the catalog', () => {
  test('says what forced air would change and what that heatsink costs', () => {
    const o = linearOf({
      ...bus,
      input: { vMin: 10.8, vNom: 12, vMax: 13.2, source: 'bus' },
      output: { ...bus.output, v: 3.3, iTyp: 0.5, iMax: 1 },
    });
    const budget = o.trace.find((t) => t.id === 'U1.thetasa')!.result.value;
    const fix = o.fixes.find((f) => f.code === 'heatsink')!;
    // The still-air budget times its factor (1) is what the sink may take once scaled by forced air (0.6).
    const sink = defaultCatalog.heatsinks.find((h) => h.thetaSaCW <= budget / defaultCatalog.thermal.airflowFactor['forced-air'])!;
    expect(defaultCatalog.heatsinks.every((h) => h.thetaSaCW > budget)).toBe(true);
    expect(fix).toMatchObject({ costCents: sink.costCents });
    expect(fix.message).toContain(`${sink.thetaSaCW} K/W`);
  });
});

describe('a part past its limit', () => {
  test('is held at its limit and flagged; the words give its limit and its power, never a temperature beyond it', () => {
    const o = linearOf({ ...bus, output: { ...bus.output, iTyp: 0.5, iMax: 1 } });
    const u1 = o.junctions.find((j) => j.ref === 'U1')!;
    expect(u1).toMatchObject({ tjC: u1.tjMaxC, beyondLimit: true });
    expect(o.issues.find((i) => i.code === 'hot-surface')!.message).toContain(`U1 (beyond its ${u1.tjMaxC} °C limit)`);
    // The trace gives the power the part would carry at its limit: (Tj,max − Ta)/(θJA·k).
    const limit = entry(o, 'U1.plimit')!;
    expect(limit.result.value).toBeCloseTo(powerAtLimit(u1.tjMaxC, 40, limit.inputs.θJA!.value * limit.inputs.kair!.value), 12);
    expect(entry(o, 'U1.tj')).toBeUndefined();
    for (const i of o.issues)
      for (const m of i.message.matchAll(/(\d+(?:\.\d+)?) ?°C/g)) expect(Number(m[1])).toBeLessThanOrEqual(u1.tjMaxC);
  });

  test('the power at the limit is never negative, even at an ambient above it', () => {
    expect(powerAtLimit(125, 130, 50)).toBe(0);
    expect(powerAtLimit(125, 25, 50)).toBe(2);
  });
});
