/**
 * The engineer's choices as the form holds them (text as typed) and as the
 * API takes them (numbers in SI units). Browser-safe; the server checks again.
 */
import { parseSi } from '../engine/units';
import {
  CHOICE_OVERRIDES,
  fieldText,
  NUMBER_OVERRIDE_KEYS,
  WEIGHT_KEYS,
  type ChoiceOverride,
  type NumberOverride,
  type WeightKey,
} from './words';
import type { AgreedRequirement } from './agreed-requirement';

/** The requirement as agreed with the client, where it departs from the brief (empty = as briefed). */
export const REQUIREMENT_FIELDS = {
  outputV: { label: 'Output voltage', unit: 'V', hint: 'Only when the client agrees to another rail voltage.' },
  tolerancePct: { label: 'Output tolerance', unit: '%', hint: 'e.g. 2 for ±2 %, when the client accepts a wider band.' },
  maxRippleVpp: { label: 'Ripple limit', unit: 'Vpp', hint: 'e.g. 20m, when the client accepts more ripple.' },
} as const;
export type RequirementField = keyof typeof REQUIREMENT_FIELDS;
export const REQUIREMENT_KEYS = Object.keys(REQUIREMENT_FIELDS) as RequirementField[];

export interface ForcedPart {
  ref: string;
  value: string;
}

export interface ChoicesForm {
  weights: Record<WeightKey, string>;
  numbers: Record<NumberOverride, string>;
  picks: Record<ChoiceOverride, string>;
  parts: ForcedPart[];
  requirement: Record<RequirementField, string>;
}

export interface Choices {
  weights: Record<WeightKey, number>;
  overrides: Record<string, unknown>;
  requirement: AgreedRequirement;
}

export interface FormIssue {
  path: string;
  message: string;
}

const text = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : typeof v === 'string' ? v : '');

/** The form filled from saved choices (a revision's weights, overrides and agreed requirement). */
export function formFrom(
  weights: Record<string, unknown>,
  overrides: Record<string, unknown>,
  agreed: AgreedRequirement = {},
): ChoicesForm {
  const parts = overrides.parts && typeof overrides.parts === 'object' ? Object.entries(overrides.parts as Record<string, unknown>) : [];
  return {
    weights: Object.fromEntries(WEIGHT_KEYS.map((k) => [k, text(weights[k])])) as ChoicesForm['weights'],
    numbers: Object.fromEntries(NUMBER_OVERRIDE_KEYS.map((k) => [k, fieldText(overrides[k])])) as ChoicesForm['numbers'],
    picks: Object.fromEntries(Object.keys(CHOICE_OVERRIDES).map((k) => [k, text(overrides[k])])) as ChoicesForm['picks'],
    parts: parts.map(([ref, value]) => ({ ref, value: fieldText(value) })),
    requirement: {
      outputV: fieldText(agreed.outputV),
      // Four significant figures: 0.02 shows as 2, not 2.0000000000000004.
      tolerancePct: agreed.tolerance === undefined ? '' : String(Number((agreed.tolerance * 100).toPrecision(4))),
      maxRippleVpp: fieldText(agreed.maxRippleVpp),
    },
  };
}

/** Turns the form into API choices; empty fields mean "the engine decides". */
export function choicesFrom(form: ChoicesForm): { ok: true; value: Choices } | { ok: false; issues: FormIssue[] } {
  const issues: FormIssue[] = [];
  const weights = {} as Record<WeightKey, number>;
  for (const key of WEIGHT_KEYS) {
    const value = Number(form.weights[key]);
    if (form.weights[key].trim() === '' || !Number.isFinite(value))
      issues.push({ path: `weights.${key}`, message: 'Give a weight from 0 to 100.' });
    else weights[key] = value;
  }
  const overrides: Record<string, unknown> = {};
  for (const key of NUMBER_OVERRIDE_KEYS) {
    const typed = form.numbers[key].trim();
    if (!typed) continue;
    const value = parseSi(typed);
    if (value === null) issues.push({ path: `overrides.${key}`, message: `“${typed}” is not a number; write e.g. 4k7, 220u or 1.5.` });
    else overrides[key] = value;
  }
  for (const key of Object.keys(CHOICE_OVERRIDES) as ChoiceOverride[]) if (form.picks[key]) overrides[key] = form.picks[key];
  const parts: Record<string, number> = {};
  form.parts.forEach((p, k) => {
    if (!p.ref.trim() && !p.value.trim()) return;
    const value = parseSi(p.value);
    if (value === null)
      issues.push({ path: `overrides.parts.${k}`, message: `Give a value for ${p.ref.trim() || 'the part'}, e.g. 4k7 or 10u.` });
    else parts[p.ref.trim().toUpperCase()] = value;
  });
  if (Object.keys(parts).length > 0) overrides.parts = parts;
  const requirement: AgreedRequirement = {};
  for (const key of REQUIREMENT_KEYS) {
    const typed = form.requirement[key].trim();
    if (!typed) continue;
    const value = parseSi(typed.replace(/\s*%$/, ''));
    if (value === null) issues.push({ path: `requirement.${key}`, message: `“${typed}” is not a number; write e.g. 3.3, 2 or 20m.` });
    else if (key === 'tolerancePct') requirement.tolerance = value / 100;
    else requirement[key] = value;
  }
  return issues.length > 0 ? { ok: false, issues } : { ok: true, value: { weights, overrides, requirement } };
}
