// Independent check with the circuit simulator eecircuit-engine (ngspice in WebAssembly): DC
// operating points of the shunt and linear designs the engine produced, at their corners.
import { Simulation, type ResultType } from 'eecircuit-engine';
import { beforeAll, describe, expect, test } from 'vitest';
import { railSpecSchema, evaluate, toSpiceNetlist, type Option } from '~/lib/engine/index.ts';
import { solveShunt } from '~/lib/engine/topologies/shunt.ts';
import { dividerVout } from '~/lib/engine/topologies/feedback.ts';

let sim: Simulation;
beforeAll(async () => {
  sim = new Simulation();
  await sim.start();
}, 60_000);

async function operatingPoint(netlist: string): Promise<Record<string, number>> {
  sim.setNetList(netlist);
  const result: ResultType = await sim.runSim();
  // ngspice reports its homotopy steps (gmin stepping) as notes and warnings; only a failed analysis counts.
  expect(sim.getError().filter((m) => /error|no convergence|abort|timestep too small/i.test(m))).toEqual([]);
  const out: Record<string, number> = {};
  if (result.dataType === 'real') for (const d of result.data) out[d.name] = d.values[0] ?? Number.NaN;
  return out;
}

/** Agreement bar of the product's quality plan: DC operating points within 2 %. */
const within2 = (sim: number, engine: number) => expect(Math.abs(sim - engine)).toBeLessThanOrEqual(0.02 * Math.abs(engine));

const brief = railSpecSchema.parse({
  input: { vMin: 10, vNom: 12, vMax: 14, source: 'adapter' },
  output: { v: 5.1, tolerance: 0.15, iMin: 0.005, iTyp: 0.01, iMax: 0.02 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 40, airflow: 'still-air' },
  // The netlist models the classic adjustable class; the engine would otherwise pick a cheaper LDO.
  overrides: { linearClass: 'adj-0a1' },
});
const options = evaluate(brief).options;
const byTopology = (id: Option['topology']) => options.find((o) => o.topology === id)!;
const corners = [
  { vIn: 10, iOut: 0.02 },
  { vIn: 12, iOut: 0.01 },
  { vIn: 14, iOut: 0.005 },
  { vIn: 14, iOut: 0.02 },
];

describe('shunt design against ngspice', () => {
  const shunt = byTopology('shunt');
  const rs = shunt.components.find((c) => c.role === 'series-resistor')!.value!;
  const dz = shunt.components.find((c) => c.role === 'zener')!.ref;
  const vKnee = shunt.assumptions[`${dz}.vKnee`]!.value;
  const rz = shunt.assumptions[`${dz}.rz`]!.value;

  test.each(corners)('output voltage and Zener current at $vIn V, $iOut A', async (corner) => {
    const op = await operatingPoint(toSpiceNetlist(shunt, corner));
    const engine = solveShunt(corner.vIn, corner.iOut, rs, vKnee, rz);
    within2(op['v(out)']!, engine.vOut);
    // The source current is the series-resistor current; the Zener takes what the load does not.
    within2(-op['i(v1)']!, engine.iSeries);
    within2(-op['i(v1)']! - corner.iOut, engine.iZener);
  });
});

describe('linear design against ngspice', () => {
  const linear = byTopology('linear');
  const u = linear.components.find((c) => c.role === 'regulator')!.ref;
  const r1 = linear.components.find((c) => c.role === 'feedback-lower')!.value!;
  const r2 = linear.components.find((c) => c.role === 'feedback-upper')!.value!;
  const vRef = linear.assumptions[`${u}.vRef`]!.value;
  const iAdj = linear.assumptions[`${u}.iAdj`]!.value;
  const iq = linear.assumptions[`${u}.iq`]!.value;

  test('the rail is made by the adjustable class with a divider', () => {
    expect(linear.feasible).toBe(true);
    expect(vRef).toBe(1.25);
  });

  test.each(corners)('output voltage, input current and divider current at $vIn V, $iOut A', async (corner) => {
    const op = await operatingPoint(toSpiceNetlist(linear, corner));
    const vOut = dividerVout(vRef, r1, r2, iAdj);
    within2(op['v(out)']!, vOut);
    // Input current = load + divider (Vref/R1) + adjust-pin current + quiescent current.
    within2(-op['i(v1)']!, corner.iOut + vRef / r1 + iAdj + iq);
    within2((op['v(out)']! - op['v(adj)']!) / r1, vRef / r1);
  });
});

describe('linear design with pre-drop against ngspice', () => {
  const hv = evaluate(
    railSpecSchema.parse({
      input: { vMin: 280, vNom: 300, vMax: 320, source: 'bus' },
      output: { v: 150, tolerance: 0.1, iMin: 0.005, iTyp: 0.01, iMax: 0.02 },
      noise: { class: 'sensor' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    }),
  ).options.find((o) => o.topology === 'linear-predrop')!;
  const u = hv.components.find((c) => c.role === 'regulator')!.ref;
  const r1 = hv.components.find((c) => c.role === 'feedback-lower')!.value!;
  const r2 = hv.components.find((c) => c.role === 'feedback-upper')!.value!;
  const vRef = hv.assumptions[`${u}.vRef`]!.value;
  const iAdj = hv.assumptions[`${u}.iAdj`]!.value;

  test.each([
    { vIn: 280, iOut: 0.02 },
    { vIn: 320, iOut: 0.005 },
  ])('output voltage at $vIn V, $iOut A', async (corner) => {
    const op = await operatingPoint(toSpiceNetlist(hv, corner));
    within2(op['v(out)']!, dividerVout(vRef, r1, r2, iAdj));
  });
});
