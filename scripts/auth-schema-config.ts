/**
 * What the better-auth CLI loads to generate `src/lib/platform/db/auth-schema.ts`
 * (`npm run auth:generate`): the app's own better-auth setup over a throwaway
 * in-memory database, since the CLI needs an `auth` instance and nothing else.
 */
import { createAuth } from '../src/lib/platform/auth/create-auth';
import { connect } from '../src/lib/platform/db/connect';

const { db } = connect('file::memory:');

export const auth = createAuth({
  db,
  secret: 'schema-generation-only-never-signs-a-session',
  baseURL: 'http://localhost:4321',
  production: false,
  sendResetPassword: async () => {},
});
