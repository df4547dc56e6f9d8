import { defineMiddleware, sequence } from 'astro:middleware';
import { serverReady } from './boot';
import { auth } from '~/lib/platform/auth';
import { isRole } from '~/lib/platform/auth/roles';
import { config } from '~/lib/platform/config';
import { apiError, internalError } from '~/lib/platform/http/responses';
import { logFailure } from '~/lib/platform/log';
import { expireLapsedQuotes } from '~/lib/quotes/expiry.server';
import { isCrossOriginWrite, securityHeaders } from '~/lib/platform/http/security';
import { islandScriptHashes } from '~/lib/platform/http/island-scripts';

const checkoutOrigin = config.payments.apiBase ? new URL(config.payments.apiBase).origin : undefined;
const headersReady = islandScriptHashes().then((hashes) => securityHeaders(config.production, checkoutOrigin, hashes));
const allowedOrigins = config.publicBaseUrl ? [new URL(config.publicBaseUrl).origin] : [];

const hardening = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.session = null;
  if (isCrossOriginWrite(context.request, context.url, allowedOrigins)) {
    return apiError(403, 'cross_origin', { message: 'This request came from another site and was refused.' });
  }
  await serverReady;
  let response: Response;
  try {
    response = await next();
  } catch (error) {
    const errorId = logFailure(error, { method: context.request.method, path: context.url.pathname });
    if (context.url.pathname.startsWith('/api/')) {
      response = internalError(errorId);
    } else {
      context.locals.errorId = errorId;
      response = await context.rewrite('/500');
    }
  }
  for (const [name, value] of Object.entries(await headersReady)) {
    if (!response.headers.has(name)) response.headers.set(name, value);
  }
  // A page shown to someone signed in holds their data: no shared cache and no back-button copy keeps it.
  if (context.locals.user && (response.headers.get('content-type') ?? '').startsWith('text/html'))
    response.headers.set('cache-control', 'private, no-store');
  return response;
});

const session = defineMiddleware(async (context, next) => {
  // No session cookie, no session: skip the lookup (anonymous pages, the public evaluate route).
  if (context.url.pathname.startsWith('/_astro/') || !(context.request.headers.get('cookie') ?? '').includes('session_token'))
    return next();
  const found = await auth.api.getSession({ headers: context.request.headers });
  if (found && isRole(found.user.role) && !found.user.banned) {
    context.locals.user = { id: found.user.id, name: found.user.name, email: found.user.email, role: found.user.role };
    context.locals.session = { id: found.session.id, expiresAt: found.session.expiresAt };
    // Lapsed quotes expire before anyone signed in reads a brief or a quote (no timer needed).
    await expireLapsedQuotes();
  }
  return next();
});

export const onRequest = sequence(hardening, session);
