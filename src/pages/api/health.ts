import type { APIRoute } from 'astro';
import { sql } from 'drizzle-orm';
import { db } from '~/lib/platform/db';
import { json } from '~/lib/platform/http/responses';

/** For the proxy and the start script: answers once migrations ran and the database answers. */
export const GET: APIRoute = async () => {
  await db.run(sql`select 1`);
  return json({ ok: true });
};
