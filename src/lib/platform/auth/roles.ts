import { createAccessControl } from 'better-auth/plugins/access';
import { adminAc, defaultStatements } from 'better-auth/plugins/admin/access';

/** The three roles of the product; new sign-ups are clients, admins promote engineers. */
export const ROLES = ['client', 'engineer', 'admin'] as const;
export type Role = (typeof ROLES)[number];
export const DEFAULT_ROLE: Role = 'client';

export const ROLE_LABELS: Record<Role, string> = {
  client: 'Client',
  engineer: 'Engineer',
  admin: 'Admin',
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}

// User management (list users, set roles) belongs to admins alone; the
// product's own permissions (briefs, quotes) are checked by `guard.ts`.
export const accessControl = createAccessControl(defaultStatements);
export const authRoles = {
  client: accessControl.newRole({ user: [], session: [] }),
  engineer: accessControl.newRole({ user: [], session: [] }),
  admin: accessControl.newRole(adminAc.statements),
};
