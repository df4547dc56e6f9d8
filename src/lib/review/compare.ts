/**
 * What changed between two saved revisions: the inputs (brief, weights,
 * overrides, chosen topology) and the key figures of each chosen option.
 */
import type { Evaluation, Option } from '../engine/types';
import { keyFigures } from './figures';

export interface ComparableRevision {
  number: number;
  topology: string;
  input: unknown;
  result: Evaluation;
}

/** One stored field that differs, by its path, with each side's stored value (undefined: not set). */
export interface InputChange {
  path: string;
  a: Leaf | undefined;
  b: Leaf | undefined;
}

export interface FigureRow {
  key: string;
  label: string;
  a: string;
  b: string;
  changed: boolean;
}

type Leaf = string | number | boolean | null;

/** Flattens nested JSON to dotted paths, so two inputs can be compared leaf by leaf. */
export function flatten(value: unknown, prefix = '', out: Record<string, Leaf> = {}): Record<string, Leaf> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [key, inner] of Object.entries(value)) flatten(inner, prefix ? `${prefix}.${key}` : key, out);
  } else if (prefix) {
    out[prefix] = Array.isArray(value) ? JSON.stringify(value) : (value as Leaf);
  }
  return out;
}

/** The option a revision settled on: the one of its chosen topology. */
export function chosenOption(revision: Pick<ComparableRevision, 'topology' | 'result'>): Option | null {
  return revision.result.options.find((o) => o.topology === revision.topology) ?? null;
}

export function inputChanges(a: ComparableRevision, b: ComparableRevision): InputChange[] {
  const changes: InputChange[] = [];
  if (a.topology !== b.topology) changes.push({ path: 'chosen topology', a: a.topology, b: b.topology });
  const fa = flatten(a.input);
  const fb = flatten(b.input);
  const paths = [...new Set([...Object.keys(fa), ...Object.keys(fb)])].sort();
  for (const path of paths) if (fa[path] !== fb[path]) changes.push({ path, a: fa[path], b: fb[path] });
  return changes;
}

function rippleLimit(input: unknown): number {
  const limit = (input as { noise?: { maxRippleVpp?: unknown } } | null)?.noise?.maxRippleVpp;
  return typeof limit === 'number' ? limit : Number.NaN;
}

export function figureRows(a: ComparableRevision, b: ComparableRevision, currency: string): FigureRow[] {
  const oa = chosenOption(a);
  const ob = chosenOption(b);
  const fa = oa ? keyFigures(oa, rippleLimit(a.input), currency) : [];
  const fb = ob ? keyFigures(ob, rippleLimit(b.input), currency) : [];
  const keys = (fa.length ? fa : fb).map((f) => ({ key: f.key, label: f.label }));
  return keys.map(({ key, label }) => {
    const x = fa.find((f) => f.key === key);
    const y = fb.find((f) => f.key === key);
    return { key, label, a: x?.text ?? '—', b: y?.text ?? '—', changed: x?.text !== y?.text };
  });
}
