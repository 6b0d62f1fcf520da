/**
 * A short per-instance memory of who a session belongs to, so that the signed-in floor of every route is not a
 * database read. Entries live at most `ttlMs` (1 s by default): a session ended or a user disabled or changed on any
 * instance bites within that time; on this instance at once, since every change here drops the user's entries.
 * Bounded in entries; the oldest go first. The clock is passed in, so tests need no waiting.
 */
export const SESSION_CACHE_TTL_MS = Math.min(1000, Number(process.env.VEERLINE_SESSION_CACHE_MS ?? 1000))
export const SESSION_CACHE_MAX = 10_000

type Entry<V> = { value: V, userId: number, expiresAt: number }

export class ShortSessionCache<V> {
  private map = new Map<string, Entry<V>>()
  constructor(private ttlMs = SESSION_CACHE_TTL_MS, private maxEntries = SESSION_CACHE_MAX) {}

  get(key: string, nowMs: number): V | undefined {
    const e = this.map.get(key)
    if (!e) return undefined
    if (e.expiresAt <= nowMs) {
      this.map.delete(key)
      return undefined
    }
    return e.value
  }

  set(key: string, userId: number, value: V, nowMs: number) {
    if (this.ttlMs <= 0) return
    this.map.delete(key)
    this.map.set(key, { value, userId, expiresAt: nowMs + this.ttlMs })
    while (this.map.size > this.maxEntries) this.map.delete(this.map.keys().next().value as string)
  }

  /** Drops every entry of one user (disabled, role changed, signed out everywhere, password reset). */
  forgetUser(userId: number) {
    for (const [k, e] of this.map) if (e.userId === userId) this.map.delete(k)
  }

  forget(key: string) {
    this.map.delete(key)
  }

  get size() { return this.map.size }
}
