import type { APIRoute } from 'astro';
import { findBriefFor } from '~/lib/briefs/briefs.server';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { json, notFound } from '~/lib/platform/http/responses';
import { addNote, listNotes, noteJson, noteRequestSchema } from '~/lib/briefs/notes.server';
import { parseBody } from '~/lib/platform/http/validation';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  return json({ items: (await listNotes(row.id)).map(noteJson) });
};

export const POST: APIRoute = async (context) => {
  const body = await parseBody(context.request, noteRequestSchema, 'invalid_note');
  if (!body.ok) return body.response;
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const row = await findBriefFor(gate.user, context.params.id ?? '');
  if (!row) return notFound();
  const note = await addNote(row.id, gate.user.id, body.value.body);
  return json(noteJson({ ...note, author: gate.user.name }), 201);
};
