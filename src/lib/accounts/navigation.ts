import type { Role } from '../platform/auth/roles';

export interface NavItem {
  href: string;
  label: string;
}

/** What each role sees in the top bar; the guard, not the menu, decides access. */
export function navigationFor(role: Role | null): NavItem[] {
  switch (role) {
    case 'client':
      return [{ href: '/briefs', label: 'My briefs' }];
    case 'engineer':
      return [{ href: '/desk', label: 'Desk' }];
    case 'admin':
      return [
        { href: '/desk', label: 'Desk' },
        { href: '/admin/users', label: 'People' },
        { href: '/admin/rate-card', label: 'Rate card' },
        { href: '/admin/catalog', label: 'Catalog' },
        { href: '/admin/mail', label: 'Mail log' },
      ];
    case null:
      return [];
  }
}
