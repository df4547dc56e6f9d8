/**
 * Every stored brief and choice field by its path, with its label and unit, so a change or a
 * saved choice reads as a person would say it. Apart from words.ts because it reaches into the
 * briefs' words: the review's island need not ship them, and the review's public face stays
 * free of the briefs (whose tables lead back to it), so only pages and *.server.ts import this.
 */
import { formatSi } from '../engine/units';
import { AIRFLOW_WORDS, NOISE_CLASS_WORDS } from '~/lib/briefs';
import { TOPOLOGY_NAMES } from './option-words';
import { CHOICE_OVERRIDES, NUMBER_OVERRIDE_KEYS, NUMBER_OVERRIDES, WEIGHT_KEYS, WEIGHT_NAMES } from './words';

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

const FIELDS: Readonly<Record<string, FieldWords>> = {
  'chosen topology': { label: 'Chosen option', unit: '', words: TOPOLOGY_NAMES },
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
