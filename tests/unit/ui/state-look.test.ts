import { describe, expect, test } from 'vitest';
import { BRIEF_STATES } from '../../../src/lib/platform/db/schema';
import { lifecycleTo } from '../../../src/lib/demo/lifecycle';
import { BRIEF_STATE_LOOK, lookOf } from '../../../src/components/ui/state-look';
import { formatMoney } from '../../../src/lib/platform/format';
import { currentNavHref, navigationFor } from '../../../src/lib/accounts/navigation';

describe('state vocabulary', () => {
  test('every brief state has a word and a glyph, so none is told by colour alone', () => {
    for (const state of BRIEF_STATES) {
      const look = lookOf(BRIEF_STATE_LOOK, state);
      expect(look.label.length, state).toBeGreaterThan(2);
      expect(look.glyph.length, state).toBeGreaterThan(0);
    }
    expect(new Set(BRIEF_STATES.map((s) => BRIEF_STATE_LOOK[s]?.label)).size).toBe(BRIEF_STATES.length);
  });

  test('the demo history of a paid brief walks the main line in order', () => {
    expect(lifecycleTo('deposit-paid').map((s) => s.to)).toEqual(['draft', 'submitted', 'in-review', 'quoted', 'accepted', 'deposit-paid']);
    expect(() => lifecycleTo('declined')).toThrow(/main-line/);
  });
});

describe('formatting', () => {
  test('money is integer minor units shown with the currency’s own decimals', () => {
    expect(formatMoney(123_456, 'EUR')).toBe('€1,234.56');
    expect(formatMoney(5_000, 'JPY')).toBe('JP¥5,000');
  });
});

describe('navigation by role', () => {
  test('clients see their briefs, staff the desk, admins also people', () => {
    expect(navigationFor('client').map((n) => n.href)).toEqual(['/briefs', '/quotes']);
    expect(navigationFor('engineer').map((n) => n.href)).toEqual(['/desk', '/desk/quotes']);
    expect(navigationFor('admin').map((n) => n.href)).toContain('/admin/users');
    expect(navigationFor(null)).toEqual([]);
  });
  test('a page marks the item it belongs to: the longest address its path starts with', () => {
    const staff = navigationFor('engineer');
    expect(currentNavHref(staff, '/desk')).toBe('/desk');
    expect(currentNavHref(staff, '/desk/briefs/b1')).toBe('/desk');
    expect(currentNavHref(staff, '/desk/quotes')).toBe('/desk/quotes');
    expect(currentNavHref(staff, '/desk/quotes/q1')).toBe('/desk/quotes');
    expect(currentNavHref(staff, '/desktop')).toBeNull();
    expect(currentNavHref(navigationFor('client'), '/quotes/q1')).toBe('/quotes');
  });
});
