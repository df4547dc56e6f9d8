// Reading switching transients from eecircuit-engine (ngspice in WebAssembly) for the switcher checks.
import type { Simulation } from 'eecircuit-engine';
import { expect } from 'vitest';
import { railSpecSchema, evaluate, type RailSpecInput, type Option } from '~/lib/engine/index.ts';

/** The engine's design of `topology` for a brief, with the figures the switcher checks read. */
export function switcherDesign(brief: RailSpecInput, topology: Option['topology']) {
  const option = evaluate(railSpecSchema.parse(brief)).options.find((o) => o.topology === topology)!;
  const sw = option.components.find((c) => c.role === 'switch')!.ref;
  return {
    option,
    traced: (id: string) => option.trace.find((t) => t.id === id)!.result.value,
    fsw: option.assumptions[`${sw}.fsw`]!.value,
    henries: option.components.find((c) => c.role === 'inductor')!.value!,
  };
}

export interface Waves {
  time: number[];
  vOut: number[];
  iL: number[];
  /** Any other vector by the simulator's name for it, such as v(bus). */
  wave(name: string): number[];
}

export async function transient(sim: Simulation, netlist: string): Promise<Waves> {
  sim.setNetList(netlist);
  const result = await sim.runSim();
  expect(sim.getError().filter((m) => /error|no convergence|abort|timestep too small/i.test(m))).toEqual([]);
  if (result.dataType !== 'real') throw new Error('expected a real transient result');
  const wave = (name: string) => result.data.find((d) => d.name === name)!.values;
  return { time: wave('time'), vOut: wave('v(out)'), iL: wave('i(vsense)'), wave };
}

/** Time average over [t0, end] by the trapezoid rule (the simulator's steps are not uniform). */
export function average(time: number[], y: number[], t0: number): number {
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
export function ripplePerPeriod(time: number[], y: number[], period: number, periods: number): number {
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
