import { describe, expect, test } from 'vitest';
import { specChanges } from '../../../src/lib/briefs/spec-diff';

const SPEC = {
  input: { vMin: 18, vNom: 24, vMax: 30, rippleVpp: 0.5, source: 'bus' },
  output: { v: 5, tolerance: 0.05, iMin: 0.1, iTyp: 0.9, iMax: 1.5 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 55, airflow: 'enclosed' },
};

describe('what changed between two versions of a spec', () => {
  test('each changed field by its label, with units; unchanged fields are left out', () => {
    const after = {
      ...SPEC,
      input: { ...SPEC.input, vMax: 36 },
      output: { ...SPEC.output, tolerance: 0.03, loadStep: 0.4 },
      thermal: { ...SPEC.thermal, airflow: 'forced-air' },
    };
    expect(specChanges(SPEC, after)).toEqual([
      { label: 'Highest input voltage', before: '30 V', after: '36 V' },
      { label: 'Output tolerance', before: '±5 %', after: '±3 %' },
      { label: 'Load step', before: '—', after: '400 mA' },
      { label: 'Airflow', before: 'enclosed, no airflow', after: 'forced air' },
    ]);
  });

  test('the same spec twice has no changes', () => {
    expect(specChanges(SPEC, structuredClone(SPEC))).toEqual([]);
  });
});
