import { describe, expect, test } from 'vitest';
import { choicesFrom, formFrom } from '~/lib/review/choices';
import { describeField } from '~/lib/review/field-words';
import { fieldText } from '~/lib/review/words';

const weights = { efficiency: 0, heat: 2, partCount: 1, noise: 2, cost: 2 };

describe('stored choices read as labelled values with units', () => {
  test('overrides and weights by their labels, values with unit and SI prefix', () => {
    expect(describeField('overrides.fswHz', 1_000_000)).toEqual({ label: 'Switching frequency', text: '1 MHz' });
    expect(describeField('overrides.parts.C5', 0.000047)).toEqual({ label: 'Forced value of C5', text: '47 µF' });
    expect(describeField('overrides.parts.R2', 4700)).toEqual({ label: 'Forced value of R2', text: '4.7 kΩ' });
    expect(describeField('weights.efficiency', 0)).toEqual({ label: 'Efficiency weight', text: '0' });
    expect(describeField('overrides.passDevice', 'nmos')).toEqual({ label: 'Pass device', text: 'N-MOSFET' });
    expect(describeField('overrides.mcDraws', 20_000)).toEqual({ label: 'Monte Carlo draws', text: '20 000' });
  });

  test('units that take no prefix stay plain, and brief fields read in words', () => {
    expect(describeField('overrides.heatsinkThetaSaCW', 0.36).text).toBe('0.36 K/W');
    expect(describeField('overrides.ambientC', -20).text).toBe('-20 °C');
    expect(describeField('noise.class', 'sensor')).toEqual({ label: 'Kind of load', text: 'Ratiometric sensor' });
    expect(describeField('output.tolerance', 0.02)).toEqual({ label: 'Output tolerance', text: '±2 %' });
    expect(describeField('noise.maxRippleVpp', 0.0005)).toEqual({ label: 'Ripple limit', text: '500 µVpp' });
    expect(describeField('overrides.fswHz', undefined).text).toBe('—');
  });
});

describe('a form filled from saved choices', () => {
  test('shows SI text the field reads back to the same numbers', () => {
    const overrides = { fswHz: 1_000_000, r1Ohm: 4700, ambientC: -20, parts: { C5: 0.000047 } };
    const form = formFrom(weights, overrides);
    expect(form.numbers.fswHz).toBe('1M');
    expect(form.numbers.r1Ohm).toBe('4700');
    expect(form.numbers.ambientC).toBe('-20');
    expect(form.parts).toEqual([{ ref: 'C5', value: '47µ' }]);
    expect(form.weights.efficiency).toBe('0');
    const back = choicesFrom(form);
    expect(back.ok && back.value.overrides).toEqual(overrides);
  });

  test('field text keeps ordinary magnitudes as plain digits', () => {
    expect(fieldText(3.3)).toBe('3.3');
    expect(fieldText(0.02)).toBe('20m');
    expect(fieldText(150_000)).toBe('150k');
    expect(fieldText(Number.NaN)).toBe('');
  });
});
