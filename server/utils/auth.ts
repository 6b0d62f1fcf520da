import type { H3Event } from 'h3'
import type { RoleName } from '#shared/utils/roles'
import type { User } from '../db/schema'
import { eq, schema, useDB } from './db'

// Who may file (a feed's API token or a signed-in dispatcher or admin); its body moves here from the accounts module.
export { requireFiler } from '../domain/accounts/api-tokens'

/**
 * Who is asking: the signed-in user as the database knows them now.
 * A disabled or removed user's session is cleared and answered 401 on its next request.
 */
export async function requireUser(event: H3Event): Promise<User> {
  const session = await requireUserSession(event, { message: 'Sign in first' })
  const [user] = await useDB().select().from(schema.users).where(eq(schema.users.id, session.user.id))
  if (!user || user.disabled) {
    await clearUserSession(event)
    throw createError({ statusCode: 401, statusMessage: user ? 'This account is disabled' : 'Sign in first' })
  }
  event.context.user = user
  return user
}

/** requireUser, then 403 unless the user's role is one of `allowed`. */
export async function requireRole(event: H3Event, ...allowed: RoleName[]): Promise<User> {
  const user = await requireUser(event)
  if (!allowed.includes(user.role)) {
    throw createError({
      statusCode: 403,
      statusMessage: `This needs the role ${allowed.join(' or ')}; you are signed in as ${user.role}`,
    })
  }
  return user
}

export function sessionUser(user: User) {
  return { id: user.id, email: user.email, name: user.name, role: user.role }
}

declare module 'h3' {
  interface H3EventContext {
    user?: User
  }
}
