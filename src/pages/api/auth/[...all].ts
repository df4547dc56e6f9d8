import type { APIRoute } from 'astro';
import { auth } from '~/lib/platform/auth';
import { guardAuthRoute } from '~/lib/platform/rate-limit/sign-in-limit';

export const ALL: APIRoute = (context) => guardAuthRoute(context, (request) => auth.handler(request));
