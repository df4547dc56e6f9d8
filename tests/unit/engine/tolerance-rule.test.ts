// The tolerance rule as practised: an option meets the rail's tolerance when its worst case fits;
// when only the ±3σ spread fits (a 99.73 % yield for a normal spread) it is feasible with a caution,
// unless the engineer asks for the worst-case rule.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema, type Option, type RailSpecInput } from '~/lib/engine/index.ts';

const usb: RailSpecInput = {
  input: { vMin: 4.75, vNom: 5, vMax: 5.25, rippleVpp: 0.05, source: 'adapter' },
  output: { v: 3.3, tolerance: 0.05, iMin: 0.01, iTyp: 0.08, iMax: 0.15 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 40, airflow: 'still-air' },
};
const linearUnder = (rule: 'statistical' | 'worst-case' | undefined): Option =>
  evaluate(railSpecSchema.parse({ ...usb, overrides: rule ? { toleranceRule: rule } : {} })).options.find((o) => o.topology === 'linear')!;
const band = { lo: 3.3 * 0.95, hi: 3.3 * 1.05 };

describe('tolerance: both views, and the rule that decided', () => {
  test('by default the statistical view may decide: feasible, with a caution, the worst case outside and the yield at least 99.73 %', () => {
    const o = linearUnder(undefined);
    expect(o.tolerance.worstCase).toEqual(o.vOutRange);
    if (o.tolerance.rule === 'worst-case') {
      expect(o.vOutRange.min).toBeGreaterThanOrEqual(band.lo);
      expect(o.vOutRange.max).toBeLessThanOrEqual(band.hi);
      return;
    }
    expect(o.feasible).toBe(true);
    expect(o.issues.map((i) => i.code)).toContain('tolerance-statistical');
    expect(o.vOutRange.min < band.lo || o.vOutRange.max > band.hi).toBe(true);
    expect(o.tolerance.statistical.yield).toBeGreaterThanOrEqual(0.9973);
    expect(o.tolerance.statistical.sigma).toBeGreaterThan(0);
  });

  test('the worst-case rule never accepts a worst case outside the band, and never costs less', () => {
    const statistical = linearUnder('statistical');
    const strict = linearUnder('worst-case');
    if (strict.feasible) {
      expect(strict.tolerance.rule).toBe('worst-case');
      expect(strict.vOutRange.min).toBeGreaterThanOrEqual(band.lo);
      expect(strict.vOutRange.max).toBeLessThanOrEqual(band.hi);
      if (statistical.feasible) expect(strict.costCents).toBeGreaterThanOrEqual(statistical.costCents);
    } else {
      expect(strict.issues.map((i) => i.code)).toContain('tolerance');
      expect(strict.fixes.map((f) => f.change)).toContain('accept the statistical rule (±3σ)');
    }
    expect(strict.issues.map((i) => i.code)).not.toContain('tolerance-statistical');
  });
});
