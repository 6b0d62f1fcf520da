// Every state, kind and role a page names (profile sources: PROFILE_SOURCE_LABELS beside their schema), in plain words, through one map. Pages call `words(category, value)`;
// a value the map does not know is shown with its dashes as spaces rather than as an internal slug.
import { KIND_WORDS } from '../limits'
import { ROLE_LABELS } from './roles'

const WORDS = {
  role: ROLE_LABELS as Record<string, string>,
  alertKind: KIND_WORDS as Record<string, string>,
  alertState: { active: 'Active', cleared: 'Cleared', superseded: 'Replaced by a newer profile', expired: 'Expired' } as Record<string, string>,
  inboxEvent: { raised: 'Raised', cleared: 'Cleared' } as Record<string, string>,
  profileStatus: { active: 'In force', superseded: 'Superseded', withdrawn: 'Withdrawn' } as Record<string, string>,
  deliveryState: { queued: 'Waiting to be sent', sent: 'Sent', failed: 'Failed' } as Record<string, string>,
  deliveryKind: { 'alert-raised': 'Alert raised', 'alert-cleared': 'Alert cleared', 'invitation': 'Invitation', 'password-reset': 'Password reset' } as Record<string, string>,
  channel: { email: 'E-mail', push: 'Web push' } as Record<string, string>,
  userState: { active: 'Active', invited: 'Invited, has not set a password yet', disabled: 'Disabled' } as Record<string, string>,
  limitSource: { 'built-in default': 'built-in default', 'organisation': 'organisation', 'airfield': 'this airfield', 'runway end': 'this runway end' } as Record<string, string>,
} as const

export type WordCategory = keyof typeof WORDS

export function words(category: WordCategory, value: string | null | undefined): string {
  if (value == null || value === '') return ''
  return WORDS[category][value] ?? value.replace(/-/g, ' ')
}

/** The known values of a category with their words, in the map's order (for filters and pickers). */
export function wordOptions(category: WordCategory): { value: string, label: string }[] {
  return Object.entries(WORDS[category]).map(([value, label]) => ({ value, label }))
}

export type UserState = 'active' | 'invited' | 'disabled'

/** A user's state in words (the Users page). */
export function userStateWord(state: UserState): string {
  return words('userState', state)
}
