import { eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';
import { catalogSchema, defaultCatalog, type Catalog } from '../engine/catalog';
import { catalogToRows, draftFromRows, rowsToCatalog, upgradedRows } from './rows';
import { db } from '../platform/db';
import { log } from '../platform/log';
import { deviceClass } from '../platform/db/schema';

// A short-lived copy per instance: the catalog changes rarely (an admin edit),
// and evaluations must not re-read and re-validate it on every request.
const FRESH_MS = 5_000;
let cached: { catalog: Catalog; at: number } | null = null;

export async function currentCatalog(now = Date.now()): Promise<Catalog> {
  if (cached && now - cached.at < FRESH_MS) return cached.catalog;
  // rowid keeps the seeded order, which the engine uses to break ties between classes.
  const rows = await db
    .select()
    .from(deviceClass)
    .orderBy(sql`rowid`);
  const catalog = rows.length === 0 ? defaultCatalog : rowsToCatalog(rows);
  cached = { catalog, at: now };
  return catalog;
}

export function forgetCatalog(): void {
  cached = null;
}

export const deviceClassEditSchema = z.object({
  id: z.string().min(1, { error: 'Choose a device class.' }),
  params: z.string().max(32_000, { error: 'Keep the parameters under 32 000 characters.' }),
});

export const CATALOG_SAVED =
  'Saved. New evaluations use the edited figures within a few seconds; saved revisions keep the figures they were made with.';

/**
 * An admin's edit of one device class: the whole catalog is rebuilt and checked
 * with the engine's schema before anything is written, so a bad figure never
 * reaches an evaluation.
 */
const notSaved = (message: string) => invalidInput('invalid_device_class', [{ path: 'params', message }]);

export async function updateDeviceClass(edit: z.infer<typeof deviceClassEditSchema>, adminId: string): Promise<Outcome<void>> {
  const { id } = edit;
  let params: unknown;
  try {
    params = JSON.parse(edit.params);
  } catch {
    return notSaved('The parameters are not valid JSON; check commas, quotes and brackets.');
  }
  const rows = await db
    .select()
    .from(deviceClass)
    .orderBy(sql`rowid`);
  const target = rows.find((row) => row.id === id);
  if (!target) return refuse('not-found', 'That device class no longer exists.');
  const edited = rows.map((row) => (row.id === id ? { ...row, params } : row));
  const checked = catalogSchema.safeParse(draftFromRows(edited));
  if (!checked.success) {
    const issue = checked.error.issues[0];
    return notSaved(`Not saved: ${issue?.path.slice(2).join('.') || 'the parameters'} — ${issue?.message ?? 'invalid'}.`);
  }
  const name = typeof (params as { label?: unknown }).label === 'string' ? (params as { label: string }).label : target.name;
  await db.update(deviceClass).set({ params, name, updatedBy: adminId, updatedAt: new Date() }).where(eq(deviceClass.id, id));
  forgetCatalog();
  return succeed(undefined);
}

export async function listDeviceClasses() {
  return db
    .select()
    .from(deviceClass)
    .orderBy(sql`rowid`);
}

/**
 * At start: a catalog stored by an earlier version gains the classes and
 * fields this version ships, keeping every stored figure. Written only when the
 * whole result passes the engine's schema; otherwise the stored one stays and
 * the reason is logged for an admin.
 */
export async function bringCatalogUpToDate(now = new Date()): Promise<{ added: string[]; filled: string[] }> {
  const stored = await listDeviceClasses();
  if (stored.length === 0) return { added: [], filled: [] };
  const { rows, added, filled } = upgradedRows(stored, catalogToRows(defaultCatalog));
  if (added.length === 0 && filled.length === 0) return { added, filled };
  const checked = catalogSchema.safeParse(draftFromRows(rows));
  if (!checked.success) {
    log.error({ issue: checked.error.issues[0] }, 'the stored device catalog could not be brought up to date; it is kept as it is');
    return { added: [], filled: [] };
  }
  const byId = new Map(rows.map((row) => [row.id, row]));
  await db.transaction(async (tx) => {
    for (const id of filled)
      await tx
        .update(deviceClass)
        .set({ params: byId.get(id)?.params, updatedAt: now })
        .where(eq(deviceClass.id, id));
    for (const id of added) {
      const row = byId.get(id);
      if (row)
        await tx.insert(deviceClass).values({ id: row.id, kind: row.kind, name: row.name, params: row.params }).onConflictDoNothing();
    }
  });
  forgetCatalog();
  log.info({ added: added.length, filled: filled.length }, 'device catalog brought up to date');
  return { added, filled };
}
