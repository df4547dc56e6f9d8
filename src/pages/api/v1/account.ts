import type { APIRoute } from 'astro';
import { signUpSchema } from '~/lib/accounts/schemas';
import { registerClient } from '~/lib/accounts/accounts.server';
import { apiError, json } from '~/lib/platform/http/responses';
import { parseBody } from '~/lib/platform/http/validation';

/** Client sign-up with the company profile, for the wizard's inline account step. */
export const POST: APIRoute = async (context) => {
  const body = await parseBody(context.request, signUpSchema);
  if (!body.ok) return body.response;
  const outcome = await registerClient(body.value, context.request.headers);
  if (!outcome.ok)
    return apiError(outcome.status, outcome.status === 409 ? 'account_exists' : 'sign_up_failed', { message: outcome.message });
  const response = json({ id: outcome.userId, name: body.value.name }, 201);
  for (const cookie of outcome.headers.getSetCookie()) response.headers.append('set-cookie', cookie);
  return response;
};
