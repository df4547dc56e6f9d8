// The weights on the engine's own scale, and the trade-off plot's logarithmic axes.
import { describe, expect, test } from 'vitest';
import { defaultWeights, railSpecSchema } from '~/lib/engine/index.ts';
import { scoreShares, stepWord, WEIGHT_STEPS } from '~/lib/ranking/weight-scale';
import { logAxis, logPosition } from '~/lib/ranking/tradeoff';

const rail = (v: number, iMax: number) =>
  railSpecSchema.parse({
    input: { vMin: 11, vNom: 12, vMax: 13, source: 'bus' },
    output: { v, tolerance: 0.05, iMin: 0, iTyp: iMax / 2, iMax },
    noise: { class: 'digital' },
    thermal: { ambientMaxC: 40, airflow: 'still-air' },
  });

describe('what matters most', () => {
  test('the named steps are the engine’s own values, and every default weight is one of them', () => {
    expect(WEIGHT_STEPS.map((s) => s.value)).toEqual([0, 1, 2, 3]);
    for (const w of Object.values(defaultWeights)) expect(stepWord(w)).not.toBeNull();
    expect(stepWord(10)).toBeNull();
  });

  test('each quality’s share of the score is its weight over the sum, with part count and cost tripled on a rail of a few milliwatts', () => {
    const shares = scoreShares({ ...defaultWeights }, rail(5, 1))!;
    expect(shares.efficiency).toBeCloseTo(3 / 10, 10);
    expect(Object.values(shares).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 10);
    const small = scoreShares({ ...defaultWeights }, rail(1, 0.001))!;
    expect(small.partCount).toBeCloseTo(3 / (3 + 2 + 3 + 2 + 6), 10);
    expect(scoreShares({ efficiency: 0, heat: 0, partCount: 0, noise: 0, cost: 0 }, rail(5, 1))).toBeNull();
  });
});

describe('the trade-off plot’s axes', () => {
  test('1-2-5 ticks inside a range padded either side of the values', () => {
    const axis = logAxis([0.025, 0.3, 9.2]);
    expect(axis.min).toBeLessThan(0.025);
    expect(axis.max).toBeGreaterThan(9.2);
    expect(axis.ticks).toEqual([0.02, 0.05, 0.1, 0.2, 0.5, 1, 2, 5, 10]);
    expect(logPosition(axis, axis.min)).toBe(0);
    expect(logPosition(axis, axis.max)).toBeCloseTo(1, 10);
    expect(logPosition(axis, 0)).toBe(0);
  });
});
