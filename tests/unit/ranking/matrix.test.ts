// The ranking read across: the pick first, each figure row shaded among the ways that can be
// built, and a blocked way shown with no score and no figure it could not have.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema } from '~/lib/engine/index.ts';
import type { Evaluation, Option, TopologyId } from '~/lib/engine/types';
import { DEMO_BRIEFS } from '~/lib/demo/scenario';
import { columnOrder, noiseMarginDb, rankingMatrix, type MatrixContext } from '~/lib/ranking/matrix';
import { heatsinkText, hottestPart } from '~/lib/review/figures';

const ctx: MatrixContext = { railPowerW: 1, rippleLimitVpp: 0.05, currency: 'EUR' };

const answers = DEMO_BRIEFS.map((b) => {
  const spec = railSpecSchema.parse(b.spec);
  return { title: b.title, spec, result: evaluate(spec) };
});
const sample = answers[0]!.result.options[0]!;

/** A way to build the rail with the figures a test sets; the rest from a real answer. */
function way(topology: TopologyId, over: Partial<Option>): Option {
  return { ...sample, topology, feasible: true, issues: [], fixes: [], ...over };
}

const rowOf = (result: Evaluation, key: string) => rankingMatrix(result, ctx).rows.find((r) => r.key === key)!;

describe('the ranking matrix', () => {
  test.each(answers.map((a) => [a.title, a] as const))('%s: the pick stands first and is the only one marked', (_t, { spec, result }) => {
    const matrix = rankingMatrix(result, {
      railPowerW: spec.output.v * spec.output.iMax,
      rippleLimitVpp: spec.noise.maxRippleVpp,
      currency: 'EUR',
    });
    expect(matrix.columns.map((c) => c.topology)).toHaveLength(result.options.length);
    if (result.recommended) expect(matrix.columns[0]).toMatchObject({ topology: result.recommended, pick: true });
    expect(matrix.columns.filter((c) => c.pick)).toHaveLength(result.recommended ? 1 : 0);
    for (const row of matrix.rows) expect(row.cells).toHaveLength(matrix.columns.length);
  });

  test('the pick moves first even where the engine listed it later', () => {
    const result: Evaluation = { recommended: 'buck', options: [way('linear', {}), way('buck', {})] };
    expect(columnOrder(result).map((o) => o.topology)).toEqual(['buck', 'linear']);
  });

  test('each figure row is shaded best, between and worst among the buildable ways, ties sharing the better', () => {
    const loss = (w: number) => ({ dissipation: { totalMaxW: w, parts: [] } });
    const result: Evaluation = {
      recommended: 'buck',
      options: [
        way('buck', loss(0.2)),
        way('linear', loss(1.5)),
        way('buck-boost', loss(0.5)),
        way('boost', loss(0.2)),
        way('shunt', { ...loss(0.01), feasible: false, score: null, issues: [{ code: 'x', severity: 'blocker', message: 'Too hot.' }] }),
      ],
    };
    expect(rowOf(result, 'loss').cells.map((c) => c.standing)).toEqual(['best', 'worst', 'between', 'best', 'apart']);
    const only: Evaluation = { recommended: 'buck', options: [way('buck', loss(0.2)), way('shunt', { ...loss(0.1), feasible: false })] };
    expect(rowOf(only, 'loss').cells.map((c) => c.standing)).toEqual(['alone', 'apart']);
  });

  test('parts and cost shade fewer and cheaper as better; yield and noise margin higher as better', () => {
    const result: Evaluation = {
      recommended: 'buck',
      options: [
        way('buck', { partCount: 6, costCents: 300, outputRippleVpp: 0.005 }),
        way('linear', { partCount: 3, costCents: 100, outputRippleVpp: 0 }),
      ],
    };
    expect(rowOf(result, 'parts').cells.map((c) => c.standing)).toEqual(['worst', 'best']);
    expect(rowOf(result, 'cost').cells.map((c) => c.standing)).toEqual(['worst', 'best']);
    expect(rowOf(result, 'noise').cells.map((c) => [c.text, c.standing])).toEqual([
      ['20 dB under', 'worst'],
      ['No ripple of its own', 'best'],
    ]);
  });

  test('a blocked way has no score, even one the answer carried, and its blocker and fix in words', () => {
    const blocked = way('linear', {
      feasible: false,
      score: 99,
      issues: [{ code: 'thermal', severity: 'blocker', message: 'U1 would pass its 125 °C limit at 37.7 W.' }],
      fixes: [{ code: 'thermal', change: 'input', message: 'Lower the input to 9 V or below' }],
    });
    const result: Evaluation = { recommended: 'buck', options: [way('buck', { score: 70 }), blocked] };
    const matrix = rankingMatrix(result, ctx);
    expect(matrix.columns[1]).toMatchObject({
      score: null,
      feasibility: 'blocked',
      reasons: ['U1 would pass its 125 °C limit at 37.7 W.'],
    });
    expect(matrix.columns[1]!.fixes).toEqual(['Lower the input to 9 V or below']);
    expect(rowOf(result, 'score').cells.map((c) => c.text)).toEqual(['70.0', 'Not scored']);
    for (const row of matrix.rows.filter((r) => r.key !== 'meets')) expect(row.cells[1]!.standing).toBe('apart');
  });

  test('a part past its limit reads as beyond it with no heatsink good enough, never a temperature or "not needed"', () => {
    const hot = way('linear', {
      feasible: false,
      score: null,
      heatsink: { required: false, maxThetaSaCW: null },
      junctions: [{ ref: 'U1', tjC: 125, tjMaxC: 125, heatsink: false, beyondLimit: true }],
    });
    const cell = rowOf({ recommended: null, options: [hot] }, 'hottest').cells[0]!;
    expect(cell).toMatchObject({ text: 'U1 beyond its 125 °C limit', note: 'no heatsink is good enough' });
    expect(heatsinkText(hot)).toBe('No heatsink is good enough');
    expect(heatsinkText({ heatsink: { required: true, maxThetaSaCW: -2 }, junctions: [] })).toBe('No heatsink is good enough');
    expect(heatsinkText({ heatsink: { required: true, maxThetaSaCW: 0.36 }, junctions: [] })).toBe('θSA ≤ 0.36 K/W');
    expect(heatsinkText({ heatsink: { required: false, maxThetaSaCW: null }, junctions: [] })).toBe('Not needed');
  });

  test('no demo brief shows a blocked way with a score, a temperature past a limit or "not needed" beside a part past it', () => {
    for (const { result } of answers) {
      const matrix = rankingMatrix(result, ctx);
      matrix.columns.forEach((c, k) => {
        if (c.feasibility !== 'blocked') return;
        expect(c.score).toBeNull();
        const texts = matrix.rows.flatMap((r) => [r.cells[k]!.text, r.cells[k]!.note ?? '']).join(' | ');
        expect(texts).not.toMatch(/Not needed/);
        const option = result.options.find((o) => o.topology === c.topology)!;
        for (const j of option.junctions.filter((x) => x.beyondLimit)) expect(texts).not.toContain(`${j.ref} ${j.tjMaxC} °C`);
      });
    }
  });

  test('the hottest part is never shown dissipating more than the whole option', () => {
    const parts = [{ ref: 'Q1', role: 'pass-transistor' as const, maxW: 3.4, faultW: 3.4 }];
    expect(hottestPart({ dissipation: { totalMaxW: 0.18, parts } })).toBeNull();
    expect(hottestPart({ dissipation: { totalMaxW: 4, parts } })).toEqual({ ref: 'Q1', maxW: 3.4 });
  });

  test('the loss reads as a share of the rail’s power, or a multiple of it past 100 %', () => {
    const result: Evaluation = {
      recommended: 'buck',
      options: [
        way('buck', { dissipation: { totalMaxW: 0.25, parts: [] } }),
        way('linear', { dissipation: { totalMaxW: 37.7, parts: [] } }),
      ],
    };
    expect(rowOf(result, 'loss').cells.map((c) => c.note)).toEqual(['25 % of the rail’s 1 W', '38 × the rail’s 1 W']);
  });

  test('noise margin in dB against the limit, saturating 60 dB under it (common practice: 20·log10 of a voltage ratio)', () => {
    expect(noiseMarginDb(0.005, 0.05)).toBeCloseTo(20, 10);
    expect(noiseMarginDb(0.1, 0.05)).toBeCloseTo(-6.02, 2);
    expect(noiseMarginDb(0, 0.05)).toBeCloseTo(60, 10);
  });

  test('a blocked design’s zero ripple is not worked out, not “no ripple”', () => {
    const result: Evaluation = {
      recommended: 'buck',
      options: [way('linear', { outputRippleVpp: 0 }), way('boost', { outputRippleVpp: 0, feasible: false, score: null })],
    };
    expect(rowOf(result, 'noise').cells.map((c) => c.text)).toEqual(['No ripple of its own', 'Not worked out']);
  });

  test('without a currency (the client’s wizard) the cost row is left out', () => {
    const result: Evaluation = { recommended: 'buck', options: [way('buck', {})] };
    expect(rankingMatrix(result, { ...ctx, currency: null }).rows.map((r) => r.key)).not.toContain('cost');
  });
});
