export const ROLES = ['admin', 'dispatcher', 'pilot', 'safety'] as const
export type RoleName = typeof ROLES[number]

export const ROLE_LABELS: Record<RoleName, string> = {
  admin: 'Administrator',
  dispatcher: 'Dispatcher',
  pilot: 'Pilot',
  safety: 'Safety officer',
}

// Where each role lands after signing in.
export const ROLE_HOME: Record<RoleName, string> = {
  admin: '/admin/users',
  dispatcher: '/airfields',
  pilot: '/briefings',
  safety: '/safety',
}
