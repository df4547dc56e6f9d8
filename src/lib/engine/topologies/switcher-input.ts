// Input robustness of a switching stage, as cautions with values: reverse polarity, hot-plug
// inrush and ringing of a ceramic input, the damping an input filter needs against the
// converter's negative input resistance, and surges on vehicle and industrial buses.
import type { ChosenCapacitor } from '../capacitors.ts';
import type { Context } from '../context.ts';
import { caution } from '../design.ts';
import { formatSi } from '../units.ts';
import type { Issue } from '../types.ts';

/** Supply lead inductance assumed for hot-plugging, about 1 µH for a metre of cable (from memory). */
const LEAD_H = 1e-6;
/** Series Schottky drop for reverse-polarity protection (common practice). */
const SCHOTTKY_V = 0.4;
/** Buses from this nominal voltage up are taken as vehicle or industrial supplies with surges. */
const SURGE_BUS_V = 9;

export interface InputFacts {
  vMax: number;
  vTrough: number;
  cin: ChosenCapacitor;
  /** Input power at the trough corner and full load. */
  pInW: number;
  /** Rated input of the switching part. */
  ratingV: number;
}

export function inputCautions(ctx: Context, f: InputFacts): Issue[] {
  const { source, vNom } = ctx.spec.input;
  const iIn = f.pInW / Math.max(f.vTrough, 0.1);
  const parts: string[] = [];
  if (source !== 'rectified') {
    parts.push(
      `reverse polarity: a reversed input drives the source's fault current through the switches' body diodes; fit a series Schottky (about ${(SCHOTTKY_V * iIn).toFixed(2)} W at ${iIn.toFixed(2)} A) or a P-channel MOSFET as an ideal diode`,
    );
  }
  if (f.cin.family.kind === 'mlcc') {
    const ipk = f.vMax * Math.sqrt(f.cin.effectiveF / LEAD_H);
    parts.push(
      `inrush: hot-plugging charges ${f.cin.part.ref} (${formatSi(f.cin.effectiveF, 'F')} ceramic) through about ${formatSi(LEAD_H, 'H')} of lead, up to ${ipk.toFixed(1)} A peak (V·√(C/L)), and the undamped input can ring to about ${(2 * f.vMax).toFixed(1)} V against the part's ${f.ratingV} V rating; a bulk electrolytic with ESR near √(L/C) = ${Math.sqrt(LEAD_H / f.cin.effectiveF).toFixed(2)} Ω damps it`,
    );
  }
  const rNeg = (f.vTrough * f.vTrough) / Math.max(f.pInW, 1e-9);
  parts.push(
    `input filter: the converter's input is a negative resistance −Vin²/Pin = −${rNeg.toFixed(2)} Ω at the input trough, so an EMI filter needs its output impedance well below ${rNeg.toFixed(2)} Ω and damping (Middlebrook's criterion, Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., ch. 10)`,
  );
  const out: Issue[] = [caution('input-robustness', `Input protection — ${parts.join('; ')}.`)];
  if (source === 'bus' && vNom >= SURGE_BUS_V) {
    out.push(
      caution(
        'surge',
        `Vehicle and industrial buses carry surges well above ${f.vMax} V (load dump per ISO 16750-2, suppressed about 35 V on 12 V systems and 58 V on 24 V systems — from memory; IEC 61000-4-5 surges on DC ports). Clamp the input with a TVS below the part's ${f.ratingV} V rating or choose a class rated for the surge.`,
      ),
    );
  }
  return out;
}
