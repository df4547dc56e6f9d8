import type { APIRoute } from 'astro';
import { auth } from '~/lib/platform/auth';

export const ALL: APIRoute = (ctx) => auth.handler(ctx.request);
