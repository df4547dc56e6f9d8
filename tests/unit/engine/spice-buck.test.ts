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

function peakToPeak(time: number[], y: number[], t0: number): number {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (let k = 0; k < time.length; k += 1) {
    if (time[k]! < t0) continue;
    lo = Math.min(lo, y[k]!);
    hi = Math.max(hi, y[k]!);
  }
  return hi - lo;
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

  test('highest input, full load: average output within 2 %, inductor ripple within 10 % of the engine', async () => {
    const w = await transient(toSpiceNetlist(buck, { vIn: 14, iOut: 1 })!);
    const t0 = (BUCK_PERIODS - BUCK_AVERAGE_PERIODS) / fsw;
    expect(Math.abs(average(w.time, w.vOut, t0) - vOutEngine)).toBeLessThanOrEqual(0.02 * vOutEngine);
    const ripple = traced('buck.dil');
    expect(Math.abs(peakToPeak(w.time, w.iL, t0) - ripple)).toBeLessThanOrEqual(0.1 * ripple);
    // Average inductor current is the load current (capacitor charge balance, Erickson & Maksimović ch. 2 — from memory).
    expect(Math.abs(average(w.time, w.iL, t0) - 1)).toBeLessThanOrEqual(0.02);
  });

  test('nominal corner: average output within 2 %, ripple ΔIL = (Vin − Vout)·D/(fsw·L) within 10 %', async () => {
    const w = await transient(toSpiceNetlist(buck, { vIn: 12, iOut: 0.5 })!);
    const t0 = (BUCK_PERIODS - BUCK_AVERAGE_PERIODS) / fsw;
    expect(Math.abs(average(w.time, w.vOut, t0) - vOutEngine)).toBeLessThanOrEqual(0.02 * vOutEngine);
    const d = traced('buck.d.nom');
    const ripple = ((12 - vOutEngine) * d) / (fsw * henries);
    expect(Math.abs(peakToPeak(w.time, w.iL, t0) - ripple)).toBeLessThanOrEqual(0.1 * ripple);
  });
});
