// Capacitor banks from the catalog's envelope: DC-bias loss, ripple-current rating, electrolytic
// life and forced values, each against a hand calculation.
import { describe, expect, test } from 'vitest';
import { defaultCatalog } from '~/lib/engine/catalog.ts';
import {
  CAPACITOR_VOLTAGE_FACTOR,
  LIFE_TARGET_H,
  biasRetention,
  chooseCapacitor,
  chooseCapacitorBank,
  electrolyticLife,
} from '~/lib/engine/capacitors.ts';

const family = (id: string) => defaultCatalog.capacitors.find((f) => f.id === id)!;
const need = { effectiveF: 10e-6, workingV: 12, rmsA: 0, esrMaxOhm: Infinity, ambientC: 40 };

describe('MLCC capacitance under DC bias (linear fit of data-sheet bias curves — from memory)', () => {
  test('X7R at 12 V on a 25 V part keeps 1 − 0.55·12/25 = 73.6 %', () => {
    expect(biasRetention(family('mlcc-x7r'), 12, 25)).toBeCloseTo(0.736, 12);
  });

  test('at the full rating X5R keeps 30 %, and the fit never goes below a fifth', () => {
    expect(biasRetention(family('mlcc-x5r'), 6.3, 6.3)).toBeCloseTo(0.3, 12);
    expect(biasRetention({ ...family('mlcc-x5r'), biasLossAtRated: 0.95 }, 6.3, 6.3)).toBe(0.2);
  });

  test('a bank for 10 µF effective at 12 V counts the 10 % tolerance and the bias loss', () => {
    const bank = chooseCapacitorBank('C1', 'output-capacitor', need, defaultCatalog);
    // Whatever the case, the capacitance left must cover the need, and the rating the 1.25× rule.
    expect(bank.effectiveF).toBeGreaterThanOrEqual(10e-6);
    expect(bank.part.ratingV!).toBeGreaterThanOrEqual(CAPACITOR_VOLTAGE_FACTOR * 12);
    const keep = (1 - bank.family.tolerance) * biasRetention(bank.family, 12, bank.part.ratingV!);
    expect(bank.effectiveF).toBeCloseTo(bank.farads * keep, 15);
  });
});

describe('what can be bought', () => {
  test('68 µF at 100 V is not offered as one X7R part: the bank is several parts or another family', () => {
    const bank = chooseCapacitorBank('C1', 'output-capacitor', { ...need, effectiveF: 68e-6, workingV: 75 }, defaultCatalog);
    expect(bank.issue?.severity).not.toBe('blocker');
    expect(bank.count > 1 || bank.family.kind !== 'mlcc').toBe(true);
    // No single X7R case in the envelope holds more than 4.7 µF at 100 V.
    const x7r100 = family('mlcc-x7r').cases.filter((c) => c.vRatedV >= 100);
    expect(Math.max(...x7r100.map((c) => c.cMaxF))).toBeLessThanOrEqual(4.7e-6);
  });

  test('ripple current sets the number of parts: 2 A RMS on 0.45 A cans needs five of them', () => {
    const only = {
      ...defaultCatalog,
      capacitors: [{ ...family('alu-lowesr'), cases: [family('alu-lowesr').cases.find((c) => c.name === '16×25')!] }],
    };
    const bank = chooseCapacitorBank('C1', 'input-capacitor', { ...need, effectiveF: 1e-6, workingV: 300, rmsA: 2 }, only);
    // ceil(2 / 0.45) = 5 parts, each carrying 0.4 A.
    expect(bank.count).toBe(5);
    expect(bank.rippleRatingA).toBeCloseTo(2.25, 12);
  });

  test('100 nF at 400 V is a film or high-voltage ceramic part: aluminium electrolytic series start near 1 µF (from memory)', () => {
    const c = chooseCapacitor('C1', 'input-capacitor', 100e-9, 400, defaultCatalog);
    expect(c.issue).toBeNull();
    expect(c.farads).toBeCloseTo(100e-9, 15);
    expect(['film', 'mlcc']).toContain(c.family.kind);
    expect(c.part.ratingV!).toBeGreaterThanOrEqual(CAPACITOR_VOLTAGE_FACTOR * 400);
  });

  test('every value chosen lies inside its case’s envelope, smallest to largest', () => {
    for (const v of [3.3, 12, 48, 160, 400, 700])
      for (const f of [1e-9, 10e-9, 100e-9, 0.47e-6, 2.2e-6, 22e-6, 220e-6]) {
        const c = chooseCapacitor('C1', 'input-capacitor', f, v, defaultCatalog);
        if (c.issue?.severity === 'blocker') continue;
        const each = c.farads / c.count;
        const fits = c.family.cases.some(
          (row) => row.vRatedV >= CAPACITOR_VOLTAGE_FACTOR * v && each >= (row.cMinF ?? 0) * (1 - 1e-9) && each <= row.cMaxF * (1 + 1e-9),
        );
        expect({ v, f, part: c.part.part, fits }).toEqual({ v, f, part: c.part.part, fits: true });
      }
  });

  test('a need no family meets is a blocker that says what was asked', () => {
    const bank = chooseCapacitorBank('C7', 'output-capacitor', { ...need, effectiveF: 1, workingV: 3000 }, defaultCatalog);
    expect(bank.issue?.severity).toBe('blocker');
    expect(bank.issue?.message).toMatch(/C7 needs .* at 3000\.0 V working/);
  });

  test('a need far past every bank the catalog builds is not printed as a part value to buy', () => {
    const bank = chooseCapacitorBank('C1', 'output-capacitor', { ...need, effectiveF: 771, workingV: 5 }, defaultCatalog);
    expect(bank.issue?.severity).toBe('blocker');
    expect(bank.issue?.message).toMatch(/^No capacitor bank can do this: .* ask C1 for about 771 F, more than 100 times the largest bank/);
    expect(bank.issue?.message).not.toMatch(/C1 needs 771/);
  });

  test('an ESR no case reaches is named as the reason', () => {
    const bank = chooseCapacitorBank(
      'C1',
      'output-capacitor',
      { ...need, effectiveF: 4.7e-6, workingV: 5, esrMaxOhm: 1e-9 },
      defaultCatalog,
    );
    expect(bank.issue?.severity).toBe('blocker');
    expect(bank.issue?.message).toMatch(/with an ESR of at most 1 nΩ; no family and case/);
  });
});

describe('electrolytic life: halving per 10 K (common practice, Arrhenius rule of thumb)', () => {
  const alu = family('alu-lowesr');
  test('2000 h at 105 °C lasts 2000·2^((105 − 65)/10) = 32 000 h at 65 °C without ripple', () => {
    expect(electrolyticLife(alu, 65, 0, 1)).toBeCloseTo(32000, 6);
  });

  test('the rated ripple adds about 5 K: 2000·2^((105 − 65 − 5)/10) = 22 627 h', () => {
    expect(electrolyticLife(alu, 65, 1, 1)).toBeCloseTo(2000 * 2 ** 3.5, 6);
  });

  test('ceramics have no wear-out term; a short-lived bank carries a caution', () => {
    expect(electrolyticLife(family('mlcc-x7r'), 65, 1, 1)).toBeNull();
    const onlyAlu = { ...defaultCatalog, capacitors: [alu] };
    const bank = chooseCapacitorBank(
      'C1',
      'output-capacitor',
      { ...need, effectiveF: 100e-6, workingV: 12, ambientC: 95, rmsA: 0.5 },
      onlyAlu,
    );
    expect(bank.lifeHours!).toBeLessThan(LIFE_TARGET_H);
    expect(bank.issue?.code).toBe('capacitor-life');
  });
});

describe('forced values', () => {
  test('a forced 47 µF at 5 V is built from standard parts and used as given', () => {
    const bank = chooseCapacitorBank('C1', 'output-capacitor', { ...need, workingV: 5, forcedF: 47e-6 }, defaultCatalog);
    expect(bank.farads).toBeCloseTo(47e-6, 15);
    expect(bank.issue).toBeNull();
  });

  test('a forced value no case can make (4.7 mF at 400 V in six parts) says why', () => {
    const bank = chooseCapacitorBank('C1', 'output-capacitor', { ...need, workingV: 400, forcedF: 4.7e-3 }, defaultCatalog);
    expect(bank.issue?.severity).toBe('blocker');
    expect(bank.issue?.message).toMatch(/the forced 4\.7 mF/);
  });
});
