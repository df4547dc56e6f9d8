/**
 * The balance invoice: its arithmetic in integer minor units, its number, and
 * its PDF read back by poppler (an independent parser of what we rendered).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { formatInvoiceNumber, invoiceFigures, invoicePdfName } from '../../../src/lib/invoices/figures';
import { renderInvoicePdf } from '../../../src/lib/invoices/document.server';
import type { InvoiceView } from '../../../src/lib/invoices/view.server';
import { lineTotal, quoteTotals } from '../../../src/lib/quotes/pricing';
import type { InvoiceRow, QuoteLineRow, QuoteRow } from '../../../src/lib/platform/db/schema';

describe('invoice arithmetic', () => {
  test('net from the lines, tax at the agreed rate on the net, gross, the deposit paid deducted', () => {
    // 12.5 h at €115.00 and a €480.00 review: net €1,917.50; 20 % tax €383.50; gross €2,301.00.
    const lines = [
      { quantityMilli: 12_500, unitPriceMinor: 11_500 },
      { quantityMilli: 1_000, unitPriceMinor: 48_000 },
    ];
    expect(invoiceFigures(lines, 2_000, 69_030)).toEqual({
      netMinor: 191_750,
      taxMinor: 38_350,
      grossMinor: 230_100,
      depositPaidMinor: 69_030,
      balanceMinor: 161_070,
    });
  });

  test('the gross is the quote’s total, so deposit and balance add up to what was agreed', () => {
    const lines = [
      { quantityMilli: 3_333, unitPriceMinor: 9_999 },
      { quantityMilli: 1_000, unitPriceMinor: 1 },
    ];
    const quoted = quoteTotals(lines, 1_950, 3_000);
    const invoiced = invoiceFigures(lines, 1_950, quoted.depositMinor);
    expect(invoiced.grossMinor).toBe(quoted.totalMinor);
    expect(invoiced.netMinor + invoiced.taxMinor).toBe(invoiced.grossMinor);
    expect(invoiced.depositPaidMinor + invoiced.balanceMinor).toBe(invoiced.grossMinor);
    for (const figure of Object.values(invoiced)) expect(Number.isInteger(figure)).toBe(true);
  });

  test('tax rounds once, half away from zero, in minor units', () => {
    // 20 cents at 2.5 % is half a cent: one cent. 1,005 cents at 7.5 % is 75.375: 75 cents.
    expect(invoiceFigures([{ quantityMilli: 1_000, unitPriceMinor: 20 }], 250, 0).taxMinor).toBe(1);
    expect(invoiceFigures([{ quantityMilli: 1_000, unitPriceMinor: 1_005 }], 750, 0).taxMinor).toBe(75);
    // A line of 0.5 unit at 3 cents is 1.5 cents: 2 cents, rounded once on the line (as on the quote).
    expect(lineTotal({ quantityMilli: 500, unitPriceMinor: 3 })).toBe(2);
  });

  test('a deposit that covered everything leaves no balance, never a negative one', () => {
    expect(invoiceFigures([{ quantityMilli: 1_000, unitPriceMinor: 1_000 }], 0, 1_200).balanceMinor).toBe(0);
  });
});

describe('invoice numbers', () => {
  test('a sequence of their own per year, four digits at least, apart from quote numbers', () => {
    expect(formatInvoiceNumber(2026, 1)).toBe('INV-2026-0001');
    expect(formatInvoiceNumber(2026, 42)).toBe('INV-2026-0042');
    expect(formatInvoiceNumber(2027, 12_345)).toBe('INV-2027-12345');
    expect(invoicePdfName('INV-2026-0042')).toBe('Railwright-invoice-INV-2026-0042.pdf');
  });
});

const issuedAt = new Date('2026-06-18T10:00:00Z');

function view(overrides: Partial<InvoiceRow> = {}): InvoiceView {
  const lines: QuoteLineRow[] = [
    {
      id: 'l0',
      quoteId: 'q',
      position: 0,
      kind: 'design',
      description: 'Design: buck converter',
      quantityMilli: 12_500,
      unit: 'h',
      unitPriceMinor: 11_500,
      totalMinor: 143_750,
    },
    {
      id: 'l1',
      quoteId: 'q',
      position: 1,
      kind: 'test-report',
      description: 'Test and report',
      quantityMilli: 1_000,
      unit: 'each',
      unitPriceMinor: 48_000,
      totalMinor: 48_000,
    },
  ];
  const figures = invoiceFigures(lines, 2_000, 69_030);
  const quote = {
    id: 'q',
    number: 'RW-2026-0042',
    currency: 'EUR',
    taxRateBp: 2_000,
    depositBp: 3_000,
  } as QuoteRow;
  const invoice: InvoiceRow = {
    id: 'i',
    quoteId: 'q',
    number: 'INV-2026-0007',
    year: 2026,
    sequence: 7,
    state: 'issued',
    currency: 'EUR',
    taxRateBp: 2_000,
    ...figures,
    purchaseOrder: 'ŻI-PO-118',
    billingAddress: 'Żak Instruments\nul. Wąska 4\n31-000 Kraków',
    registrationNumber: '08812734',
    taxId: 'EU372918455',
    issuedAt,
    paidAt: null,
    createdAt: issuedAt,
    updatedAt: issuedAt,
    ...overrides,
  };
  return {
    invoice,
    quote,
    lines,
    brief: { id: 'b', title: 'Detector bias, 150 V', ownerId: 'c' },
    client: { name: 'Łukasz Żak', email: 'lz@detector.test', company: 'Żak Instruments' },
  };
}

function poppler(tool: 'pdftotext' | 'pdffonts', pdf: Buffer): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'railwright-invoice-')), 'invoice.pdf');
  writeFileSync(file, pdf);
  return execFileSync(tool, tool === 'pdftotext' ? ['-layout', file, '-'] : [file], { encoding: 'utf8' });
}

describe('the invoice PDF', () => {
  test('carries our identifiers, the billing address and PO, the lines, the tax breakdown, the deposit deducted and the balance due', async () => {
    const text = poppler('pdftotext', await renderInvoicePdf(view())).replace(/\s+/g, ' ');
    for (const expected of [
      'INV-2026-0007',
      'Invoice for the balance',
      'Company registration 08812734',
      'VAT / tax id EU372918455',
      'Billed to Łukasz Żak, Żak Instruments',
      'ul. Wąska 4',
      '31-000 Kraków',
      'Your PO ŻI-PO-118',
      'RW-2026-0042',
      '18 Jun 2026',
      'Design: buck converter',
      'Net €1,917.50',
      'Tax (20 %) €383.50',
      'Gross €2,301.00',
      'Deposit paid − €690.30',
      'Balance due €1,610.70',
      'Pay the balance of €1,610.70 online',
    ])
      expect(text).toContain(expected);

    const fonts = poppler('pdffonts', await renderInvoicePdf(view()))
      .split('\n')
      .slice(2)
      .filter(Boolean);
    expect(fonts.length).toBeGreaterThan(0);
    for (const row of fonts) expect(row).toMatch(/Manrope.*\byes\s+yes\s+yes\b/);
  });

  test('a paid invoice says so; blank identifiers and no PO leave their lines out', async () => {
    const paidAt = new Date('2026-06-21T08:00:00Z');
    const text = poppler(
      'pdftotext',
      await renderInvoicePdf(view({ state: 'paid', paidAt, purchaseOrder: null, registrationNumber: '', taxId: '' })),
    ).replace(/\s+/g, ' ');
    expect(text).toContain('Paid — thank you');
    expect(text).toContain('Paid 21 Jun 2026');
    expect(text).toContain('Balance (paid) €1,610.70');
    for (const absent of ['Your PO', 'Company registration', 'VAT / tax id', 'Pay the balance of']) expect(text).not.toContain(absent);
  });

  test('the same invoice renders to the same bytes', async () => {
    const first = await renderInvoicePdf(view());
    // Later by more than a clock tick: nothing of the time of rendering may reach the bytes.
    await new Promise((resolve) => setTimeout(resolve, 20));
    const second = await renderInvoicePdf(view());
    expect(first.equals(second)).toBe(true);
  });
});
