// Independent check with eecircuit-engine (ngspice in WebAssembly): a switching transient of the
// boost design the engine produced, driven open loop at the engine's duty cycle.
import { Simulation } from 'eecircuit-engine';
import { beforeAll, describe, expect, test } from 'vitest';
import { toSpiceNetlist } from '~/lib/engine/index.ts';
import { BUCK_AVERAGE_PERIODS, BUCK_PERIODS } from '~/lib/engine/spice/index.ts';
import { average, ripplePerPeriod, switcherDesign, transient } from './spice-waves';

let sim: Simulation;
beforeAll(async () => {
  sim = new Simulation();
  await sim.start();
}, 60_000);

// A 12 V bus raised to 24 V at 0.5 A (one of the benchmark's briefs).
const {
  option: boost,
  traced,
  fsw,
  henries,
} = switcherDesign(
  {
    input: { vMin: 9, vNom: 12, vMax: 16, rippleVpp: 0.2, source: 'bus' },
    output: { v: 24, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
    noise: { class: 'digital' },
    thermal: { ambientMaxC: 50, airflow: 'forced-air' },
  },
  'boost',
);
const vOutEngine = traced('boost.fb');
const t0 = (BUCK_PERIODS - BUCK_AVERAGE_PERIODS) / fsw;

describe('boost design against an ngspice switching transient', () => {
  test('the design is feasible and its netlist has the low-side switch and the output rectifier', () => {
    expect(boost.feasible).toBe(true);
    const netlist = toSpiceNetlist(boost, { vIn: 12, iOut: 0.5 });
    expect(netlist).toMatch(/^S1 sw 0 g 0 /m);
    expect(netlist).toMatch(/^(Drect|S2) sw out /m);
  });

  // Measured: 12 V → 24.103 V (engine 24.12 V), ΔIL 0.453 A against 0.446 A, inductor current
  // 1.019·Iout·Vout/Vin; 9 V → 24.100 V, ΔIL 0.417 A against 0.418 A, 1.056·Iout·Vout/Vin.
  for (const corner of [
    { vIn: 12, iOut: 0.5 },
    { vIn: 9, iOut: 0.5 },
  ]) {
    test(`${corner.vIn} V in, ${corner.iOut} A out: average output within 2 %, inductor current, ripple within 10 %`, async () => {
      const w = await transient(sim, toSpiceNetlist(boost, corner));
      const vOut = average(w.time, w.vOut, t0);
      expect(Math.abs(vOut - vOutEngine)).toBeLessThanOrEqual(0.02 * vOutEngine);
      // Average inductor current is Iout/(1 − D) = Iout·Vout/(η·Vin) by charge balance on the output
      // capacitor (Erickson & Maksimović ch. 2 — from memory); losses (η < 1) put it above Iout·Vout/Vin.
      const iL = average(w.time, w.iL, t0);
      expect(iL).toBeGreaterThanOrEqual((corner.iOut * vOut) / corner.vIn);
      expect(iL).toBeLessThanOrEqual((1.15 * corner.iOut * vOut) / corner.vIn);
      // Inductor ripple ΔIL = Vin·D/(fsw·L) with D = 1 − Vin/Vout (same text, from memory).
      const d = 1 - corner.vIn / vOut;
      const ripple = (corner.vIn * d) / (fsw * henries);
      expect(Math.abs(ripplePerPeriod(w.time, w.iL, 1 / fsw, 10) - ripple)).toBeLessThanOrEqual(0.1 * ripple);
    }, 60_000);
  }

  test('highest input, light load: average output within 2 %', async () => {
    // At 16 V the open-loop output still rings slowly after 300 periods (measured 24.106 V, the last
    // ten periods' average 3 mV from the ten before), so only the average output is held here, not the
    // power balance.
    const w = await transient(sim, toSpiceNetlist(boost, { vIn: 16, iOut: 0.2 }));
    expect(Math.abs(average(w.time, w.vOut, t0) - vOutEngine)).toBeLessThanOrEqual(0.02 * vOutEngine);
  }, 60_000);
});
