import { describe, expect, test } from 'vitest';
import { agreedRequirementOf, withAgreedRequirement } from '~/lib/review/agreed-requirement';
import { choicesFrom, formFrom } from '~/lib/review/choices';
import { briefWithChoices } from '~/lib/review/requests';

const brief = {
  input: { vMin: 4.75, vNom: 5, vMax: 5.25, rippleVpp: 0, source: 'adapter' },
  output: { v: 3.3, tolerance: 0.01, iMin: 0, iTyp: 0.05, iMax: 0.1 },
  noise: { class: 'sensor', maxRippleVpp: 0.01 },
  thermal: { ambientMaxC: 40, airflow: 'still-air' },
};

describe('the requirement agreed with the client', () => {
  test('the form takes the tolerance in per cent and the ripple with an SI prefix, and gives them back as typed', () => {
    const form = formFrom({ efficiency: 1, heat: 1, partCount: 1, noise: 1, cost: 1 }, {});
    const typed = { ...form, requirement: { outputV: '', tolerancePct: '2 %', maxRippleVpp: '20m' } };
    const choices = choicesFrom(typed);
    expect(choices.ok).toBe(true);
    if (!choices.ok) return;
    expect(choices.value.requirement).toEqual({ tolerance: 0.02, maxRippleVpp: 0.02 });
    expect(formFrom({}, {}, choices.value.requirement).requirement).toEqual({ outputV: '', tolerancePct: '2', maxRippleVpp: '20m' });
  });

  test('text that is not a number names its field', () => {
    const form = formFrom({ efficiency: 1, heat: 1, partCount: 1, noise: 1, cost: 1 }, {});
    const choices = choicesFrom({ ...form, requirement: { outputV: 'three', tolerancePct: '', maxRippleVpp: '' } });
    expect(choices).toEqual({ ok: false, issues: [expect.objectContaining({ path: 'requirement.outputV' })] });
  });

  test('merging keeps the rest of the brief, and the departure is read back from the designed spec', () => {
    const merged = withAgreedRequirement(brief, { tolerance: 0.03 });
    expect(merged.output).toEqual({ ...brief.output, tolerance: 0.03 });
    expect(merged.noise).toEqual(brief.noise);
    expect(agreedRequirementOf(brief, merged)).toEqual({ tolerance: 0.03 });
    expect(agreedRequirementOf(brief, brief)).toEqual({});
  });

  test('the merged spec is checked as a whole: a tolerance past the schema’s limit is refused at its path', () => {
    const parsed = briefWithChoices(brief, { requirement: { tolerance: 0.9 } });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]?.path).toEqual(['output', 'tolerance']);
    expect(briefWithChoices(brief, { requirement: { outputV: 3 } }).data?.output.v).toBe(3);
  });
});
