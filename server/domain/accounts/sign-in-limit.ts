import type { H3Event } from 'h3'
import { and, eq, gte, or, schema, sql, takeTurn, transaction, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'

export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000
export const SIGN_IN_MAX_FAILURES = 5

/** The caller's address; X-Forwarded-For is trusted only behind a proxy we were told about. */
export function clientAddress(event: H3Event): string {
  const trust = process.env.VEERLINE_TRUST_PROXY === '1'
  return getRequestIP(event, { xForwardedFor: trust })?.split(',')[0]?.trim() || 'unknown'
}

/** Seconds until the caller may try again, or 0 when not locked out. */
export async function signInWaitS(email: string, address: string, db: DB | Tx = useDB()): Promise<number> {
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MS)
  const t = schema.signInFailures
  const rows = await db.select({
    key: sql<string>`IF(${t.email} = ${email}, 'email', 'address')`,
    n: sql<number>`COUNT(*)`,
    oldest: sql<Date>`MIN(${t.at})`,
  }).from(t)
    .where(and(gte(t.at, since), or(eq(t.email, email), eq(t.clientAddress, address))))
    .groupBy(sql`1`)
  let waitS = 0
  for (const row of rows) {
    if (Number(row.n) >= SIGN_IN_MAX_FAILURES) {
      const oldest = new Date(row.oldest).getTime()
      waitS = Math.max(waitS, Math.ceil((oldest + SIGN_IN_WINDOW_MS - Date.now()) / 1000))
    }
  }
  return Math.max(waitS, 0)
}

/**
 * Takes one sign-in attempt for this e-mail and address, or says how many seconds to wait (then nothing is taken).
 * The attempt counts as a failure from here on, until clearSignInFailures() after the right password, so attempts
 * made at the same moment, through any instance on any Galera node, cannot add up to more than the limit: the check
 * and the count are one transaction that first writes the e-mail's and the address's turn rows (takeTurn), so two
 * of them for the same key take turns.
 */
export async function takeSignInAttempt(email: string, address: string): Promise<number> {
  return transaction(async (tx) => {
    await takeTurn(tx, `sign-in:email:${email}`, `sign-in:address:${address}`)
    const waitS = await signInWaitS(email, address, tx)
    if (waitS === 0) await tx.insert(schema.signInFailures).values({ email, clientAddress: address })
    return waitS
  })
}

/** After the right password: the e-mail's failures (this attempt's among them) are forgotten. */
export async function clearSignInFailures(email: string) {
  await useDB().delete(schema.signInFailures).where(eq(schema.signInFailures.email, email))
}
