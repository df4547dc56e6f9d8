import { describe, expect, test } from 'vitest';
import { balanceDue } from '../../../src/lib/quotes/balance-due';
import { quoteListHref, quoteListQuerySchema } from '../../../src/lib/quotes/list-query';
import { infeasibleDraftNote, infeasibleReasonFor } from '../../../src/lib/quotes/drafting';
import { feasibilityWords } from '../../../src/lib/review/option-words';

describe('the balance of a quote', () => {
  test('once accepted it is the total until a deposit is received, then the total less what was received', () => {
    expect(balanceDue({ state: 'accepted', totalMinor: 120_000, depositPaidMinor: 0 })).toBe(120_000);
    expect(balanceDue({ state: 'deposit-paid', totalMinor: 120_000, depositPaidMinor: 36_000 })).toBe(84_000);
  });
  test('once the balance invoice is paid nothing is left to pay', () => {
    expect(balanceDue({ state: 'deposit-paid', totalMinor: 241054, depositPaidMinor: 72316, balancePaidMinor: 168738 })).toBe(0);
    expect(balanceDue({ state: 'deposit-paid', totalMinor: 241054, depositPaidMinor: 72316 })).toBe(168738);
  });
  test('never reads below nothing, even if more was received than the total', () => {
    expect(balanceDue({ state: 'deposit-paid', totalMinor: 10_000, depositPaidMinor: 12_000 })).toBe(0);
  });
  test('a quote nobody is bound by has no balance', () => {
    for (const state of ['draft', 'sent', 'declined', 'expired', 'withdrawn'] as const)
      expect(balanceDue({ state, totalMinor: 10_000, depositPaidMinor: 0 }), state).toBeNull();
  });
});

describe('the quote list address', () => {
  test('keeps the filters, leaves out empty ones and the defaults', () => {
    expect(quoteListHref('/desk/quotes', {})).toBe('/desk/quotes');
    expect(quoteListHref('/desk/quotes', { state: 'sent', q: 'RW 7', client: 'c1', page: 2, pageSize: 10 })).toBe(
      '/desk/quotes?state=sent&q=RW+7&client=c1&page=2&pageSize=10',
    );
    expect(quoteListHref('/quotes', { page: 1, pageSize: 25, q: '' })).toBe('/quotes');
  });
  test('reads back through the query schema to the same view', () => {
    const view = { state: 'withdrawn' as const, q: 'valve', page: 3, pageSize: 50 };
    const search = new URL(quoteListHref('/quotes', view), 'http://x').searchParams;
    expect(quoteListQuerySchema.parse(Object.fromEntries(search))).toEqual(view);
  });
  test('the list form’s empty filters mean “any” and keep the chosen page size', () => {
    expect(quoteListQuerySchema.parse({ q: '', state: '', client: '', pageSize: '10' })).toEqual({ page: 1, pageSize: 10 });
  });
  test('refuses an unknown state and pages past the limits', () => {
    expect(quoteListQuerySchema.safeParse({ state: 'paid-twice' }).success).toBe(false);
    expect(quoteListQuerySchema.safeParse({ pageSize: '101' }).success).toBe(false);
    expect(quoteListQuerySchema.safeParse({ page: '0' }).success).toBe(false);
  });
});

describe('quoting a design that does not meet the brief', () => {
  test('a feasible design keeps no reason, whatever is given', () => {
    expect(infeasibleReasonFor({ number: 1, feasible: true }, 'anything')).toEqual({ ok: true, reason: null });
  });
  test('an infeasible one needs a reason that is more than spaces', () => {
    for (const given of [undefined, '', '   ']) {
      const outcome = infeasibleReasonFor({ number: 4, feasible: false }, given);
      expect(outcome.ok).toBe(false);
      if (!outcome.ok) {
        expect(outcome.issue.path).toBe('infeasibleReason');
        expect(outcome.issue.message).toContain('revision 4 does not meet the brief');
      }
    }
    expect(infeasibleReasonFor({ number: 4, feasible: false }, '  agreed shortfall ')).toEqual({ ok: true, reason: 'agreed shortfall' });
    expect(infeasibleDraftNote(4, 'agreed shortfall')).toBe(
      'Drafted from revision 4, whose design does not meet the brief: agreed shortfall',
    );
  });
  test('feasibility reads as a mark and a word, not colour alone', () => {
    expect(feasibilityWords(true)).toEqual({ mark: '✓', text: 'Feasible' });
    expect(feasibilityWords(false)).toEqual({ mark: '✕', text: 'Not feasible' });
  });
});
