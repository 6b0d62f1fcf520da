/**
 * HTTP load benchmark (run by scripts/bench-http.sh, which starts the database and the built server).
 * Routes are taken in turn in one run with autocannon; every figure is also given as a ratio to the liveness
 * route measured in the same phase of the same run, since absolute figures on a shared machine say little.
 * Phase 1: the demo plus bench airfields up to 10 airfields; phase 2: grown to 203 airfields and 1,000 users.
 * Then the sizes: a 5,000-level briefing's JSON and page HTML, and the briefing page's JavaScript loaded up front
 * (gzip) against a bare Nuxt page built from the same node_modules.
 */
import { writeFileSync, mkdirSync } from 'node:fs'
import { loadavg, cpus } from 'node:os'
import { gzipSync } from 'node:zlib'
import autocannon from 'autocannon'
import { drizzle } from 'drizzle-orm/mysql2'
import mysql from 'mysql2/promise'
import * as schema from '../../server/db/schema'
import { benchCode, growTo, DEEP_LEVELS, SHALLOW_LEVELS } from './scale-seed'

const BASE = process.env.VEERLINE_BENCH_URL ?? 'http://127.0.0.1:3102'
const BARE = process.env.VEERLINE_BENCH_BARE_URL ?? ''
const SECONDS = Number(process.env.VEERLINE_BENCH_SECONDS ?? 3)
// Each phase measures every route this many times over, in turn (the medians count): VEERLINE_BENCH_ROUNDS.
const ROUNDS = Math.max(1, Number(process.env.VEERLINE_BENCH_ROUNDS ?? 5))
// Only the routes whose names match this pattern (besides liveness and session, which every ratio needs), e.g. to
// profile one route: VEERLINE_BENCH_ONLY='briefing 20'. The targets then judge only what was measured.
const ONLY = process.env.VEERLINE_BENCH_ONLY ? new RegExp(process.env.VEERLINE_BENCH_ONLY) : null
const CONNECTIONS = Number(process.env.VEERLINE_BENCH_CONNECTIONS ?? 32)
const OUT_DIR = process.env.VEERLINE_BENCH_OUT ?? '.data/bench'
const DEEP = benchCode(0) // every profile with 5,000 levels
const SHALLOW = benchCode(1) // 20 levels

type Row = { phase: string, route: string, path: string, reqPerS: number, p50Ms: number, p99Ms: number, non2xx: number, errors: number, bytesPerReq: number, ratioToLive: number, ratioToSession: number }

async function signIn(email: string, password: string) {
  const res = await fetch(`${BASE}/api/session`, { method: 'POST', headers: { 'content-type': 'application/json', 'origin': BASE }, body: JSON.stringify({ email, password }) })
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`)
  const cookie = res.headers.getSetCookie().map(c => c.split(';')[0]!).find(c => c.startsWith('nuxt-session='))
  if (!cookie) throw new Error('no session cookie')
  return cookie
}

// What a browser's fetch sends with every request (every current browser accepts gzip); the server compresses
// the larger JSON answers for it. VEERLINE_BENCH_ACCEPT_ENCODING='' measures uncompressed answers.
const ACCEPT_ENCODING = process.env.VEERLINE_BENCH_ACCEPT_ENCODING ?? 'gzip, deflate, br'
const headersFor = (cookie: string | null): Record<string, string> => ({
  ...(cookie ? { cookie } : {}), ...(ACCEPT_ENCODING ? { 'accept-encoding': ACCEPT_ENCODING } : {}),
})

async function load(path: string, cookie: string | null, seconds: number) {
  const r = await autocannon({
    url: `${BASE}${path}`, connections: CONNECTIONS, duration: seconds,
    headers: headersFor(cookie),
  })
  const bytesPerReq = r.requests.total ? r.throughput.total / r.requests.total : 0
  return { reqPerS: r.requests.average, p50Ms: r.latency.p50, p99Ms: r.latency.p99, non2xx: r.non2xx, errors: r.errors + r.timeouts, bytesPerReq }
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b)
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2
}

/**
 * Every route of a phase in turn, ROUNDS times over (each round with a liveness measurement of its own); a route's
 * figures are the medians over the rounds, its ratio the median of its ratios to the liveness of the same round. A
 * shared machine's bursts of other work then move one round, not the answer.
 *
 * The session route, which the others are judged against, is measured again after each of them: a route's ratio to
 * it is its req/s over the mean of the session runs just before and just after it (seconds apart, not a round apart:
 * this machine's speed drifts by up to 2x over a minute). The session row shows the median of all its runs.
 */
async function phase(name: string, cookie: string, routes: [string, string, boolean][]): Promise<Row[]> {
  const runs = new Map<string, (Awaited<ReturnType<typeof load>> & { ratio: number, toSession: number })[]>()
  for (const [, path, signed] of routes) {
    const c = signed ? cookie : null
    const first = await fetch(`${BASE}${path}`, { headers: headersFor(c) })
    if (first.status !== 200) throw new Error(`${path} answered ${first.status}: ${(await first.text()).slice(0, 300)}`)
    await load(path, c, 1) // warm-up, not counted
  }
  const sessionPath = routes.find(([route]) => route === 'session')![1]
  const keep = (route: string, m: Awaited<ReturnType<typeof load>>, live: number, toSession: number) =>
    runs.set(route, [...(runs.get(route) ?? []), { ...m, ratio: live ? m.reqPerS / live : Number.NaN, toSession }])
  for (let round = 0; round < ROUNDS; round++) {
    let live = 0
    let session = 0
    for (const [route, path, signed] of routes) {
      if (route === 'session') continue
      const m = await load(path, signed ? cookie : null, SECONDS)
      if (route === 'liveness') live = m.reqPerS
      const before = session
      const s = await load(sessionPath, cookie, SECONDS)
      session = s.reqPerS
      keep('session', s, live, 1)
      keep(route, m, live, before ? m.reqPerS / ((before + session) / 2) : Number.NaN)
    }
  }
  const rows: Row[] = []
  for (const [route, path] of routes) {
    const r = runs.get(route)!
    const row: Row = {
      phase: name, route, path, reqPerS: median(r.map(x => x.reqPerS)), p50Ms: median(r.map(x => x.p50Ms)), p99Ms: median(r.map(x => x.p99Ms)),
      non2xx: r.reduce((n, x) => n + x.non2xx, 0), errors: r.reduce((n, x) => n + x.errors, 0), bytesPerReq: median(r.map(x => x.bytesPerReq)),
      ratioToLive: median(r.map(x => x.ratio)), ratioToSession: median(r.map(x => x.toSession)),
    }
    rows.push(row)
    console.log(`  ${name.padEnd(13)} ${route.padEnd(22)} ${row.reqPerS.toFixed(0).padStart(7)} req/s  p50 ${String(row.p50Ms).padStart(4)} ms  p99 ${String(row.p99Ms).padStart(5)} ms  x${row.ratioToLive.toFixed(3)} live  x${row.ratioToSession.toFixed(2)} session  ${kb(row.bytesPerReq).padStart(9)}/answer`
      + `  (rounds: ${r.map(x => `${x.reqPerS.toFixed(0)}/${x.p99Ms}`).join(' ')} req/s/p99)${row.non2xx || row.errors ? `  (${row.non2xx} non-2xx, ${row.errors} errors)` : ''}`)
  }
  return rows
}

/** The JavaScript a page loads before it runs: its module entry and the modules it preloads, each gzipped. */
async function upFrontJs(base: string, path: string, cookie: string | null) {
  const res = await fetch(`${base}${path}`, { headers: cookie ? { cookie } : {} })
  const html = await res.text()
  if (res.status !== 200) throw new Error(`${path} answered ${res.status}: ${html.slice(0, 300)}`)
  const srcs = new Set<string>()
  for (const m of html.matchAll(/<script[^>]+type="module"[^>]+src="([^"]+)"|<script[^>]+src="([^"]+)"[^>]+type="module"/g)) srcs.add((m[1] ?? m[2])!)
  for (const m of html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+)"|<link[^>]+href="([^"]+)"[^>]+rel="modulepreload"/g)) srcs.add((m[1] ?? m[2])!)
  let gzipBytes = 0
  let rawBytes = 0
  for (const src of srcs) {
    const body = Buffer.from(await (await fetch(new URL(src, base))).arrayBuffer())
    rawBytes += body.length
    gzipBytes += gzipSync(body).length
  }
  return { files: srcs.size, rawBytes, gzipBytes, htmlBytes: Buffer.byteLength(html) }
}

const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`
const verdict = (ok: boolean) => (ok ? 'pass' : 'FAIL')

async function main() {
  const connection = await mysql.createConnection({ uri: process.env.DATABASE_URL!, timezone: 'Z' })
  const db = drizzle(connection, { schema, mode: 'default' })
  console.log(`[bench:http] ${CONNECTIONS} connections, ${SECONDS} s per route and round, ${ROUNDS} rounds, medians (after 1 s warm-up), Accept-Encoding: ${ACCEPT_ENCODING || '(none)'}, ${cpus().length} cores, load average ${loadavg().map(x => x.toFixed(2)).join(' ')}`)

  await growTo(db, 7)
  const cookie = await signIn('pilot@veerline.example', 'veerline-demo')
  const allRoutes = (): [string, string, boolean][] => [
    // In each round the routes judged against the session route come right after it.
    ['liveness', '/healthz/live', false],
    ['session', '/api/session', true],
    ['airfield list', '/api/airfields', true],
    ['home list', '/api/briefings', true],
    // As the briefing page asks it: the end it shows in detail (?end=best before it knows one), the others ranked.
    [`briefing ${SHALLOW_LEVELS} levels`, `/api/airfields/${SHALLOW}/briefing?end=best`, true],
    [`briefing ${DEEP_LEVELS} levels`, `/api/airfields/${DEEP}/briefing?end=best`, true],
    // Every end in detail (the API's default, for feeds): shown, no target.
    [`briefing ${SHALLOW_LEVELS} levels, every end`, `/api/airfields/${SHALLOW}/briefing`, true],
    ['readiness (DB ping)', '/healthz', false],
  ]
  const routes = () => allRoutes().filter(([route]) => !ONLY || ['liveness', 'session'].includes(route) || ONLY.test(route))
  const rows = await phase('10 airfields', cookie, routes())
  const t0 = Date.now()
  await growTo(db, 200)
  const [[{ n }]] = await connection.query('SELECT COUNT(*) AS n FROM airfields') as unknown as [[{ n: number }]]
  console.log(`[bench:http] grown to ${n} airfields in ${((Date.now() - t0) / 1000).toFixed(0)} s`)
  rows.push(...await phase(`${n} airfields`, cookie, routes()))
  await connection.end()

  // Sizes
  // fetch() undoes the gzip: these are the JSON texts themselves; the gzip sizes are measured beside them.
  const textOf = async (path: string) => (await fetch(`${BASE}${path}`, { headers: { cookie } })).text()
  const jsonText = await textOf(`/api/airfields/${DEEP}/briefing`)
  const jsonBytes = Buffer.byteLength(jsonText)
  const pageJson = await textOf(`/api/airfields/${DEEP}/briefing?end=best`)
  const page = await upFrontJs(BASE, `/briefings/${DEEP}`, cookie)
  const bare = BARE ? await upFrontJs(BARE, '/', null) : null

  const get = (p: string, route: string) => rows.find(r => r.phase === p && r.route === route)
  const small = '10 airfields'
  const big = `${n} airfields`
  const session = get(big, 'session')!
  console.log('\n| phase | route | req/s | p50 ms | p99 ms | x liveness | x session | KB/answer | target | result |')
  console.log('| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |')
  const checks: boolean[] = []
  for (const r of rows) {
    let target = ''
    let ok: boolean | null = null
    if (r.route === 'session') {
      target = '≥ 0.25x liveness'
      ok = r.ratioToLive >= 0.25
    }
    else if (!['liveness', 'readiness (DB ping)'].includes(r.route) && !r.route.endsWith('every end')) {
      target = '≥ 0.7x session, p99 ≤ 25 ms'
      // Each run's req/s over the mean of the session runs just before and after it, the median of the rounds.
      ok = r.ratioToSession >= 0.7 && r.p99Ms <= 25
    }
    if (r.non2xx || r.errors) ok = false
    if (ok !== null) checks.push(ok)
    console.log(`| ${r.phase} | ${r.route} | ${r.reqPerS.toFixed(0)} | ${r.p50Ms} | ${r.p99Ms} | ${r.ratioToLive.toFixed(3)} | ${r.route === 'liveness' ? '' : r.ratioToSession.toFixed(2)} | ${(r.bytesPerReq / 1024).toFixed(1)} | ${target} | ${ok === null ? '' : verdict(ok)} |`)
  }
  // Judged, like the routes, against the session runs just around each run: the session route's cost grows with
  // neither airfields nor levels, and it is measured seconds from the run, where the liveness route of the phase was
  // measured a minute before (its rounds moved by up to 2x within a phase on this machine). The ratio of the
  // liveness ratios is printed beside it.
  console.log('\n| flat in | compared (each as x the session runs around it) | ratio | as x liveness | target | result |')
  console.log('| --- | --- | --- | --- | --- | --- |')
  const flat = (label: string, a: Row | undefined, b: Row | undefined) => {
    if (!a || !b) return
    const ratio = b.ratioToSession / a.ratioToSession
    const ok = ratio >= 0.8 && ratio <= 1.25
    checks.push(ok)
    console.log(`| ${label} | ${a.phase} ${a.route} → ${b.phase} ${b.route} | ${ratio.toFixed(2)} | ${(b.ratioToLive / a.ratioToLive).toFixed(2)} | within 20% | ${verdict(ok)} |`)
  }
  flat('airfields', get(small, 'airfield list'), get(big, 'airfield list'))
  flat('airfields', get(small, 'home list'), get(big, 'home list'))
  flat('airfields', get(small, `briefing ${SHALLOW_LEVELS} levels`), get(big, `briefing ${SHALLOW_LEVELS} levels`))
  flat('levels', get(big, `briefing ${SHALLOW_LEVELS} levels`), get(big, `briefing ${DEEP_LEVELS} levels`))

  console.log('\n| size | measured | target | result |')
  console.log('| --- | --- | --- | --- |')
  const size = (label: string, value: string, target: string, ok: boolean | null) => {
    if (ok !== null) checks.push(ok)
    console.log(`| ${label} | ${value} | ${target} | ${ok === null ? (target ? 'not measured' : '') : verdict(ok)} |`)
  }
  size(`briefing JSON, ${DEEP_LEVELS} levels, every end`, `${kb(jsonBytes)} (${kb(gzipSync(jsonText).length)} gzip)`, '≤ 300 KB', jsonBytes <= 300 * 1024)
  size(`briefing JSON, ${DEEP_LEVELS} levels, as the page asks (?end=best)`, `${kb(Buffer.byteLength(pageJson))} (${kb(gzipSync(pageJson).length)} gzip)`, '', null)
  size(`briefing page HTML, ${DEEP_LEVELS} levels`, kb(page.htmlBytes), '≤ 500 KB', page.htmlBytes <= 500 * 1024)
  size('briefing page JS up front (gzip)', `${kb(page.gzipBytes)} in ${page.files} files (${kb(page.rawBytes)} raw)`, '', null)
  if (bare) size('bare Nuxt page JS up front (gzip)', `${kb(bare.gzipBytes)} in ${bare.files} files`, '', null)
  size('briefing page JS / bare Nuxt page', bare ? `${(page.gzipBytes / bare.gzipBytes).toFixed(2)}x` : 'no bare page', '≤ 1.5x', bare ? page.gzipBytes <= 1.5 * bare.gzipBytes : null)
  console.log(`\n[bench:http] ${checks.filter(Boolean).length} of ${checks.length} targets met; session ${session.reqPerS.toFixed(0)} req/s; load average at the end ${loadavg().map(x => x.toFixed(2)).join(' ')}`)

  mkdirSync(OUT_DIR, { recursive: true })
  const file = `${OUT_DIR}/http-${new Date().toISOString().replace(/[:.]/g, '-')}.json`
  writeFileSync(file, JSON.stringify({ rows, sizes: { jsonBytes, pageJsonBytes: Buffer.byteLength(pageJson), page, bare }, acceptEncoding: ACCEPT_ENCODING, loadavg: loadavg() }, null, 2))
  console.log(`[bench:http] figures kept in ${file}`)
}

await main()
