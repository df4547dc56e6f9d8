import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { railSpecSchema, evaluate } from '../../../src/lib/engine';
import { defaultCatalog } from '../../../src/lib/engine/catalog';
import { designFacts, draftLines, lineTotal, quoteTotals, rateCardSchema } from '../../../src/lib/quotes/pricing';
import { DEMO_RATE_CARD } from '../../../src/lib/demo/scenario';
import { renderQuotePdf } from '../../../src/lib/quotes/render.server';
import { runs } from '../../../src/lib/platform/pdf/fonts';
import { DEFAULT_TERMS, validUntilFrom, type QuoteRow } from '../../../src/lib/quotes/core.server';
import { designSummary, requirementRows, type QuoteView } from '../../../src/lib/quotes/view.server';

const card = rateCardSchema.parse(DEMO_RATE_CARD);

/** A 150 V bias rail from a 300–350 V supply: hazardous voltage and stored energy. */
function highVoltageView(): QuoteView {
  const input = railSpecSchema.parse({
    input: { vMin: 300, vNom: 325, vMax: 350, rippleVpp: 4, source: 'rectified' },
    output: { v: 150, tolerance: 0.02, iMin: 0.002, iTyp: 0.01, iMax: 0.02 },
    noise: { class: 'sensor', maxRippleVpp: 0.01 },
    thermal: { ambientMaxC: 35, airflow: 'still-air' },
  });
  const result = evaluate(input, defaultCatalog);
  const option = result.options.find((o) => o.cautions.some((c) => c.code === 'hazardous-voltage'));
  if (!option) throw new Error('The engine gave no option with a hazardous-voltage caution');
  const facts = designFacts({ topology: option.topology, number: 1, input, result });
  if (!facts) throw new Error('No design facts');
  const lines = draftLines(card, facts, 2).map((l, position) => ({
    ...l,
    id: `l${position}`,
    quoteId: 'q',
    position,
    totalMinor: lineTotal(l),
  }));
  const now = new Date('2026-05-04T09:00:00Z');
  const quote: QuoteRow = {
    id: 'q',
    briefId: 'b',
    revisionId: 'r',
    number: 'RW-2026-0042',
    year: 2026,
    sequence: 42,
    state: 'sent',
    currency: 'EUR',
    quantity: 2,
    taxRateBp: 2_000,
    depositBp: 3_000,
    ...quoteTotals(lines, 2_000, 3_000),
    terms: DEFAULT_TERMS,
    validUntil: validUntilFrom(now, 30),
    createdBy: 'e',
    sentAt: now,
    acceptedAt: null,
    purchaseOrder: null,
    declineReason: null,
    createdAt: now,
    updatedAt: now,
  };
  return {
    quote,
    state: 'sent',
    lines,
    brief: { id: 'b', title: 'Detector bias, 150 V', state: 'quoted', ownerId: 'c' },
    client: { name: 'Łukasz Żak', email: 'lz@detector.test', company: 'Żak Instruments' },
    revision: { id: 'r', number: 1, topology: option.topology, note: '' },
    requirements: requirementRows(input),
    design: designSummary(option),
  };
}

function poppler(tool: 'pdftotext' | 'pdffonts', pdf: Buffer): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'railwright-pdf-')), 'quote.pdf');
  writeFileSync(file, pdf);
  return execFileSync(tool, tool === 'pdftotext' ? ['-layout', file, '-'] : [file], { encoding: 'utf8' });
}

describe('the quote PDF', () => {
  test('carries the quote, the design, the cautions and the totals, in embedded Manrope', async () => {
    const view = highVoltageView();
    const pdf = await renderQuotePdf(view, { quoteUrl: 'https://railwright.test/quotes/q' });
    const text = poppler('pdftotext', pdf).replace(/\s+/g, ' ');
    for (const expected of [
      'RW-2026-0042',
      'Łukasz Żak, Żak Instruments',
      '4 May 2026',
      '3 Jun 2026',
      'above the 60 V ES1 limit',
      'stores',
      'typical values — confirm against the chosen part’s data',
      'defer to local electrical codes and licensed practice',
      'High-voltage safety review',
      'https://railwright.test/quotes/q',
    ]) {
      expect(text).toContain(expected);
    }
    expect(text).toMatch(/\d kΩ/);
    const euros = (minor: number) => `€${(minor / 100).toLocaleString('en-GB', { minimumFractionDigits: 2 })}`;
    for (const figure of [view.quote.subtotalMinor, view.quote.taxMinor, view.quote.totalMinor, view.quote.depositMinor])
      expect(text).toContain(euros(figure));

    const fonts = poppler('pdffonts', pdf).split('\n').slice(2).filter(Boolean);
    expect(fonts.length).toBeGreaterThanOrEqual(3); // Latin regular and bold, plus the Greek and Latin Extended subsets used
    for (const row of fonts) {
      expect(row).toMatch(/Manrope/);
      expect(row).toMatch(/\byes\s+yes\s+yes\b/); // embedded, subset, with a Unicode map
    }
  });

  test('characters go to the font subset that draws them', () => {
    expect(runs('R1 10 kΩ, Łódź')).toEqual([
      'R1 10 k',
      { text: 'Ω', font: 'ManropeGreek' },
      ', ',
      { text: 'Ł', font: 'ManropeLatinExt' },
      'ód',
      { text: 'ź', font: 'ManropeLatinExt' },
    ]);
    expect(runs('plain €1,234.50 — ±5 %')).toEqual(['plain €1,234.50 — ±5 %']);
  });
});
