import { spawn, type ChildProcess } from 'node:child_process'
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { createTestAirfield, mailTo, newUser, smtpPid, waitFor, windProfile } from '../support/alerts'

// The crossing case: runway 18 (true heading 180°, variation 0), wind 220° at 30 kt, 40° off the runway.
// FAA knowledge-test crosswind chart worked example: crosswind 30·sin 40° = 19.28 kt, headwind 22.98 kt.
const FAA_CROSSWIND_KT = 19.28

type Client = ApiClient
let admin: Client, safety: Client, dispatcher: Client

async function deliveriesOf(alertId: number) {
  const log = await safety.get('/api/alerts?limit=500')
  return (log.body.alerts as { id: number, deliveries: { id: number, deliveryId: string, channel: string, state: string, attempts: number, lastError: string | null, sentBy: string | null }[] }[])
    .find(a => a.id === alertId)?.deliveries ?? []
}

/** A test airfield where only runway 18's crosswind can cross: crosswind 18 kt for the field, 25 kt on 36, tailwind 30 kt. */
async function crosswindField() {
  const code = await createTestAirfield({ 18: 180, 36: 360 })
  const a = await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 18, maxTailwindKt: 30 }, reason: 'Test field: crosswind limit for a light type' })
  expect(a.status).toBe(200)
  const b = await safety.put(`/api/limits/airfields/${code}`, { designator: '36', values: { maxCrosswindKt: 25 }, reason: 'Test field: runway 36 has the better surface' })
  expect(b.status).toBe(200)
  return code
}

async function file(code: string, dirDeg: number, speedKt: number) {
  const res = await dispatcher.post(`/api/airfields/${code}/profiles`, windProfile(dirDeg, speedKt))
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  return res.body.profile.id as number
}

async function alertsAt(code: string, state = 'active') {
  return (await safety.get(`/api/alerts?airfield=${code}&state=${state}`)).body.alerts as { id: number, designator: string, kind: string, value: number, limitValue: number, excess: number, profileId: number }[]
}

async function outboxIdle() {
  const queued = await safety.get('/api/alerts/deliveries?state=queued')
  return queued.body.deliveries.length === 0
}

beforeAll(async () => {
  admin = await signedIn('admin')
  safety = await signedIn('safety')
  dispatcher = await signedIn('dispatcher')
})

describe('alerts: evaluation, e-mail and push', () => {
  it('one crossing makes one alert, one e-mail with the figures and one decrypted push; filing again duplicates nothing; a calmer profile clears it', async () => {
    const code = await crosswindField()
    const pilot = await newUser(admin, 'pilot', 'xw')
    expect((await pilot.client.put(`/api/subscriptions/${code}`, { email: true, push: true })).status).toBe(200)
    const device = await pilot.client.post('/api/push/simulated', { label: 'Test phone' })
    expect(device.status, JSON.stringify(device.body)).toBe(201)

    const profileId = await file(code, 220, 30)
    const active = await alertsAt(code)
    expect(active).toHaveLength(1)
    expect(active[0]).toMatchObject({ designator: '18', kind: 'crosswind', limitValue: 18, profileId })
    expect(active[0]!.value).toBeCloseTo(FAA_CROSSWIND_KT, 2)
    expect(active[0]!.excess).toBeCloseTo(FAA_CROSSWIND_KT - 18, 2)

    const mails = await waitFor('the alert e-mail', async () => {
      const m = await mailTo(admin, pilot.email)
      return m.length ? m : null
    })
    expect(mails).toHaveLength(1)
    const mail = mails[0]!
    expect(mail.subject).toContain(`${code} runway 18`)
    expect(mail.text).toContain('Value: 19.3 kt')
    expect(mail.text).toContain('Limit: 18 kt')
    expect(mail.text).toContain('Over the limit by: 1.3 kt')
    expect(mail.text).toContain(`/briefings/${code}?profile=${profileId}`)
    expect(mail.text).toMatch(/Valid: \d{4}-\d\d-\d\d \d\d:\d\dZ to /)
    expect(mail.text).toContain(VEERLINE_CAUTION_START)
    expect(mail.html).toContain(`/briefings/${code}?profile=${profileId}`)

    const pushes = await waitFor('the decrypted push', async () => {
      const d = await pilot.client.get('/api/push/device')
      return d.body.messages.length ? d.body.messages : null
    })
    expect(pushes).toHaveLength(1)
    expect(pushes[0].vapid.verified).toBe(true)
    expect(pushes[0].payload).toMatchObject({ airfield: code, designator: '18', kind: 'crosswind', limit: 18, event: 'raised', profileId })
    expect(pushes[0].payload.value).toBeCloseTo(FAA_CROSSWIND_KT, 2)
    expect(pushes[0].payload.caution).toContain('Advisory only')

    const inbox = await pilot.client.get('/api/alerts/inbox')
    expect(inbox.body.unacknowledged).toBe(1)

    // Filing the same profile again: the newer version carries the same crossing over; no second alert or notice.
    const againId = await file(code, 220, 30)
    const afterAgain = await alertsAt(code)
    expect(afterAgain).toHaveLength(1)
    expect(afterAgain[0]!.profileId).toBe(againId)
    await waitFor('the outbox to drain', outboxIdle)
    expect(await mailTo(admin, pilot.email)).toHaveLength(1)
    expect((await pilot.client.get('/api/push/device')).body.messages).toHaveLength(1)
    expect((await pilot.client.get('/api/alerts/inbox/count')).body.unacknowledged).toBe(1)

    // A calmer newer profile (220° at 20 kt: 12.9 kt crosswind) clears it and says so.
    await file(code, 220, 20)
    expect(await alertsAt(code)).toHaveLength(0)
    const cleared = await alertsAt(code, 'cleared')
    expect(cleared).toHaveLength(1)
    const clearMails = await waitFor('the all-clear e-mail', async () => {
      const m = await mailTo(admin, pilot.email)
      return m.length >= 2 ? m : null
    })
    expect(clearMails[0]!.subject).toContain('all clear')
    expect(clearMails[0]!.text).toMatch(/no longer crosses/)

    // Acknowledge: the count goes down; another user cannot acknowledge it.
    const items = (await pilot.client.get('/api/alerts/inbox')).body.items
    expect((await dispatcher.post(`/api/alerts/inbox/${items[0].id}/acknowledge`)).status).toBe(404)
    expect((await pilot.client.post(`/api/alerts/inbox/${items[0].id}/acknowledge`)).status).toBe(200)
    expect((await pilot.client.get('/api/alerts/inbox/count')).body.unacknowledged).toBe(items.length - 1)
  })

  it('with the SMTP stand-in down the delivery is retried and arrives once it is back, none lost', async () => {
    const code = await crosswindField()
    const pilot = await newUser(admin, 'pilot', 'retry')
    await pilot.client.put(`/api/subscriptions/${code}`, { email: true, push: false })
    const pid = smtpPid()
    process.kill(pid, 'SIGUSR1')
    try {
      await file(code, 220, 30)
      const [alert] = await alertsAt(code)
      const failedOnce = await waitFor('a failed attempt', async () => {
        const d = (await deliveriesOf(alert!.id)).find(x => x.channel === 'email')
        return d && d.attempts >= 1 && d.state === 'queued' && d.lastError ? d : null
      })
      expect(failedOnce.lastError).toMatch(/ECONNREFUSED|connect|421/i)
    }
    finally {
      process.kill(pid, 'SIGUSR2')
    }
    const [alert] = await alertsAt(code)
    const sent = await waitFor('the delivery to be sent', async () => {
      const d = (await deliveriesOf(alert!.id)).find(x => x.channel === 'email')
      return d?.state === 'sent' ? d : null
    }, 45_000)
    expect(sent.attempts).toBeGreaterThanOrEqual(2)
    const mails = await mailTo(admin, pilot.email)
    expect(mails).toHaveLength(1)
    expect(mails[0]!.deliveryId).toBe(sent.deliveryId)
  })

  it('two app instances on one database deliver each message exactly once', async () => {
    const port2 = process.env.VEERLINE_PORT_2
    expect(port2, 'VEERLINE_PORT_2 is set by scripts/test.sh').toBeTruthy()
    const second: ChildProcess = spawn(process.execPath, ['.output/server/index.mjs'], {
      env: { ...process.env, PORT: port2, NITRO_PORT: port2, HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1' },
      stdio: 'ignore',
    })
    try {
      await waitFor('the second instance', async () => (await fetch(`http://127.0.0.1:${port2}/healthz`)).ok)
      const code = await crosswindField()
      const users = []
      for (let i = 0; i < 12; i++) users.push(await newUser(admin, 'pilot', `twin${i}`))
      for (const u of users) await u.client.put(`/api/subscriptions/${code}`, { email: true, push: false })
      // File through the second instance: both workers see the same outbox.
      const viaSecond = new ApiClient(`http://127.0.0.1:${port2}`)
      await viaSecond.signIn('dispatch@veerline.example')
      const res = await viaSecond.post(`/api/airfields/${code}/profiles`, windProfile(220, 30))
      expect(res.status).toBe(201)
      const [alert] = await alertsAt(code)
      const deliveries = await waitFor('all 12 deliveries sent', async () => {
        const d = await deliveriesOf(alert!.id)
        return d.length === 12 && d.every(x => x.state === 'sent') ? d : null
      }, 45_000)
      // Each of the 12 recipients got exactly one message, and the 12 messages carry the 12 delivery ids once each.
      // (The stand-in's mailbox outlives test runs, so only these fresh recipients are counted.)
      const got: string[] = []
      for (const u of users) {
        const mails = await mailTo(admin, u.email)
        expect(mails, u.email).toHaveLength(1)
        got.push(mails[0]!.deliveryId!)
      }
      expect(got.sort()).toEqual(deliveries.map(d => d.deliveryId).sort())
      console.log('deliveries sent by instance:', Object.entries(deliveries.reduce<Record<string, number>>((acc, d) => ({ ...acc, [d.sentBy!]: (acc[d.sentBy!] ?? 0) + 1 }), {})))
    }
    finally {
      second.kill('SIGTERM')
      await new Promise(r => second.exitCode != null ? r(null) : second.once('exit', r))
    }
  })
})

describe('thresholds', () => {
  it('only safety officers and admins change them (401 signed out, 403 others), with ranges and a reason', async () => {
    const body = { values: { maxCrosswindKt: 22 }, reason: 'Probe change' }
    expect((await new ApiClient().put('/api/limits/organisation', body)).status).toBe(401)
    for (const role of ['pilot', 'dispatcher'] as const) {
      const res = await (await signedIn(role)).put('/api/limits/organisation', { nonsense: true })
      expect(res.status).toBe(403)
    }
    const code = await createTestAirfield({ '09': 90, '27': 270 })
    expect((await dispatcher.put(`/api/limits/airfields/${code}`, body)).status).toBe(403)

    const tooHigh = await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 75, nearLimitMarginPct: -1 }, reason: 'x' })
    expect(tooHigh.status).toBe(422)
    const messages = tooHigh.body.data.issues.map((i: { field: string, message: string }) => `${i.field}: ${i.message}`)
    expect(messages).toContain('values.maxCrosswindKt: Maximum crosswind must be at most 60 kt')
    expect(messages).toContain('values.nearLimitMarginPct: Near-limit margin must be at least 0 %')
    expect(messages.some((m: string) => m.startsWith('reason:'))).toBe(true)

    const badEnd = await safety.put(`/api/limits/airfields/${code}`, { designator: '18', values: { maxCrosswindKt: 15 }, reason: 'Runway 18 probe' })
    expect(badEnd.status).toBe(422)

    const ok = await admin.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 22 }, reason: 'Admin probe change' })
    expect(ok.status).toBe(200)
    const ok2 = await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 21 }, reason: 'Safety probe change' })
    expect(ok2.status).toBe(200)
    const history = (await safety.get(`/api/limits/history?airfield=${code}`)).body.changes
    expect(history).toHaveLength(2)
    expect(history[0]).toMatchObject({ reason: 'Safety probe change', changedBy: { email: 'safety@veerline.example' }, oldValues: { maxCrosswindKt: 22 }, newValues: { maxCrosswindKt: 21 } })
    expect(history[1]).toMatchObject({ oldValues: null, newValues: { maxCrosswindKt: 22, maxTailwindKt: null } })
    const all = (await (await signedIn('pilot')).get('/api/limits')).body
    const field = all.airfields.find((a: { code: string }) => a.code === code)
    expect(field.effective.maxCrosswindKt).toBe(21)
    expect(field.source.maxCrosswindKt).toBe('airfield')
  })
})

const VEERLINE_CAUTION_START = 'Caution: Advisory only.'
