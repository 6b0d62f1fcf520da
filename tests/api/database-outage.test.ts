// While MariaDB is stopped every answer that needs it is 503 Service Unavailable with Retry-After (RFC 9110
// §15.6.4: 503 "the server is currently unable to handle the request due to a temporary overload or scheduled
// maintenance"; §10.2.3: Retry-After says how long to wait), never 500; afterwards the app recovers by itself, and a
// client that repeats its filing with the same Idempotency-Key files it exactly once (the key's first use is the one
// kept; draft-ietf-httpapi-idempotency-key-header, from memory).
import { execFileSync } from 'node:child_process'
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, BASE_URL, DEMO, DEMO_PASSWORD, signedIn } from '../support/api'
import { closeDb, countRows, makeAirfield, profileBody } from '../support/airfields'

function db(command: 'start' | 'stop') {
  execFileSync('bash', ['scripts/db.sh', command], { stdio: 'pipe', env: process.env, timeout: 60_000 })
}

async function waitHealthy() {
  for (let i = 0; i < 100; i++) {
    const res = await fetch(`${BASE_URL}/healthz`).catch(() => null)
    if (res?.status === 200) return
    await new Promise(r => setTimeout(r, 200))
  }
  throw new Error('the app did not recover within 20 s of the database starting')
}

/** Every route file in server/api as "METHOD /api/path" with made-up parameters (as the security matrix finds them). */
function apiRoutes(): { method: string, path: string }[] {
  const root = join(process.cwd(), 'server/api')
  const out: { method: string, path: string }[] = []
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = join(dir, name)
      if (statSync(full).isDirectory()) walk(full)
      else {
        const m = /^(.*)\.(get|post|put|patch|delete)\.ts$/.exec(relative(root, full))
        if (!m) continue
        const path = `/api/${m[1]!}`.replace(/\/index$/, '').replace(/\[code\]/g, 'XOUT').replace(/\[[^\]]+\]/g, '1')
        out.push({ method: m[2]!.toUpperCase(), path })
      }
    }
  }
  walk(root)
  return out
}

// The routes open to signed-out callers (tests/api/security-matrix.test.ts marks them PUBLIC).
const PUBLIC_ROUTES = /^\/api\/(session|invitations\/(1|accept)|password-resets(\/confirm)?)$/

afterAll(closeDb)

describe('a database outage', () => {
  it('answers a filing 503 with Retry-After, every route 503 and never 500, /healthz 503; afterwards the same Idempotency-Key files once', async () => {
    const dispatcher = await signedIn('dispatcher')
    const admin = await signedIn('admin')
    const { code } = await makeAirfield(dispatcher)
    const key = `outage-${Date.now()}-${Math.random().toString(36).slice(2)}`
    const marker = `filed through an outage ${key}`
    const body = profileBody(0, 2, { notes: marker })
    const routes = apiRoutes()
    expect(routes.length).toBeGreaterThan(40)

    db('stop')
    const others: string[] = []
    try {
      const filing = await dispatcher.post(`/api/airfields/${code}/profiles`, body, { 'idempotency-key': key })
      expect(filing.status).toBe(503)
      expect(Number(filing.headers.get('retry-after'))).toBeGreaterThan(0)
      expect(filing.body.statusMessage).toMatch(/database is not answering just now; try again in \d+ seconds/i)

      // Every API route, as a signed-in admin: who is asking is the first question, and it needs the database.
      for (const { method, path } of routes) {
        const res = await fetch(new URL(path, BASE_URL), {
          method,
          headers: { 'cookie': admin.cookie, 'x-forwarded-for': admin.address, 'origin': new URL(BASE_URL).origin, ...(method === 'GET' ? {} : { 'content-type': 'application/json' }) },
          body: method === 'GET' ? undefined : '{}',
          signal: AbortSignal.timeout(10_000),
        })
        await res.body?.cancel()
        if (res.status === 503 && Number(res.headers.get('retry-after')) > 0) continue
        // A route open to signed-out callers may refuse unusable input before it needs the database (a 4xx).
        const refusedBeforeDatabase = res.status >= 400 && res.status < 500 && PUBLIC_ROUTES.test(path)
        if (!refusedBeforeDatabase) others.push(`${method} ${path}: ${res.status}`)
      }

      // A sign-in, nuxt-auth-utils' own session route, pages (signed in and not), and the health route.
      const signIn = await new ApiClient().post('/api/session', { email: DEMO.pilot, password: DEMO_PASSWORD })
      expect(signIn.status).toBe(503)
      expect(signIn.headers.get('retry-after')).toBeTruthy()
      const session = await fetch(`${BASE_URL}/api/_auth/session`, { headers: { cookie: dispatcher.cookie } })
      expect(session.status).toBe(503)
      expect(session.headers.get('retry-after')).toBeTruthy()
      for (const page of ['/airfields', `/airfields/${code}`, '/']) {
        const res = await fetch(`${BASE_URL}${page}`, { headers: { cookie: dispatcher.cookie, accept: 'text/html' }, redirect: 'manual' })
        expect(res.status, page).toBe(503)
        expect(res.headers.get('retry-after'), page).toBeTruthy()
        expect(await res.text(), page).toMatch(/database is not answering/i)
      }
      const health = await fetch(`${BASE_URL}/healthz`)
      expect(health.status).toBe(503)
    }
    finally {
      db('start')
    }
    expect(others, 'routes that did not answer 503 with Retry-After').toEqual([])
    await waitHealthy()

    const retried = await dispatcher.post(`/api/airfields/${code}/profiles`, body, { 'idempotency-key': key })
    expect(retried.status).toBe(201)
    expect(retried.headers.get('idempotent-replayed')).toBeNull()
    const again = await dispatcher.post(`/api/airfields/${code}/profiles`, body, { 'idempotency-key': key })
    expect(again.status).toBe(201)
    expect(again.headers.get('idempotent-replayed')).toBe('true')
    expect(again.body.profile.id).toBe(retried.body.profile.id)
    expect(await countRows('profiles', 'notes = ?', [marker])).toBe(1)
  })
})
