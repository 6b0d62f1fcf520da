// What the sealed session cookie carries (nuxt-auth-utils). The stored session and the user are re-read on every request.
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: 'admin' | 'dispatcher' | 'pilot' | 'safety'
  }
  interface UserSession {
    // The random session id whose SHA-256 names the user_sessions row (server/domain/accounts/session-store.ts).
    sid?: string
    signedInAt?: string
    seenAt?: string
  }
}

export {}
