import type { H3Event } from 'h3'
import { and, eq, gte, or, schema, sql, useDB } from '../../utils/db'

export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000
export const SIGN_IN_MAX_FAILURES = 5

/** The caller's address; X-Forwarded-For is trusted only behind a proxy we were told about. */
export function clientAddress(event: H3Event): string {
  const trust = process.env.VEERLINE_TRUST_PROXY === '1'
  return getRequestIP(event, { xForwardedFor: trust })?.split(',')[0]?.trim() || 'unknown'
}

/** Seconds until the caller may try again, or 0 when not locked out. */
export async function signInWaitS(email: string, address: string): Promise<number> {
  const since = new Date(Date.now() - SIGN_IN_WINDOW_MS)
  const t = schema.signInFailures
  const rows = await useDB().select({
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

export async function recordSignInFailure(email: string, address: string) {
  await useDB().insert(schema.signInFailures).values({ email, clientAddress: address })
}
