// Delivery under faults: two instances, a graceful stop mid-batch, a kill -9 mid-batch, a long SMTP outage.
// These run on a database of their own (VEERLINE_OUTBOX_TEST_DATABASE_URL, made by scripts/test.sh) with app instances
// started here, so only workers this file controls take its rows. Messages are counted at the stand-ins (the SMTP
// stand-in's mailbox file, the push stand-in's message list) by the delivery id each message carries.
import { createECDH, randomBytes } from 'node:crypto'
import mysql from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'
import { createTestAirfield, windProfile } from '../support/alerts'
import { mailCounts, makeRecipients, pushCounts, pushStandin, setSmtpDelay, smtpPid, until } from '../support/fanout'
import { startInstance, stopInstance, type Instance } from '../support/instance'

const DB_URL = process.env.VEERLINE_OUTBOX_TEST_DATABASE_URL!
let conn: mysql.Connection
let a: Instance
const started: Instance[] = []

interface Row { id: number, delivery_id: string, channel: string, state: string, attempts: number, sent_by: string | null, last_error: string | null }
interface Attempt { outbox_id: number, attempt: number, instance: string, outcome: string }

async function q<T>(sqlText: string, params: unknown[] = []) {
  const [rows] = await conn.query(sqlText, params)
  return rows as T[]
}
const rowsOf = (alertId: number) => q<Row>('SELECT id, delivery_id, channel, state, attempts, sent_by, last_error FROM outbox WHERE alert_id = ? ORDER BY id', [alertId])
const attemptsOf = (alertId: number) => q<Attempt>(`SELECT t.outbox_id, t.attempt, t.instance, t.outcome FROM outbox_attempts t
  JOIN outbox o ON o.id = t.outbox_id WHERE o.alert_id = ? ORDER BY t.outbox_id, t.attempt, t.id`, [alertId])

async function signedInAt(base: string, email: string) {
  const c = new ApiClient(base)
  await c.signIn(email)
  return c
}

/** A test airfield whose runway 18 crosswind crosses (wind 220° at 30 kt: 19.28 kt, FAA crosswind chart example) with `emails` followers. */
async function fanOut(tag: string, emails: number, pushes = 0) {
  const code = await createTestAirfield({ 18: 180, 36: 360 }, 'Outbox fault field', DB_URL)
  const safety = await signedInAt(a.baseUrl, 'safety@veerline.example')
  expect((await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 18, maxTailwindKt: 30 }, reason: 'Fault test: crosswind limit' })).status).toBe(200)
  expect((await safety.put(`/api/limits/airfields/${code}`, { designator: '36', values: { maxCrosswindKt: 25 }, reason: 'Fault test: runway 36 clear' })).status).toBe(200)
  const recipients = await makeRecipients(DB_URL, code, `${tag}-${Date.now()}`, emails, pushes)
  return { code, ...recipients, safety }
}

async function file(code: string, via = a) {
  const dispatcher = await signedInAt(via.baseUrl, 'dispatch@veerline.example')
  const res = await dispatcher.post(`/api/airfields/${code}/profiles`, windProfile(220, 30))
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  const [alert] = await q<{ id: number }>('SELECT a.id FROM alerts a JOIN airfields f ON f.id = a.airfield_id WHERE f.code = ? AND a.state = \'active\'', [code])
  expect(alert).toBeTruthy()
  return alert!.id
}

const allSent = (alertId: number, n: number) => async () => {
  const rows = await rowsOf(alertId)
  return rows.length === n && rows.every(r => r.state === 'sent') ? rows : null
}

beforeAll(async () => {
  expect(DB_URL, 'VEERLINE_OUTBOX_TEST_DATABASE_URL is set by scripts/test.sh').toBeTruthy()
  conn = await mysql.createConnection({ uri: DB_URL, timezone: 'Z' })
  a = await startInstance('out-a', DB_URL, { VEERLINE_OUTBOX_BATCH: '10' })
  started.push(a)
}, 60_000)

afterAll(async () => {
  setSmtpDelay(0)
  process.kill(smtpPid(), 'SIGUSR2')
  for (const i of started) await stopInstance(i)
  await conn?.end()
}, 90_000)

describe('outbox under faults', () => {
  it('two instances deliver 60 e-mails and 10 pushes exactly once each, counted at the stand-ins', async () => {
    const b = await startInstance('out-b', DB_URL, { VEERLINE_OUTBOX_BATCH: '10' })
    started.push(b)
    const f = await fanOut('twice', 60, 10)
    setSmtpDelay(15)
    try {
      const alertId = await file(f.code)
      const rows = await until('all 70 sent', allSent(alertId, 70), 60_000)
      const mails = mailCounts(f.addresses)
      const pushes = await pushCounts(f.devices)
      expect(mails.size).toBe(60)
      expect(pushes.size).toBe(10)
      expect([...mails.values(), ...pushes.values()].every(n => n === 1)).toBe(true)
      expect(new Set([...mails.keys(), ...pushes.keys()])).toEqual(new Set(rows.map(r => r.delivery_id)))
      // Both workers took part, and each row has exactly one attempt, recorded as sent.
      expect(new Set(rows.map(r => r.sent_by))).toEqual(new Set([a.instanceId, b.instanceId]))
      const attempts = await attemptsOf(alertId)
      expect(attempts).toHaveLength(70)
      expect(attempts.every(t => t.outcome === 'sent')).toBe(true)
    }
    finally {
      setSmtpDelay(0)
      await stopInstance(b)
    }
  }, 90_000)

  it('SIGTERM mid-batch: the stopping worker records every send before it exits, gives the rest back, and nothing is sent twice', async () => {
    const b = await startInstance('out-term', DB_URL, { VEERLINE_OUTBOX_BATCH: '30' })
    started.push(b)
    const f = await fanOut('term', 60)
    setSmtpDelay(200)
    try {
      const alertId = await file(f.code)
      await until('the worker to hold a batch', async () => {
        const [c] = await q<{ n: number }>('SELECT COUNT(*) AS n FROM outbox WHERE alert_id = ? AND claimed_by = ? AND state = \'queued\' AND lease_until > NOW(3)', [alertId, b.instanceId])
        return Number(c!.n) >= 10
      }, 30_000, 50)
      const exit = await stopInstance(b, 'SIGTERM')
      expect(exit.signal).toBeNull()
      // Before the process was gone, every attempt it made was closed: sent or given back, none left open.
      const mine = (await attemptsOf(alertId)).filter(t => t.instance === b.instanceId)
      expect(mine.filter(t => t.outcome === 'sending')).toEqual([])
      expect(mine.some(t => t.outcome === 'released')).toBe(true)
      expect(mine.every(t => t.outcome === 'sent' || t.outcome === 'released')).toBe(true)
      setSmtpDelay(0)
      const rows = await until('all 60 sent', allSent(alertId, 60), 60_000)
      const mails = mailCounts(f.addresses)
      expect(mails.size).toBe(60)
      expect([...mails.values()].every(n => n === 1)).toBe(true)
      // What it gave back went out once, from the other instance; its own sends are on record under its name.
      expect(rows.filter(r => r.sent_by === b.instanceId).length).toBe(mine.filter(t => t.outcome === 'sent').length)
    }
    finally {
      setSmtpDelay(0)
    }
  }, 90_000)

  it('kill -9 mid-batch: its leases run out, the rows are due again, and every resend is on record with both senders', async () => {
    const c = await startInstance('out-kill', DB_URL, { VEERLINE_OUTBOX_BATCH: '30', VEERLINE_OUTBOX_LEASE_MS: '3000' })
    started.push(c)
    const f = await fanOut('kill', 50)
    setSmtpDelay(300)
    try {
      const alertId = await file(f.code)
      await until('the doomed worker to be mid-batch', async () => {
        const [n] = await q<{ open: number, sent: number }>(`SELECT SUM(t.outcome = 'sending') AS open, SUM(t.outcome = 'sent') AS sent
          FROM outbox_attempts t JOIN outbox o ON o.id = t.outbox_id WHERE o.alert_id = ? AND t.instance = ?`, [alertId, c.instanceId])
        return Number(n!.open) >= 5 && Number(n!.sent) >= 1
      }, 30_000, 50)
      await stopInstance(c, 'SIGKILL')
      const open = (await attemptsOf(alertId)).filter(t => t.instance === c.instanceId && t.outcome === 'sending').map(t => t.outbox_id)
      expect(open.length).toBeGreaterThan(0)
      setSmtpDelay(0)
      const rows = await until('all 50 sent', allSent(alertId, 50), 60_000)
      const attempts = await attemptsOf(alertId)
      for (const id of open) {
        const tries = attempts.filter(t => t.outbox_id === id)
        expect(tries.map(t => [t.instance, t.outcome])).toEqual([[c.instanceId, 'lease-expired'], [a.instanceId, 'sent']])
        expect(rows.find(r => r.id === id)!.attempts).toBe(2)
      }
      // Every copy that reached the mail server is accounted for by an attempt: a message received twice is one whose
      // first attempt died with the worker (lease-expired) and whose second was sent.
      const mails = mailCounts(f.addresses)
      expect(mails.size).toBe(50)
      for (const r of rows) {
        const got = mails.get(r.delivery_id) ?? 0
        const tries = attempts.filter(t => t.outbox_id === r.id)
        expect(got).toBeGreaterThanOrEqual(1)
        expect(got).toBeLessThanOrEqual(tries.filter(t => t.outcome === 'sent' || t.outcome === 'lease-expired').length)
        if (got > 1) expect(tries.some(t => t.outcome === 'lease-expired')).toBe(true)
      }
    }
    finally {
      setSmtpDelay(0)
    }
  }, 90_000)

  it('a 10-minute SMTP outage (clock at 1/100) ends with every message delivered once, none failed', async () => {
    // Only the worker with the shortened clock may take these rows.
    await stopInstance(a)
    const d = await startInstance('out-clock', DB_URL, { VEERLINE_OUTBOX_TIME_SCALE: '0.01' })
    started.push(d)
    a = d
    const f = await fanOut('outage', 20)
    const pid = smtpPid()
    process.kill(pid, 'SIGUSR1')
    let alertId = 0
    try {
      alertId = await file(f.code, d)
      // 10 minutes at 1/100 speed: 6 s of refused connections.
      await new Promise(r => setTimeout(r, 6000))
      const during = await rowsOf(alertId)
      expect(during).toHaveLength(20)
      expect(during.every(r => r.state === 'queued' && r.attempts >= 2 && r.last_error)).toBe(true)
      // /healthz and the alert log show the queue: these 20 are the whole backlog of this database.
      const health = await (await fetch(`${d.baseUrl}/healthz`)).json()
      expect(health.outbox).toMatchObject({ backlog: 20, failed: 0 })
      expect(health.outbox.due + health.outbox.sending + health.outbox.retrying).toBe(20)
      expect(health.outbox.oldestDueAgeS).toBeGreaterThanOrEqual(0)
      const log = await (await signedInAt(d.baseUrl, 'safety@veerline.example')).get(`/api/alerts?airfield=${f.code}`)
      expect(log.body.queue).toMatchObject({ backlog: 20, failed: 0 })
      expect(log.body.alerts[0].deliveries[0].tries.length).toBeGreaterThanOrEqual(2)
    }
    finally {
      process.kill(pid, 'SIGUSR2')
    }
    const rows = await until('all 20 sent after the outage', allSent(alertId, 20), 30_000)
    expect(rows.every(r => r.attempts >= 3)).toBe(true)
    const mails = mailCounts(f.addresses)
    expect(mails.size).toBe(20)
    expect([...mails.values()].every(n => n === 1)).toBe(true)
    const attempts = await attemptsOf(alertId)
    for (const r of rows) {
      const tries = attempts.filter(t => t.outbox_id === r.id)
      expect(tries.at(-1)!.outcome).toBe('sent')
      expect(tries.slice(0, -1).every(t => t.outcome === 'error')).toBe(true)
    }
  }, 90_000)

  it('a notice that fails for good shows at once to the safety office (header count, alert log, /healthz), not to a pilot', async () => {
    const f = await fanOut('gone', 1)
    // A device the push service does not know (404): the delivery fails at once, without retries.
    const pushOnly = f.userIds[0]!
    await conn.query('UPDATE alert_subscriptions SET email = 0, push = 1 WHERE user_id = ?', [pushOnly])
    const ecdh = createECDH('prime256v1')
    ecdh.generateKeys()
    await conn.query('INSERT INTO push_subscriptions (user_id, endpoint, p256dh, auth, label) VALUES (?, ?, ?, ?, ?)', [pushOnly,
      `${pushStandin()}/push/00000000-0000-4000-8000-000000000000`, ecdh.getPublicKey().toString('base64url'), randomBytes(16).toString('base64url'), 'Lost phone'])
    const alertId = await file(f.code)
    await until('the push to fail', async () => (await rowsOf(alertId)).some(r => r.state === 'failed'), 30_000)
    const safety = await signedInAt(a.baseUrl, 'safety@veerline.example')
    expect((await safety.get('/api/alerts/inbox/count')).body.failedAlertNotices).toBeGreaterThanOrEqual(1)
    expect((await safety.get(`/api/alerts?airfield=${f.code}`)).body.queue.failedAlerts).toBeGreaterThanOrEqual(1)
    // The header's notice leads to the alerts with a notice not delivered: this one is among them, with who it was for.
    const failedOnly = await safety.get(`/api/alerts?delivery=failed&airfield=${f.code}`)
    expect(failedOnly.body.alerts.map((x: { id: number }) => x.id)).toEqual([alertId])
    const lost = failedOnly.body.alerts[0].deliveries.find((d: { state: string }) => d.state === 'failed')
    expect(lost).toMatchObject({ channel: 'push', userId: pushOnly, device: null })
    expect(lost.recipientEmail).toBe(f.addresses[0])
    const bad = await safety.get('/api/alerts?delivery=lost')
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0]).toMatchObject({ field: 'delivery' })
    expect((await (await fetch(`${a.baseUrl}/healthz`)).json()).outbox.failed).toBeGreaterThanOrEqual(1)
    const pilot = await signedInAt(a.baseUrl, 'pilot@veerline.example')
    expect((await pilot.get('/api/alerts/inbox/count')).body).not.toHaveProperty('failedAlertNotices')
  }, 60_000)
  it('an alert filed on an instance goes out once the filing is answered, without waiting for that instance\'s poll', async () => {
    // Every other worker stopped; this one polls every 10 minutes, so only the wake after the filing can send in time.
    for (const i of started) await stopInstance(i)
    const w = await startInstance('out-wake', DB_URL, { VEERLINE_OUTBOX_INTERVAL_MS: '600000' })
    started.push(w)
    a = w
    const f = await fanOut('wake', 3)
    // Give the start-up claim time to find nothing (the poll then rests for 10 minutes).
    await new Promise(r => setTimeout(r, 500))
    const alertId = await file(f.code, w)
    const rows = await until('the notices to be sent', allSent(alertId, 3), 20_000)
    expect(rows.every(r => r.sent_by === w.instanceId)).toBe(true)
    const mails = mailCounts(f.addresses)
    expect([...mails.values()]).toEqual([1, 1, 1])
  }, 60_000)
})
