import type { RoleName } from '#shared/utils/roles'

declare module '#app' {
  interface PageMeta {
    /** Roles that may open the page; others are sent to their home page. */
    roles?: RoleName[]
    /** Open to signed-out visitors (sign-in, invitations). */
    public?: boolean
    /** The page shows weather: the caution is shown under it. */
    weather?: boolean
  }
}

export {}
