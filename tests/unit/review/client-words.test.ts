// How the options read to a client in the wizard's live panel: blocked options say why in plain
// words, and only the options that can be built contribute safety cautions.
import { describe, expect, test } from 'vitest';
import { evaluate, railSpecSchema } from '~/lib/engine/index.ts';
import { clientBlocker, clientCautions, nothingBuildable } from '~/lib/review/option-words';

const blocked = (code: string, cautions: { code: string; message: string }[] = []) => ({
  feasible: false,
  issues: [{ code, severity: 'blocker' as const, message: `engineer words for ${code}` }],
  cautions,
});
const buildable = (cautions: { code: string; message: string }[] = []) => ({ feasible: true, issues: [], cautions });

describe('the live panel in a client’s words', () => {
  test('a blocked option says why without symbols; a buildable one has no blocker', () => {
    expect(clientBlocker(blocked('heatsink'))).toBe('would run too hot even on a practical heatsink');
    expect(clientBlocker(blocked('something-new'))).toBe('does not meet the brief as described');
    expect(clientBlocker(buildable())).toBeNull();
  });

  test('cautions come from the options that can be built, plus the brief’s own voltage cautions', () => {
    const hot = { code: 'hot-surface', message: 'Hot surfaces above about 60 °C: D1 (about 801 °C).' };
    const hv = { code: 'hazardous-voltage', message: 'This supply works at up to 150 V DC …' };
    const energy = { code: 'stored-energy', message: 'C1 stores 2 J at 150 V …' };
    expect(clientCautions([blocked('thermal', [hot, hv])]).map((c) => c.code)).toEqual(['hazardous-voltage']);
    const shown = clientCautions([blocked('thermal', [hot]), buildable([energy, hv])]);
    expect(shown.map((c) => c.code)).toEqual(['stored-energy', 'hazardous-voltage']);
    expect(shown[0]!.message).not.toMatch(/C1|½/);
  });

  test('with nothing buildable the panel names the reason most options share', () => {
    expect(nothingBuildable([blocked('thermal'), blocked('heatsink'), blocked('thermal')])).toBe(
      'None of the 3 ways can be built as the brief stands: the main reason is that 2 of them would run too hot.',
    );
    // No shared majority: the closest option's reason (the options come best first).
    expect(
      nothingBuildable([blocked('current'), blocked('output-max'), blocked('output-max'), blocked('input-max'), blocked('input-max')]),
    ).toBe(
      'None of the 5 ways can be built as the brief stands: the main reason is that the closest of them cannot deliver the load current.',
    );
    expect(nothingBuildable([blocked('tolerance'), blocked('tolerance')])).toBe(
      'None of the 2 ways can be built as the brief stands: the main reason is that every one cannot hold the output within the allowed deviation.',
    );
  });

  test('an evaluation with blocked options shows none of their figures among the client’s cautions', () => {
    // 150 V in, 12 V at 2 A: the linear options burn watts, a switcher does the job (common practice).
    const spec = railSpecSchema.parse({
      input: { vMin: 140, vNom: 150, vMax: 160, rippleVpp: 0, source: 'bus' },
      output: { v: 12, tolerance: 0.05, iMin: 0.1, iTyp: 1, iMax: 2 },
      noise: { class: 'digital' },
      thermal: { ambientMaxC: 40, airflow: 'still-air' },
    });
    const result = evaluate(spec);
    const blockedCautions = result.options.filter((o) => !o.feasible).flatMap((o) => o.cautions.map((c) => c.message));
    for (const c of clientCautions(result.options))
      expect(blockedCautions.filter((m) => m === c.message && !/ES1|mains/.test(m))).toEqual([]);
    expect(clientCautions(result.options).some((c) => c.code === 'hazardous-voltage')).toBe(true);
  });
});
