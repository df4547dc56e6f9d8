import { sql } from 'drizzle-orm';
import { defaultCatalog, type Catalog } from '../engine/catalog';
import { rowsToCatalog } from './catalog-rows';
import { db } from './db';
import { deviceClass } from './db/schema';

// A short-lived copy per instance: the catalog changes rarely (an admin edit),
// and evaluations must not re-read and re-validate it on every request.
const FRESH_MS = 5_000;
let cached: { catalog: Catalog; at: number } | null = null;

export async function currentCatalog(now = Date.now()): Promise<Catalog> {
  if (cached && now - cached.at < FRESH_MS) return cached.catalog;
  // rowid keeps the seeded order, which the engine uses to break ties between classes.
  const rows = await db.select().from(deviceClass).orderBy(sql`rowid`);
  const catalog = rows.length === 0 ? defaultCatalog : rowsToCatalog(rows);
  cached = { catalog, at: now };
  return catalog;
}

export function forgetCatalog(): void {
  cached = null;
}
