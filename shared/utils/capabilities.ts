import type { RoleName } from './roles'

/**
 * What each role may do: the one map used by server routes (`requireCapability`), page meta
 * (`definePageMeta({ can: '…' })`), the navigation and the buttons (`can(user, '…')`).
 */
export const CAPABILITIES = {
  'read-briefings': ['admin', 'dispatcher', 'pilot', 'safety'],
  'record-receipt': ['pilot'],
  'manage-airfields': ['dispatcher', 'admin'],
  'file-profile': ['dispatcher', 'admin'],
  'withdraw-profile': ['dispatcher', 'admin'],
  'manage-tokens': ['dispatcher', 'admin'],
  'manage-limits': ['safety', 'admin'],
  'read-alert-log': ['safety', 'admin'],
  'read-audit': ['safety', 'admin'],
  'manage-users': ['admin'],
  'read-mailbox': ['admin'],
} as const satisfies Record<string, readonly RoleName[]>

export type Capability = keyof typeof CAPABILITIES

/** Whether a user (or a bare role) may do `capability`; a signed-out caller may do nothing. */
export function can(who: { role: RoleName } | RoleName | null | undefined, capability: Capability): boolean {
  const role = typeof who === 'string' ? who : who?.role
  return !!role && (CAPABILITIES[capability] as readonly RoleName[]).includes(role)
}

/** The roles that have a capability, for messages ("This needs the role dispatcher or admin"). */
export function rolesWith(capability: Capability): readonly RoleName[] {
  return CAPABILITIES[capability]
}
