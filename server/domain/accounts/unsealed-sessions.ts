/**
 * Unsealing the session cookie once per cookie, not once per request. The cookie is sealed by h3 (iron: AES-256
 * and an HMAC-SHA-256 over it, each key derived with PBKDF2): the same sealed text always unseals to the same
 * content, so once h3 has checked and opened a cookie, the next request carrying exactly that text is given the
 * opened content instead of opening it again. Kept until the seal itself would be refused (its creation time plus
 * the session's maxAge, as h3 checks it) and at most KEEP_MS; bounded in entries, oldest out first.
 * This does not decide whether a session holds: the stored session row and its user are still read on every
 * request (session-store.ts), so signing out, a reset, a role change or a disable bite at once.
 */
import type { H3Event } from 'h3'

const KEEP_MS = 10 * 60_000
const MAX_ENTRIES = Number(process.env.VEERLINE_UNSEALED_SESSIONS) || 20_000

type Opened = { id: string, createdAt: number, data: Record<string, unknown>, until: number }
const opened = new Map<string, Opened>()

type SessionConfig = { name?: string, maxAge?: number }
function config(): SessionConfig {
  return (useRuntimeConfig() as unknown as { session?: SessionConfig }).session ?? {}
}
const nameOf = (c: SessionConfig) => c.name || 'nuxt-session'

/** The sealed session text of this request, looked for where h3 looks (its session header, then the cookie). */
export function sealedSessionOf(event: H3Event): string | undefined {
  const name = nameOf(config())
  const header = event.node.req.headers[`x-${name.toLowerCase()}-session`]
  if (typeof header === 'string' && header) return header
  const cookie = event.node.req.headers.cookie
  if (!cookie || !cookie.includes(`${name}=`)) return undefined
  const value = parseCookies(event)[name]
  return value || undefined
}

type Sessions = Record<string, { id: string, createdAt: number, data: Record<string, unknown> }>
const sessionsOf = (event: H3Event) => (event.context.sessions ??= Object.create(null)) as Sessions

/** Gives h3 the opened content of `sealed` when it was opened before and is still valid; true when it did. */
export function primeUnsealed(event: H3Event, sealed: string): boolean {
  const entry = opened.get(sealed)
  if (!entry) return false
  if (Date.now() >= entry.until) {
    opened.delete(sealed)
    return false
  }
  const sessions = sessionsOf(event)
  const name = nameOf(config())
  if (sessions[name]) return false
  // A copy: h3 updates a session's data in place (Object.assign) when the route changes it.
  sessions[name] = { id: entry.id, createdAt: entry.createdAt, data: { ...entry.data } }
  return true
}

/** After h3 opened `sealed` for this request: keeps what it found, when it found a session in it. */
export function keepUnsealed(event: H3Event, sealed: string) {
  const c = config()
  const session = sessionsOf(event)[nameOf(c)]
  if (!session?.id || !session.createdAt || !session.data || typeof session.data.sid !== 'string') return
  const now = Date.now()
  const sealEnd = c.maxAge ? session.createdAt + c.maxAge * 1000 : Number.POSITIVE_INFINITY
  const until = Math.min(now + KEEP_MS, sealEnd)
  if (until <= now) return
  opened.set(sealed, { id: session.id, createdAt: session.createdAt, data: { ...session.data }, until })
  while (opened.size > MAX_ENTRIES) opened.delete(opened.keys().next().value as string)
}
