import { describe, expect, test } from 'vitest';
import type { Evaluation, Option } from '../../../src/lib/engine/types';
import type { RailSpec } from '../../../src/lib/engine/rail-spec';
import {
  designFacts,
  divRound,
  draftLines,
  formatDecimal,
  lineTotal,
  parseDecimal,
  quoteTotals,
  rateCardSchema,
  withQuantity,
  type DesignFacts,
  type RateCard,
} from '../../../src/lib/quotes/pricing';
import { formatQuoteNumber, validUntilFrom } from '../../../src/lib/quotes/core.server';

const card: RateCard = {
  currency: 'EUR',
  hourlyRateMinor: 10_000,
  designHoursByTopology: { shunt: 3, linear: 5, 'linear-predrop': 10, buck: 12, boost: 12, 'buck-boost': 16, 'buck+linear': 16 },
  complexityHours: { highVoltage: 6, tightNoise: 4, heatsink: 3, perRevision: 1.5 },
  hvReviewMinor: 48_000,
  prototypePerUnitMinor: 9_500,
  testReportMinor: 36_000,
  taxRateBp: 2_000,
  depositBp: 3_000,
  validityDays: 30,
  registrationNumber: '',
  taxId: '',
};

const hardBuck: DesignFacts = {
  topology: 'buck',
  highVoltage: true,
  tightNoise: true,
  heatsink: true,
  revisionNumber: 2,
  partCount: 9,
  partsCostCents: 1_234,
};

describe('drafted lines', () => {
  test('every effort driver adds its line; parts and build scale with units', () => {
    const lines = draftLines(card, hardBuck, 4);
    expect(lines.map((l) => [l.kind, l.quantityMilli, l.unitPriceMinor, lineTotal(l)])).toEqual([
      ['design', 12_000, 10_000, 120_000], // 12 h × €100
      ['design', 6_000, 10_000, 60_000], // high voltage
      ['design', 4_000, 10_000, 40_000], // tight noise
      ['design', 3_000, 10_000, 30_000], // heatsink
      ['design', 3_000, 10_000, 30_000], // 2 revisions × 1.5 h
      ['hv-review', 1_000, 48_000, 48_000],
      ['parts', 4_000, 1_234, 4_936], // 4 × €12.34
      ['prototype', 4_000, 9_500, 38_000], // 4 × €95
      ['test-report', 1_000, 36_000, 36_000],
    ]);
    // Subtotal 406 936; tax 20 % = 81 387.2 → 81 387; total 488 323; deposit 30 % = 146 496.9 → 146 497.
    expect(quoteTotals(lines, card.taxRateBp, card.depositBp)).toEqual({
      subtotalMinor: 406_936,
      taxMinor: 81_387,
      totalMinor: 488_323,
      depositMinor: 146_497,
    });
  });

  test('a plain design has no driver lines, and a zero-hour driver adds nothing', () => {
    const plain = { ...hardBuck, highVoltage: false, tightNoise: false, heatsink: false, revisionNumber: 1 };
    const lines = draftLines({ ...card, complexityHours: { ...card.complexityHours, perRevision: 0 } }, plain, 1);
    expect(lines.map((l) => l.kind)).toEqual(['design', 'parts', 'prototype', 'test-report']);
    // 120 000 + 1 234 + 9 500 + 36 000 = 166 734; tax 33 346.8 → 33 347; total 200 081; deposit 60 024.3 → 60 024.
    expect(quoteTotals(lines, 2_000, 3_000)).toEqual({
      subtotalMinor: 166_734,
      taxMinor: 33_347,
      totalMinor: 200_081,
      depositMinor: 60_024,
    });
  });

  test('parts cost converts from the engine’s hundredths into a currency without minor units', () => {
    const yen = draftLines({ ...card, currency: 'JPY' }, hardBuck, 1).find((l) => l.kind === 'parts');
    expect(yen?.unitPriceMinor).toBe(12); // 1 234 hundredths of a yen → ¥12.34 → ¥12
  });

  test('changing the units moves only the per-unit lines', () => {
    const lines = withQuantity(draftLines(card, hardBuck, 1), 7);
    expect(lines.filter((l) => l.kind === 'parts' || l.kind === 'prototype').map((l) => l.quantityMilli)).toEqual([7_000, 7_000]);
    expect(lines.filter((l) => l.kind === 'design').map((l) => l.quantityMilli)).toEqual([12_000, 6_000, 4_000, 3_000, 3_000]);
  });
});

describe('rounding in minor units', () => {
  test('line amounts round half away from zero, so a discount mirrors a charge', () => {
    expect(lineTotal({ quantityMilli: 1_333, unitPriceMinor: 1_999 })).toBe(2_665); // 2 664.667
    expect(lineTotal({ quantityMilli: 500, unitPriceMinor: 1 })).toBe(1); // 0.5
    expect(lineTotal({ quantityMilli: 500, unitPriceMinor: -1 })).toBe(-1);
    expect(lineTotal({ quantityMilli: 499, unitPriceMinor: 1 })).toBe(0);
    expect(divRound(-7, 2)).toBe(-4);
  });

  test('tax and deposit are each rounded once, from the rounded figures before them', () => {
    // 3 lines of 0.333 h at €100: 3 × 3 330 = 9 990; tax 15 % = 1 498.5 → 1 499; total 11 489; deposit 12.5 % = 1 436.125 → 1 436.
    const third = { quantityMilli: 333, unitPriceMinor: 10_000 };
    expect(quoteTotals([third, third, third], 1_500, 1_250)).toEqual({
      subtotalMinor: 9_990,
      taxMinor: 1_499,
      totalMinor: 11_489,
      depositMinor: 1_436,
    });
    // Tax on 5 minor units at 10 % is half a unit: it rounds up.
    expect(quoteTotals([{ quantityMilli: 1_000, unitPriceMinor: 5 }], 1_000, 0).taxMinor).toBe(1);
  });
});

describe('design facts from a revision', () => {
  const option = (over: Partial<Option>) =>
    ({ topology: 'linear', heatsink: { required: false, maxThetaSaCW: null }, partCount: 5, costCents: 300, ...over }) as Option;
  const spec = (vMax: number, vOut: number, ripple: number) =>
    ({
      input: { vMin: vMax * 0.8, vNom: vMax * 0.9, vMax, rippleVpp: 0, source: 'bus' },
      output: { v: vOut, tolerance: 0.02, iMin: 0, iTyp: 0.1, iMax: 0.2 },
      noise: { class: 'sensor', maxRippleVpp: ripple },
    }) as RailSpec;
  const result = (o: Option): Evaluation => ({ recommended: o.topology, options: [o] });

  test('above 60 V on either side is high voltage; 1 mV ripple or less is a tight noise limit', () => {
    expect(designFacts({ topology: 'linear', number: 1, input: spec(60, 12, 0.0011), result: result(option({})) })).toMatchObject({
      highVoltage: false,
      tightNoise: false,
    });
    expect(designFacts({ topology: 'linear', number: 1, input: spec(61, 12, 0.001), result: result(option({})) })).toMatchObject({
      highVoltage: true,
      tightNoise: true,
    });
    expect(
      designFacts({
        topology: 'linear',
        number: 3,
        input: spec(24, 150, 0.01),
        result: result(option({ heatsink: { required: true, maxThetaSaCW: 4 } })),
      }),
    ).toMatchObject({ highVoltage: true, heatsink: true, revisionNumber: 3, partsCostCents: 300 });
  });

  test('a revision whose chosen topology is missing from its result gives no facts', () => {
    expect(designFacts({ topology: 'buck', number: 1, input: spec(24, 5, 0.05), result: result(option({})) })).toBeNull();
  });
});

describe('numbers, dates and typed figures', () => {
  test('quote numbers are the year and a four-digit sequence', () => {
    expect(formatQuoteNumber(2026, 7)).toBe('RW-2026-0007');
    expect(formatQuoteNumber(2027, 12_345)).toBe('RW-2027-12345');
  });

  test('a quote is valid to the end of its last day (UTC)', () => {
    expect(validUntilFrom(new Date('2026-03-10T15:00:00Z'), 30).toISOString()).toBe('2026-04-09T23:59:59.999Z');
  });

  test('decimals typed by a person read exactly into scaled integers and back', () => {
    expect(parseDecimal('115.5', 2)).toBe(11_550);
    expect(parseDecimal(' 1,25 ', 2)).toBe(125);
    expect(parseDecimal('.5', 3)).toBe(500);
    expect(parseDecimal('-50', 2)).toBe(-5_000);
    expect(parseDecimal('0.29', 2)).toBe(29); // 0.29 × 100 is 28.999… in floating point
    expect(parseDecimal('1.234', 2)).toBeNull();
    expect(parseDecimal('', 2)).toBeNull();
    expect(parseDecimal('12 EUR', 2)).toBeNull();
    expect(formatDecimal(11_550, 2)).toBe('115.50');
    expect(formatDecimal(5, 2)).toBe('0.05');
    expect(formatDecimal(-5_000, 2)).toBe('-50.00');
    expect(formatDecimal(42, 0)).toBe('42');
  });

  test('the rate card schema refuses what cannot be priced', () => {
    expect(rateCardSchema.safeParse(card).success).toBe(true);
    const issues = (over: object) => rateCardSchema.safeParse({ ...card, ...over }).error?.issues.map((i) => i.path.join('.'));
    expect(issues({ depositBp: 10_001 })).toEqual(['depositBp']);
    expect(issues({ hourlyRateMinor: 100.5 })).toEqual(['hourlyRateMinor']);
    expect(issues({ currency: 'eur' })).toEqual(['currency']);
    expect(issues({ designHoursByTopology: { ...card.designHoursByTopology, buck: -1 } })).toEqual(['designHoursByTopology.buck']);
  });
});
