/** GET /api/v1/files/:id — the file's bytes as an attachment, for its brief's owner and staff. */
import type { APIRoute } from 'astro';
import { logFailure } from '~/lib/platform/log';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { apiError, notFound } from '~/lib/platform/http/responses';
import { findFileFor, uploadStore } from '~/lib/briefs/file-store.server';
import { attachmentDisposition } from '~/lib/platform/uploads/file-names';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const file = await findFileFor(gate.user, context.params.id ?? '');
  if (!file) return notFound();
  const bytes = await uploadStore.get(file.storageKey);
  if (!bytes) {
    const errorId = logFailure(new Error('upload bytes missing'), { fileId: file.id, storageKey: file.storageKey });
    return apiError(500, 'file_missing', {
      errorId,
      message: `The file’s contents are missing from storage; ask an engineer to restore it (reference ${errorId}).`,
    });
  }
  return new Response(bytes, {
    status: 200,
    headers: {
      'content-type': file.mimeType,
      'content-length': String(bytes.byteLength),
      'content-disposition': attachmentDisposition(file.originalName),
      'x-content-type-options': 'nosniff',
      'cache-control': 'private, no-store',
      // Even if opened in place, an upload may run nothing and load nothing.
      'content-security-policy': "default-src 'none'; sandbox",
    },
  });
};
