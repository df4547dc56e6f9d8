// How catalog labels and figures read inside the engine's sentences, and a check of every message
// the engine writes for the corpus of ordinary briefs.
import { describe, expect, test } from 'vitest';
import { defaultCatalog, evaluate, railSpecSchema } from '~/lib/engine/index.ts';
import { classPhrase, formatKPerW, lowerFirst, shortBy } from '~/lib/engine/units.ts';
import { CORPUS } from './corpus/briefs.ts';

describe('class labels read as sentences', () => {
  test.each([
    ['Buck converter with catch diode, 100 V, 1.5 A', 'the buck converter with catch diode rated 100 V, 1.5 A'],
    ['Synchronous buck converter, 100 V, 0.5 A (small package)', 'the synchronous buck converter rated 100 V, 0.5 A (small package)'],
    [
      'Low-input boost converter with output diode, from 1.5 V, 30 V switch, 1 A',
      'the low-input boost converter with output diode from 1.5 V rated 30 V switch, 1 A',
    ],
    ['Adjustable 1.25 V regulator, high-voltage variant, 1.5 A', 'the adjustable 1.25 V regulator, high-voltage variant, rated 1.5 A'],
    ['Zener, 5 W', 'the Zener rated 5 W'],
    ['Aluminium polymer', 'the aluminium polymer'],
  ])('%s → %s', (label, phrase) => {
    expect(classPhrase(label)).toBe(phrase);
    expect(classPhrase(label, true)).toBe(`T${phrase.slice(1)}`);
  });

  test('acronyms and names keep their capitals', () => {
    expect(lowerFirst('NPN, 400 V')).toBe('NPN, 400 V');
    expect(lowerFirst('Zener, 1.3 W')).toBe('Zener, 1.3 W');
    expect(lowerFirst('Multilayer ceramic, X7R')).toBe('multilayer ceramic, X7R');
  });
});

describe('figures in messages', () => {
  test('thermal resistances are always in K/W with two or three significant figures', () => {
    expect(formatKPerW(0.36)).toBe('0.36 K/W');
    expect(formatKPerW(0.0123)).toBe('0.012 K/W');
    expect(formatKPerW(3.456)).toBe('3.5 K/W');
    expect(formatKPerW(12.345)).toBe('12.3 K/W');
    expect(formatKPerW(-1.5)).toBe('−1.5 K/W');
    expect(formatKPerW(Number.NaN)).toBe('—');
  });

  test('a negative margin is said as a shortfall', () => {
    expect(shortBy(-0.3)).toBe('0.30 V short');
    expect(shortBy(0.05)).toBe('0.05 V short');
  });
});

describe('every engine message over the corpus', () => {
  const classLabels = [
    ...defaultCatalog.linearRegulators,
    ...defaultCatalog.shuntReferences,
    ...defaultCatalog.switchers,
    ...defaultCatalog.passDevices,
    ...defaultCatalog.capacitors,
  ].map((c) => c.label);
  const messages = CORPUS.flatMap((brief) =>
    evaluate(railSpecSchema.parse(brief.spec), defaultCatalog).options.flatMap((o) => [
      ...o.issues.map((i) => `${brief.id} ${o.topology}: ${i.message}`),
      ...o.fixes.map((f) => `${brief.id} ${o.topology}: ${f.message}`),
    ]),
  );

  test('the corpus yields messages to check', () => {
    expect(messages.length).toBeGreaterThan(1000);
  });

  test('no thermal resistance in mK/W and no negative margin', () => {
    expect(messages.filter((m) => m.includes('mK/W'))).toEqual([]);
    expect(messages.filter((m) => /−0\.\d+ V above|leaves [−-]\d/.test(m))).toEqual([]);
  });

  test('no catalog label pasted in with its capitalised class noun', () => {
    expect(messages.filter((m) => classLabels.some((label) => m.includes(label)))).toEqual([]);
  });
});
