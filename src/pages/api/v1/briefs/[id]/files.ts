/** POST /api/v1/briefs/:id/files — attach one file (multipart field `file`, optional `kind`). */
import type { APIRoute } from 'astro';
import { findBriefFor } from '~/lib/briefs/briefs.server';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { apiError, conflict, invalid, json, notFound } from '~/lib/platform/http/responses';
import { saveUpload } from '~/lib/briefs/file-store.server';
import { closedMessage, isClosedBrief, type SaveOutcome } from '~/lib/briefs/files.server';
import { readUploadForm } from '~/lib/platform/uploads/read-upload-form';

function refusalResponse(outcome: Exclude<SaveOutcome, { ok: true }>): Response {
  switch (outcome.reason) {
    case 'invalid':
      return invalid(outcome.error, [{ path: outcome.path, message: outcome.message }]);
    case 'too_large':
      return apiError(413, 'file_too_large', { message: outcome.message });
    case 'type_not_accepted':
      return apiError(415, 'file_type_not_accepted', { message: outcome.message });
    case 'not_found':
      return notFound();
    case 'closed':
      return conflict(outcome.message);
  }
}

export const POST: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  // Clients find only their own briefs; staff find every brief.
  const target = await findBriefFor(gate.user, context.params.id ?? '');
  if (!target) return notFound();
  if (isClosedBrief(target.status)) return conflict(closedMessage(target.status));

  const form = await readUploadForm(context.request);
  if (!form.ok) return form.response;
  const outcome = await saveUpload({
    briefId: target.id,
    uploaderId: gate.user.id,
    kind: form.kind,
    name: form.file.name,
    bytes: new Uint8Array(await form.file.arrayBuffer()),
  });
  return outcome.ok ? json(outcome.file, 201) : refusalResponse(outcome);
};
