// Safety cautions shown wherever a design is shown and in the PDF.
import { formatSi } from './units.ts';
import type { RailSpec } from './rail-spec.ts';
import type { Caution } from './types.ts';

/** ES1 limit for DC voltage in IEC 62368-1: above 60 V DC a source is no longer ordinary-person safe. */
export const ES1_DC_LIMIT_V = 60;
/** A surface above about 60 °C is a touch hazard (common practice). */
export const HOT_SURFACE_C = 60;
/** Stored energy worth a bleeder even at safe voltages: sparks and burns (common practice). */
export const STORED_ENERGY_J = 1;
/** Discharge time the bleeder suggestion aims for, s (common practice; confirm against the applicable standard). */
export const DISCHARGE_TIME_S = 5;
/** Resistors dissipating more than this run well above 60 °C on their surface (common practice). */
export const HOT_RESISTOR_W = 1;

export interface ChargedCapacitor {
  ref: string;
  farads: number;
  volts: number;
}

export interface HotPart {
  ref: string;
  surfaceC: number;
  /** The part's limit when it would pass it: the caution then names the limit, never a temperature beyond it. */
  beyondLimitC: number | null;
}

export function hazardousVoltage(spec: RailSpec, vOutMax: number): Caution | null {
  const worst = Math.max(spec.input.vMax, vOutMax);
  if (worst <= ES1_DC_LIMIT_V) return null;
  return {
    code: 'hazardous-voltage',
    message: `This supply works at up to ${worst.toFixed(0)} V DC, above the ${ES1_DC_LIMIT_V} V ES1 limit of IEC 62368-1. Hazardous voltage: build and test by qualified persons only; connect instruments with the circuit de-energised, then power up; defer to local electrical codes and licensed practice.`,
  };
}

/** Bleeder that brings the capacitor below ES1 (or to a tenth when it starts below) within the discharge time. */
export function bleederFor(c: ChargedCapacitor): { ohms: number; watts: number } {
  const ratio = c.volts > ES1_DC_LIMIT_V ? c.volts / ES1_DC_LIMIT_V : 10;
  const ohms = DISCHARGE_TIME_S / (c.farads * Math.log(ratio));
  return { ohms, watts: (c.volts * c.volts) / ohms };
}

export function storedEnergy(caps: readonly ChargedCapacitor[]): Caution[] {
  const out: Caution[] = [];
  for (const c of caps) {
    const joules = 0.5 * c.farads * c.volts * c.volts;
    if (c.volts <= ES1_DC_LIMIT_V && joules < STORED_ENERGY_J) continue;
    const b = bleederFor(c);
    out.push({
      code: 'stored-energy',
      message: `${c.ref} stores ${formatSi(joules, 'J', 2)} at ${c.volts.toFixed(0)} V (½·C·V²). Fit a bleeder (about ${formatSi(b.ohms, 'Ω', 2)}, ${formatSi(b.watts, 'W', 2)}) so it discharges within ${DISCHARGE_TIME_S} s, and check it is discharged before touching the circuit.`,
    });
  }
  return out;
}

export function hotSurfaces(parts: readonly HotPart[], hotResistors: readonly string[]): Caution | null {
  const hot = parts.filter((p) => p.surfaceC > HOT_SURFACE_C);
  if (hot.length === 0 && hotResistors.length === 0) return null;
  const list = [
    ...hot.map((p) =>
      p.beyondLimitC === null ? `${p.ref} (about ${p.surfaceC.toFixed(0)} °C)` : `${p.ref} (beyond its ${p.beyondLimitC} °C limit)`,
    ),
    ...hotResistors.map((r) => `${r} (power resistor)`),
  ].join(', ');
  return {
    code: 'hot-surface',
    message: `Hot surfaces above about ${HOT_SURFACE_C} °C: ${list}. Guard them against touch and keep them clear of other parts.`,
  };
}

export function mainsScope(spec: RailSpec): Caution | null {
  if (spec.input.source !== 'rectified') return null;
  return {
    code: 'mains-scope',
    message:
      'The input is rectified mains: isolation, fusing, inrush and surge protection upstream of this regulator are outside what this engine designs. Have them designed to the applicable standard.',
  };
}
