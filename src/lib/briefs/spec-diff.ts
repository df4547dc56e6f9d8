/**
 * What changed between two submitted versions of a brief's spec, in the words and units the
 * client used in the wizard (never the spec's internal paths). Browser-safe.
 */
import { formatSi } from '../engine/units';

export interface SpecChange {
  label: string;
  before: string;
  after: string;
}

type Show = (value: unknown) => string;

const si =
  (unit: string): Show =>
  (value) =>
    typeof value === 'number' ? formatSi(value, unit) : '—';
const percent: Show = (value) =>
  typeof value === 'number' ? `±${(value * 100).toLocaleString('en-GB', { maximumFractionDigits: 2 })} %` : '—';
const celsius: Show = (value) => (typeof value === 'number' ? `${value} °C` : '—');
const words =
  (names: Record<string, string>): Show =>
  (value) =>
    typeof value === 'string' ? (names[value] ?? value) : '—';

/** The fields a client sets, in the wizard's order: where each lives, its label, how it reads. */
const FIELDS: [path: string, label: string, show: Show][] = [
  ['input.vMin', 'Lowest input voltage', si('V')],
  ['input.vNom', 'Nominal input voltage', si('V')],
  ['input.vMax', 'Highest input voltage', si('V')],
  ['input.rippleVpp', 'Input ripple', si('Vpp')],
  ['input.source', 'Input source', words({ battery: 'battery', adapter: 'mains adapter', rectified: 'rectified mains', bus: 'DC bus' })],
  ['output.v', 'Output voltage', si('V')],
  ['output.tolerance', 'Output tolerance', percent],
  ['output.iMin', 'Lowest load current', si('A')],
  ['output.iTyp', 'Typical load current', si('A')],
  ['output.iMax', 'Highest load current', si('A')],
  ['output.loadStep', 'Load step', si('A')],
  ['output.maxStepDeviation', 'Allowed step deviation', si('V')],
  ['noise.class', 'Kind of load', words({ digital: 'digital', sensor: 'sensor', precision: 'precision analog', rf: 'RF' })],
  ['noise.maxRippleVpp', 'Output ripple limit', si('Vpp')],
  ['thermal.ambientMaxC', 'Highest ambient temperature', celsius],
  ['thermal.airflow', 'Airflow', words({ enclosed: 'enclosed, no airflow', 'still-air': 'open, still air', 'forced-air': 'forced air' })],
];

function at(spec: unknown, path: string): unknown {
  let value: unknown = spec;
  for (const key of path.split('.')) value = value && typeof value === 'object' ? (value as Record<string, unknown>)[key] : undefined;
  return value;
}

export function specChanges(before: unknown, after: unknown): SpecChange[] {
  return FIELDS.flatMap(([path, label, show]) => {
    const was = show(at(before, path));
    const now = show(at(after, path));
    return was === now ? [] : [{ label, before: was, after: now }];
  });
}
