// A small HTTP client for the fault suite: keeps the session cookie, spreads requests over the app instances and
// repeats a request (same body, same Idempotency-Key) on another instance when one is out of reach or answers 503.
export type Answer = { status: number, headers: Headers, body: any, instance: number }

export type Tally = { requests: number, ok: number, unavailable503: number, refused: number, server5xx: number, other: Record<string, number> }
export const newTally = (): Tally => ({ requests: 0, ok: 0, unavailable503: 0, refused: 0, server5xx: 0, other: {} })

const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))

export class SuiteClient {
  cookie = ''
  constructor(readonly urls: string[], readonly tally: Tally) {}

  async once(instance: number, method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Answer> {
    const h: Record<string, string> = { ...headers }
    if (this.cookie) h.cookie = this.cookie
    if (body !== undefined) h['content-type'] = 'application/json'
    // Like one of our own pages: a cookie-carrying write names its origin (the request guard refuses it otherwise).
    if (method !== 'GET' && method !== 'HEAD') h.origin = new URL(this.urls[instance]!).origin
    this.tally.requests++
    const res = await fetch(new URL(path, this.urls[instance]), {
      method, headers: h, body: body === undefined ? undefined : JSON.stringify(body), redirect: 'manual',
      signal: AbortSignal.timeout(30_000),
    })
    for (const c of res.headers.getSetCookie?.() ?? []) {
      const [pair] = c.split(';')
      if (pair!.startsWith('nuxt-session=')) this.cookie = pair!.endsWith('=') ? '' : pair!
    }
    const text = await res.text()
    let parsed: any = text
    try {
      parsed = text ? JSON.parse(text) : null
    }
    catch { /* not JSON */ }
    if (res.status < 400) this.tally.ok++
    else if (res.status === 503) this.tally.unavailable503++
    else if (res.status >= 500) this.tally.server5xx++
    else this.tally.other[res.status] = (this.tally.other[res.status] ?? 0) + 1
    return { status: res.status, headers: res.headers, body: parsed, instance }
  }

  /**
   * The request until it gets an answer that is not "come back later": a refused connection, a reset or a 503
   * or any 5xx moves it to the next instance after a short wait (Retry-After, at most 1 s). Bounded by attempts and time.
   */
  async send(start: number, method: string, path: string, body?: unknown, headers: Record<string, string> = {}, limits = { attempts: 120, ms: 120_000 }): Promise<Answer & { attempts: number }> {
    const until = Date.now() + limits.ms
    let instance = start % this.urls.length
    for (let attempt = 1; ; attempt++) {
      let answer: Answer | null = null
      try {
        answer = await this.once(instance, method, path, body, headers)
      }
      catch {
        this.tally.refused++
      }
      // Any 5xx is counted in the tally (the suite asserts there is no 5xx but 503) and tried again like a 503.
      if (answer && answer.status < 500) return { ...answer, attempts: attempt }
      if (attempt >= limits.attempts || Date.now() > until) {
        throw new Error(`${method} ${path}: no answer but "come back later" after ${attempt} attempts`)
      }
      const retryAfterS = Number(answer?.headers.get('retry-after'))
      await sleep(Math.min(1000, Number.isFinite(retryAfterS) && retryAfterS > 0 ? retryAfterS * 1000 : 300) * (0.5 + Math.random() / 2))
      instance = (instance + 1) % this.urls.length
    }
  }
}
