import { describe, expect, test } from 'vitest';
import { formatSi, numberFormsHint, parseSi } from '~/lib/engine/units.ts';

describe('SI formatting and parsing (SI prefixes of the BIPM SI brochure)', () => {
  test('formats with prefixes and three significant figures', () => {
    expect(formatSi(4700, 'Ω')).toBe('4.7 kΩ');
    expect(formatSi(220e-6, 'F')).toBe('220 µF');
    expect(formatSi(1.8312, 'W')).toBe('1.83 W');
    expect(formatSi(999.7, 'V')).toBe('1 kV');
    expect(formatSi(10e6, 'Ω')).toBe('10 MΩ');
    expect(formatSi(0.0153, 'A')).toBe('15.3 mA');
    expect(formatSi(0, 'V')).toBe('0 V');
    expect(formatSi(-0.5, 'V')).toBe('−500 mV');
    expect(formatSi(Number.NaN, 'V')).toBe('—');
  });

  test('parses resistor-code and prefixed input', () => {
    expect(parseSi('4k7')).toBe(4700);
    expect(parseSi('4.7k')).toBe(4700);
    expect(parseSi('220u')).toBeCloseTo(220e-6, 15);
    expect(parseSi('220µ')).toBeCloseTo(220e-6, 15);
    expect(parseSi('0.5')).toBe(0.5);
    expect(parseSi('10M')).toBe(10e6);
    expect(parseSi('3m3')).toBeCloseTo(3.3e-3, 15);
    expect(parseSi('4.7 kΩ')).toBe(4700);
    expect(parseSi('100nF')).toBeCloseTo(100e-9, 15);
    expect(parseSi('1R5')).toBe(1.5);
  });

  test('returns null on garbage', () => {
    for (const bad of ['', 'abc', '4..7k', 'k47', '1e', '--5', '4k7k']) expect(parseSi(bad)).toBeNull();
  });

  // The code style in which a prefix or the unit letter stands for the decimal point (resistor and
  // capacitor marking, IEC 60062 letter code; "3V3" for rails is common practice), and the decimal comma.
  const READS: ReadonlyArray<readonly [string, string | undefined, number]> = [
    ['3V3', undefined, 3.3],
    ['3V3', 'V', 3.3],
    ['3v3', 'V', 3.3],
    ['1A5', 'A', 1.5],
    ['4k7', 'Ω', 4700],
    ['4k7Ω', 'Ω', 4700],
    ['4k7 ohm', undefined, 4700],
    ['2R2', undefined, 2.2],
    ['0R1', 'Ω', 0.1],
    ['1M5', undefined, 1.5e6],
    ['4u7', 'F', 4.7e-6],
    ['4µ7', 'F', 4.7e-6],
    ['4µ7F', 'F', 4.7e-6],
    ['3,3', 'V', 3.3],
    ['3,3 V', 'V', 3.3],
    ['0,25', undefined, 0.25],
    ['1,5k', undefined, 1500],
    ['100m', 'V', 0.1],
    ['100mV', 'V', 0.1],
    ['100 mv', 'V', 0.1],
    ['12.5', '%', 12.5],
    ['12.5 %', '%', 12.5],
    ['40 °C', '°C', 40],
    ['-20', '°C', -20],
    ['1e-3', 'A', 1e-3],
  ];
  test.each(READS)('reads %s (unit %s) as %d', (text, unit, value) => {
    expect(parseSi(text, unit)).toBeCloseTo(value, 12);
  });

  const REFUSED: ReadonlyArray<readonly [string, string | undefined]> = [
    ['3V3V', undefined],
    ['3V3V', 'V'],
    ['k', undefined],
    ['1..2', undefined],
    ['4k7k', 'Ω'],
    ['3v3', undefined],
    ['3A3', 'V'],
    ['100mA', 'V'],
    ['1,000.5', undefined],
    ['1,2,3', undefined],
    ['V3', 'V'],
    ['3V', '%'],
    ['2R2Ω3', 'Ω'],
  ];
  test.each(REFUSED)('refuses %s (unit %s)', (text, unit) => {
    expect(parseSi(text, unit)).toBeNull();
  });

  test('the message for an unreadable value names the accepted forms', () => {
    expect(numberFormsHint('V')).toBe('Write a number like 3.3, 3,3, 3V3, 4k7 or 100m.');
    expect(numberFormsHint('°C')).toBe('Write a number like 3.3, 3,3, 4k7 or 100m.');
  });

  test('formatting then parsing returns the value to three figures', () => {
    for (const v of [1, 4.7e3, 2.2e-6, 0.33, 15e6, 6.8e-9]) {
      const text = formatSi(v, '');
      expect(parseSi(text.replace(' ', ''))).toBeCloseTo(v, 12);
    }
  });
});
