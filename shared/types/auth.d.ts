// What the sealed session cookie carries (nuxt-auth-utils). The role is re-read from the database on every request.
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: 'admin' | 'dispatcher' | 'pilot' | 'safety'
  }
}

export {}
