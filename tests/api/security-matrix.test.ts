// The route x caller matrix (issue "Safe to deploy", point 8): every file in server/api is a route, every route has a
// row here saying who may call it, and each row is tried signed out, as each role and with a feed's API token.
// A new route without its row fails this suite, and so does a row whose route is gone. Expected statuses: RFC 9110
// §15.5.2 (401: no valid credentials) and §15.5.4 (403: known caller, not allowed); every caller is checked before
// the (deliberately unusable) input, so 401 and 403 come first. Nothing here may answer 5xx.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'

type Role = 'admin' | 'dispatcher' | 'pilot' | 'safety'
const ROLES: Role[] = ['admin', 'dispatcher', 'pilot', 'safety']
/** Who may call a route: anyone, any signed-in user, some roles, or some roles and a feed's API token. */
type Access = { public: true } | { roles: Role[] | 'any', token?: boolean }
const ANY: Access = { roles: 'any' }
const PUBLIC: Access = { public: true }
const roles = (...r: Role[]): Access => ({ roles: r })
const filer: Access = { roles: ['dispatcher', 'admin'], token: true }

// One row per route file (method and path as Nitro serves them). `fresh`: the call would end the caller's own
// session, so it runs on a client signed in for it alone.
const MATRIX: Record<string, Access & { fresh?: boolean }> = {
  'GET /api/airfields': ANY,
  'POST /api/airfields': roles('dispatcher', 'admin'),
  'GET /api/airfields/[code]': ANY,
  'PATCH /api/airfields/[code]': roles('dispatcher', 'admin'),
  'GET /api/airfields/[code]/briefing': ANY,
  'GET /api/airfields/[code]/events': ANY,
  'GET /api/airfields/[code]/profiles': ANY,
  'POST /api/airfields/[code]/profiles': filer,
  'POST /api/airfields/[code]/profiles/import': filer,
  'POST /api/airfields/[code]/profiles/periods': filer,
  'GET /api/airfields/[code]/profiles/supersedes': filer,
  'POST /api/airfields/[code]/runways': roles('dispatcher', 'admin'),
  'PATCH /api/airfields/[code]/runways/[id]': roles('dispatcher', 'admin'),
  'GET /api/airfields/[code]/trend': ANY,
  'GET /api/alerts': roles('safety', 'admin'),
  'GET /api/alerts/deliveries': roles('safety', 'admin'),
  'POST /api/alerts/deliveries/[id]/retry': roles('safety', 'admin'),
  'GET /api/alerts/inbox': ANY,
  'GET /api/alerts/inbox/count': ANY,
  'POST /api/alerts/inbox/[id]/acknowledge': ANY,
  'POST /api/alerts/inbox/acknowledge': ANY,
  'GET /api/audit': roles('admin', 'safety'),
  'GET /api/briefings': ANY,
  'GET /api/invitations': roles('admin'),
  'POST /api/invitations': roles('admin'),
  'GET /api/invitations/[token]': PUBLIC,
  'POST /api/invitations/accept': PUBLIC,
  'GET /api/mailbox': roles('admin'),
  'POST /api/password-resets': PUBLIC,
  'POST /api/password-resets/confirm': PUBLIC,
  'GET /api/preferences': ANY,
  'PUT /api/preferences': ANY,
  'GET /api/profiles/[id]': ANY,
  'POST /api/profiles/[id]/withdraw': roles('dispatcher', 'admin'),
  'GET /api/push/device': ANY,
  'POST /api/push/simulated': ANY,
  'GET /api/push/subscriptions': ANY,
  'POST /api/push/subscriptions': ANY,
  'DELETE /api/push/subscriptions/[id]': ANY,
  'GET /api/push/vapid-key': ANY,
  'GET /api/receipts': ANY,
  'POST /api/receipts': roles('pilot'),
  'GET /api/session': ANY,
  'POST /api/session': PUBLIC,
  'DELETE /api/session': { ...ANY, fresh: true },
  'DELETE /api/session/all': { ...ANY, fresh: true },
  'GET /api/subscriptions': ANY,
  'PUT /api/subscriptions/[code]': ANY,
  'DELETE /api/subscriptions/[code]': ANY,
  'GET /api/limits': ANY,
  'GET /api/limits/history': roles('safety', 'admin'),
  'PUT /api/limits/organisation': roles('safety', 'admin'),
  'PUT /api/limits/airfields/[code]': roles('safety', 'admin'),
  'GET /api/tokens': roles('dispatcher', 'admin'),
  'POST /api/tokens': roles('dispatcher', 'admin'),
  'POST /api/tokens/[id]/revoke': roles('dispatcher', 'admin'),
  'GET /api/users': roles('admin'),
  'POST /api/users': roles('admin'),
  'PATCH /api/users/[id]': roles('admin'),
  'POST /api/users/[id]/invitation': roles('admin'),
  'DELETE /api/users/[id]/invitation': roles('admin'),
  'POST /api/wind/coded': roles('dispatcher', 'admin'),
  // Any signed-in user previews (the entry form); a feed may too, with its token.
  'POST /api/wind/preview': { roles: 'any', token: true },
}

/** Every route file under server/api as "METHOD /api/path" (index files name their folder). */
function routesFromFiles(): string[] {
  const root = join(process.cwd(), 'server', 'api')
  const out: string[] = []
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = join(dir, name)
      if (statSync(full).isDirectory()) walk(full)
      else if (name.endsWith('.ts')) {
        const m = /^(.*)\.(get|post|put|patch|delete)\.ts$/.exec(relative(root, full).split('\\').join('/'))
        // A route file without a method suffix answers every method: not allowed here (STYLE.md).
        if (!m) throw new Error(`server/api/${relative(root, full)} has no method in its name`)
        const path = `/api/${m[1]!}`.replace(/\/index$/, '').replace(/^\/api\/index$/, '/api')
        out.push(`${m[2]!.toUpperCase()} ${path}`)
      }
    }
  }
  walk(root)
  return out.sort()
}

/** The path with unusable values in its parameters: no such airfield, id or token. */
const concrete = (path: string) => path.replace('[code]', 'XQQQ').replace('[id]', '999999999').replace('[token]', 'no-such-token')

type Caller = 'signed out' | Role | 'api token'
const CALLERS: Caller[] = ['signed out', ...ROLES, 'api token']

function expected(access: Access, caller: Caller): 'pass' | 401 | 403 {
  if ('public' in access) return 'pass'
  if (caller === 'signed out') return 401
  if (caller === 'api token') return access.token ? 'pass' : 401
  return access.roles === 'any' || access.roles.includes(caller) ? 'pass' : 403
}

const clients = {} as Record<Caller, ApiClient>
let tokenHeader: Record<string, string>
beforeAll(async () => {
  clients['signed out'] = new ApiClient()
  for (const r of ROLES) clients[r] = await signedIn(r)
  const made = await clients.dispatcher.post('/api/tokens', { name: `matrix-${Date.now()}` })
  expect(made.status).toBe(201)
  tokenHeader = { authorization: `Bearer ${made.body.token.secret}` }
  clients['api token'] = new ApiClient()
})

describe('route x caller matrix', () => {
  const routes = routesFromFiles()

  it('every route file has its row, and every row its route file', () => {
    expect(routes.filter(r => !(r in MATRIX)), 'routes without a row').toEqual([])
    expect(Object.keys(MATRIX).filter(r => !routes.includes(r)), 'rows without a route').toEqual([])
  })

  it('each caller gets 401, 403 or past the door, never 5xx', async () => {
    const seen: string[] = []
    for (const route of routes) {
      const access = MATRIX[route]
      if (!access) continue
      const [method, path] = route.split(' ') as [string, string]
      for (const caller of CALLERS) {
        let client = clients[caller]
        if (access.fresh && caller !== 'signed out' && caller !== 'api token') client = await signedIn(caller)
        const body = method === 'GET' || method === 'DELETE' ? undefined : {}
        const res = await client.request(method, concrete(path), body, caller === 'api token' ? tokenHeader : {})
        // Signing out everywhere ended the shared client's session of that role too: sign it in again.
        if (access.fresh && caller !== 'signed out' && caller !== 'api token') clients[caller] = await signedIn(caller)
        const want = expected(access, caller)
        const label = `${route} as ${caller}: ${res.status} ${JSON.stringify(res.body)?.slice(0, 160)}`
        expect(res.status, label).toBeLessThan(500)
        if (want === 'pass') expect([401, 403], label).not.toContain(res.status)
        else expect(res.status, label).toBe(want)
        seen.push(`${route} ${caller}`)
      }
    }
    console.log(`[matrix] ${routes.length} routes x ${CALLERS.length} callers = ${seen.length} rows checked`)
    expect(seen.length).toBe(routes.length * CALLERS.length)
  })
})
