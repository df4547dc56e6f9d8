// An adjustable precision shunt reference (cathode on the rail, anode to ground, its reference
// input on a divider) as a macro model: the reference as a source with the part's value, the same
// finite-gain amplifier as the regulators, and a cathode current sink whose loop gain gives the
// data sheet's dynamic impedance zKa with the reference input tied to the cathode. The reference
// voltage holds at the data sheet's test current; the reference-input current is drawn from the
// divider's midpoint. Horowitz & Hill, The Art of Electronics, 3rd ed., §9.10 (shunt references — from memory).
import type { Catalog } from '../catalog.ts';
import type { Component, Option } from '../types.ts';
import { catalogEntry, num } from './netlist-text.ts';
import { ERROR_GAIN, errorAmplifier } from './regulator.ts';

/** Cathode current at which the data sheet states the reference voltage (typical of the class, from memory). */
const TEST_CURRENT_A = 10e-3;
/** The catalog's reference-input current is the data sheet's maximum; the typical part draws half (from memory). */
const TYPICAL_IREF_SHARE = 0.5;

/** The shunt reference `u` with its divider (the feedback pair listed after it), regulating node `out`. */
export function shuntReferenceLines(option: Option, u: Component, catalog: Catalog): string[] {
  const ref = catalogEntry(catalog.shuntReferences, u.part);
  if (!ref) throw new Error(`The catalog has no shunt reference "${u.part}"; the netlist needs its data-sheet figures.`);
  const after = option.components.slice(option.components.indexOf(u));
  const lower = after.find((c) => c.role === 'feedback-lower');
  const upper = after.find((c) => c.role === 'feedback-upper');
  if (!lower || !upper) throw new Error(`The shunt design's reference ${u.ref} has no divider; its netlist cannot be written.`);
  // Ik = Itest + (V(ref) − Vref)/zKa with the reference input on the cathode: the sink's
  // transconductance times the amplifier's gain is 1/zKa.
  const gk = 1 / (Math.max(ref.zKaOhm, 1e-3) * ERROR_GAIN);
  return [
    `V${u.ref}ref ${u.ref}_r 0 DC ${num(ref.vRefV)}`,
    ...errorAmplifier(u.ref, 'adj', `${u.ref}_r`, 0),
    `B${u.ref}k out 0 I = max(${num(TEST_CURRENT_A)} + ${num(gk)}*V(${u.ref}_a), 0)`,
    `I${u.ref}ref adj 0 DC ${num(TYPICAL_IREF_SHARE * ref.iRefA)}`,
    `R${upper.ref} out adj ${num(upper.value ?? 0)}`,
    `R${lower.ref} adj 0 ${num(lower.value ?? 0)}`,
  ];
}
