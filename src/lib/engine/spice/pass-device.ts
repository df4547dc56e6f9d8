// The pre-drop's high-voltage pass device as the simulator's own bipolar (Gummel-Poon) or MOSFET
// (level 1) model, anchored at the catalog's control voltage at the device's rated current, so its
// Vbe or Vgs follows the load as a real part's does instead of staying at one figure.
import type { Catalog } from '../catalog.ts';
import type { Component } from '../types.ts';
import { ROOM_C, SENSE_BETA_TYP, SENSE_VBE_AT_A, senseVbe } from '../topologies/foldback.ts';
import { VT, catalogEntry, num } from './netlist-text.ts';

/** Small-signal NPN of the current limiter at the simulator's 27 °C: the engine's typical Vbe at 1 mA and typical gain. */
const SENSE_VBE_1MA_V = senseVbe(ROOM_C, SENSE_VBE_AT_A);
/** Gate overdrive above threshold at which a power MOSFET carries its rated current (typical transfer curve, from memory). */
const MOSFET_OVERDRIVE_V = 1;

/** The device `q` from drain/collector `d` to source/emitter `s`, driven at `g`, with its model card. */
export function passDeviceLines(q: Component, d: string, g: string, s: string, catalog: Catalog): string[] {
  const dev = catalogEntry(catalog.passDevices, q.part);
  if (!dev) throw new Error(`The catalog has no pass device "${q.part}"; the netlist needs its data-sheet figures.`);
  if (dev.kind === 'nmos') {
    // Saturation: iD = KP/2·(vGS − VTO)² (Sedra & Smith, Microelectronic Circuits, 7th ed., §5.2 — from memory).
    const vto = dev.vControlV - MOSFET_OVERDRIVE_V;
    return [
      `M${q.ref} ${d} ${g} ${s} ${s} NHV${q.ref}`,
      `.model NHV${q.ref} NMOS(LEVEL=1 VTO=${num(vto)} KP=${num((2 * dev.iMaxA) / MOSFET_OVERDRIVE_V ** 2)})`,
    ];
  }
  // iC = IS·exp(vBE/Vt) with the data sheet's least current gain (Sedra & Smith, 7th ed., §6.2 — from memory).
  return [
    `Q${q.ref} ${d} ${g} ${s} QHV${q.ref}`,
    `.model QHV${q.ref} NPN(BF=${num(dev.gainMin)} IS=${num(dev.iMaxA * Math.exp(-dev.vControlV / VT))})`,
  ];
}

/** The limiter's small-signal NPN `q`: collector `c`, base `b`, emitter `e`. */
export function senseTransistorLines(q: Component, c: string, b: string, e: string): string[] {
  return [
    `Q${q.ref} ${c} ${b} ${e} QS${q.ref}`,
    `.model QS${q.ref} NPN(BF=${SENSE_BETA_TYP} IS=${num(SENSE_VBE_AT_A * Math.exp(-SENSE_VBE_1MA_V / VT))})`,
  ];
}
