// Scoring as a practitioner judges: losses against the rail's own power, size and price weighing
// more on a small rail, the simpler topology winning a tie, and no score for what cannot be built.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema, defaultWeights, type Option, type RailSpecInput } from '~/lib/engine/index.ts';
import {
  HYBRID_MARGIN_POINTS,
  POWER_FLOOR_W,
  QUIET_RAIL_MARGIN_POINTS,
  STRADDLE_MARGIN_POINTS,
  TIE_POINTS,
  effectiveWeights,
  railSizeW,
  pickReason,
  rankOptions,
  subScores,
  type ScoreInputs,
} from '~/lib/engine/scoring.ts';

const inputs = (over: Partial<ScoreInputs>): ScoreInputs => ({
  pOutNominalW: 1,
  lossNominalW: 0.1,
  pOutMaxW: 1,
  lossMaxW: 0.1,
  source: 'adapter',
  thermalMargin: 1,
  heatsinkRequired: false,
  heatsinkImpractical: false,
  partCount: 5,
  rippleVpp: 0.001,
  rippleLimitVpp: 0.05,
  switchingOutputOnQuietRail: false,
  costCents: 100,
  ...over,
});

const usb: RailSpecInput = {
  input: { vMin: 4.75, vNom: 5, vMax: 5.25, rippleVpp: 0.05, source: 'adapter' },
  output: { v: 1.8, tolerance: 0.05, iMin: 0.001, iTyp: 0.01, iMax: 0.014 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 40, airflow: 'still-air' },
};

describe('efficiency counts the power lost against the rail’s power budget', () => {
  test('above the floor it is the efficiency; below it, milliwatts barely move the score', () => {
    // 10 W out, 1 W lost: 10/11 = 90.9 %.
    expect(subScores(inputs({ pOutNominalW: 10, lossNominalW: 1, pOutMaxW: 10, lossMaxW: 1 })).efficiency).toBeCloseTo(100 * (10 / 11), 9);
    // A 25 mW rail: an LDO losing 45 mW against a buck losing 15 mW differs by 0.5/0.545 vs 0.5/0.515 — under 6 points,
    // where percentage efficiency (36 % vs 62 %) would differ by 26.
    const ldo = subScores(inputs({ pOutNominalW: 0.025, lossNominalW: 0.045, pOutMaxW: 0.025, lossMaxW: 0.045 })).efficiency;
    const buck = subScores(inputs({ pOutNominalW: 0.025, lossNominalW: 0.015, pOutMaxW: 0.025, lossMaxW: 0.015 })).efficiency;
    expect(POWER_FLOOR_W.other).toBe(0.5);
    expect(buck - ldo).toBeCloseTo(100 * (0.5 / 0.515 - 0.5 / 0.545), 9);
    expect(buck - ldo).toBeLessThan(6);
  });

  test('a battery pays for every microwatt: its losses count against the rail’s own power', () => {
    const on = (source: ScoreInputs['source']) =>
      subScores(inputs({ source, pOutNominalW: 0.0003, lossNominalW: 0.0003, pOutMaxW: 0.0003, lossMaxW: 0.0003 })).efficiency;
    expect(on('battery')).toBeCloseTo(50, 9);
    expect(on('adapter')).toBeGreaterThan(on('battery'));
  });

  test('part count and cost weigh ×1 at 1 W and above, ×2 at 100 mW, ×3 at 10 mW and below — half that on a battery', () => {
    const w = { ...defaultWeights };
    // 1 V in and out: the rail's size is its output power.
    const rail = (watts: number, source: ScoreInputs['source'] = 'adapter') =>
      railSpecSchema.parse({
        ...usb,
        input: { ...usb.input, vMin: 1, vNom: 1, vMax: 1, source },
        output: { ...usb.output, v: 1, iTyp: watts, iMax: watts },
      });
    expect(effectiveWeights(w, rail(5))).toEqual(w);
    expect(effectiveWeights(w, rail(0.1))).toMatchObject({ partCount: 2 * w.partCount, cost: 2 * w.cost, efficiency: w.efficiency });
    expect(effectiveWeights(w, rail(0.001))).toMatchObject({ partCount: 3 * w.partCount, cost: 3 * w.cost });
    expect(effectiveWeights(w, rail(0.001, 'battery'))).toMatchObject({
      partCount: 2 * w.partCount,
      cost: 2 * w.cost,
      efficiency: w.efficiency,
    });
    expect(effectiveWeights(w, rail(5, 'battery'))).toEqual(w);
  });

  test('a rail delivering milliwatts from a high input is not judged as small as its output says', () => {
    // 36–60 V to 3.3 V at 5 mA: 16.5 mW out, yet a shunt or linear stage of it draws up to 0.3 W.
    const spec = railSpecSchema.parse({
      ...usb,
      input: { ...usb.input, vMin: 36, vNom: 48, vMax: 60 },
      output: { ...usb.output, v: 3.3, iTyp: 0.002, iMax: 0.005 },
    });
    // Hand calculation: 5 mA · √(3.3 V · 60 V) = 70.4 mW, so ×(1 + log10(1/0.0704)) = ×2.15, not ×2.78.
    expect(railSizeW(spec)).toBeCloseTo(0.005 * Math.sqrt(3.3 * 60), 12);
    expect(effectiveWeights(defaultWeights, spec).cost / defaultWeights.cost).toBeCloseTo(1 + Math.log10(1 / 0.0704), 2);
  });

  test('a switching output claims no noise margin on an RF or precision rail', () => {
    expect(subScores(inputs({ rippleVpp: 1e-6 })).noise).toBe(100);
    expect(subScores(inputs({ rippleVpp: 1e-6, switchingOutputOnQuietRail: true })).noise).toBe(50);
  });
});

const option = (topology: Option['topology'], feasible: boolean, score: number | null, blockers = feasible ? 0 : 1): Option =>
  ({
    topology,
    label: topology,
    feasible,
    score,
    subScores: { efficiency: 80, heat: 80, partCount: 80, noise: 80, cost: 80 },
    issues: Array.from({ length: blockers }, () => ({ code: 'x', severity: 'blocker', message: 'x' })),
  }) as unknown as Option;

describe('ranking', () => {
  test('feasible first by score; within a tie the simpler topology; infeasible last with no score, fewest blockers first', () => {
    const ranked = rankOptions([
      option('buck-boost', true, 70.5),
      option('boost', true, 70.5 - TIE_POINTS),
      option('buck', true, 60),
      option('linear', false, null, 2),
      option('shunt', false, null, 1),
    ]);
    expect(ranked.map((o) => o.topology)).toEqual(['boost', 'buck-boost', 'buck', 'shunt', 'linear']);
  });

  test('a clear lead is not a tie', () => {
    expect(rankOptions([option('buck', true, 72), option('linear', true, 70)]).map((o) => o.topology)).toEqual(['buck', 'linear']);
  });

  // Common practice: a buck-boost only where the input straddles the output; a linear output stage on RF and precision rails.
  test('a buck-boost must beat a feasible plain buck or boost by more than the straddle margin', () => {
    expect(
      rankOptions([option('buck-boost', true, 70 + STRADDLE_MARGIN_POINTS - 1), option('buck', true, 70)]).map((o) => o.topology),
    ).toEqual(['buck', 'buck-boost']);
    expect(
      rankOptions([option('buck-boost', true, 70 + STRADDLE_MARGIN_POINTS + 2), option('boost', true, 70)]).map((o) => o.topology),
    ).toEqual(['buck-boost', 'boost']);
    const ranked = rankOptions([option('buck-boost', true, 75), option('boost', true, 70)]);
    expect(pickReason(ranked, defaultWeights)).toMatch(/preferred to .*a plain boost regulates over the whole input range/);
  });

  test('on an RF or precision rail a linear output stage wins unless a bare switcher leads by more than the quiet-rail margin', () => {
    const rf = { noise: { class: 'rf' as const, maxRippleVpp: 0.001 } };
    const digital = { noise: { class: 'digital' as const, maxRippleVpp: 0.05 } };
    const options = [option('buck', true, 78), option('buck+linear', true, 72)];
    expect(rankOptions(options, rf).map((o) => o.topology)).toEqual(['buck+linear', 'buck']);
    expect(pickReason(rankOptions(options, rf), defaultWeights, rf)).toMatch(/on an RF rail a linear output stage is preferred/);
    expect(rankOptions(options, digital).map((o) => o.topology)).toEqual(['buck', 'buck+linear']);
    expect(
      rankOptions([option('buck', true, 72 + QUIET_RAIL_MARGIN_POINTS + TIE_POINTS + 1), option('linear', true, 72)], rf).map(
        (o) => o.topology,
      ),
    ).toEqual(['buck', 'linear']);
  });

  // Common practice: a switcher with a linear post-regulator where one stage alone falls short.
  test('a switcher + post-regulator must beat a feasible single stage by more than the hybrid margin', () => {
    const sensor = { noise: { class: 'sensor' as const, maxRippleVpp: 0.01 } };
    const quietSensor = { noise: { class: 'sensor' as const, maxRippleVpp: 100e-6 } };
    const near = 70 + HYBRID_MARGIN_POINTS - 1;
    // A plain linear regulator whose loss is bearable, on any rail.
    expect(rankOptions([option('buck+linear', true, near), option('linear', true, 70)], sensor).map((o) => o.topology)).toEqual([
      'linear',
      'buck+linear',
    ]);
    // A bare switcher that meets the limit, on a rail that is not quiet.
    expect(rankOptions([option('buck+linear', true, near), option('buck', true, 70)], sensor).map((o) => o.topology)).toEqual([
      'buck',
      'buck+linear',
    ]);
    // A load asking for 100 µV is quiet whatever its class: the bare switcher is the one handicapped.
    expect(rankOptions([option('buck+linear', true, near), option('buck', true, 70)], quietSensor).map((o) => o.topology)).toEqual([
      'buck+linear',
      'buck',
    ]);
    // On a quiet rail the handicapped bare switcher never wins a tie against a linear output stage:
    // hybrid 70.6 − 5, buck 74.8 − 10, linear 63.3 leaves the hybrid and the buck within a point.
    const rf = { noise: { class: 'rf' as const, maxRippleVpp: 0.0005 } };
    expect(
      rankOptions([option('buck', true, 74.8), option('buck+linear', true, 70.6), option('linear', true, 63.3)], rf).map((o) => o.topology),
    ).toEqual(['buck+linear', 'buck', 'linear']);
    const far = [option('buck+linear', true, 70 + HYBRID_MARGIN_POINTS + TIE_POINTS + 1), option('linear', true, 70)];
    expect(rankOptions(far, sensor).map((o) => o.topology)).toEqual(['buck+linear', 'linear']);
    expect(
      pickReason(rankOptions([option('buck+linear', true, near), option('linear', true, 70)], sensor), defaultWeights, sensor),
    ).toMatch(/a single linear stage meets this rail/);
  });

  test('against a single stage far behind, the hybrid carries no margin: it stands on its own score', () => {
    // 24 V → 15 V at 0.5 A on a precision rail: a linear regulator burning 5 W scores far below.
    // Hybrid 66.0, filtered buck 71.6 − 10 (quiet rail), linear 54.8: the hybrid is the pick.
    const precision = { noise: { class: 'precision' as const, maxRippleVpp: 0.001 } };
    expect(
      rankOptions([option('buck', true, 71.6), option('buck+linear', true, 66), option('linear', true, 54.8)], precision).map(
        (o) => o.topology,
      ),
    ).toEqual(['buck+linear', 'buck', 'linear']);
  });

  test('the reason names the tie, the lead or the blockers', () => {
    expect(pickReason(rankOptions([option('buck-boost', true, 70.5), option('boost', true, 70)]), defaultWeights)).toMatch(
      /tie, which the simpler topology wins/,
    );
    expect(pickReason([option('linear', true, 80), option('shunt', false, null)], defaultWeights)).toMatch(
      /only option .* Not feasible: shunt/,
    );
    expect(pickReason([option('shunt', false, null)], defaultWeights)).toMatch(/No option meets every requirement/);
  });
});

describe('ordinary rails', () => {
  const run = (input: RailSpecInput) => evaluate(railSpecSchema.parse(input));
  test('12 V → 24 V at 0.5 A: the boost, not the buck-boost', () => {
    const r = run({
      input: { vMin: 9, vNom: 12, vMax: 16, rippleVpp: 0.2, source: 'bus' },
      output: { v: 24, tolerance: 0.05, iMin: 0.01, iTyp: 0.2, iMax: 0.5 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    });
    expect(r.recommended).toBe('boost');
    expect(r.reason).toContain(r.options[0]!.label);
  });

  test('a 25 mW rail from USB gets the linear regulator, and infeasible options carry no score', () => {
    const r = run(usb);
    expect(r.recommended).toBe('linear');
    for (const o of r.options) expect(o.score === null).toBe(!o.feasible);
  });
});
