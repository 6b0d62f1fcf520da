import type { RoleName } from '#shared/utils/roles'

export type NavItem = { to: string, label: string, roles: RoleName[] }

// The navigation, per role: a role sees only what it may use.
export const NAV_ITEMS: NavItem[] = [
  { to: '/briefings', label: 'Briefings', roles: ['admin', 'dispatcher', 'pilot', 'safety'] },
  { to: '/airfields', label: 'Airfields', roles: ['admin', 'dispatcher', 'pilot', 'safety'] },
  { to: '/safety', label: 'Limits', roles: ['admin', 'safety'] },
  { to: '/alerts/log', label: 'Alert log', roles: ['admin', 'safety'] },
  { to: '/audit', label: 'Audit', roles: ['admin', 'safety'] },
  { to: '/tokens', label: 'Tokens', roles: ['dispatcher', 'admin'] },
  { to: '/admin/users', label: 'Users', roles: ['admin'] },
  // Local stand-ins for the hosted mail and push services (development and demo).
  { to: '/mailbox', label: 'Mailbox', roles: ['admin'] },
  { to: '/device', label: 'Device', roles: ['admin', 'dispatcher', 'pilot', 'safety'] },
]

export function navFor(role: RoleName | undefined): NavItem[] {
  return role ? NAV_ITEMS.filter(i => i.roles.includes(role)) : []
}
