import { describe, expect, test } from 'vitest';
import { unreadHref, unreadLabel } from '../../../src/lib/accounts/navigation';

describe('the header’s unread count', () => {
  test('says the count in words, singular and plural', () => {
    expect(unreadLabel(1)).toBe('1 unread message');
    expect(unreadLabel(3)).toBe('3 unread messages');
  });

  test('leads each side to the thread on its own page of the brief', () => {
    expect(unreadHref('client', 'b1')).toBe('/briefs/b1#messages');
    expect(unreadHref('engineer', 'b1')).toBe('/desk/briefs/b1#messages');
    expect(unreadHref('admin', 'b1')).toBe('/desk/briefs/b1#messages');
  });
});
