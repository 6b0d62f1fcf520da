// npm run test:ha: the fault suite. Starts its own Galera cluster (3 nodes), 3 app instances and the stand-ins, runs
// bounded loops of filings, limit changes and briefing reads across all instances, and meanwhile
//   (a) kills -9 one Galera node and starts it again (it rejoins by IST),
//   (b) kills -9 an app instance in the middle of an alert fan-out,
//   (c) stops the SMTP stand-in for a minute,
//   (d) stops a node cleanly, keeps writing, and starts it again with its stale state.
// At the end it prints and asserts: filings acknowledged = stored, 0 doubled; notices due = delivered, 0 lost,
// no copy at the stand-ins that the outbox does not record as a resend; the same briefing on every instance;
// no 5xx but 503 anywhere; and the time each fault took to heal. Exit code 0 only when every check holds.
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { Cluster, isRoot, log } from './cluster-lib'
import { newTally, SuiteClient, type Tally } from './client'

if (!isRoot()) {
  console.error('npm run test:ha starts mariadbd as the mysql user and so must run as root')
  process.exit(1)
}

const startedAt = Date.now()
const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))
const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`
const num = (name: string, fallback: number) => Number(process.env[name] || fallback)

const SETTINGS = {
  subscribersEmail: num('VEERLINE_HA_EMAIL_SUBSCRIBERS', 20),
  subscribersPush: num('VEERLINE_HA_PUSH_SUBSCRIBERS', 4),
  filers: 3,
  maxFilingsPerFiler: num('VEERLINE_HA_MAX_FILINGS', 150),
  maxLimitChanges: 60,
  maxReads: 3000,
  smtpOutageMs: num('VEERLINE_HA_SMTP_OUTAGE_MS', 60_000),
  // Every loop and wait stops by itself by this time.
  deadlineMs: num('VEERLINE_HA_DEADLINE_MS', 15 * 60_000),
}
const deadline = startedAt + SETTINGS.deadlineMs
const pastDeadline = () => Date.now() > deadline

// Its own data folder, so that the data of `npm run cluster` is left alone.
process.env.VEERLINE_CLUSTER_DATA_DIR ||= join(new URL('../..', import.meta.url).pathname, '.data/cluster/fault-suite')
const cluster = new Cluster()
const urls = cluster.cfg.appPorts.map((_, i) => cluster.appUrl(i))
const FIELD = 'XFLT' // fictitious test airfield with subscribers: its alerts fan out
const QUIET = 'XFLQ' // fictitious test airfield without subscribers: most filings and the limit changes go here
const RUN = `ha-${Date.now().toString(36)}`

// Retries of failed sends wait at most 5 s in the suite (60 s by default), so that the SMTP outage heals quickly; with
// such short waits the default 15 attempts would be spent within the minute's outage, so the suite allows more (the
// defaults give a notice about 13 minutes of retries).
const appEnv = { VEERLINE_OUTBOX_BACKOFF_MAX_MS: '5000', VEERLINE_OUTBOX_MAX_ATTEMPTS: '500' }
const tallies: Record<string, Tally> = { setup: newTally(), filings: newTally(), limits: newTally(), reads: newTally() }

// ── Database reads for the checks (root over a node's socket, causal reads) ───────────────────────────────────────

async function anyNodeSql(query: string): Promise<string[][]> {
  let last: unknown
  for (const i of [0, 1, 2]) {
    if (!cluster.nodes[i]) continue
    try {
      return await cluster.rootSql(i, `SET SESSION wsrep_sync_wait = 1; USE \`${cluster.cfg.dbName}\`; ${query}`)
    }
    catch (err) {
      last = err
    }
  }
  throw new Error(`no node answered: ${(last as Error)?.message}`)
}
const scalar = async (query: string) => Number((await anyNodeSql(query))[0]?.[0] ?? 0)

async function outboxPending(): Promise<number> {
  return scalar('SELECT COUNT(*) FROM outbox WHERE state = \'queued\'')
}

async function waitFor(what: string, check: () => Promise<boolean>, limitMs: number, stepMs = 250): Promise<number> {
  const t0 = Date.now()
  while (Date.now() - t0 < limitMs && !pastDeadline()) {
    try {
      if (await check()) return Date.now() - t0
    }
    catch { /* not yet */ }
    await sleep(stepMs)
  }
  throw new Error(`${what}: not within ${seconds(limitMs)}`)
}

// ── Set-up through the API ───────────────────────────────────────────────────────────────────────────────────────

async function signIn(email: string, password: string, instance = 0) {
  const c = new SuiteClient(urls, tallies.setup!)
  const res = await c.send(instance, 'POST', '/api/session', { email, password })
  if (res.status !== 200) throw new Error(`sign-in of ${email}: ${res.status} ${JSON.stringify(res.body)}`)
  return c
}

function levels(strong: boolean, step: number) {
  // strong: a 270° wind of 38 kt at the surface is a 38 kt crosswind on runway 18/36 (limit 20 kt by default);
  // calm: 6 kt along the runway. `step` nudges the speed aloft so that each filing differs.
  return strong
    ? [{ heightM: 10, directionDeg: 270, speedKt: 38 }, { heightM: 300, directionDeg: 275, speedKt: 45 + (step % 5) }, { heightM: 600, directionDeg: 280, speedKt: 50 }]
    : [{ heightM: 10, directionDeg: 180, speedKt: 6 }, { heightM: 300, directionDeg: 185, speedKt: 10 + (step % 5) }, { heightM: 600, directionDeg: 190, speedKt: 14 }]
}

function profile(strong: boolean, step: number, notes: string) {
  const from = new Date(Math.floor(Date.now() / 60_000) * 60_000 - 60_000)
  return {
    validFrom: from.toISOString(), validTo: new Date(from.getTime() + 3 * 3600_000).toISOString(),
    source: 'wind-profiler', heightReference: 'AGL', notes, levels: levels(strong, step),
  }
}

async function setUp() {
  const admin = await signIn('admin@veerline.example', 'veerline-demo')
  for (const [code, name] of [[FIELD, 'Fault Test Field'], [QUIET, 'Quiet Test Field']] as const) {
    const made = await admin.send(0, 'POST', '/api/airfields', { code, name, latitudeDeg: 47.1, longitudeDeg: 8.2, elevation: 400, elevationUnit: 'm' })
    if (made.status !== 201 && made.status !== 409) throw new Error(`airfield ${code}: ${made.status} ${JSON.stringify(made.body)}`)
    if (made.status === 201) {
      const rw = await admin.send(0, 'POST', `/api/airfields/${code}/runways`, { lengthM: 2500, ends: [{ designator: '18', trueHeadingDeg: 180 }, { designator: '36', trueHeadingDeg: 360 }] })
      if (rw.status !== 201) throw new Error(`runway at ${code}: ${rw.status} ${JSON.stringify(rw.body)}`)
    }
  }
  const total = SETTINGS.subscribersEmail + SETTINGS.subscribersPush
  for (let n = 0; n < total; n++) {
    const email = `crew${n}.${RUN}@veerline.example`
    const made = await admin.send(n, 'POST', '/api/users', { email, name: `Test crew ${n}`, role: 'pilot', password: 'fault-suite-pass' })
    if (made.status !== 201) throw new Error(`user ${email}: ${made.status} ${JSON.stringify(made.body)}`)
    const user = await signIn(email, 'fault-suite-pass', n)
    const push = n >= SETTINGS.subscribersEmail
    if (push) {
      const device = await user.send(n, 'POST', '/api/push/simulated', { label: `device ${n}` })
      if (device.status !== 201) throw new Error(`device for ${email}: ${device.status} ${JSON.stringify(device.body)}`)
    }
    const sub = await user.send(n, 'PUT', `/api/subscriptions/${FIELD}`, { email: !push, push })
    if (sub.status !== 200) throw new Error(`subscription of ${email}: ${sub.status} ${JSON.stringify(sub.body)}`)
  }
  log(`set up: airfields ${FIELD} and ${QUIET}, ${SETTINGS.subscribersEmail} e-mail and ${SETTINGS.subscribersPush} push subscribers of ${FIELD}`)
}

// ── The load: bounded loops ──────────────────────────────────────────────────────────────────────────────────────

type Filing = { key: string, notes: string, profileId: number | null, attempts: number, field: string }
const filings: Filing[] = []
const limitChanges: { reason: string, acknowledged: boolean }[] = []
let stopLoad = false
let fanOutRequests = 0

async function filer(n: number, dispatcher: SuiteClient) {
  // Up to maxFilingsPerFiler filings at QUIET, spread over the faults; filer 0 also files at FIELD whenever a fault
  // asks for a fan-out (a strong profile raises, a calm one clears), until the load stops.
  let quiet = 0
  for (let step = 0; !stopLoad && !pastDeadline(); step++) {
    const fanOut = n === 0 && fanOutRequests > 0
    if (!fanOut && quiet >= SETTINGS.maxFilingsPerFiler) {
      await sleep(100)
      continue
    }
    if (fanOut) fanOutRequests--
    else quiet++
    const field = fanOut ? FIELD : QUIET
    const strong = fanOut ? filings.filter(f => f.field === FIELD).length % 2 === 0 : step % 2 === 0
    const key = `${RUN}-f${n}-${step}`
    const notes = `${RUN} filing ${n}/${step}`
    const entry: Filing = { key, notes, profileId: null, attempts: 0, field }
    filings.push(entry)
    const res = await dispatcher.send(n + step, 'POST', `/api/airfields/${field}/profiles`, profile(strong, step, notes), { 'idempotency-key': key })
    entry.attempts = res.attempts
    if (res.status === 201) entry.profileId = res.body.profile.id
    else log(`filing ${key} refused: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`)
    await sleep(fanOut ? 50 : 600 + Math.random() * 400)
  }
}

async function limitChanger(safety: SuiteClient) {
  for (let step = 0; step < SETTINGS.maxLimitChanges && !stopLoad && !pastDeadline(); step++) {
    const reason = `${RUN} limit change ${step}`
    const entry = { reason, acknowledged: false }
    limitChanges.push(entry)
    const body = { values: { maxCrosswindKt: 24 + (step % 2) }, reason }
    for (let tries = 0; tries < 40 && !entry.acknowledged && !pastDeadline(); tries++) {
      // No Idempotency-Key on this route: one request at a time, and before sending it again (the answer may have
      // been lost after the change was kept, e.g. when the instance was killed), look whether it was kept.
      const res = await safety.once((step + tries) % urls.length, 'PUT', `/api/limits/airfields/${QUIET}`, body).catch(() => {
        safety.tally.refused++
        return null
      })
      if (res?.status === 200) entry.acknowledged = true
      else if (await scalar(`SELECT COUNT(*) FROM threshold_changes WHERE reason = '${reason}'`).catch(() => 0) > 0) entry.acknowledged = true
      else await sleep(300)
    }
    await sleep(1800 + Math.random() * 400)
  }
}

async function reader(pilot: SuiteClient) {
  for (let n = 0; n < SETTINGS.maxReads && !stopLoad && !pastDeadline(); n++) {
    await pilot.once(n % urls.length, 'GET', `/api/airfields/${n % 2 ? FIELD : QUIET}/briefing`).catch(() => {
      pilot.tally.refused++
    })
    await sleep(150)
  }
}

// ── Faults ───────────────────────────────────────────────────────────────────────────────────────────────────────

type Heal = { fault: string, healedMs: number, detail: string }
const heals: Heal[] = []

async function appAnswers(i: number) {
  const res = await fetch(`${urls[i]}/healthz`, { signal: AbortSignal.timeout(2000) })
  return res.ok
}

async function clusterWhole() {
  const states = await Promise.all([0, 1, 2].map(i => cluster.nodeState(i)))
  return states.every(s => s.up && s.ready && s.state === 'Synced' && s.size === 3)
}

function transferKind(i: number, sinceBytes: number): string {
  const f = join(cluster.nodeDir(i), 'err.log')
  const text = existsSync(f) ? readFileSync(f, 'utf8').slice(sinceBytes) : ''
  if (/IST received|Receiving IST/i.test(text)) return 'IST (incremental state transfer)'
  if (/SST (succeeded|complete)|rsync SST completed|Proceeding with SST/i.test(text)) return 'SST (full state transfer, rsync)'
  return 'state transfer not named in the log'
}
const logSize = (i: number) => {
  const f = join(cluster.nodeDir(i), 'err.log')
  return existsSync(f) ? readFileSync(f).length : 0
}

async function faultKillNode() {
  const i = 1
  log(`(a) kill -9 of node n${i + 1} (app2 prefers it)`)
  const since = logSize(i)
  const t0 = Date.now()
  await cluster.killNode(i)
  // app2 moves to the next host of its DATABASE_URL: time until it answers /healthz again.
  const served = await waitFor('app2 answering after the node kill', () => appAnswers(i), 60_000, 100)
  await sleep(8000)
  log(`(a) starting n${i + 1} again`)
  const restarted = Date.now()
  await cluster.startNode(i, { waitMs: 180_000 })
  await waitFor('cluster whole again', clusterWhole, 120_000)
  const healed = Date.now() - t0
  heals.push({ fault: '(a) kill -9 of a Galera node, started again after 8 s', healedMs: healed, detail: `app2 answered /healthz again after ${seconds(served)}; node rejoined by ${transferKind(i, since)} ${seconds(Date.now() - restarted)} after its start; cluster of 3 Synced ${seconds(healed)} after the kill` })
}

async function faultKillAppMidFanOut() {
  const i = 2
  const before = await scalar('SELECT COALESCE(MAX(id), 0) FROM outbox')
  const leases = (await anyNodeSql('SELECT column_name FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = \'outbox\' AND column_name = \'claimed_by\'')).length > 0
  // Slows the mail stand-in a little (where it reads the setting), so that a fan-out lasts long enough to be cut.
  const delayFile = join(cluster.cfg.dataDir, 'standins', 'smtp-delay-ms')
  writeFileSync(delayFile, '40')
  log('(b) starting a fan-out, then kill -9 of app3 while it sends')
  fanOutRequests += 1
  await waitFor('the fan-out has begun', async () => (await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before}`)) > 0, 60_000, 50)
  // With lease claims: wait (up to 20 s) until app3 holds claims it has not finished; otherwise until the first is sent.
  const holding = leases
    ? await waitFor('app3 holds claims', async () => (await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before} AND state = 'queued' AND claimed_by LIKE 'app3%' AND lease_until > NOW(3)`)) > 0, 20_000, 25).then(() => true, () => false)
    : await waitFor('the first notice sent', async () => (await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before} AND state = 'sent'`)) > 0, 60_000, 25).then(() => true, () => false)
  const t0 = Date.now()
  await cluster.killApp(i, 'SIGKILL')
  const pendingAtKill = await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before} AND state = 'queued'`)
  const heldAtKill = leases ? await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before} AND state = 'queued' AND claimed_by LIKE 'app3%' AND lease_until > NOW(3)`) : 0
  await sleep(3000)
  await cluster.startApp(i, appEnv)
  writeFileSync(delayFile, '0')
  await waitFor('the fan-out delivered', async () => (await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before} AND state = 'queued'`)) === 0, 300_000)
  const healed = Date.now() - t0
  const made = await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before}`)
  heals.push({ fault: '(b) kill -9 of an app instance mid fan-out, started again after 3 s', healedMs: healed, detail: `${made} notices in the fan-out, ${pendingAtKill} not yet sent at the kill${leases ? `, ${heldAtKill} of them claimed by app3${holding ? '' : ' (app3 had claimed none within 20 s)'}` : ''}; all sent ${seconds(healed)} after the kill` })
}

async function faultSmtpOutage() {
  log(`(c) SMTP stand-in stops listening for ${seconds(SETTINGS.smtpOutageMs)}`)
  const before = await scalar('SELECT COALESCE(MAX(id), 0) FROM outbox')
  cluster.smtpListening(false)
  fanOutRequests += 1
  await sleep(SETTINGS.smtpOutageMs)
  const waiting = await scalar(`SELECT COUNT(*) FROM outbox WHERE channel = 'email' AND state = 'queued'`)
  const t0 = Date.now()
  cluster.smtpListening(true)
  log(`(c) SMTP stand-in listens again; ${waiting} e-mails waiting`)
  await waitFor('e-mail queue drained', async () => (await scalar(`SELECT COUNT(*) FROM outbox WHERE channel = 'email' AND state = 'queued'`)) === 0, 300_000)
  const healed = Date.now() - t0
  const made = await scalar(`SELECT COUNT(*) FROM outbox WHERE id > ${before}`)
  heals.push({ fault: `(c) SMTP stand-in down for ${seconds(SETTINGS.smtpOutageMs)}`, healedMs: healed, detail: `${waiting} e-mails waited (${made} notices queued since the stop); all sent ${seconds(healed)} after the mail server came back` })
}

async function faultStaleNode() {
  const i = 2
  log(`(d) clean stop of node n${i + 1}; writes go on without it`)
  await cluster.stopNode(i)
  const seqnoAtStop = await scalar('SELECT VARIABLE_VALUE FROM information_schema.GLOBAL_STATUS WHERE VARIABLE_NAME = \'WSREP_LAST_COMMITTED\'').catch(() => 0)
  await sleep(15_000)
  const since = logSize(i)
  const t0 = Date.now()
  log(`(d) starting n${i + 1} with its stale state`)
  await cluster.startNode(i, { waitMs: 180_000 })
  await waitFor('cluster whole again', clusterWhole, 120_000)
  const healed = Date.now() - t0
  heals.push({ fault: '(d) a node stopped for 15 s of writes, started with its stale state', healedMs: healed, detail: `rejoined by ${transferKind(i, since)}; Synced ${seconds(healed)} after its start (cluster had committed past seqno ${seqnoAtStop || '?'} at the stop)` })
}

/** Key paths at which two JSON values differ ('' = the root). */
function differingPaths(a: unknown, b: unknown, path = ''): string[] {
  if (a === b) return []
  if (a && b && typeof a === 'object' && typeof b === 'object' && Array.isArray(a) === Array.isArray(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)])
    return [...keys].flatMap(k => differingPaths((a as any)[k], (b as any)[k], path ? `${path}.${k}` : k))
  }
  return [path || '(root)']
}

// ── Checks ───────────────────────────────────────────────────────────────────────────────────────────────────────

type Check = { name: string, ok: boolean, detail: string }
const checks: Check[] = []
const check = (name: string, ok: boolean, detail: string) => checks.push({ name, ok, detail })

type Mail = { deliveryId: string | null }
type Push = { payload?: { deliveryId?: number | string } }

/** Lines of a JSON Lines file, or the array of a JSON file (the stand-ins' two ways of keeping what they got). */
function keptMessages<T>(dir: string, base: string, fromJson: (v: any) => T[]): T[] {
  const jsonl = join(dir, `${base}.jsonl`)
  if (existsSync(jsonl)) {
    return readFileSync(jsonl, 'utf8').split('\n').filter(l => l.trim()).flatMap((l) => {
      try {
        return [JSON.parse(l) as T]
      }
      catch {
        return []
      }
    })
  }
  const json = join(dir, `${base}.json`)
  return existsSync(json) ? fromJson(JSON.parse(readFileSync(json, 'utf8'))) : []
}

/** Copies received at the stand-ins, counted by delivery id (the e-mail header X-Veerline-Delivery, the push payload's deliveryId). */
function standinCopies(): Map<string, number> {
  const dir = join(cluster.cfg.dataDir, 'standins')
  const copies = new Map<string, number>()
  const add = (id: unknown) => {
    if (id === null || id === undefined || id === '') return
    copies.set(String(id), (copies.get(String(id)) ?? 0) + 1)
  }
  for (const m of keptMessages<Mail>(dir, 'mailbox', v => v as Mail[])) add(m.deliveryId)
  for (const m of keptMessages<Push>(dir, 'pushbox', v => (v.messages ?? []) as Push[])) add(m.payload?.deliveryId)
  return copies
}

/**
 * Per delivery id, how many copies the outbox itself accounts for: every attempt it records (outbox_attempts: a
 * claim whose lease ran out may have gone out, and the next claim sends again, recorded as a resend). Where there is
 * no attempts table, the row's attempts count. Only sent rows.
 */
async function recordedSends(): Promise<{ sends: Map<string, number>, source: string }> {
  const tables = (await anyNodeSql('SELECT table_name FROM information_schema.tables WHERE table_schema = DATABASE()')).map(r => r[0])
  const cols = (await anyNodeSql('SELECT column_name FROM information_schema.columns WHERE table_schema = DATABASE() AND table_name = \'outbox\'')).map(r => r[0])
  const idColumn = cols.includes('delivery_id') ? 'o.delivery_id' : 'o.id'
  const sends = new Map<string, number>()
  const rows = tables.includes('outbox_attempts')
    ? await anyNodeSql(`SELECT ${idColumn}, (SELECT COUNT(*) FROM outbox_attempts a WHERE a.outbox_id = o.id AND a.outcome <> 'released') FROM outbox o WHERE o.state = 'sent'`)
    : await anyNodeSql(`SELECT ${idColumn}, o.attempts FROM outbox o WHERE o.state = 'sent'`)
  for (const [id, n] of rows) sends.set(String(id), Number(n))
  return { sends, source: tables.includes('outbox_attempts') ? 'attempts recorded in outbox_attempts' : 'the outbox rows\' attempts count' }
}

async function runChecks() {
  // Filings: every acknowledged one stored once; nothing stored that was not acknowledged; nothing doubled.
  const stored = await anyNodeSql(`SELECT notes, COUNT(*) FROM profiles WHERE notes LIKE '${RUN} filing %' GROUP BY notes`)
  const storedCount = new Map(stored.map(([notes, n]) => [notes!, Number(n)]))
  const acked = filings.filter(f => f.profileId !== null)
  const doubled = [...storedCount.values()].filter(n => n > 1).length
  const storedNotAcked = [...storedCount.keys()].filter(k => !acked.some(f => f.notes === k)).length
  const ackedNotStored = acked.filter(f => !storedCount.has(f.notes)).length
  const retried = filings.filter(f => f.attempts > 1).length
  check('filings acknowledged = stored, 0 doubled', acked.length === storedCount.size && doubled === 0 && ackedNotStored === 0 && storedNotAcked === 0,
    `${filings.length} sent, ${acked.length} acknowledged, ${storedCount.size} stored, ${doubled} doubled, ${ackedNotStored} acknowledged but missing, ${storedNotAcked} stored but never acknowledged; ${retried} needed more than one attempt (same Idempotency-Key)`)
  check('every filing acknowledged', acked.length === filings.length, `${filings.length - acked.length} without an acknowledgement`)

  const changesKept = await anyNodeSql(`SELECT reason, COUNT(*) FROM threshold_changes WHERE reason LIKE '${RUN} limit change %' GROUP BY reason`)
  const changesDoubled = changesKept.filter(([, n]) => Number(n) > 1).length
  const changesAcked = limitChanges.filter(c => c.acknowledged).length
  check('limit changes acknowledged = stored, 0 doubled', changesAcked === changesKept.length && changesDoubled === 0,
    `${limitChanges.length} sent, ${changesAcked} acknowledged, ${changesKept.length} stored, ${changesDoubled} doubled`)

  // Notices: everything due was delivered; at the stand-ins every outbox row arrived, and a second copy only
  // where the outbox records a second send.
  const due = await scalar('SELECT COUNT(*) FROM outbox')
  const delivered = await scalar('SELECT COUNT(*) FROM outbox WHERE state = \'sent\'')
  const failed = await scalar('SELECT COUNT(*) FROM outbox WHERE state = \'failed\'')
  const copies = standinCopies()
  const { sends, source } = await recordedSends()
  let missing = 0
  let unrecorded = 0
  let extra = 0
  let recordedResends = 0
  for (const [id, n] of sends) {
    const got = copies.get(id) ?? 0
    if (got === 0) missing++
    if (got > n) unrecorded += got - n
    if (Math.min(got, n) > 1) recordedResends += Math.min(got, n) - 1
  }
  for (const id of copies.keys()) if (!sends.has(id)) extra++
  const totalCopies = [...copies.values()].reduce((a, b) => a + b, 0)
  check('notices due = delivered, 0 lost', due === delivered && missing === 0 && failed === 0,
    `${due} due, ${delivered} delivered (outbox), ${failed} failed, ${missing} sent but not at the stand-ins; ${totalCopies} copies received, ${recordedResends} of them recorded resends`)
  check('no copy the outbox does not record as a resend', unrecorded === 0 && extra === 0,
    `${unrecorded} unrecorded extra copies, ${extra} copies with no sent outbox row (copies allowed per row: ${source})`)

  // The same briefing on every instance, for the same profile and time: the latest filing at each airfield, and
  // the briefing of now (the profile in force). Compared whole, key by key (but for the time the answer was made),
  // and by ETag; the paths that differ are printed.
  const pilot = await signIn('pilot@veerline.example', 'veerline-demo')
  const at = new Date(Math.floor(Date.now() / 60_000) * 60_000).toISOString()
  const compared: string[] = []
  let allSame = true
  for (const field of [FIELD, QUIET]) {
    const last = acked.filter(f => f.field === field).at(-1)
    for (const query of [last ? `profile=${last.profileId}&at=${encodeURIComponent(at)}` : null, `at=${encodeURIComponent(at)}`]) {
      if (!query) continue
      const answers = await Promise.all(urls.map((_, i) => pilot.once(i, 'GET', `/api/airfields/${field}/briefing?${query}`)))
      // generatedAt is when this answer was made (a per-request field, server/domain/briefings/read.ts): left out.
      const diffs = answers.slice(1).flatMap(a => differingPaths(answers[0]!.body, a.body)).filter(p => p !== 'briefing.generatedAt')
      const same = answers.every(a => a.status === 200 && a.headers.get('etag') === answers[0]!.headers.get('etag')) && diffs.length === 0
      allSame &&= same
      compared.push(`${field} ${query.startsWith('profile') ? `profile ${last!.profileId}` : 'in force'}: ${answers.map(a => `${a.status}/${JSON.stringify(a.body).length} B/${a.headers.get('etag') ?? '-'}`).join(', ')}${diffs.length ? ` differ at ${[...new Set(diffs)].slice(0, 5).join(', ')}` : ''}`)
    }
  }
  check('every instance\'s briefing equal for the same profile', allSame && compared.length > 0, compared.join('; '))

  // Never a 5xx other than 503.
  const all = Object.values(tallies)
  const server5xx = all.reduce((a, t) => a + t.server5xx, 0)
  check('no 5xx but 503 (with Retry-After) anywhere', server5xx === 0, Object.entries(tallies).map(([k, t]) => `${k}: ${t.requests} requests, ${t.ok} ok, ${t.unavailable503} × 503, ${t.refused} refused/reset, ${t.server5xx} other 5xx${Object.keys(t.other).length ? `, ${JSON.stringify(t.other)}` : ''}`).join('; '))
}

// ── The run ──────────────────────────────────────────────────────────────────────────────────────────────────────

let stopping: Promise<void> | null = null
const stopEverything = () => (stopping ??= cluster.stopAll())
process.on('SIGINT', () => void stopEverything().then(() => process.exit(130)))
process.on('SIGTERM', () => void stopEverything().then(() => process.exit(143)))

let exitCode = 1
try {
  rmSync(join(cluster.cfg.dataDir, 'standins'), { recursive: true, force: true })
  await cluster.startDatabase(true)
  await cluster.migrate()
  await cluster.build()
  await cluster.startStandins()
  await Promise.all(urls.map((_, i) => cluster.startApp(i, appEnv)))
  log(`cluster up after ${seconds(Date.now() - startedAt)}: ${urls.join(', ')}`)
  await setUp()

  const dispatcher = await signIn('dispatch@veerline.example', 'veerline-demo')
  const fileClient = new SuiteClient(urls, tallies.filings!)
  fileClient.cookie = dispatcher.cookie
  const safety = new SuiteClient(urls, tallies.limits!)
  safety.cookie = (await signIn('safety@veerline.example', 'veerline-demo')).cookie
  const pilot = new SuiteClient(urls, tallies.reads!)
  pilot.cookie = (await signIn('pilot@veerline.example', 'veerline-demo')).cookie

  const load = Promise.all([
    ...Array.from({ length: SETTINGS.filers }, (_, n) => filer(n, fileClient)),
    limitChanger(safety), reader(pilot), reader(pilot),
  ])
  fanOutRequests += 1
  await sleep(5000)
  // A fault that does not heal within its bound is a FAIL of its own; the suite goes on to the next and the checks.
  for (const [name, fault] of [['(a) node kill', faultKillNode], ['(b) app kill mid fan-out', faultKillAppMidFanOut], ['(c) SMTP outage', faultSmtpOutage], ['(d) stale node', faultStaleNode]] as const) {
    try {
      await fault()
    }
    catch (err) {
      log(`${name}: ${(err as Error).message}`)
      check(`fault ${name} healed`, false, (err as Error).message)
    }
  }
  fanOutRequests += 1
  await sleep(5000)
  stopLoad = true
  await load
  log('load stopped; waiting for the outbox to drain')
  const drained = await waitFor('outbox drained', async () => (await outboxPending()) === 0, 300_000).catch(() => -1)
  if (drained < 0) log('the outbox did not drain in 300 s')
  await runChecks()
  exitCode = checks.every(c => c.ok) ? 0 : 1
}
catch (err) {
  console.error(`[fault suite] ${(err as Error).stack ?? err}`)
  check('the suite ran to the end', false, (err as Error).message)
}
finally {
  await stopEverything()
}

console.log('\n══ Fault suite summary ══')
for (const h of heals) console.log(`heal  ${h.fault}: ${seconds(h.healedMs)} — ${h.detail}`)
for (const c of checks) console.log(`${c.ok ? 'PASS' : 'FAIL'}  ${c.name}: ${c.detail}`)
console.log(`run time ${seconds(Date.now() - startedAt)}; ${checks.filter(c => c.ok).length}/${checks.length} checks passed`)
process.exit(exitCode)
