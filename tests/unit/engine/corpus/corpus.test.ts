// The corpus of ordinary briefs: each gets a recommendation an experienced engineer would accept
// (the accepted set and its reason sit beside each brief) and no impossible figure anywhere.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema, type Evaluation } from '~/lib/engine/index.ts';
import { CORPUS, corpusFamilies } from './briefs.ts';
import { impossibleFigures } from './impossible.ts';

/**
 * Briefs the engine cannot yet design as an engineer would, and why. Each must still fail, so
 * the day the engine meets one, this list loses it.
 */
const KNOWN_GAPS: Record<string, string> = {};

const evaluated = new Map<string, Evaluation>();
function run(id: string): Evaluation {
  const cached = evaluated.get(id);
  if (cached) return cached;
  const brief = CORPUS.find((b) => b.id === id)!;
  const result = evaluate(railSpecSchema.parse(brief.spec));
  evaluated.set(id, result);
  return result;
}

describe('the corpus itself', () => {
  test('has at least 70 valid briefs with unique ids, every family at least 5, each with its reason', () => {
    expect(CORPUS.length).toBeGreaterThanOrEqual(70);
    expect(new Set(CORPUS.map((b) => b.id)).size).toBe(CORPUS.length);
    for (const family of corpusFamilies) expect(CORPUS.filter((b) => b.family === family).length).toBeGreaterThanOrEqual(5);
    for (const b of CORPUS) {
      expect(railSpecSchema.safeParse(b.spec).success).toBe(true);
      expect(b.accept.length).toBeGreaterThan(0);
      expect(b.why).toMatch(/common practice|from memory|\(.+\)/);
    }
  });
});

describe.each(corpusFamilies)('%s briefs', (family) => {
  const briefs = CORPUS.filter((b) => b.family === family);
  test.each(briefs.map((b) => [b.id, b] as const))('%s gets an accepted recommendation', (id, brief) => {
    const result = run(id);
    if (id in KNOWN_GAPS) {
      // The gap is real: no accepted topology is recommended, and each accepted one says what blocks it.
      expect(brief.accept).not.toContain(result.recommended);
      for (const o of result.options.filter((x) => brief.accept.includes(x.topology)))
        expect(o.issues.some((i) => i.severity === 'blocker')).toBe(true);
      return;
    }
    const blockers = result.options
      .filter((o) => brief.accept.includes(o.topology))
      .map((o) =>
        o.feasible
          ? `${o.topology}: feasible, score ${o.score}, outranked — ${result.reason ?? ''}`
          : `${o.topology}: ${o.issues
              .filter((i) => i.severity === 'blocker')
              .map((i) => i.message)
              .join(' | ')}`,
      );
    expect({ recommended: result.recommended, accepted: brief.accept.includes(result.recommended!) ? 'yes' : blockers }).toEqual({
      recommended: expect.toSatisfy((r: string | null) => r !== null && brief.accept.includes(r as never)),
      accepted: 'yes',
    });
  });
  test.each(briefs.map((b) => [b.id, b] as const))('%s prints no impossible figure', (id, brief) => {
    expect(impossibleFigures(run(id), railSpecSchema.parse(brief.spec))).toEqual([]);
  });
});
