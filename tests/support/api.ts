// Helpers for the API suite: a tiny cookie-keeping client for the real server that scripts/test.sh started.
export const BASE_URL = process.env.TEST_BASE_URL || 'http://127.0.0.1:3100'
export const DEMO_PASSWORD = 'veerline-demo'
export const DEMO = {
  admin: 'admin@veerline.example',
  dispatcher: 'dispatch@veerline.example',
  pilot: 'pilot@veerline.example',
  safety: 'safety@veerline.example',
} as const

/**
 * A client address of its own for each client (sent as X-Forwarded-For, which the test server trusts), so that
 * sign-in lockouts in one test do not reach another: random in 198.18.0.0/15, the range kept for benchmark tests
 * (RFC 2544). Only the address-lockout test uses TEST-NET-3 (203.0.113.0/24, RFC 5737).
 */
function nextAddress() {
  const n = Math.floor(Math.random() * 131_070) + 1
  return `198.${18 + (n >> 16)}.${(n >> 8) & 255}.${n & 255}`
}
export const LOCKOUT_TEST_ADDRESS = '203.0.113.66'

export type ApiResponse<T = any> = { status: number, headers: Headers, body: T }

export class ApiClient {
  cookie = ''
  constructor(public baseUrl = BASE_URL, public address = nextAddress()) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    // Like a browser on one of our pages: a write names its origin (the server refuses cookie writes without it).
    const origin: Record<string, string> = method === 'GET' || method === 'HEAD' ? {} : { origin: new URL(this.baseUrl).origin }
    const h: Record<string, string> = { 'x-forwarded-for': this.address, ...origin, ...headers }
    if (this.cookie) h.cookie = this.cookie
    let payload: BodyInit | undefined
    if (typeof body === 'string' || body instanceof FormData || body instanceof Blob) {
      payload = body as BodyInit
      // A text body without a declared type: JSON when it looks like JSON, else a CSV file (the import route).
      if (typeof body === 'string' && !Object.keys(h).some(k => k.toLowerCase() === 'content-type')) {
        h['content-type'] = /^\uFEFF?\s*[[{]/.test(body) ? 'application/json' : 'text/csv'
      }
    }
    else if (body !== undefined) {
      payload = JSON.stringify(body)
      h['content-type'] = 'application/json'
    }
    const res = await fetch(new URL(path, this.baseUrl), { method, headers: h, body: payload, redirect: 'manual' })
    const set = res.headers.getSetCookie?.() ?? []
    for (const c of set) {
      const [pair] = c.split(';')
      if (pair!.startsWith('nuxt-session=')) this.cookie = pair!.endsWith('=') ? '' : pair!
    }
    const text = await res.text()
    let parsed: any = text
    try {
      parsed = text ? JSON.parse(text) : null
    }
    catch { /* not JSON: keep the text */ }
    return { status: res.status, headers: res.headers, body: parsed as T }
  }

  get<T = any>(path: string, headers?: Record<string, string>) { return this.request<T>('GET', path, undefined, headers) }
  post<T = any>(path: string, body?: unknown, headers?: Record<string, string>) { return this.request<T>('POST', path, body, headers) }
  patch<T = any>(path: string, body?: unknown, headers?: Record<string, string>) { return this.request<T>('PATCH', path, body, headers) }
  put<T = any>(path: string, body?: unknown, headers?: Record<string, string>) { return this.request<T>('PUT', path, body, headers) }
  delete<T = any>(path: string, body?: unknown, headers?: Record<string, string>) { return this.request<T>('DELETE', path, body, headers) }

  async signIn(email: string, password = DEMO_PASSWORD) {
    const res = await this.post('/api/session', { email, password })
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`)
    return res
  }
}

export async function signedIn(role: keyof typeof DEMO, baseUrl = BASE_URL) {
  const client = new ApiClient(baseUrl)
  await client.signIn(DEMO[role])
  return client
}

/**
 * The UTC day the demo scenario was seeded for (its first profile's date), so that tests read the demo's day even
 * when they run just after midnight UTC.
 */
export async function demoDay(client: ApiClient): Promise<string> {
  const res = await client.get('/api/airfields/XVAL/profiles?sort=validFrom&order=asc&pageSize=1')
  if (res.status !== 200 || !res.body.profiles?.length) throw new Error(`no demo profiles at XVAL: ${res.status}`)
  return String(res.body.profiles[0].validFrom).slice(0, 10)
}
