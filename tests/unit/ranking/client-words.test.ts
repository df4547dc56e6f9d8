// Why a way cannot be built, as the client's wizard says it: plain words, no device figures.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema } from '~/lib/engine/index.ts';
import { DEMO_BRIEFS } from '~/lib/demo/scenario';
import { clientBlocker } from '~/lib/ranking/client-words';

describe('a blocker in a client’s words', () => {
  test('every blocked way of the demo briefs reads as a plain sentence with no θ, SOA or K/W', () => {
    const said = DEMO_BRIEFS.flatMap((b) =>
      evaluate(railSpecSchema.parse(b.spec))
        .options.filter((o) => !o.feasible)
        .map(clientBlocker),
    );
    expect(said.length).toBeGreaterThan(0);
    for (const sentence of said) {
      expect(sentence).toMatch(/^[A-Z].*\.$/);
      expect(sentence).not.toMatch(/θ|SOA|K\/W/);
      expect(sentence).not.toBe('It does not meet the brief as described.');
    }
  });

  test('a code without words reads as not meeting the brief', () => {
    expect(clientBlocker({ issues: [{ code: 'new-check', severity: 'blocker', message: 'θJC too high' }] })).toBe(
      'It does not meet the brief as described.',
    );
  });
});
