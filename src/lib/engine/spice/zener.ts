// A Zener diode as the simulator's own junction-diode model with reverse breakdown, set from the
// part's data-sheet point: Vz at the test current Izt and the dynamic impedance Zzt there.
// Away from Izt the breakdown follows the diode law (about Vt per e-fold of current, plus the bulk
// resistance), not the straight line Vz0 + rz·Iz the engine uses (Sedra & Smith, Microelectronic
// Circuits, 7th ed., §4.4.1 — from memory); the simulator's diode: ngspice manual, junction diode
// model parameters BV, IBV, N, RS (from memory).
import type { Catalog } from '../catalog.ts';
import type { Component } from '../types.ts';
import { dynamicImpedance, testCurrent } from '../zeners.ts';
import { VT, catalogEntry, num } from './netlist-text.ts';

/** Emission coefficient of the breakdown; the default of the diode model. */
const BREAKDOWN_N = 1;

/** The diode's model card for the Zener part `dz` (its class from the catalog, its voltage from the part list). */
export function zenerModel(name: string, dz: Component, catalog: Catalog): string {
  const series = catalogEntry(catalog.zenerSeries, dz.part);
  if (!series) throw new Error(`The catalog has no Zener series "${dz.part}"; the netlist needs its data-sheet figures.`);
  const vz = dz.value ?? 0;
  const izt = testCurrent(series, vz);
  const zzt = dynamicImpedance(series, vz);
  // The junction contributes N·Vt/Izt of the slope at Izt; the bulk resistance the rest.
  const junction = (BREAKDOWN_N * VT) / izt;
  // A part whose Zzt is below the junction's own share gets a steeper junction, not a negative resistance.
  const [n, rs] = zzt - junction >= 1e-3 ? [BREAKDOWN_N, zzt - junction] : [Math.max((zzt * izt) / VT, 0.01), 1e-3];
  // ngspice places IBV at the junction's −BV; the bulk resistance adds RS·Izt to make Vz at Izt.
  return `.model ${name} D(BV=${num(vz - rs * izt)} IBV=${num(izt)} N=${num(n)} RS=${num(rs)})`;
}
