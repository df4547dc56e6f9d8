/**
 * Opens the database and better-auth for command-line scripts, configured from
 * the same environment variables as the server (scripts cannot use astro:env).
 */
import { connect, DEFAULT_DATABASE_URL } from '../src/lib/platform/db/connect';
import { createAuth } from '../src/lib/platform/auth/create-auth';

export function scriptContext() {
  const url = process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL;
  const { db, client } = connect(url, process.env.DATABASE_AUTH_TOKEN);
  const auth = createAuth({
    db,
    // Scripts only hash passwords; the secret that signs sessions stays the server's.
    secret: process.env.BETTER_AUTH_SECRET ?? 'railwright-script-context-only-hashes-passwords',
    baseURL: process.env.PUBLIC_BASE_URL ?? 'http://localhost:4321',
    production: false,
    sendResetPassword: async () => {
      throw new Error('Scripts do not send password-reset mail.');
    },
  });
  return { url, db, client, auth };
}
