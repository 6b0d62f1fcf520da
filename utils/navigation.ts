import type { RoleName } from '#shared/utils/roles'

export type NavItem = { to: string, label: string, roles: RoleName[] }

// The navigation, per role: a role sees only what it may use.
export const NAV_ITEMS: NavItem[] = [
  { to: '/briefings', label: 'Briefings', roles: ['admin', 'dispatcher', 'pilot', 'safety'] },
  { to: '/airfields', label: 'Airfields', roles: ['admin', 'dispatcher', 'pilot', 'safety'] },
  { to: '/safety', label: 'Limits', roles: ['admin', 'safety'] },
  { to: '/admin/users', label: 'Users', roles: ['admin'] },
  { to: '/audit', label: 'Audit', roles: ['admin', 'safety'] },
  { to: '/tokens', label: 'Tokens', roles: ['dispatcher', 'admin'] },
]

export function navFor(role: RoleName | undefined): NavItem[] {
  return role ? NAV_ITEMS.filter(i => i.roles.includes(role)) : []
}
