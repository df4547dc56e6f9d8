import { describe, expect, test } from 'vitest';
import { formatSi, parseSi } from '~/lib/engine/units.ts';

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

  test('formatting then parsing returns the value to three figures', () => {
    for (const v of [1, 4.7e3, 2.2e-6, 0.33, 15e6, 6.8e-9]) {
      const text = formatSi(v, '');
      expect(parseSi(text.replace(' ', ''))).toBeCloseTo(v, 12);
    }
  });
});
