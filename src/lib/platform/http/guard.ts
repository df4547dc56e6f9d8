/**
 * The one guard every page and API route uses. Pages redirect anonymous
 * visitors to sign-in and show the 403 page to the wrong role; API routes
 * answer 401/403 as JSON (docs/api.md).
 */
import type { APIContext, AstroGlobal } from 'astro';
import { forbidden, unauthorized } from './responses';
import type { Role } from '../auth/roles';

export type SignedInUser = NonNullable<App.Locals['user']>;

export const STAFF: readonly Role[] = ['engineer', 'admin'];
export const ADMIN_ONLY: readonly Role[] = ['admin'];
export const ANY_ROLE: readonly Role[] = ['client', 'engineer', 'admin'];

export function hasRole(user: App.Locals['user'], roles: readonly Role[]): user is SignedInUser {
  return user !== null && roles.includes(user.role);
}

export function isStaff(user: App.Locals['user']): boolean {
  return hasRole(user, STAFF);
}

type Gate = { ok: true; user: SignedInUser } | { ok: false; response: Response };

export function guardApi(context: Pick<APIContext, 'locals'>, roles: readonly Role[]): Gate {
  const { user } = context.locals;
  if (!user) return { ok: false, response: unauthorized() };
  if (!roles.includes(user.role)) return { ok: false, response: forbidden() };
  return { ok: true, user };
}

export async function guardPage(astro: AstroGlobal, roles: readonly Role[]): Promise<Gate> {
  const { user } = astro.locals;
  if (!user) {
    const next = astro.url.pathname + astro.url.search;
    return { ok: false, response: astro.redirect(`/sign-in?next=${encodeURIComponent(next)}`, 303) };
  }
  if (!roles.includes(user.role)) return { ok: false, response: await astro.rewrite('/403') };
  return { ok: true, user };
}
