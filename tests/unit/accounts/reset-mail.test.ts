import { describe, expect, test } from 'vitest';
import { passwordResetMail } from '../../../src/lib/platform/auth/reset-mail';
import { WITHHELD, withoutSecrets } from '../../../src/lib/platform/mail/redact';

describe('what the mail log keeps of a reset e-mail', () => {
  const mail = passwordResetMail({ email: 'ada@example.test', name: 'Ada' }, 'https://app.example/reset-password?token=Zq81-secret_token');

  test('the recipient gets the live link', () => {
    expect(mail.text).toContain('https://app.example/reset-password?token=Zq81-secret_token');
  });

  test('the logged body keeps the words and the page but not the token', () => {
    const logged = withoutSecrets(mail.text);
    expect(logged).not.toContain('Zq81-secret_token');
    expect(logged).toContain(`https://app.example/reset-password?token=${WITHHELD}`);
    expect(logged).toContain('Open this link within one hour');
  });

  test('a token among other query parameters is withheld too; other links stay as they are', () => {
    expect(withoutSecrets('see https://a.example/x?lang=en&token=abc#top and https://a.example/quotes/q1')).toBe(
      `see https://a.example/x?lang=en&token=${WITHHELD}#top and https://a.example/quotes/q1`,
    );
  });
});
