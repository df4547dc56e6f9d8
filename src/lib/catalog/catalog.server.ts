import { eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';
import { classFields, FIELD_PREFIX, readableIssue, readClassForm } from './class-form';
import { kindName, lookOf } from './field-look';
import { CLASS_LISTS, catalogSchema, defaultCatalog, type Catalog, type ClassList } from '../engine/catalog';
import { catalogToRows, draftFromRows, rowsToCatalog, upgradedRows, type DeviceClassRow } from './rows';
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

const classId = z.string({ error: 'Choose a device class.' }).min(1, { error: 'Choose a device class.' });
const className = z
  .string({ error: 'Name the class.' })
  .trim()
  .min(1, { error: 'Name the class as designs will show it.' })
  .max(120, { error: 'Keep the name under 120 characters.' });

/** The catalog page's forms: one `intent` per thing an admin does to a class. An edit carries its figures as `f.<path>` fields. */
export const catalogActionSchema = z.discriminatedUnion(
  'intent',
  [
    z.looseObject({ intent: z.literal('edit'), id: classId }),
    z.object({
      intent: z.literal('json'),
      id: classId,
      params: z.string().max(32_000, { error: 'Keep the parameters under 32 000 characters.' }),
    }),
    z.object({ intent: z.literal('copy'), id: classId, label: className }),
    z.object({ intent: z.literal('add'), kind: z.enum(CLASS_LISTS, { error: 'Choose the kind of class to add.' }), label: className }),
    z.object({ intent: z.literal('retire'), id: classId }),
    z.object({ intent: z.literal('restore'), id: classId }),
  ],
  { error: 'Choose what to do.' },
);
export type CatalogAction = z.infer<typeof catalogActionSchema>;
export type CatalogDone = 'saved' | 'copied' | 'added' | 'retired' | 'restored';

export const CATALOG_DONE: Record<CatalogDone, string> = {
  saved: 'Saved. New evaluations use the edited figures within a few seconds; saved revisions keep the figures they were made with.',
  copied: 'Copied. The copy is in use for new evaluations: check its figures below.',
  added: 'Added, with the figures of the first class of its kind: change them to the new part’s below.',
  retired: 'Retired. Saved revisions keep it; new evaluations no longer choose it.',
  restored: 'Back in use: new evaluations may choose it again.',
};

type Row = typeof deviceClass.$inferSelect;
interface Change {
  id: string;
  kind: string;
  params: unknown;
  /** A class not yet stored (a copy or a new one). */
  fresh?: boolean;
}

/** Every change to the catalog: an admin's form post, checked field by field and then as a whole before anything is written. */
export async function actOnCatalog(action: CatalogAction, adminId: string): Promise<Outcome<{ id: string; done: CatalogDone }>> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .select()
      .from(deviceClass)
      .orderBy(sql`rowid`);
    const target = 'id' in action ? rows.find((row) => row.id === action.id) : undefined;
    if ('id' in action && !target) return refuse('not-found', 'That device class no longer exists.');
    const change = changeOf(action, target, rows);
    if (!change.ok) return change;
    const checked = checkWhole(rows, change.value);
    if (!checked.ok) return checked;
    const { id, kind, params } = change.value;
    const name = typeof (params as { label?: unknown }).label === 'string' ? (params as { label: string }).label : (target?.name ?? kind);
    if (change.value.fresh) await tx.insert(deviceClass).values({ id, kind, name, params, updatedBy: adminId });
    else await tx.update(deviceClass).set({ params, name, updatedBy: adminId, updatedAt: new Date() }).where(eq(deviceClass.id, id));
    forgetCatalog();
    return succeed({ id, done: doneOf(action) });
  });
}

const doneOf = (action: CatalogAction): CatalogDone =>
  action.intent === 'edit' || action.intent === 'json'
    ? 'saved'
    : action.intent === 'copy'
      ? 'copied'
      : action.intent === 'add'
        ? 'added'
        : action.intent === 'retire'
          ? 'retired'
          : 'restored';

const notValid = (message: string, path = 'params') => invalidInput('invalid_device_class', [{ path, message }]);

function changeOf(action: CatalogAction, target: Row | undefined, rows: readonly Row[]): Outcome<Change> {
  if (action.intent === 'add') {
    const [template] = defaultCatalog[action.kind];
    return succeed(copyOf(action.kind, template, action.label, rows));
  }
  if (!target) return refuse('not-found', 'That device class no longer exists.');
  const { id, kind } = target;
  switch (action.intent) {
    case 'edit': {
      const read = readClassForm(kind, target.params, formFields(action));
      const [first] = read.issues;
      if (first) {
        const label = classFields(kind, target.params).find((field) => field.name === first.path)?.label ?? 'a figure';
        return refuse('invalid', `Not saved: ${target.name} — ${label}: ${lowerFirst(first.message)}`, {
          code: 'invalid_device_class',
          issues: read.issues,
        });
      }
      return succeed({ id, kind, params: read.params });
    }
    case 'json':
      try {
        return succeed({ id, kind, params: JSON.parse(action.params) as unknown });
      } catch {
        return notValid('The parameters are not valid JSON; check commas, quotes and brackets.');
      }
    case 'copy':
      if (!isClassList(kind)) return refuse('wrong-state', `${target.name} is a single section of the catalog; it has no copies.`);
      return succeed(copyOf(kind, target.params, action.label, rows));
    case 'retire':
    case 'restore': {
      if (!isClassList(kind)) return refuse('wrong-state', `${target.name} is a single section of the catalog; it cannot be retired.`);
      const { retired: _was, ...rest } = target.params as Record<string, unknown>;
      return succeed({ id, kind, params: action.intent === 'retire' ? { ...rest, retired: true } : rest });
    }
  }
}

const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);

const isClassList = (kind: string): kind is ClassList => (CLASS_LISTS as readonly string[]).includes(kind);

/** The typed figures of an edit: every posted `f.<path>` field as text. */
function formFields(action: Record<string, unknown>): Record<string, string> {
  return Object.fromEntries(
    Object.entries(action).filter((entry): entry is [string, string] => entry[0].startsWith(FIELD_PREFIX) && typeof entry[1] === 'string'),
  );
}

/** A new class from another's figures, with its own name and an identifier made from it. */
function copyOf(kind: ClassList, from: unknown, label: string, rows: readonly Row[]): Change {
  const taken = new Set(rows.filter((row) => row.kind === kind).map((row) => (row.params as { id?: string }).id));
  const base =
    label
      .toLowerCase()
      .normalize('NFKD')
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .slice(0, 40) || 'class';
  let classKey = base;
  for (let n = 2; taken.has(classKey); n++) classKey = `${base}-${n}`;
  const { retired: _was, ...figures } = structuredClone(from) as Record<string, unknown>;
  return { id: `${kind}:${classKey}`, kind, params: { ...figures, id: classKey, label }, fresh: true };
}

/** The whole catalog with the change, through the engine's schema; a refusal names the class and the field. */
function checkWhole(rows: readonly Row[], change: Change): Outcome<void> {
  const edited: DeviceClassRow[] = change.fresh
    ? [...rows, { ...change, name: '' }]
    : rows.map((row) => (row.id === change.id ? { ...row, params: change.params } : row));
  const checked = catalogSchema.safeParse(draftFromRows(edited));
  if (checked.success) return succeed(undefined);
  const issue = checked.error.issues[0];
  if (!issue) return notValid('Not saved: the catalog does not read.');
  const [kind, ...rest] = issue.path.map(String);
  const ofKind = edited.filter((row) => row.kind === kind);
  const listed = isClassList(kind ?? '') && rest.length > 0;
  const culprit = listed ? ofKind[Number(rest[0])] : ofKind[0];
  const fieldPath = listed ? rest.slice(1) : rest;
  const className = culprit ? (culprit.id === change.id ? classNameOf(change, culprit) : culprit.name) : kindName(kind ?? '');
  const field = fieldPath.filter((part) => !/^\d+$/.test(part)).at(-1);
  const what = isClassList(kind ?? '') && rest.length === 0 ? kindName(kind ?? '') : className;
  const message = `Not saved: ${what} — ${field ? `${lookOf(field).label}: ` : ''}${readableIssue(issue)}.`;
  // The edited class's own field also shows the message beside it.
  const path = culprit?.id === change.id && fieldPath.length > 0 ? FIELD_PREFIX + fieldPath.join('.') : 'params';
  return invalidInput('invalid_device_class', [{ path, message }]);
}

const classNameOf = (change: Change, row: { name: string }) => {
  const label = (change.params as { label?: unknown } | null)?.label;
  return typeof label === 'string' && label ? label : row.name;
};

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
