import type { Capability } from '#shared/utils/capabilities'

/** A navigation item; `can` names what a user needs to see it (none: every signed-in user). */
export type NavItem = { to: string, label: string, can?: Capability }

// The navigation: a user sees only what their role may use (the one capability map decides).
export const NAV_ITEMS: NavItem[] = [
  { to: '/briefings', label: 'Briefings', can: 'read-briefings' },
  { to: '/airfields', label: 'Airfields', can: 'read-briefings' },
  { to: '/safety', label: 'Limits', can: 'manage-limits' },
  { to: '/alerts/log', label: 'Alert log', can: 'read-alert-log' },
  { to: '/audit', label: 'Audit', can: 'read-audit' },
  { to: '/tokens', label: 'Tokens', can: 'manage-tokens' },
  { to: '/admin/users', label: 'Users', can: 'manage-users' },
  // Local stand-ins for the hosted mail and push services (development and demo).
  { to: '/mailbox', label: 'Mailbox', can: 'read-mailbox' },
  { to: '/device', label: 'Device' },
]

export function navFor(user: Parameters<typeof can>[0]): NavItem[] {
  if (!user) return []
  return NAV_ITEMS.filter(i => !i.can || can(user, i.can))
}
