// Independent check with eecircuit-engine (ngspice in WebAssembly): a switching transient of the
// buck design the engine produced, driven open loop at the engine's duty cycle.
import { Simulation } from 'eecircuit-engine';
import { beforeAll, describe, expect, test } from 'vitest';
import { briefSchema, evaluate, toSpiceNetlist } from '~/lib/engine/index.ts';
import { BUCK_AVERAGE_PERIODS, BUCK_PERIODS } from '~/lib/engine/spice.ts';

let sim: Simulation;
beforeAll(async () => {
  sim = new Simulation();
  await sim.start();
}, 60_000);

interface Waves {
  time: number[];
  vOut: number[];
  iL: number[];
}

async function transient(netlist: string): Promise<Waves> {
  sim.setNetList(netlist);
  const result = await sim.runSim();
  expect(sim.getError().filter((m) => /error|no convergence|abort|timestep too small/i.test(m))).toEqual([]);
  if (result.dataType !== 'real') throw new Error('expected a real transient result');
  const wave = (name: string) => result.data.find((d) => d.name === name)!.values;
  return { time: wave('time'), vOut: wave('v(out)'), iL: wave('i(vsense)') };
}

/** Time average over [t0, end] by the trapezoid rule (the simulator's steps are not uniform). */
function average(time: number[], y: number[], t0: number): number {
  let area = 0;
  for (let k = 1; k < time.length; k += 1) {
    if (time[k]! <= t0) continue;
    area += ((y[k]! + y[k - 1]!) / 2) * (time[k]! - time[k - 1]!);
  }
  return area / (time[time.length - 1]! - t0);
}

/**
 * Peak-to-peak within each of the last `periods` switching periods, averaged: the open-loop LC
 * rings slowly around its operating point, and a window spanning many periods would add that
 * ringing to the switching ripple.
 */
function ripplePerPeriod(time: number[], y: number[], period: number, periods: number): number {
  const end = time[time.length - 1]!;
  let sum = 0;
  for (let p = 0; p < periods; p += 1) {
    const from = end - (p + 1) * period;
    const to = end - p * period;
    let lo = Number.POSITIVE_INFINITY;
    let hi = Number.NEGATIVE_INFINITY;
    for (let k = 0; k < time.length; k += 1) {
      if (time[k]! < from || time[k]! > to) continue;
      lo = Math.min(lo, y[k]!);
      hi = Math.max(hi, y[k]!);
    }
    sum += hi - lo;
  }
  return sum / periods;
}

const buck = evaluate(
  briefSchema.parse({
    input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
    output: { v: 3.3, tolerance: 0.05, iMin: 0.1, iTyp: 0.5, iMax: 1 },
    noise: { class: 'digital' },
    thermal: { ambientMaxC: 40, airflow: 'still-air' },
  }),
).options.find((o) => o.topology === 'buck')!;
const traced = (id: string) => buck.trace.find((t) => t.id === id)!.result.value;
const vOutEngine = traced('buck.fb');
const sw = buck.components.find((c) => c.role === 'switch')!.ref;
const fsw = buck.assumptions[`${sw}.fsw`]!.value;
const henries = buck.components.find((c) => c.role === 'inductor')!.value!;

describe('buck design against an ngspice switching transient', () => {
  test('the design is feasible and synchronous (two switches in the netlist)', () => {
    expect(buck.feasible).toBe(true);
    expect(toSpiceNetlist(buck, { vIn: 12, iOut: 0.5 })).toMatch(/^S2 /m);
  });

  test('highest input, full load: average output within 2 %, inductor ripple within 10 %, output ripple bounded', async () => {
    const w = await transient(toSpiceNetlist(buck, { vIn: 14, iOut: 1 })!);
    const t0 = (BUCK_PERIODS - BUCK_AVERAGE_PERIODS) / fsw;
    expect(Math.abs(average(w.time, w.vOut, t0) - vOutEngine)).toBeLessThanOrEqual(0.02 * vOutEngine);
    const ripple = traced('buck.dil');
    expect(Math.abs(ripplePerPeriod(w.time, w.iL, 1 / fsw, 10) - ripple)).toBeLessThanOrEqual(0.1 * ripple);
    // Output ripple ΔIL/(8·fsw·C) + ΔIL·ESR adds two peaks that do not coincide in time, so the
    // engine's figure is an upper bound: at or above the simulated ripple, and within 30 % of it.
    const simulated = ripplePerPeriod(w.time, w.vOut, 1 / fsw, 10);
    expect(traced('buck.ripple')).toBeGreaterThanOrEqual(simulated);
    expect(traced('buck.ripple')).toBeLessThanOrEqual(1.3 * simulated);
    // Average inductor current is the load current (capacitor charge balance, Erickson & Maksimović ch. 2 — from memory).
    expect(Math.abs(average(w.time, w.iL, t0) - 1)).toBeLessThanOrEqual(0.02);
  });

  test('nominal corner: average output within 2 %, ripple ΔIL = (Vin − Vout)·D/(fsw·L) within 10 %', async () => {
    const w = await transient(toSpiceNetlist(buck, { vIn: 12, iOut: 0.5 })!);
    const t0 = (BUCK_PERIODS - BUCK_AVERAGE_PERIODS) / fsw;
    expect(Math.abs(average(w.time, w.vOut, t0) - vOutEngine)).toBeLessThanOrEqual(0.02 * vOutEngine);
    const d = traced('buck.d.nom');
    const ripple = ((12 - vOutEngine) * d) / (fsw * henries);
    expect(Math.abs(ripplePerPeriod(w.time, w.iL, 1 / fsw, 10) - ripple)).toBeLessThanOrEqual(0.1 * ripple);
  });
});
