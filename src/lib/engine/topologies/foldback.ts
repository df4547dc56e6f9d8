// Foldback current limit: a sense transistor across the sense resistor Rs, its base fed from a
// divider (RA from the pass device's side of Rs, RB to ground), so the limit falls with the
// voltage at the sense node (The Art of Electronics, 2nd ed., §6.06, foldback current limiting —
// from memory): I(Vn) = (Vbe·(1 + k) + Vn·k)/Rs with k = RA/RB, Vn the regulator's side of Rs.
// The sense transistor's base current flows through RA as well and adds RA·Ib to the drop.

export interface Foldback {
  /** Divider ratio RA/RB. */
  k: number;
  rs: number;
}

/** Small-signal NPN sense transistor: Vbe 0.65 V at 1 mA and 25 °C (typical, from memory). */
export const SENSE_VBE_25C_V = 0.65;
export const SENSE_VBE_AT_A = 1e-3;
/** Vbe falls about 2 mV per kelvin at a fixed collector current (common practice). */
export const SENSE_VBE_TEMPCO_V_PER_K = -2e-3;
/** Current gain of the sense transistor: typical and least at 1–10 mA (small-signal NPN, from memory). */
export const SENSE_BETA_TYP = 200;
export const SENSE_BETA_MIN = 100;
/** Temperature of the simulator's device models and of a bench check, °C (the simulator's default). */
export const ROOM_C = 27;
/** Boltzmann constant over the electron charge, V/K. */
const K_OVER_Q = 8.617333e-5;

/** Thermal voltage kT/q at tempC. */
export function thermalVoltage(tempC: number): number {
  return K_OVER_Q * (tempC + 273.15);
}

/** Vbe of the sense transistor at tempC carrying icA: the 25 °C value, its tempco and Vt·ln(Ic/1 mA) (Ebers–Moll). */
export function senseVbe(tempC: number, icA: number): number {
  return SENSE_VBE_25C_V + SENSE_VBE_TEMPCO_V_PER_K * (tempC - 25) + thermalVoltage(tempC) * Math.log(Math.max(icA, 1e-9) / SENSE_VBE_AT_A);
}

/** Limit current at sense-node voltage vn; baseDropV is RA times the sense transistor's base current. */
export function foldbackCurrent(fb: Foldback, vbe: number, vn: number, baseDropV = 0): number {
  return (vbe * (1 + fb.k) + Math.max(0, vn) * fb.k + baseDropV) / fb.rs;
}

/**
 * k and Rs that put the limit at iLimit when the sense node sits at vNormal and at iShort when it
 * has fallen to vShort (output shorted). Null where the swing vNormal − vShort is too small for
 * that ratio: the smallest reachable short-circuit current is then minShortCurrent().
 */
export function designFoldback(iLimit: number, iShort: number, vNormal: number, vShort: number, vbe: number): Foldback | null {
  const swing = vNormal - vShort;
  const denominator = (iShort * swing) / (iLimit - iShort) - vbe - vShort;
  if (!(iLimit > iShort) || !(denominator > 0)) return null;
  const k = vbe / denominator;
  return { k, rs: (k * swing) / (iLimit - iShort) };
}

/** The short-circuit current below which designFoldback has no solution (k → ∞). */
export function minShortCurrent(iLimit: number, vNormal: number, vShort: number, vbe: number): number {
  const swing = vNormal - vShort;
  return (iLimit * (vbe + vShort)) / (swing + vbe + vShort);
}
