import { describe, expect, test } from 'vitest';
import { catalogToRows } from '../../../src/lib/catalog/rows';
import { classFields, prefixedReading, readClassForm, readNumber } from '../../../src/lib/catalog/class-form';
import { FIELD_LOOK } from '../../../src/lib/catalog/field-look';
import { defaultCatalog } from '../../../src/lib/engine/catalog';

const rows = catalogToRows(defaultCatalog);
/** What a browser posts: a ticked box as `on`, an unticked one not at all. */
const asPosted = (kind: string, params: unknown) =>
  Object.fromEntries(
    classFields(kind, params).flatMap((f) => (f.type !== 'boolean' ? [[f.name, f.value]] : f.value === 'true' ? [[f.name, 'on']] : [])),
  );

describe('a device class as a form', () => {
  test('every figure of every shipped class has a labelled field, and posting them unchanged changes nothing', () => {
    for (const row of rows) {
      const fields = classFields(row.kind, row.params);
      expect(fields.length, row.id).toBeGreaterThan(0);
      for (const field of fields) {
        const key =
          field.name === 'f.value'
            ? row.kind
            : field.name
                .split('.')
                .filter((p) => !/^\d+$/.test(p))
                .at(-1);
        expect(FIELD_LOOK[key ?? ''], field.name).toBeDefined();
      }
      const read = readClassForm(row.kind, row.params, asPosted(row.kind, row.params));
      expect(read.issues, row.id).toEqual([]);
      expect(read.params, row.id).toEqual(row.params);
    }
  });

  test('choices come from the schema and numbers carry their unit', () => {
    const regulator = rows.find((row) => row.kind === 'linearRegulators');
    const fields = classFields('linearRegulators', regulator?.params);
    expect(fields.find((f) => f.name === 'f.kind')?.choices).toEqual(['adjustable', 'ldo', 'fixed']);
    expect(fields.find((f) => f.name === 'f.thetaJaCW')).toMatchObject({ label: 'θJA, junction to air', unit: 'K/W', type: 'number' });
    expect(fields.find((f) => f.name === 'f.costCents')?.type).toBe('integer');
    expect(fields.find((f) => f.name === 'f.esrMaxOhm')?.blank).toBe('null');
    expect(fields.find((f) => f.name === 'f.retired')).toMatchObject({ type: 'boolean', blank: 'omit' });
    expect(fields.some((f) => f.name === 'f.id')).toBe(false);
  });

  test('a bad figure is refused beside its own field, in words', () => {
    const thermal = rows.find((row) => row.kind === 'thermal');
    const posted = asPosted('thermal', thermal?.params);
    const negative = readClassForm('thermal', thermal?.params, { ...posted, 'f.tjMarginK': '-5' });
    expect(negative.issues).toEqual([{ path: 'f.tjMarginK', message: 'Must not be negative.' }]);
    const words = readClassForm('thermal', thermal?.params, { ...posted, 'f.airflowFactor.enclosed': 'lots' });
    expect(words.issues[0]?.path).toBe('f.airflowFactor.enclosed');
    expect(words.issues[0]?.message).toContain('“lots” is not a number');
    const good = readClassForm('thermal', thermal?.params, { ...posted, 'f.tjMarginK': '12,5' });
    expect(good.issues).toEqual([]);
    expect((good.params as { tjMarginK: number }).tjMarginK).toBe(12.5);
  });

  test('a blank limit that may be absent means no limit; a required one is refused', () => {
    const regulator = rows.find((row) => row.kind === 'linearRegulators');
    const posted = asPosted('linearRegulators', regulator?.params);
    const noLimit = readClassForm('linearRegulators', regulator?.params, { ...posted, 'f.esrMaxOhm': '' });
    expect(noLimit.issues).toEqual([]);
    expect((noLimit.params as { esrMaxOhm: number | null }).esrMaxOhm).toBeNull();
    const missing = readClassForm('linearRegulators', regulator?.params, { ...posted, 'f.dropoutV': ' ' });
    expect(missing.issues).toEqual([{ path: 'f.dropoutV', message: 'Enter a number.' }]);
    const fraction = readClassForm('linearRegulators', regulator?.params, { ...posted, 'f.costCents': '12.5' });
    expect(fraction.issues).toEqual([{ path: 'f.costCents', message: 'Enter a whole number.' }]);
  });

  test('a figure in an SI unit also shows with its prefix', () => {
    expect(prefixedReading({ type: 'number', unit: 'Hz', value: '2200000' })).toBe('= 2.2 MHz');
    expect(prefixedReading({ type: 'number', unit: 'F', value: '1.5e-10' })).toBe('= 150 pF');
    expect(prefixedReading({ type: 'number', unit: 'V', value: '5.5' })).toBeNull();
    expect(prefixedReading({ type: 'number', unit: 'K/W', value: '0.5' })).toBeNull();
  });

  test('numbers are read as a practitioner writes them', () => {
    expect(readNumber('4.7e-5')).toBe(4.7e-5);
    expect(readNumber(' 0,47 ')).toBe(0.47);
    expect(readNumber('1 000')).toBe(1000);
    expect(readNumber('47µ')).toBe(4.7e-5);
    expect(readNumber('2.2M')).toBe(2.2e6);
    expect(readNumber('4k7')).toBe(4700);
    expect(readNumber('lots')).toBeNull();
    expect(readNumber('')).toBeNull();
  });
});
