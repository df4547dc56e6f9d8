/**
 * Words the review screens share with the calculation sheet and the exports,
 * so a figure is described the same way wherever it appears.
 */
import type { ComponentRole } from '../engine/types';
import { formatSi } from '../engine/units';

/** Said beside every figure that rests on a typical device parameter (docs/engine.md §1). */
export const TYPICAL_NOTE = 'typical — confirm against the chosen part’s data';

/** Said with every set of cautions: the engine proposes, qualified people decide. */
export const CAUTION_DEFERRAL =
  'These designs are engineering proposals. Build, measure and test them only under qualified supervision, and defer to local electrical codes and licensed practice.';

export const ROLE_NAMES: Record<ComponentRole, string> = {
  'series-resistor': 'Series resistor',
  zener: 'Zener diode',
  regulator: 'Regulator',
  'feedback-lower': 'Feedback resistor, lower',
  'feedback-upper': 'Feedback resistor, upper',
  'pass-transistor': 'Pass transistor',
  'standoff-zener': 'Standoff Zener',
  'bias-resistor': 'Bias resistor',
  'sense-resistor': 'Current-sense resistor',
  'limit-transistor': 'Current-limit transistor',
  inductor: 'Inductor',
  switch: 'Switching stage',
  diode: 'Diode',
  'input-capacitor': 'Input capacitor',
  'output-capacitor': 'Output capacitor',
  'bypass-capacitor': 'Bypass capacitor',
  'protection-diode': 'Protection diode',
  heatsink: 'Heatsink',
};

export const WEIGHT_NAMES = {
  efficiency: 'Efficiency',
  heat: 'Heat',
  partCount: 'Part count',
  noise: 'Quietness',
  cost: 'Parts cost',
} as const;

export type WeightKey = keyof typeof WEIGHT_NAMES;
export const WEIGHT_KEYS = Object.keys(WEIGHT_NAMES) as WeightKey[];

/**
 * The engineer's number overrides: label and unit wherever one is shown or typed. `plain` units
 * take no SI prefix (0.36 K/W, not 360 mK/W).
 */
export const NUMBER_OVERRIDES = {
  r1Ohm: { label: 'R1 (feedback, lower)', unit: 'Ω', hint: 'Linear designs; the upper resistor is solved from it.' },
  fswHz: { label: 'Switching frequency', unit: 'Hz', hint: 'Switchers; e.g. 400k or 1M.' },
  heatsinkThetaSaCW: { label: 'Heatsink θSA', unit: 'K/W', plain: true, hint: 'Fit this heatsink instead of the one the engine picks.' },
  ambientC: { label: 'Ambient temperature', unit: '°C', plain: true, hint: 'Design at this ambient instead of the brief’s.' },
  standoffV: { label: 'Standoff voltage', unit: 'V', hint: 'Pre-drop designs: the Zener the regulator stands on.' },
  mcDraws: { label: 'Monte Carlo draws', unit: '', plain: true, hint: '100 to 100 000.' },
} as const;
export type NumberOverride = keyof typeof NUMBER_OVERRIDES;
export const NUMBER_OVERRIDE_KEYS = Object.keys(NUMBER_OVERRIDES) as NumberOverride[];

export const CHOICE_OVERRIDES = {
  linearClass: { label: 'Regulator class' },
  passDevice: {
    label: 'Pass device',
    options: [
      ['npn', 'NPN transistor'],
      ['nmos', 'N-MOSFET'],
    ],
  },
  resistorSeries: {
    label: 'Resistor series',
    options: [
      ['E96', 'E96 (1 %)'],
      ['E24', 'E24 (5 %)'],
    ],
  },
  toleranceRule: {
    label: 'Tolerance rule',
    options: [
      ['statistical', 'Statistical (±3σ may decide)'],
      ['worst-case', 'Worst case only'],
    ],
  },
} as const;
export type ChoiceOverride = keyof typeof CHOICE_OVERRIDES;

/**
 * A number as a form field shows it, ready to be read back by `parseSi`: plain digits for
 * ordinary magnitudes, an SI prefix for the very small and large (1M, 47µ, 20m).
 */
export function fieldText(value: unknown): string {
  if (typeof value === 'string') return value;
  if (typeof value !== 'number' || !Number.isFinite(value)) return '';
  if (value === 0 || (Math.abs(value) >= 0.1 && Math.abs(value) < 10_000)) return String(Number(value.toPrecision(6)));
  return formatSi(value, '', 6).replace(/\s/g, '').replace('−', '-');
}
