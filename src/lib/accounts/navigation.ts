import type { Role } from '../platform/auth/roles';

export interface NavItem {
  href: string;
  label: string;
}

/** What each role sees in the top bar; the guard, not the menu, decides access. */
export function navigationFor(role: Role | null): NavItem[] {
  switch (role) {
    case 'client':
      return [
        { href: '/briefs', label: 'My briefs' },
        { href: '/quotes', label: 'My quotes' },
      ];
    case 'engineer':
      return [
        { href: '/desk', label: 'Desk' },
        { href: '/desk/quotes', label: 'Quotes' },
      ];
    case 'admin':
      return [
        { href: '/desk', label: 'Desk' },
        { href: '/desk/quotes', label: 'Quotes' },
        { href: '/admin/users', label: 'People' },
        { href: '/admin/rate-card', label: 'Rate card' },
        { href: '/admin/catalog', label: 'Catalog' },
        { href: '/admin/mail', label: 'Mail log' },
      ];
    case null:
      return [];
  }
}

/** The item a page belongs to: the longest address the path starts with, so /desk/quotes marks Quotes, not Desk. */
export function currentNavHref(items: readonly NavItem[], path: string): string | null {
  const matches = items.filter((item) => path === item.href || path.startsWith(`${item.href}/`));
  return matches.sort((a, b) => b.href.length - a.href.length)[0]?.href ?? null;
}
