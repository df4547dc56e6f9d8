import type { APIRoute } from 'astro';
import { auth } from '~/lib/server/auth';

export const ALL: APIRoute = (ctx) => auth.handler(ctx.request);
