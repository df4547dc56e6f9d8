import type { APIRoute } from 'astro';
import { auth } from '~/lib/platform/auth';
import { redirectWithCookies } from '~/lib/accounts/form-actions';

export const POST: APIRoute = async ({ request }) => {
  const result = await auth.api.signOut({ headers: request.headers, returnHeaders: true }).catch(() => null);
  return redirectWithCookies('/', result?.headers ?? new Headers());
};
