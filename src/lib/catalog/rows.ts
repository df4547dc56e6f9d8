/**
 * The device-class catalog as table rows and back. Lists (regulators, Zener
 * series, pass devices, switchers, capacitor families) become one row per
 * class; the single-valued sections become one row each.
 */
import { CLASS_LISTS, catalogSchema, type Catalog } from '../engine/catalog';

export interface DeviceClassRow {
  id: string;
  kind: string;
  name: string;
  params: unknown;
}

const LIST_KINDS = CLASS_LISTS;
const SINGLE_KINDS = {
  version: 'Catalog version',
  inductors: 'Inductor family',
  heatsinks: 'Heatsink steps',
  diode: 'Catch and protection diode',
  thermal: 'Thermal assumptions',
  costs: 'Cost estimates',
} as const;

export function catalogToRows(catalog: Catalog): DeviceClassRow[] {
  const rows: DeviceClassRow[] = [];
  for (const kind of LIST_KINDS) {
    for (const item of catalog[kind]) rows.push({ id: `${kind}:${item.id}`, kind, name: item.label, params: item });
  }
  for (const [kind, name] of Object.entries(SINGLE_KINDS) as [keyof typeof SINGLE_KINDS, string][]) {
    rows.push({ id: kind, kind, name, params: catalog[kind] });
  }
  return rows;
}

/** The catalog's shape from rows in insertion order, not yet checked. */
export function draftFromRows(rows: readonly DeviceClassRow[]): Record<string, unknown> {
  const draft: Record<string, unknown> = {};
  for (const kind of LIST_KINDS) draft[kind] = [];
  for (const row of rows) {
    const list = draft[row.kind];
    if (Array.isArray(list)) list.push(row.params);
    else draft[row.kind] = row.params;
  }
  return draft;
}

/** Rebuilds and validates the catalog; throws a zod error naming the bad field. */
export function rowsToCatalog(rows: readonly DeviceClassRow[]): Catalog {
  return catalogSchema.parse(draftFromRows(rows));
}

function fillMissing(stored: unknown, shipped: unknown): unknown {
  if (!isPlainObject(stored) || !isPlainObject(shipped)) return stored;
  const out: Record<string, unknown> = { ...stored };
  for (const [key, value] of Object.entries(shipped)) out[key] = key in stored ? fillMissing(stored[key], value) : value;
  return out;
}

const isPlainObject = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

/**
 * A stored catalog brought up to the one this version ships: classes it lacks
 * are added, fields a class gained are filled from the shipped class, and every
 * figure already stored (an admin's edit included) is kept.
 */
export function upgradedRows(
  stored: readonly DeviceClassRow[],
  shipped: readonly DeviceClassRow[],
): { rows: DeviceClassRow[]; added: string[]; filled: string[] } {
  const shippedById = new Map(shipped.map((row) => [row.id, row]));
  const filled: string[] = [];
  const rows = stored.map((row) => {
    const fresh = shippedById.get(row.id);
    if (!fresh) return row;
    const params = fillMissing(row.params, fresh.params);
    if (JSON.stringify(params) === JSON.stringify(row.params)) return row;
    filled.push(row.id);
    return { ...row, params };
  });
  const have = new Set(stored.map((row) => row.id));
  const added = shipped.filter((row) => !have.has(row.id));
  return { rows: [...rows, ...added], added: added.map((row) => row.id), filled };
}
