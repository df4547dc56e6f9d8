import { describe, expect, test } from 'vitest';
import { homeFor, redirectWithCookies, safeNext } from '../../../src/lib/accounts/form-actions';

describe('where a sign-in may send the visitor next', () => {
  test.each([
    ['/desk?state=submitted', '/desk?state=submitted'],
    ['//evil.example/path', '/home'],
    ['/\\evil.example', '/home'],
    ['https://evil.example', '/home'],
    ['', '/home'],
    [null, '/home'],
  ])('%s → %s', (next, expected) => {
    expect(safeNext(next, '/home')).toBe(expected);
  });

  test('each role has its start page', () => {
    expect(homeFor('client')).toBe('/briefs');
    expect(homeFor('engineer')).toBe('/desk');
    expect(homeFor('admin')).toBe('/desk');
    expect(homeFor(undefined)).toBe('/');
  });

  test('a redirect carries every cookie better-auth set', () => {
    const headers = new Headers();
    headers.append('set-cookie', 'a=1; Path=/; HttpOnly');
    headers.append('set-cookie', 'b=2; Path=/; HttpOnly');
    const response = redirectWithCookies('/desk', headers);
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/desk');
    expect(response.headers.getSetCookie()).toEqual(['a=1; Path=/; HttpOnly', 'b=2; Path=/; HttpOnly']);
  });
});
