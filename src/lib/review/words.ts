/**
 * Words the review screens share with the calculation sheet and the exports,
 * so a figure is described the same way wherever it appears.
 */
import type { ComponentRole } from '../engine/types';
import { formatSi } from '../engine/units';
import { AIRFLOW_WORDS, NOISE_CLASS_WORDS } from '~/lib/briefs';

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

interface FieldWords {
  label: string;
  unit: string;
  /** No SI prefix for this unit; `percent` shows a fraction as %. */
  plain?: boolean;
  percent?: boolean;
  /** Words for the stored words of a choice. */
  words?: Readonly<Record<string, string>>;
}

const wordsOf = (table: Record<string, { label: string }>) => Object.fromEntries(Object.entries(table).map(([k, v]) => [k, v.label]));

/** Every brief and choice field by its stored path, so a change or a saved choice reads as a person would say it. */
const FIELDS: Readonly<Record<string, FieldWords>> = {
  'input.vMin': { label: 'Lowest input', unit: 'V' },
  'input.vNom': { label: 'Nominal input', unit: 'V' },
  'input.vMax': { label: 'Highest input', unit: 'V' },
  'input.rippleVpp': { label: 'Input ripple', unit: 'Vpp' },
  'input.source': { label: 'Input source', unit: '' },
  'output.v': { label: 'Output voltage', unit: 'V' },
  'output.tolerance': { label: 'Output tolerance', unit: '', percent: true },
  'output.iMin': { label: 'Lowest load current', unit: 'A' },
  'output.iTyp': { label: 'Typical load current', unit: 'A' },
  'output.iMax': { label: 'Highest load current', unit: 'A' },
  'output.loadStep': { label: 'Load step', unit: 'A' },
  'output.maxStepDeviation': { label: 'Allowed step deviation', unit: 'V' },
  'noise.class': { label: 'Kind of load', unit: '', words: wordsOf(NOISE_CLASS_WORDS) },
  'noise.maxRippleVpp': { label: 'Ripple limit', unit: 'Vpp' },
  'thermal.ambientMaxC': { label: 'Highest ambient', unit: '°C', plain: true },
  'thermal.airflow': { label: 'Airflow', unit: '', words: AIRFLOW_WORDS },
  'thermal.enclosure.surfaceCm2': { label: 'Enclosure surface', unit: 'cm²', plain: true },
  'thermal.enclosure.material': { label: 'Enclosure material', unit: '' },
  'thermal.enclosure.otherW': { label: 'Other dissipation in the enclosure', unit: 'W' },
  'thermal.enclosure.fanFlowM3h': { label: 'Fan flow', unit: 'm³/h', plain: true },
  'overrides.seed': { label: 'Monte Carlo seed', unit: '', plain: true },
  ...Object.fromEntries(WEIGHT_KEYS.map((k) => [`weights.${k}`, { label: `${WEIGHT_NAMES[k]} weight`, unit: '', plain: true }])),
  ...Object.fromEntries(NUMBER_OVERRIDE_KEYS.map((k) => [`overrides.${k}`, NUMBER_OVERRIDES[k]])),
  ...Object.fromEntries(
    Object.entries(CHOICE_OVERRIDES).map(([k, v]) => [
      `overrides.${k}`,
      { label: v.label, unit: '', ...('options' in v ? { words: Object.fromEntries(v.options) } : {}) },
    ]),
  ),
};

/** The unit a forced part's value is in, from its reference's letter (R1 → Ω, C2 → F, L1 → H). */
const PART_UNITS: Readonly<Record<string, string>> = { R: 'Ω', C: 'F', L: 'H' };

function fieldOf(path: string): FieldWords {
  const part = /^overrides\.parts\.([A-Z]+)(\d+)$/.exec(path);
  if (part) return { label: `Forced value of ${part[1]}${part[2]}`, unit: PART_UNITS[part[1] ?? ''] ?? '' };
  // A field this table does not know yet still reads as words, never as a dotted path.
  return FIELDS[path] ?? { label: path.split('.').at(-1) ?? path, unit: '' };
}

/** A stored value in words: 1 MHz, 47 µF, ±2 %, 0.36 K/W, "N-MOSFET". */
function valueText(field: FieldWords, value: unknown): string {
  if (value === undefined || value === null || value === '') return '—';
  if (typeof value === 'number') {
    if (field.percent) return `±${Number((value * 100).toPrecision(4))} %`;
    if (field.plain) return `${Number(value.toPrecision(6)).toLocaleString('en-GB').replace(/,/g, ' ')} ${field.unit}`.trimEnd();
    return formatSi(value, field.unit, 4);
  }
  if (typeof value === 'string') return field.words?.[value] ?? value;
  return String(value);
}

/** A stored field as a person reads it: its label and its value with unit and SI prefix. */
export function describeField(path: string, value: unknown): { label: string; text: string } {
  const field = fieldOf(path);
  return { label: field.label, text: valueText(field, value) };
}

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
