/** What a draft may hold before submit: anything missing, nothing of the wrong kind. */
import { describe, expect, test } from 'vitest';
import { createBriefSchema, draftSpecIssues, keepableDraftSpec } from '../../../src/lib/briefs/requests';

describe('a draft spec', () => {
  test('an unknown source is refused on save, naming the field', () => {
    const parsed = createBriefSchema.safeParse({ title: 'Bias rail', spec: { input: { source: 'nuclear', vMin: 10 } } });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => i.path.join('.'))).toEqual(['spec.input.source']);
  });

  test('missing and cleared fields are fine until submit', () => {
    expect(draftSpecIssues({})).toEqual([]);
    expect(draftSpecIssues({ input: { vMin: null, source: '' }, output: { v: 5 } })).toEqual([]);
  });

  test('a number given as text and a field that is not part of a brief are refused', () => {
    expect(draftSpecIssues({ output: { v: 'five' }, colour: 'red' }).map((i) => i.path)).toEqual(['output.v', 'colour']);
  });

  test('a stored draft opens without its impossible values and keeps the rest', () => {
    const stored = { input: { source: 'nuclear', vMin: 10 }, noise: { class: 'loud' }, thermal: { ambientMaxC: 40 } };
    expect(keepableDraftSpec(stored)).toEqual({ input: { vMin: 10 }, noise: {}, thermal: { ambientMaxC: 40 } });
    expect(stored.input.source).toBe('nuclear');
  });
});
