/** Shared by the upload tests: the stack's upload folder, brief ids, and posting a file. */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { eq, like } from 'drizzle-orm';
import { inject } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { brief, briefFile } from '../../../src/lib/platform/db/schema';
import type { Visitor } from '../../support/client';

export const baseUrl = inject('baseUrl');
const databaseUrl = inject('databaseUrl');
// Read-only: the tests look at what the server wrote, never write themselves.
export const { db } = connect(databaseUrl);

/** The stack sets UPLOAD_DIR to `uploads` beside the database file. */
export const dataDir = path.dirname(databaseUrl.slice('file:'.length));
export const uploadDir = path.join(dataDir, 'uploads');

export const storedFiles = (): string[] => {
  try {
    return readdirSync(uploadDir);
  } catch {
    return [];
  }
};

export const fixture = (name: string) => new Uint8Array(readFileSync(new URL(`../../fixtures/uploads/${name}`, import.meta.url)));

export async function briefIdTitled(prefix: string): Promise<string> {
  const [row] = await db
    .select({ id: brief.id })
    .from(brief)
    .where(like(brief.title, `${prefix}%`))
    .limit(1);
  if (!row) throw new Error(`No demo brief is titled "${prefix}…"`);
  return row.id;
}

export const fileRowsOf = (briefId: string) => db.select().from(briefFile).where(eq(briefFile.briefId, briefId));

export interface Part {
  bytes: Uint8Array;
  name: string;
  kind?: string;
  /** What the browser claims; the server must not believe it. */
  type?: string;
}

export function uploadForm(part: Part): FormData {
  const form = new FormData();
  form.set('file', new Blob([part.bytes as Uint8Array<ArrayBuffer>], { type: part.type ?? 'application/octet-stream' }), part.name);
  if (part.kind !== undefined) form.set('kind', part.kind);
  return form;
}

export const upload = (visitor: Visitor, briefId: string, part: Part) =>
  visitor.request(`/api/v1/briefs/${briefId}/files`, { method: 'POST', body: uploadForm(part) });

export const EXE = new Uint8Array([
  0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00, 0x00, 0x00, 0xff, 0xff, 0x00, 0x00, 0xb8, 0, 0, 0,
]);
export const MAX_BYTES = 10 * 1024 * 1024;
