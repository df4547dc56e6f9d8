import { signUpSchema } from '~/lib/accounts/schemas';
import { registerClient } from '~/lib/accounts/accounts.server';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';
import { clientAddressOf } from '~/lib/platform/rate-limit/client-address';

/** Client sign-up with the company profile, for the wizard's inline account step. */
export const POST = apiMutation({
  access: 'anyone',
  body: signUpSchema,
  run: ({ body, context }) => registerClient(body, context.request.headers, clientAddressOf(context)),
  answer: (created) => {
    const response = json({ id: created.userId, name: created.name }, 201);
    for (const cookie of created.headers.getSetCookie()) response.headers.append('set-cookie', cookie);
    return response;
  },
});
