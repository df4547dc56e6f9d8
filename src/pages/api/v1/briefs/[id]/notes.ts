import type { APIRoute } from 'astro';
import { briefOf, findBriefFor } from '~/lib/briefs/briefs.server';
import { apiMutation } from '~/lib/platform/http/mutation';
import { succeed } from '~/lib/platform/outcome';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { json, notFound } from '~/lib/platform/http/responses';
import { addNote, listNotes, noteJson, noteRequestSchema } from '~/lib/briefs/notes.server';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  return json({ items: (await listNotes(row.id)).map(noteJson) });
};

export const POST = apiMutation({
  access: STAFF,
  body: noteRequestSchema,
  invalidCode: 'invalid_note',
  run: async ({ user, body, context }) => {
    const found = await briefOf(user, context.params.id);
    return found.ok ? succeed({ ...(await addNote(found.value.id, user.id, body.body)), author: user.name }) : found;
  },
  answer: (note) => json(noteJson(note), 201),
});
