// Plain words for the states, kinds, sources and roles the pages name: one map, a function per category.

export const WORDS = {
  userState: {
    active: 'Active',
    invited: 'Invited, has not set a password yet',
    disabled: 'Disabled',
  },
} as const

export type UserState = keyof typeof WORDS.userState

/** A user's state in words (the Users page). */
export function userStateWord(state: UserState): string {
  return WORDS.userState[state]
}
