/** Internal notes on a brief: the consultancy's own record, never shown to the client. */
import { desc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../platform/db';
import { briefNote, user } from '../platform/db/schema';

export const noteRequestSchema = z
  .object({
    body: z
      .string()
      .trim()
      .min(1, { error: 'Write something in the note.' })
      .max(4_000, { error: 'Keep the note under 4 000 characters.' }),
  })
  .strict();

export async function listNotes(briefId: string) {
  return db
    .select({ id: briefNote.id, body: briefNote.body, createdAt: briefNote.createdAt, author: user.name })
    .from(briefNote)
    .leftJoin(user, eq(user.id, briefNote.authorId))
    .where(eq(briefNote.briefId, briefId))
    .orderBy(desc(briefNote.createdAt), desc(briefNote.id));
}

export async function addNote(briefId: string, authorId: string, body: string) {
  const [row] = await db.insert(briefNote).values({ briefId, authorId, body }).returning();
  if (!row) throw new Error('Insert returned no row');
  return row;
}

export function noteJson(row: { id: string; body: string; createdAt: Date; author?: string | null }) {
  return { id: row.id, body: row.body, author: row.author ?? null, createdAt: row.createdAt.toISOString() };
}
