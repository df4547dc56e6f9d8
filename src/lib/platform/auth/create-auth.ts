import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin } from 'better-auth/plugins';
import type { Database } from '../db/connect';
import * as schema from '../db/schema';
import { RESET_LINK_SECONDS } from './password-token';
import { authRoles, DEFAULT_ROLE } from './roles';

/** What a deactivated account hears when it signs in with the right password. */
export const ACCOUNT_DEACTIVATED = 'This account is deactivated. Ask an admin of the consultancy to reactivate it.';

/** In development the same server answers on localhost and 127.0.0.1. */
function trustedOrigins(baseURL: string): string[] {
  const origin = new URL(baseURL).origin;
  const twin = origin.includes('//localhost') ? origin.replace('//localhost', '//127.0.0.1') : origin.replace('//127.0.0.1', '//localhost');
  return [...new Set([origin, twin])];
}

export interface AuthOptions {
  db: Database;
  secret: string;
  baseURL: string;
  production: boolean;
  /** Receives the one-time token; the caller builds the link to its own reset page. */
  sendResetPassword: (to: { email: string; name: string }, token: string) => Promise<void>;
}

/** better-auth configured for Railwright; free of `astro:env` so the schema generator can load it. */
export function createAuth(options: AuthOptions) {
  return betterAuth({
    appName: 'Railwright',
    secret: options.secret,
    baseURL: options.baseURL,
    trustedOrigins: trustedOrigins(options.baseURL),
    database: drizzleAdapter(options.db, { provider: 'sqlite', schema }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 10,
      autoSignIn: true,
      resetPasswordTokenExpiresIn: RESET_LINK_SECONDS,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, token }) => {
        await options.sendResetPassword({ email: user.email, name: user.name }, token);
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    // Sign-in attempts are limited by our own database-backed limiter (shared by
    // every app instance); better-auth's in-memory one would not be.
    rateLimit: { enabled: false },
    advanced: {
      useSecureCookies: options.production,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax', secure: options.production },
    },
    plugins: [admin({ defaultRole: DEFAULT_ROLE, adminRoles: ['admin'], roles: authRoles, bannedUserMessage: ACCOUNT_DEACTIVATED })],
  });
}

export type Auth = ReturnType<typeof createAuth>;
