/**
 * Quote pricing: the rate card, the design facts a revision gives, the lines
 * they price to, and the totals. Pure and browser-safe, so the quote builder
 * previews with the very arithmetic the server stores. Money is integer minor
 * units; rates are basis points; line quantities are thousandths.
 */
import { z } from 'zod';
import type { RailSpec } from '../engine/rail-spec';
import type { Evaluation, TopologyId } from '../engine/types';
import { topologyIds } from '../engine/types';
import { ES1_DC_LIMIT_V } from '../engine/cautions';
import { infeasibleReasonField } from './drafting';
import { chosenOption, TOPOLOGY_NAMES } from '~/lib/review';

/** A ripple budget of 1 mV or less (precision and RF loads) takes extra layout and filtering work. */
export const TIGHT_NOISE_VPP = 0.001;

export const MAX_UNITS = 10_000;
const MAX_PRICE_MINOR = 100_000_000;
const MAX_QUANTITY_MILLI = MAX_UNITS * 1000;

const hours = (label: string) =>
  z
    .number({ error: `${label} must be a number of hours.` })
    .min(0, `${label} must not be negative.`)
    .max(1000, `${label} must not exceed 1000 h.`);
const minor = (label: string) =>
  z
    .int({ error: `${label} must be a whole amount in minor units.` })
    .min(0, `${label} must not be negative.`)
    .max(MAX_PRICE_MINOR, `${label} is too large.`);
const basisPoints = (label: string) =>
  z
    .int({ error: `${label} must be whole basis points.` })
    .min(0, `${label} must not be negative.`)
    .max(10_000, `${label} must not exceed 100 %.`);

export const COMPLEXITY_DRIVERS = ['highVoltage', 'tightNoise', 'heatsink', 'perRevision'] as const;
export type ComplexityDriver = (typeof COMPLEXITY_DRIVERS)[number];

const firmIdentifier = (what: string) =>
  z
    .string()
    .trim()
    .max(40, `${what} is at most 40 characters.`)
    .regex(/^[A-Za-z0-9 ./-]*$/, `${what} holds letters, digits, spaces, dots, slashes and dashes only.`)
    .default('');

export const rateCardSchema = z.object({
  currency: z.string().regex(/^[A-Z]{3}$/, 'The currency is a three-letter ISO 4217 code such as EUR.'),
  hourlyRateMinor: minor('The hourly rate'),
  designHoursByTopology: z.object(
    Object.fromEntries(topologyIds.map((t) => [t, hours(`Design hours for ${TOPOLOGY_NAMES[t]}`)])) as Record<
      TopologyId,
      ReturnType<typeof hours>
    >,
  ),
  complexityHours: z.object({
    highVoltage: hours('High-voltage design hours'),
    tightNoise: hours('Low-noise design hours'),
    heatsink: hours('Heatsink design hours'),
    perRevision: hours('Hours per revision'),
  }),
  hvReviewMinor: minor('The high-voltage safety review'),
  prototypePerUnitMinor: minor('The prototype build per unit'),
  testReportMinor: minor('The test and report'),
  taxRateBp: basisPoints('The tax rate'),
  depositBp: basisPoints('The deposit'),
  validityDays: z
    .int({ error: 'The validity must be a whole number of days.' })
    .min(1, 'A quote is valid for at least one day.')
    .max(365, 'Keep the validity within a year.'),
  /** Printed on the balance invoice under the letterhead; blank until the admin fills them in. */
  registrationNumber: firmIdentifier('The company registration number'),
  taxId: firmIdentifier('The VAT or tax id'),
});
export type RateCard = z.infer<typeof rateCardSchema>;

export const QUOTE_LINE_KINDS = ['design', 'hv-review', 'parts', 'prototype', 'test-report', 'other'] as const;
export type QuoteLineKind = (typeof QUOTE_LINE_KINDS)[number];

export const quoteLineSchema = z.object({
  kind: z.enum(QUOTE_LINE_KINDS, { error: `The kind must be one of ${QUOTE_LINE_KINDS.join(', ')}.` }),
  description: z.string().trim().min(1, 'Describe the line.').max(300, 'Keep the description under 300 characters.'),
  quantityMilli: z
    .int({ error: 'The quantity is whole thousandths (1.5 → 1500).' })
    .min(1, 'The quantity must be above zero.')
    .max(MAX_QUANTITY_MILLI, 'The quantity is too large.'),
  unit: z.string().trim().min(1, 'Name the unit (h, unit, item).').max(20, 'Keep the unit short.'),
  // Negative prices are allowed so a line can be a discount.
  unitPriceMinor: z
    .int({ error: 'The unit price is a whole amount in minor units.' })
    .min(-MAX_PRICE_MINOR, 'The unit price is too large.')
    .max(MAX_PRICE_MINOR, 'The unit price is too large.'),
});
export type QuoteLineInput = z.infer<typeof quoteLineSchema>;

const units = z
  .int({ error: 'The number of units must be a whole number.' })
  .min(1, 'Quote at least one unit.')
  .max(MAX_UNITS, `Quote at most ${MAX_UNITS} units.`);

export const createQuoteSchema = z
  .object({
    revisionId: z.string({ error: 'Name the revision to quote.' }).min(1, 'Name the revision to quote.'),
    quantity: units.default(1),
    infeasibleReason: infeasibleReasonField,
  })
  .strict();

/** The quote builder's start form: the same fields, typed into text boxes. */
export const createQuoteFormSchema = z.object({
  revisionId: createQuoteSchema.shape.revisionId,
  quantity: z.coerce.number({ error: 'Enter a whole number of units.' }).pipe(units),
  infeasibleReason: infeasibleReasonField,
});

const isoDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD.');

export const patchQuoteSchema = z
  .object({
    quantity: units.optional(),
    lines: z.array(quoteLineSchema).min(1, 'A quote needs at least one line.').max(50, 'Keep a quote under 50 lines.').optional(),
    taxRateBp: basisPoints('The tax rate').optional(),
    depositBp: basisPoints('The deposit').optional(),
    validUntil: isoDay.optional(),
    terms: z.string().max(4_000, 'Keep the terms under 4 000 characters.').optional(),
    clientNote: z.string().max(2_000, 'Keep the note to the client under 2 000 characters.').optional(),
  })
  .strict();
export type QuotePatch = z.infer<typeof patchQuoteSchema>;

/** Digits after the decimal point in the currency's minor unit (EUR 2, JPY 0). */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** Integer division rounded half away from zero, so a discount rounds like a charge. */
export function divRound(numerator: number, denominator: number): number {
  const q = Math.round(Math.abs(numerator) / denominator);
  return numerator < 0 ? -q : q;
}

export function lineTotal(line: Pick<QuoteLineInput, 'quantityMilli' | 'unitPriceMinor'>): number {
  return divRound(line.quantityMilli * line.unitPriceMinor, 1000);
}

export interface QuoteTotals {
  subtotalMinor: number;
  taxMinor: number;
  totalMinor: number;
  depositMinor: number;
}

/** Tax on the subtotal, deposit on the total including tax; each rounded once, in minor units. */
export function quoteTotals(
  lines: readonly Pick<QuoteLineInput, 'quantityMilli' | 'unitPriceMinor'>[],
  taxRateBp: number,
  depositBp: number,
): QuoteTotals {
  const subtotalMinor = lines.reduce((sum, line) => sum + lineTotal(line), 0);
  const taxMinor = divRound(subtotalMinor * taxRateBp, 10_000);
  const totalMinor = subtotalMinor + taxMinor;
  return { subtotalMinor, taxMinor, totalMinor, depositMinor: divRound(totalMinor * depositBp, 10_000) };
}

/** What a revision tells the pricing: the chosen option and the drivers of design effort. */
export interface DesignFacts {
  topology: TopologyId;
  highVoltage: boolean;
  tightNoise: boolean;
  heatsink: boolean;
  revisionNumber: number;
  partCount: number;
  partsCostCents: number;
}

export function designFacts(revision: { topology: string; number: number; input: RailSpec; result: Evaluation }): DesignFacts | null {
  const option = chosenOption(revision);
  if (!option) return null;
  const { input, output, noise } = revision.input;
  return {
    topology: option.topology,
    highVoltage: Math.max(input.vMax, output.v) > ES1_DC_LIMIT_V,
    tightNoise: (noise.maxRippleVpp ?? Infinity) <= TIGHT_NOISE_VPP,
    heatsink: option.heatsink.required,
    revisionNumber: revision.number,
    partCount: option.partCount,
    partsCostCents: option.costCents,
  };
}

const milli = (value: number) => Math.round(value * 1000);

/**
 * The lines a new quote starts from. Design work is one line per effort
 * driver so the client sees what the hours are for; parts and the prototype
 * build scale with the number of units.
 */
export function draftLines(card: RateCard, facts: DesignFacts, quantity: number): QuoteLineInput[] {
  const hourly = (description: string, h: number): QuoteLineInput => ({
    kind: 'design',
    description,
    quantityMilli: milli(h),
    unit: 'h',
    unitPriceMinor: card.hourlyRateMinor,
  });
  const lines: QuoteLineInput[] = [
    hourly(`Design of the ${TOPOLOGY_NAMES[facts.topology].toLowerCase()}`, card.designHoursByTopology[facts.topology]),
  ];
  if (facts.highVoltage) lines.push(hourly('High-voltage design: creepage, clearance, bleeders', card.complexityHours.highVoltage));
  if (facts.tightNoise) lines.push(hourly('Low-noise design: filtering and layout for the ripple budget', card.complexityHours.tightNoise));
  if (facts.heatsink) lines.push(hourly('Thermal design: heatsink selection and mounting', card.complexityHours.heatsink));
  if (card.complexityHours.perRevision > 0) {
    const n = facts.revisionNumber;
    lines.push(hourly(`Design review of ${n} revision${n === 1 ? '' : 's'}`, card.complexityHours.perRevision * n));
  }
  if (facts.highVoltage)
    lines.push({
      kind: 'hv-review',
      description: 'High-voltage safety review',
      quantityMilli: 1000,
      unit: 'item',
      unitPriceMinor: card.hvReviewMinor,
    });
  // The engine estimates part cost in hundredths of the currency; convert to this currency's minor unit.
  const partsMinor = divRound(facts.partsCostCents * 10 ** minorDigits(card.currency), 100);
  lines.push({
    kind: 'parts',
    description: `Parts per unit (${facts.partCount} parts, estimate)`,
    quantityMilli: quantity * 1000,
    unit: 'unit',
    unitPriceMinor: partsMinor,
  });
  lines.push({
    kind: 'prototype',
    description: 'Prototype build and bring-up per unit',
    quantityMilli: quantity * 1000,
    unit: 'unit',
    unitPriceMinor: card.prototypePerUnitMinor,
  });
  lines.push({
    kind: 'test-report',
    description: 'Bench test and written report',
    quantityMilli: 1000,
    unit: 'item',
    unitPriceMinor: card.testReportMinor,
  });
  return lines.filter((line) => line.quantityMilli > 0);
}

/** Lines priced per unit follow the quote's number of units when it changes. */
export function withQuantity<L extends Pick<QuoteLineInput, 'kind' | 'quantityMilli'>>(lines: readonly L[], quantity: number): L[] {
  return lines.map((line) => (line.kind === 'parts' || line.kind === 'prototype' ? { ...line, quantityMilli: quantity * 1000 } : line));
}

/** Thousandths as a person reads them: 12500 → "12.5". */
export function formatQuantity(quantityMilli: number): string {
  return (quantityMilli / 1000).toLocaleString('en-GB', { maximumFractionDigits: 3 });
}

/** Basis points as a percentage: 2000 → "20 %", 1250 → "12.5 %". */
export function formatBp(bp: number): string {
  return `${(bp / 100).toLocaleString('en-GB', { maximumFractionDigits: 2 })} %`;
}

/**
 * Reads a decimal typed by a person into an integer scaled by 10^digits,
 * exactly (no floating point): parseDecimal('115.5', 2) → 11550. Null when it
 * is not a number or has more decimals than the scale holds.
 */
export function parseDecimal(text: string, digits: number): number | null {
  const match = /^\s*(-)?(\d{0,12})(?:[.,](\d*))?\s*$/.exec(text);
  if (!match || (!match[2] && !match[3])) return null;
  const fraction = match[3] ?? '';
  if (fraction.length > digits) return null;
  const value = Number(`${match[2] || '0'}${fraction.padEnd(digits, '0')}`);
  return match[1] ? -value : value;
}

/** The inverse of parseDecimal, for form fields: 11550, 2 → "115.50". */
export function formatDecimal(scaled: number, digits: number): string {
  const sign = scaled < 0 ? '-' : '';
  const text = String(Math.abs(scaled)).padStart(digits + 1, '0');
  return digits === 0 ? `${sign}${text}` : `${sign}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}
