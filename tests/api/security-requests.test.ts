// Cross-site writes, security headers and request bodies (issue "Safe to deploy", points 3, 4 and 6).
// References: the Fetch standard (Origin and Sec-Fetch-Site on requests; "CORS-safelisted request-header" lists
// application/x-www-form-urlencoded, multipart/form-data and text/plain as the types a foreign page may send
// without a preflight), RFC 6454 (origin = scheme, host, port), CSP Level 3 (frame-ancestors, nonces), RFC 9110
// §15.5.14 (413 Content Too Large) and §15.5.16 (415), RFC 8259 §8.1 (a JSON text may begin with no byte order mark
// and a parser MAY ignore one), OWASP Secure Headers Project (nosniff, X-Frame-Options DENY, Referrer-Policy).
import { request as httpRequest } from 'node:http'
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, BASE_URL, signedIn } from '../support/api'
import { createTestAirfield, windProfile } from '../support/alerts'

let admin: ApiClient
let dispatcher: ApiClient
let db: mysql.Connection
beforeAll(async () => {
  admin = await signedIn('admin')
  dispatcher = await signedIn('dispatcher')
  db = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
})
afterAll(async () => {
  await db?.end()
})

const count = async (sql: string, params: unknown[] = []) => {
  const [rows] = await db.query(sql, params) as unknown as [{ n: number }[]]
  return Number(rows[0]!.n)
}
const EVIL = 'http://evil.example'
const ownOrigin = new URL(BASE_URL).origin

describe('cross-site writes are refused', () => {
  it('a foreign-origin form POST cannot sign in, and sets no session', async () => {
    const c = new ApiClient()
    const res = await c.post('/api/session', 'email=dispatch%40veerline.example&password=veerline-demo',
      { 'origin': EVIL, 'content-type': 'application/x-www-form-urlencoded' })
    expect(res.status).toBe(403)
    expect(res.body.statusMessage).toMatch(/another site/)
    expect(res.headers.getSetCookie().some(s => /^nuxt-session=[^;]{20,}/.test(s) && res.status === 200)).toBe(false)
  })

  it('a foreign origin with the admin\'s cookie creates no API token and no user', async () => {
    const tokens = await count('SELECT COUNT(*) AS n FROM api_tokens')
    const users = await count('SELECT COUNT(*) AS n FROM users')
    const t = await admin.post('/api/tokens', { name: 'cross-site' }, { origin: EVIL })
    expect(t.status).toBe(403)
    const u = await admin.post('/api/users', { email: `csrf-${Date.now()}@veerline.example`, name: 'X', role: 'admin', password: 'cross-site-pass' }, { origin: EVIL })
    expect(u.status).toBe(403)
    expect(await count('SELECT COUNT(*) AS n FROM api_tokens')).toBe(tokens)
    expect(await count('SELECT COUNT(*) AS n FROM users')).toBe(users)
  })

  it('another port of the same host, a sibling host and an opaque origin are foreign too (RFC 6454)', async () => {
    const url = new URL(BASE_URL)
    for (const origin of [`${url.protocol}//${url.hostname}:1`, 'http://app.127.0.0.1.nip.example', 'null']) {
      expect((await dispatcher.post('/api/tokens', { name: 'x' }, { origin })).status).toBe(403)
    }
    // Sec-Fetch-Site wins when a browser sends it: same-site is not same-origin.
    expect((await dispatcher.post('/api/tokens', { name: 'x' }, { 'origin': ownOrigin, 'sec-fetch-site': 'same-site' })).status).toBe(403)
  })

  it('a cookie write without Origin is refused; with Sec-Fetch-Site same-origin alone it passes', async () => {
    const bare = await dispatcher.request('DELETE', '/api/tokens/0', undefined, { origin: '' })
    expect(bare.status).toBe(403)
    expect(bare.body.statusMessage).toMatch(/no Origin/)
    const tokenName = `sfs-${Date.now()}`
    const ok = await dispatcher.post('/api/tokens', { name: tokenName }, { 'origin': '', 'sec-fetch-site': 'same-origin' })
    expect(ok.status).toBe(201)
  })

  it('same origin but a form body type is 415, nothing saved', async () => {
    const tokens = await count('SELECT COUNT(*) AS n FROM api_tokens')
    const res = await dispatcher.post('/api/tokens', 'name=form', { 'content-type': 'application/x-www-form-urlencoded' })
    expect(res.status).toBe(415)
    const plain = await dispatcher.post('/api/tokens', '{"name":"plain"}', { 'content-type': 'text/plain' })
    expect(plain.status).toBe(415)
    expect(await count('SELECT COUNT(*) AS n FROM api_tokens')).toBe(tokens)
  })

  it('a feed\'s bearer-token filing needs no Origin (it carries no cookie)', async () => {
    const code = await createTestAirfield({ 18: 180, 36: 360 })
    const made = await dispatcher.post('/api/tokens', { name: `feed-${code}` })
    expect(made.status).toBe(201)
    const feed = new ApiClient()
    const res = await feed.post(`/api/airfields/${code}/profiles`, windProfile(180, 10), { authorization: `Bearer ${made.body.token.secret}`, origin: '' })
    expect(res.status).toBe(201)
  })
})

describe('security headers', () => {
  it('a page carries a CSP of our own origin with a nonce, and the other headers', async () => {
    const res = await fetch(new URL('/sign-in', BASE_URL))
    expect(res.status).toBe(200)
    const csp = res.headers.get('content-security-policy')!
    expect(csp).toContain('default-src \'self\'')
    expect(csp).toContain('frame-ancestors \'none\'')
    expect(csp).toContain('object-src \'none\'')
    expect(csp).toContain('base-uri \'none\'')
    expect(csp).not.toMatch(/https:|\*|unsafe-eval/)
    expect(csp).not.toContain('upgrade-insecure-requests') // plain-HTTP loopback test server
    const nonce = /'nonce-([^']+)'/.exec(csp)![1]!
    const html = await res.text()
    // Nuxt's own scripts carry the nonce, so hydration runs under the policy.
    expect(html).toContain(`nonce="${nonce}"`)
    expect(res.headers.get('x-content-type-options')).toBe('nosniff')
    expect(res.headers.get('x-frame-options')).toBe('DENY')
    expect(res.headers.get('referrer-policy')).toBe('same-origin')
    expect(res.headers.get('x-powered-by')).toBeNull()
    expect(res.headers.get('access-control-allow-origin')).toBeNull()
    expect(res.headers.get('strict-transport-security')).toBeNull()
    expect(res.headers.get('cross-origin-embedder-policy')).toBeNull()
  })

  it('asked again (its rules kept per path), a page gets a nonce of its own each time and the same other headers', async () => {
    const answers = []
    for (let i = 0; i < 3; i++) {
      const res = await fetch(new URL('/sign-in?again=' + i, BASE_URL))
      const csp = res.headers.get('content-security-policy')!
      const nonce = /'nonce-([^']+)'/.exec(csp)![1]!
      expect(await res.text()).toContain(`nonce="${nonce}"`)
      answers.push({ nonce, rest: csp.replace(nonce, ''), frame: res.headers.get('x-frame-options'), powered: res.headers.get('x-powered-by') })
    }
    expect(new Set(answers.map(a => a.nonce)).size).toBe(3)
    // CSP Level 3 §6.1 (common practice): a nonce is fresh per response; the rest of the policy does not change.
    expect(new Set(answers.map(a => a.rest)).size).toBe(1)
    expect(answers.every(a => a.frame === 'DENY' && a.powered === null)).toBe(true)
  })

  it('every API answer is no-store, nosniff, unframeable and without X-Powered-By', async () => {
    for (const [c, path] of [[dispatcher, '/api/session'], [dispatcher, '/api/tokens'], [new ApiClient(), '/api/session']] as const) {
      const res = await c.get(path)
      expect(res.headers.get('cache-control')).toBe('no-store')
      expect(res.headers.get('x-content-type-options')).toBe('nosniff')
      expect(res.headers.get('content-security-policy')).toContain('frame-ancestors \'none\'')
      expect(res.headers.get('x-powered-by')).toBeNull()
    }
  })
})

/** A raw request, so the test decides Content-Length and chunking itself; the answer counts even when the server
 * closes the connection before the whole body was sent (that is the point). */
function rawPost(path: string, headers: Record<string, string>, chunks: Buffer[]): Promise<{ status: number, body: string }> {
  return new Promise((resolve, reject) => {
    const url = new URL(path, BASE_URL)
    let answered = false
    // A connection of its own: a body cut short must not leave bytes on a socket another request reuses.
    const req = httpRequest({ host: url.hostname, port: url.port, path: url.pathname + url.search, method: 'POST', headers, agent: false }, (res) => {
      answered = true
      let body = ''
      res.on('data', (d) => {
        body += d
      })
      res.on('end', () => resolve({ status: res.statusCode!, body }))
      res.on('error', () => resolve({ status: res.statusCode!, body }))
    })
    req.on('error', (err) => {
      if (!answered) setTimeout(() => (answered ? undefined : reject(err)), 10_000)
    })
    let i = 0
    const next = (err?: Error | null) => {
      if (err || answered || req.destroyed) return
      if (i >= chunks.length) return req.end()
      req.write(chunks[i++], next)
    }
    next()
  })
}

describe('request bodies', () => {
  it('a 12 MB body declared in Content-Length is 413 before it is read', async () => {
    const res = await rawPost('/api/airfields', {
      'content-type': 'application/json', 'content-length': String(12 * 1024 * 1024), 'origin': ownOrigin,
      'cookie': dispatcher.cookie, 'x-forwarded-for': dispatcher.address,
    }, [Buffer.from('{"code":"XAAA"')])
    expect(res.status).toBe(413)
    expect(JSON.parse(res.body).statusMessage).toMatch(/larger than the limit/)
  })

  it('a chunked body is cut off at the limit with 413', async () => {
    // 5 x 64 KB without a Content-Length: past the 128 KB limit only while it streams.
    const chunk = Buffer.alloc(64 * 1024, 0x20)
    const res = await rawPost('/api/airfields', {
      'content-type': 'application/json', 'transfer-encoding': 'chunked', 'origin': ownOrigin,
      'cookie': dispatcher.cookie, 'x-forwarded-for': dispatcher.address,
    }, [Buffer.from('{"name":"'), ...Array.from({ length: 5 }, () => chunk)])
    expect(res.status, res.body).toBe(413)
  })

  it('a JSON body with a byte order mark reads like one without (sign-in and filing alike)', async () => {
    const c = new ApiClient()
    const res = await c.post('/api/session', `\uFEFF${JSON.stringify({ email: 'pilot@veerline.example', password: 'veerline-demo' })}`, { 'content-type': 'application/json' })
    expect(res.status).toBe(200)
    const code = await createTestAirfield({ 18: 180, 36: 360 })
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, `\uFEFF${JSON.stringify(windProfile(180, 12))}`, { 'content-type': 'application/json' })
    expect(filed.status).toBe(201)
  })

  it('JSON nested deeper than 64 levels is 422 with the body named, nothing saved', async () => {
    const code = await createTestAirfield({ 18: 180, 36: 360 })
    const deep = `${'['.repeat(100_000)}${']'.repeat(100_000)}`
    const before = await count('SELECT COUNT(*) AS n FROM profiles')
    for (const path of [`/api/airfields/${code}/profiles`, `/api/airfields/${code}/profiles/import?format=json&mode=preview`, '/api/wind/preview']) {
      const res = await dispatcher.post(path, deep, { 'content-type': 'application/json' })
      expect(res.status, path).toBe(422)
      expect(res.body.data.issues[0].field).toBe('(body)')
    }
    // 64 levels are still read (and then judged by the route's own rules).
    const ok = await dispatcher.post('/api/wind/preview', `${'['.repeat(64)}${']'.repeat(64)}`, { 'content-type': 'application/json' })
    expect(ok.status).toBeLessThan(500)
    expect(ok.status).not.toBe(413)
    expect(await count('SELECT COUNT(*) AS n FROM profiles')).toBe(before)
  })
})
