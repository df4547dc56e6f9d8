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

/** The header's words for unread messages: text, so the count never rests on a coloured dot. */
export function unreadLabel(count: number): string {
  return count === 1 ? '1 unread message' : `${count} unread messages`;
}

/** Where the header's unread count leads: the thread of the brief with the newest unread message, on the viewer's side. */
export function unreadHref(role: Role, briefId: string): string {
  return role === 'client' ? `/briefs/${briefId}#messages` : `/desk/briefs/${briefId}#messages`;
}
