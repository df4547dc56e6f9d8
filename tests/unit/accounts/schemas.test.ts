import { describe, expect, test } from 'vitest';
import { fieldErrors, signUpSchema } from '../../../src/lib/accounts/schemas';

describe('account form schemas', () => {
  test('a valid sign-up passes, trimmed', () => {
    const parsed = signUpSchema.parse({ name: '  Ana  ', company: 'Lab', email: 'ana@lab.example', password: 'long-enough-1' });
    expect(parsed.name).toBe('Ana');
  });
  test('each bad field gets its own plain-words message', () => {
    const result = signUpSchema.safeParse({ name: '', company: '', email: 'not-an-email', password: 'short' });
    expect(result.success).toBe(false);
    if (result.success) return;
    expect(fieldErrors(result.error)).toEqual({
      name: 'Tell us your name.',
      company: 'Tell us your company or lab.',
      email: 'Enter an e-mail address such as name@company.com.',
      password: 'Use at least 10 characters.',
    });
  });
});
