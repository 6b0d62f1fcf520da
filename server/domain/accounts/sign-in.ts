import type { User } from '../../db/schema'
import { and, eq, gte, schema, sql, transaction, useDB } from '../../utils/db'
import { recordAudit } from '../../utils/audit'
import { unauthorised } from '../../utils/errors'
import { credentialsMatch } from './credentials'
import { clearSignInFailures, takeSignInAttempt } from './sign-in-limit'
import { issueToken } from './tokens'

export type SignInResult = { kind: 'locked', waitS: number } | { kind: 'signed-in', user: User }

/**
 * Checks an e-mail and password. An unknown e-mail costs the same hash work as a known one (a fixed dummy hash), so
 * timing does not tell which exist; one message whatever went wrong. The route starts the session.
 */
export async function signIn(email: string, password: string, address: string): Promise<SignInResult> {
  // Counted as a failure until the password proves right (see takeSignInAttempt).
  const waitS = await takeSignInAttempt(email, address)
  if (waitS > 0) return { kind: 'locked', waitS }
  const [user] = await useDB().select().from(schema.users).where(eq(schema.users.email, email))
  const ok = await credentialsMatch(user, password, { hash: hashPassword, verify: verifyPassword })
  if (!user || !ok) throw unauthorised('E-mail or password not recognised')
  await clearSignInFailures(email)
  await recordAudit(useDB(), { user }, 'session.sign-in', 'user', user.id)
  return { kind: 'signed-in', user }
}

const RESET_WINDOW_MS = 15 * 60 * 1000
const RESET_MAX_PER_WINDOW = 3

/**
 * Sends a reset link when the address has a usable account, at most 3 per account per 15 minutes so the address
 * cannot be flooded. The route answers before this runs (`event.waitUntil`), so neither the answer nor its timing
 * tells whether the address has an account. Each request for an account is audited, with whether a link went out.
 */
export async function requestPasswordReset(email: string, appUrl: string) {
  await transaction(async (tx) => {
    const [user] = await tx.select().from(schema.users).where(eq(schema.users.email, email)).for('update')
    const t = schema.userTokens
    const [recent] = await tx.select({ n: sql<number>`COUNT(*)` }).from(t)
      .where(and(eq(t.userId, user?.id ?? 0), eq(t.purpose, 'password-reset'), gte(t.createdAt, new Date(Date.now() - RESET_WINDOW_MS))))
    if (!user) return
    const usable = !user.disabled && Boolean(user.passwordHash)
    const withinLimit = Number(recent?.n ?? 0) < RESET_MAX_PER_WINDOW
    if (usable && withinLimit) await issueToken(tx, 'password-reset', user, appUrl)
    await recordAudit(tx, { label: 'password-reset request', userId: user.id }, 'user.request-reset', 'user', user.id, {
      linkSent: usable && withinLimit,
      ...(usable ? {} : { why: user.disabled ? 'account disabled' : 'no password yet (invitation pending)' }),
      ...(usable && !withinLimit ? { why: `already ${RESET_MAX_PER_WINDOW} links in ${RESET_WINDOW_MS / 60_000} minutes` } : {}),
    })
  })
}
