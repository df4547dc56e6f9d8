/**
 * The consultancy's one rate card: read it, and save an admin's edit of it.
 * Takes the database as an argument so the seed and scripts use it too.
 */
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { topologyIds } from '../engine/types';
import { minorDigits, parseDecimal, rateCardSchema, type RateCard } from './pricing';
import type { DbOrTx } from '../platform/db/connect';
import { rateCard } from '../platform/db/schema';
import { invalidInput, succeed, type FieldIssue, type Outcome } from '../platform/outcome';
import { zodIssues } from '../platform/http/validation';

const RATE_CARD_ID = 1;

export async function readRateCard(db: DbOrTx): Promise<(RateCard & { updatedAt: Date }) | null> {
  const [row] = await db.select().from(rateCard).where(eq(rateCard.id, RATE_CARD_ID)).limit(1);
  if (!row) return null;
  const parsed = rateCardSchema.safeParse(row);
  // A stored card that no longer passes the schema is a data fault an admin must fix on the rate card page.
  if (!parsed.success)
    throw new Error(
      `The stored rate card is invalid: ${zodIssues(parsed.error)
        .map((i) => `${i.path}: ${i.message}`)
        .join('; ')}`,
    );
  return { ...parsed.data, updatedAt: row.updatedAt };
}

export async function saveRateCard(db: DbOrTx, card: RateCard, updatedBy: string): Promise<void> {
  const values = { ...card, updatedBy, updatedAt: new Date() };
  await db
    .insert(rateCard)
    .values({ id: RATE_CARD_ID, ...values })
    .onConflictDoUpdate({ target: rateCard.id, set: values });
}

/** Form field names of the rate card page, one per figure. */
export const hoursField = (topology: string) => `hours.${topology}`;
export const complexityField = (driver: string) => `complexity.${driver}`;

/**
 * The rate card page's form (amounts in major units, rates in percent, hours
 * as decimals) read into a card in minor units and basis points, with an
 * issue per field a person can correct.
 */
export function rateCardFromForm(form: Record<string, string>): Outcome<RateCard> {
  const issues: FieldIssue[] = [];
  const currency = (form.currency ?? '').trim().toUpperCase();
  let digits = 2;
  try {
    digits = minorDigits(currency);
  } catch {
    issues.push({ path: 'currency', message: 'The currency is a three-letter ISO 4217 code such as EUR.' });
  }
  const read = (name: string, scale: number, what: string): number => {
    const value = parseDecimal(form[name] ?? '', scale);
    if (value === null) {
      issues.push({ path: name, message: `Enter ${what}${scale ? ` with at most ${scale} decimals` : ' as a whole number'}.` });
      return 0;
    }
    return value;
  };
  const money = (name: string) => read(name, digits, 'an amount');
  const percent = (name: string) => read(name, 2, 'a percentage');
  const hours = (name: string) => {
    const milli = read(name, 3, 'a number of hours');
    return milli / 1000;
  };
  const draft = {
    currency,
    hourlyRateMinor: money('hourlyRate'),
    designHoursByTopology: Object.fromEntries(topologyIds.map((t) => [t, hours(hoursField(t))])),
    complexityHours: {
      highVoltage: hours(complexityField('highVoltage')),
      tightNoise: hours(complexityField('tightNoise')),
      heatsink: hours(complexityField('heatsink')),
      perRevision: hours(complexityField('perRevision')),
    },
    hvReviewMinor: money('hvReview'),
    prototypePerUnitMinor: money('prototypePerUnit'),
    testReportMinor: money('testReport'),
    taxRateBp: percent('taxRate'),
    depositBp: percent('deposit'),
    validityDays: read('validityDays', 0, 'a number of days'),
    registrationNumber: form.registrationNumber ?? '',
    taxId: form.taxId ?? '',
  };
  if (issues.length) return refused(issues);
  const parsed = rateCardSchema.safeParse(draft);
  if (!parsed.success) return refused(zodIssues(parsed.error).map((i) => ({ ...i, path: formFieldOf(i.path) })));
  return succeed(parsed.data);
}

const refused = (issues: FieldIssue[]) => ({
  ...invalidInput('invalid_rate_card', issues),
  message: 'Some figures need correcting; see the fields marked below.',
});

/** An admin's save from the rate card page: every figure read and checked before anything is written. */
export async function saveRateCardForm(db: DbOrTx, form: Record<string, string>, updatedBy: string): Promise<Outcome<void>> {
  const read = rateCardFromForm(form);
  if (!read.ok) return read;
  await saveRateCard(db, read.value, updatedBy);
  return succeed(undefined);
}

export const RATE_CARD_SAVED = 'Rate card saved. New quotes are priced with it; quotes already drafted keep their prices.';
/** The form's fields arrive as strings, one per figure; `rateCardFromForm` reads each. */
export const rateCardFormSchema = z.record(z.string(), z.string());

/** Maps a schema path back to the form field that holds it, so the error lands beside the input. */
function formFieldOf(path: string): string {
  const [head, tail] = path.split('.');
  if (head === 'designHoursByTopology' && tail) return hoursField(tail);
  if (head === 'complexityHours' && tail) return complexityField(tail);
  const names: Record<string, string> = {
    hourlyRateMinor: 'hourlyRate',
    hvReviewMinor: 'hvReview',
    prototypePerUnitMinor: 'prototypePerUnit',
    testReportMinor: 'testReport',
    taxRateBp: 'taxRate',
    depositBp: 'deposit',
  };
  return names[head ?? ''] ?? path;
}
