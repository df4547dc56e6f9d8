/** POST /api/v1/briefs/:id/files — attach one file (multipart field `file`, optional `kind`). */
import { briefOf } from '~/lib/briefs/briefs.server';
import { saveUpload } from '~/lib/briefs/file-store.server';
import { closedMessage, isClosedBrief } from '~/lib/briefs/files.server';
import { ANY_ROLE } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { refuse } from '~/lib/platform/outcome';
import { readUploadForm } from '~/lib/platform/uploads/read-upload-form';

/** The body is multipart, read by the upload reader with its own (larger) limit once the brief is known to take files. */
export const POST = apiMutation({
  access: ANY_ROLE,
  run: async ({ user, context }) => {
    // Clients find only their own briefs; staff find every brief.
    const target = await briefOf(user, context.params.id);
    if (!target.ok) return target;
    if (isClosedBrief(target.value.state)) return refuse('wrong-state', closedMessage(target.value.state));
    const form = await readUploadForm(context.request);
    if (!form.ok) return form;
    return saveUpload({
      briefId: target.value.id,
      uploaderId: user.id,
      kind: form.value.kind,
      name: form.value.file.name,
      bytes: new Uint8Array(await form.value.file.arrayBuffer()),
    });
  },
  answer: (file) => json(file, 201),
});
