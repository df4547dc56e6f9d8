/**
 * One device class as a form: the fields, their kinds and their choices are
 * read from the engine's catalog schema, so a figure the engine gains appears
 * here without a second list; the posted form is read back the same way and
 * checked with the class's own schema, each message beside its field.
 */
import { z } from 'zod';
import { CLASS_LISTS, catalogSchema } from '../engine/catalog';
import { formatSi, parseSi } from '../engine/units';
import type { FieldIssue } from '../platform/outcome';
import { GROUP_LOOK, lookOf } from './field-look';

/** Form inputs of a class's figures are named `f.<path>`, e.g. `f.refGrades.0.tolerance`. */
export const FIELD_PREFIX = 'f.';
/** A section that is a single figure (the catalog's version) has one input. */
const ROOT_FIELD = `${FIELD_PREFIX}value`;

export interface ClassField {
  /** The input's name. */
  name: string;
  /** The heading of the nested figures it belongs to ("Case sizes · 2"), or null at the top. */
  group: string | null;
  label: string;
  unit: string | undefined;
  type: 'number' | 'integer' | 'text' | 'boolean' | 'choice';
  choices: readonly string[];
  /** What a blank box means: no limit (null), not given (omitted), or nothing allowed. */
  blank: 'null' | 'omit' | null;
  value: string;
}

type Schema = z.ZodType;

/** The schema of one row of `kind`: a class of a list section, or a whole single section. */
export function rowSchemaOf(kind: string): Schema | null {
  const section = (catalogSchema.shape as Record<string, Schema>)[kind];
  if (!section) return null;
  return (CLASS_LISTS as readonly string[]).includes(kind) && section instanceof z.ZodArray ? (section.element as Schema) : section;
}

interface Unwrapped {
  inner: Schema;
  nullable: boolean;
  optional: boolean;
}

function unwrap(schema: Schema): Unwrapped {
  let inner = schema;
  let nullable = false;
  let optional = false;
  for (;;) {
    if (inner instanceof z.ZodOptional) optional = true;
    else if (inner instanceof z.ZodNullable) nullable = true;
    else return { inner, nullable, optional };
    inner = (inner as z.ZodOptional<Schema> | z.ZodNullable<Schema>).unwrap();
  }
}

const isInteger = (schema: Schema) => schema instanceof z.ZodNumber && schema.isInt;

function groupName(kind: string, path: readonly (string | number)[]): string | null {
  const parts: string[] = [];
  for (const [at, part] of path.entries())
    if (typeof part === 'string') parts.push(GROUP_LOOK[part] ?? lookOf(part).label);
    else parts.push(at === 0 ? `${GROUP_LOOK[kind] ?? 'Item'} ${part + 1}` : `${part + 1}`);
  return parts.length > 0 ? parts.join(' · ') : null;
}

/** The editable figures of one class, in the schema's order, with what is stored (or was typed). */
export function classFields(kind: string, params: unknown, typed: Readonly<Record<string, string>> = {}): ClassField[] {
  const schema = rowSchemaOf(kind);
  const fields: ClassField[] = [];
  const visit = (node: Schema, value: unknown, path: (string | number)[], key: string | null) => {
    const { inner, nullable, optional } = unwrap(node);
    if (inner instanceof z.ZodObject) {
      if (value === undefined || value === null || typeof value !== 'object') return;
      for (const [field, child] of Object.entries(inner.shape as Record<string, Schema>)) {
        // A class keeps its identifier: a copy gets a new one.
        if (path.length === 0 && field === 'id') continue;
        visit(child, (value as Record<string, unknown>)[field], [...path, field], field);
      }
      return;
    }
    if (inner instanceof z.ZodArray) {
      if (!Array.isArray(value)) return;
      value.forEach((item, index) => visit(inner.element as Schema, item, [...path, index], key));
      return;
    }
    const name = path.length > 0 ? FIELD_PREFIX + path.join('.') : ROOT_FIELD;
    const look = lookOf(key ?? kind);
    const isLeafOfList = typeof path[path.length - 1] === 'number';
    const stored = value === undefined || value === null ? '' : String(value);
    fields.push({
      name,
      group: groupName(kind, path.slice(0, -1)),
      label: isLeafOfList ? `${look.label} ${Number(path[path.length - 1]) + 1}` : look.label,
      unit: look.unit,
      type:
        inner instanceof z.ZodBoolean
          ? 'boolean'
          : inner instanceof z.ZodEnum
            ? 'choice'
            : inner instanceof z.ZodNumber
              ? isInteger(inner)
                ? 'integer'
                : 'number'
              : 'text',
      choices: inner instanceof z.ZodEnum ? (inner.options as string[]) : [],
      blank: nullable ? 'null' : optional ? 'omit' : null,
      value: typed[name] ?? stored,
    });
  };
  if (schema) visit(schema, params, [], null);
  return fields;
}

/** A figure as typed: plain, exponent or SI-prefix notation, a decimal comma allowed ("0,47", "4.7e-5", "47µ", "4k7", "1 M"). */
export function readNumber(text: string): number | null {
  return parseSi(text.replace(/\s/g, '').replace(',', '.'));
}

/** Units an SI prefix reads well with; a figure in one of them also shows as "= 2.2 MHz". */
const PREFIXED_UNITS = new Set(['V', 'A', 'W', 'F', 'H', 'Hz', 's', 'Ω', 'C', 'T']);

/** The stored figure with an SI prefix, when that reads differently from the plain number. */
export function prefixedReading(field: Pick<ClassField, 'type' | 'unit' | 'value'>): string | null {
  if (field.type !== 'number' || !field.unit || !PREFIXED_UNITS.has(field.unit)) return null;
  const value = readNumber(field.value);
  if (value === null || value === 0) return null;
  const reading = formatSi(value, field.unit, 4);
  return reading === `${value} ${field.unit}` ? null : `= ${reading}`;
}

const sentence = (message: string) => message.charAt(0).toUpperCase() + message.slice(1);

/**
 * The class's figures from a posted form, over what is stored (a field the
 * form did not send keeps its stored value), checked with the class's schema.
 */
export function readClassForm(
  kind: string,
  stored: unknown,
  form: Readonly<Record<string, string>>,
): { params: unknown; issues: FieldIssue[] } {
  const fields = classFields(kind, stored);
  const issues: FieldIssue[] = [];
  let params: unknown = structuredClone(stored);
  for (const field of fields) {
    const path = field.name.slice(FIELD_PREFIX.length).split('.');
    const typed = form[field.name];
    let next: unknown;
    if (field.type === 'boolean') next = typed === 'on' ? true : field.blank === 'omit' ? undefined : false;
    else if (typed === undefined) continue;
    else if (field.type === 'number' || field.type === 'integer') {
      if (typed.trim() === '') {
        if (field.blank === null) issues.push({ path: field.name, message: 'Enter a number.' });
        next = field.blank === 'null' ? null : undefined;
      } else {
        next = readNumber(typed);
        if (next === null)
          issues.push({ path: field.name, message: `“${typed.trim()}” is not a number; write it like 0.47 (or 0,47), 4.7e-5 or 47µ.` });
      }
    } else next = typed.trim();
    if (field.name === ROOT_FIELD) params = next;
    else setAt(params, path, next);
  }
  if (issues.length > 0) return { params, issues };
  const schema = rowSchemaOf(kind);
  const checked = schema?.safeParse(params);
  if (checked && !checked.success)
    for (const issue of checked.error.issues)
      issues.push({ path: FIELD_PREFIX + issue.path.join('.'), message: `${sentence(readableIssue(issue))}.` });
  return { params, issues };
}

/** zod's own words for a wrong type are for programmers; a person reads what to enter. */
export function readableIssue(issue: z.core.$ZodIssue): string {
  if (issue.code === 'too_small' && issue.origin === 'string') return 'enter some text';
  if (issue.code === 'invalid_type' && issue.expected === 'int') return 'enter a whole number';
  if (issue.code === 'invalid_type') return `enter a ${issue.expected}`;
  if (issue.code === 'invalid_value') return `choose one of ${issue.values.join(', ')}`;
  if (issue.code === 'too_small') return `must be at least ${String(issue.minimum)}`;
  if (issue.code === 'too_big') return `must be at most ${String(issue.maximum)}`;
  return issue.message;
}

function setAt(target: unknown, path: readonly string[], value: unknown): void {
  let node = target as Record<string, unknown>;
  for (const part of path.slice(0, -1)) node = node[part] as Record<string, unknown>;
  const last = path[path.length - 1] ?? '';
  if (value === undefined) delete node[last];
  else node[last] = value;
}
