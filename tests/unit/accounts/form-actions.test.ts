import { describe, expect, test } from 'vitest';
import { homeFor, redirectWithCookies, safeNext } from '../../../src/lib/accounts/form-actions';

describe('where a sign-in may send the visitor next', () => {
  const origin = 'https://app.example';
  test.each([
    ['/desk?state=submitted', '/desk?state=submitted'],
    ['/quotes/q1#pay', '/quotes/q1#pay'],
    ['https://app.example/briefs?page=2', '/briefs?page=2'],
    ['//evil.example/path', '/home'],
    ['/\\evil.example', '/home'],
    ['https://evil.example', '/home'],
    // A browser drops tabs and line breaks from a Location, leaving `//evil.example/…`.
    ['/\t/evil.example/phish.html', '/home'],
    ['/\n/evil.example/phish.html', '/home'],
    ['/\r\n/evil.example', '/home'],
    ['\t//evil.example', '/home'],
    ['javascript:alert(1)', '/home'],
    ['http://[::1', '/home'],
    ['', '/home'],
    [null, '/home'],
  ])('%j → %s', (next, expected) => {
    expect(safeNext(next, '/home', origin)).toBe(expected);
  });

  test('what passes carries no control character into the Location header', () => {
    const passed = safeNext('/desk\r\nset-cookie: x=1', '/home', origin);
    expect(passed).not.toMatch(/[\r\n\t]/);
    expect(() => new Headers({ location: passed })).not.toThrow();
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
