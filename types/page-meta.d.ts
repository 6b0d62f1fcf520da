import type { Capability } from '#shared/utils/capabilities'

declare module '#app' {
  interface PageMeta {
    /** What the page needs (shared/utils/capabilities.ts); a role without it is sent to its home page. */
    can?: Capability
    /** Open to signed-out visitors (sign-in, invitations). */
    public?: boolean
    /** The page shows weather: the caution is shown under it. */
    weather?: boolean
  }
}

export {}
