import type { APIRoute } from 'astro';
import { sql } from 'drizzle-orm';
import { db } from '~/lib/server/db';
import { json } from '~/lib/server/http';

/** For the proxy and the start script: answers once migrations ran and the database answers. */
export const GET: APIRoute = async () => {
  await db.run(sql`select 1`);
  return json({ ok: true });
};
