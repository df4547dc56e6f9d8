import { describe, expect, inject, test } from 'vitest';
import { DEMO, Visitor } from '../../support/client';
import { DEMO_RATE_CARD } from '../../../src/lib/demo/scenario';
import { railUnderReview } from './helpers';

const baseUrl = inject('baseUrl');

/** The rate card form as an admin fills it: amounts in euros, rates in percent, hours as decimals. */
function form(overrides: Record<string, string> = {}): Record<string, string> {
  const card = DEMO_RATE_CARD;
  const euros = (minor: number) => (minor / 100).toFixed(2);
  return {
    currency: card.currency,
    hourlyRate: euros(card.hourlyRateMinor),
    hvReview: euros(card.hvReviewMinor),
    prototypePerUnit: euros(card.prototypePerUnitMinor),
    testReport: euros(card.testReportMinor),
    taxRate: String(card.taxRateBp / 100),
    deposit: String(card.depositBp / 100),
    validityDays: String(card.validityDays),
    registrationNumber: card.registrationNumber,
    taxId: card.taxId,
    ...Object.fromEntries(Object.entries(card.designHoursByTopology).map(([t, h]) => [`hours.${t}`, String(h)])),
    ...Object.fromEntries(Object.entries(card.complexityHours).map(([d, h]) => [`complexity.${d}`, String(h)])),
    ...overrides,
  };
}

describe('the rate card', () => {
  test('an admin changes it and the next draft is priced with it; existing drafts keep their prices', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const page = await (await admin.request('/admin/rate-card')).text();
    expect(page).toContain('value="115.00"');
    const rail = await railUnderReview(baseUrl);
    const before = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
    try {
      const saved = await admin.form(
        '/admin/rate-card',
        form({ hourlyRate: '120.50', 'hours.buck': '10.25', 'complexity.perRevision': '2', taxRate: '7.5', taxId: ' EU 111 222 333 ' }),
      );
      expect(saved.status).toBe(303);
      const shown = await (await admin.follow(saved)).text();
      expect(shown).toContain('Rate card saved');
      // The identifiers printed on invoices are kept with the card, trimmed.
      expect(shown).toContain('value="EU 111 222 333"');
      expect(shown).toContain('value="08812734"');

      const after = await (await rail.engineer.request('/api/v1/quotes', { method: 'POST', json: { revisionId: rail.revisionId } })).json();
      expect(after.lines[0]).toMatchObject({ quantityMilli: 10_250, unitPriceMinor: 12_050, totalMinor: 123_513 }); // 10.25 h × €120.50 = €1 235.125 → €1 235.13
      expect(after.lines[1]).toMatchObject({ quantityMilli: 2_000, unitPriceMinor: 12_050 });
      expect(after.taxRateBp).toBe(750);
      const kept = await (await rail.engineer.request(`/api/v1/quotes/${before.id}`)).json();
      expect(kept.lines[0].unitPriceMinor).toBe(11_500);
    } finally {
      expect((await admin.form('/admin/rate-card', form())).status).toBe(303);
    }
  });

  test('figures that do not read are refused beside their field, and nothing is saved', async () => {
    const admin = await new Visitor(baseUrl).signIn(DEMO.admin);
    const refused = await admin.form(
      '/admin/rate-card',
      form({ hourlyRate: 'a lot', deposit: '120', 'hours.linear': '-1', currency: 'EURO' }),
    );
    expect(refused.status).toBe(400);
    const html = await refused.text();
    expect(html).toContain('Enter an amount with at most 2 decimals.');
    expect(html).toContain('The currency is a three-letter ISO 4217 code such as EUR.');
    const badId = await admin.form('/admin/rate-card', form({ taxId: 'EU<372>' }));
    expect(badId.status).toBe(400);
    expect(await badId.text()).toContain('The VAT or tax id holds letters, digits, spaces, dots, slashes and dashes only.');
    const fixedCurrency = await admin.form('/admin/rate-card', form({ deposit: '120', 'hours.linear': '-1' }));
    expect(fixedCurrency.status).toBe(400);
    const text = await fixedCurrency.text();
    expect(text).toContain('The deposit must not exceed 100 %.');
    expect(text).toContain('Design hours for Linear regulator must not be negative.');
    expect(await (await admin.request('/admin/rate-card')).text()).toContain('value="115.00"');
  });

  test('only admins see it', async () => {
    const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
    expect((await engineer.request('/admin/rate-card')).status).toBe(403);
    expect((await engineer.form('/admin/rate-card', form({ hourlyRate: '1.00' }))).status).toBe(403);
    expect((await new Visitor(baseUrl).request('/admin/rate-card')).status).toBe(303);
  });
});
