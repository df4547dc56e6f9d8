import { describe, expect, test } from 'vitest';
import { fixText, heatsinkText, toleranceText } from '~/lib/review/figures';

const spread = { worstCase: { min: 3.2, max: 3.4 }, statistical: { sigma: 0.01, yield: 0.999 } };

describe('how an option’s fixes and tolerance read', () => {
  test('a fix carries its cost with a sign, or none when the engine does not know it', () => {
    expect(
      fixText({ code: 'tolerance', change: 'resistors 0.1 %', costCents: 42, message: 'Meets ±1 % with 0.1 % resistors' }, 'EUR'),
    ).toBe('Meets ±1 % with 0.1 % resistors (+€0.42)');
    expect(fixText({ code: 'headroom', change: 'input', message: 'Needs ≥ 3.75 V input' }, 'EUR')).toBe('Needs ≥ 3.75 V input');
  });

  test('a tolerance blocker reads “not met”, whatever rule was asked for', () => {
    const blocked = {
      issues: [{ code: 'tolerance', severity: 'blocker' as const, message: '' }],
      tolerance: { ...spread, rule: 'statistical' as const },
    };
    expect(toleranceText(blocked)).toBe('not met');
    expect(toleranceText({ issues: [], tolerance: { ...spread, rule: 'worst-case' } })).toBe('met in the worst case');
    expect(toleranceText({ issues: [], tolerance: { ...spread, rule: 'statistical' } })).toBe('met statistically (±3σ) only');
  });

  test('a heatsink figure is in K/W, never with a milli prefix', () => {
    expect(heatsinkText({ heatsink: { required: true, maxThetaSaCW: 0.36 }, junctions: [] })).toBe('θSA ≤ 0.36 K/W');
    expect(heatsinkText({ heatsink: { required: true, maxThetaSaCW: 14.26 }, junctions: [] })).toBe('θSA ≤ 14.3 K/W');
  });
});
