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
import { railFiguresOf } from '../../../src/lib/schematic';

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
    clientNote: '',
    infeasibleReason: null,
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
    design: designSummary(option, railFiguresOf(input)),
  };
}

/** The view with `extra` more price lines, which moves the blocks after the price down the pages. */
function withExtraLines(view: QuoteView, extra: number): QuoteView {
  const more = Array.from({ length: extra }, (_, k) => ({ ...view.lines[0]!, id: `x${k}`, position: view.lines.length + k }));
  return { ...view, lines: [...view.lines, ...more] };
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

  test('the terms and the acceptance block stay together on one page, wherever the price ends', async () => {
    const terms = DEFAULT_TERMS.split('\n').map((t) => t.slice(0, 40));
    for (let extra = 0; extra <= 24; extra += 3) {
      const pdf = await renderQuotePdf(withExtraLines(highVoltageView(), extra), { quoteUrl: 'https://railwright.test/quotes/q' });
      const pages = poppler('pdftotext', pdf)
        .split('\f')
        .map((page) => page.replace(/\s+/g, ' '));
      const at = pages.findIndex((page) => page.includes('Terms'));
      expect(at, `${extra} extra lines`).toBeGreaterThanOrEqual(0);
      for (const term of terms) expect(pages[at], `${extra} extra lines: ${term}`).toContain(term);
      expect(pages[at], `${extra} extra lines`).toContain('Accept and pay the deposit');
    }
  }, 60_000);

  test('a heatsink figure reads in K/W with two significant figures', () => {
    const spec = railSpecSchema.parse({
      input: { vMin: 300, vNom: 325, vMax: 350, rippleVpp: 4, source: 'rectified' },
      output: { v: 150, tolerance: 0.02, iMin: 0.002, iTyp: 0.01, iMax: 0.02 },
      noise: { class: 'sensor', maxRippleVpp: 0.01 },
      thermal: { ambientMaxC: 35, airflow: 'still-air' },
    });
    const option = evaluate(spec, defaultCatalog).options[0]!;
    const summary = designSummary({ ...option, heatsink: { required: true, maxThetaSaCW: 0.36 } }, railFiguresOf(spec));
    expect(summary.figures.find((r) => r.label === 'Heatsink')?.value).toBe('needed, at most 0.36 K/W');
  });

  test('draws the design on a landscape page of its own, labels in embedded Manrope, with the part list', async () => {
    const view = highVoltageView();
    const pdf = await renderQuotePdf(view, { quoteUrl: 'https://railwright.test/quotes/q' });
    const file = path.join(mkdtempSync(path.join(tmpdir(), 'railwright-pdf-')), 'quote.pdf');
    writeFileSync(file, pdf);
    const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [file], { encoding: 'utf8' }))?.[1]);
    const pageText = (n: number) =>
      execFileSync('pdftotext', ['-layout', '-f', String(n), '-l', String(n), file, '-'], { encoding: 'utf8' });
    // The drawing's page: the first that starts with its heading; nothing of it is on the page before.
    const at = Array.from({ length: pages }, (_, i) => i + 1).find((n) => pageText(n).trimStart().startsWith('Schematic'))!;
    expect(at).toBeGreaterThan(1);
    expect(pageText(at - 1)).not.toContain('Marked nets');
    const drawingPage = Array.from({ length: pages - at + 1 }, (_, i) => pageText(at + i))
      .join(' ')
      .replace(/\s+/g, ' ');
    expect(drawingPage).toContain('Schematic');
    expect(drawingPage).toContain('Part list');
    expect(drawingPage).toContain('Marked nets may exceed 60 V DC: dangerous voltage');
    const option = view.design!;
    for (const p of option.parts) expect(drawingPage).toContain(p.ref);
    // The drawing's own labels: its terminals' ranges and the values with SI prefixes, Ω set from the Greek subset.
    expect(drawingPage).toContain('300 V – 350 V');
    expect(drawingPage).toMatch(/150 V \(147 V – 153 V\)/);
    expect(drawingPage).toMatch(/301 k ?Ω/);
    const size = execFileSync('pdfinfo', ['-f', String(at), '-l', String(at), file], { encoding: 'utf8' });
    expect(size).toMatch(/Page\s+\d+ size:\s+841\.89 x 595\.28/);
    const fonts = poppler('pdffonts', pdf).split('\n').slice(2).filter(Boolean);
    for (const row of fonts) expect(row).toMatch(/Manrope/);
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
