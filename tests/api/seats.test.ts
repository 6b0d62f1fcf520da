// Issue 13, the other seats: a limit change's dry run against the real change, following an airfield with active
// alerts, acknowledging many inbox entries at once.
import { beforeAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { createTestAirfield, newUser, windProfile } from '../support/alerts'

// Runways 18 and 36 (true 180° and 360°, variation 0), wind 220° at 30 kt: 40° off both ends.
// FAA knowledge-test crosswind chart worked example: crosswind 30·sin 40° = 19.28 kt on either end.
const FAA_CROSSWIND_KT = 19.28

let admin: ApiClient, safety: ApiClient, dispatcher: ApiClient

beforeAll(async () => {
  admin = await signedIn('admin')
  safety = await signedIn('safety')
  dispatcher = await signedIn('dispatcher')
})

type Effect = { event: string, airfieldCode: string, designator: string, kind: string, profileId: number, value: number, limitValue: number, message: string }
const keys = (items: Effect[]) => items.map(e => `${e.event} ${e.airfieldCode} ${e.designator} ${e.kind} #${e.profileId} ${e.limitValue}`).sort()

async function alertsAt(code: string, state = 'active') {
  return (await safety.get(`/api/alerts?airfield=${code}&state=${state}`)).body.alerts as { id: number, designator: string, kind: string, profileId: number, value: number, message: string }[]
}

/** A field whose 30 kt crosswind limit nothing crosses, with one profile (220° at 30 kt) in force. */
async function fieldWithProfile() {
  const code = await createTestAirfield({ 18: 180, 36: 360 }, 'Seats test field')
  expect((await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 30, maxTailwindKt: 30 }, reason: 'Test field: wide limits' })).status).toBe(200)
  const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, windProfile(220, 30))
  expect(filed.status, JSON.stringify(filed.body)).toBe(201)
  expect(await alertsAt(code)).toEqual([])
  return { code, profileId: filed.body.profile.id as number }
}

describe('limit changes with their effect', () => {
  it('a dry run saves nothing and answers the same raised and cleared set the real change then makes', async () => {
    const { code, profileId } = await fieldWithProfile()
    const historyBefore = (await safety.get(`/api/limits/history?airfield=${code}`)).body.changes.length
    const lower = { values: { maxCrosswindKt: 15 }, reason: 'Seats test: lower the crosswind limit' }

    const dry = await safety.put(`/api/limits/airfields/${code}?dryRun=1`, lower)
    expect(dry.status, JSON.stringify(dry.body)).toBe(200)
    expect(dry.body.dryRun).toBe(true)
    expect(dry.body.changeId).toBeNull()
    expect(dry.body.lowered).toEqual(['maxCrosswindKt'])
    expect(dry.body.effectiveBefore.maxCrosswindKt).toBe(30)
    expect(dry.body.effectiveAfter.maxCrosswindKt).toBe(15)
    expect(keys(dry.body.effect.raised)).toEqual([`raised ${code} 18 crosswind #${profileId} 15`, `raised ${code} 36 crosswind #${profileId} 15`])
    expect(dry.body.effect.raised[0].value).toBeCloseTo(FAA_CROSSWIND_KT, 2)
    expect(dry.body.effect.cleared).toEqual([])
    // Nothing saved: no alert, no history entry, the override as it was.
    expect(await alertsAt(code)).toEqual([])
    expect((await safety.get(`/api/limits/history?airfield=${code}`)).body.changes).toHaveLength(historyBefore)
    const overview = (await safety.get('/api/limits')).body.airfields.find((a: { code: string }) => a.code === code)
    expect(overview.values.maxCrosswindKt).toBe(30)

    const real = await safety.put(`/api/limits/airfields/${code}`, lower)
    expect(real.status).toBe(200)
    expect(real.body.dryRun).toBe(false)
    expect(keys(real.body.effect.raised)).toEqual(keys(dry.body.effect.raised))
    expect(keys(real.body.effect.cleared)).toEqual(keys(dry.body.effect.cleared))
    const active = await alertsAt(code)
    expect(active.map(a => `${a.designator} ${a.kind} #${a.profileId}`).sort()).toEqual([`18 crosswind #${profileId}`, `36 crosswind #${profileId}`])
    // The alert says it came from a limit change, with the reason given.
    for (const a of active) expect(a.message).toContain('after a limit change (airfield): Seats test: lower the crosswind limit')

    // One runway end back to 25 kt: the dry run and the change clear runway 36 only.
    const end = { designator: '36', values: { maxCrosswindKt: 25 }, reason: 'Seats test: runway 36 is wider' }
    const dryEnd = await safety.put(`/api/limits/airfields/${code}?dryRun=1`, end)
    expect(dryEnd.status).toBe(200)
    expect(dryEnd.body.lowered).toEqual([])
    expect(keys(dryEnd.body.effect.cleared)).toEqual([`cleared ${code} 36 crosswind #${profileId} 15`])
    expect(dryEnd.body.effect.raised).toEqual([])
    expect((await alertsAt(code)).length).toBe(2)
    const realEnd = await safety.put(`/api/limits/airfields/${code}`, end)
    expect(keys(realEnd.body.effect.cleared)).toEqual(keys(dryEnd.body.effect.cleared))
    expect(keys(realEnd.body.effect.raised)).toEqual([])
    const cleared = (await alertsAt(code, 'cleared')) as unknown as { designator: string, clearReason: string }[]
    expect(cleared.map(c => c.designator)).toEqual(['36'])
    expect(realEnd.body.effect.cleared[0].message).toContain('after a limit change (runway end 36): Seats test: runway 36 is wider')
  })

  it('a bad dryRun value is 422 naming it; the dry run asks the same capability', async () => {
    const { code } = await fieldWithProfile()
    const body = { values: { maxCrosswindKt: 15 }, reason: 'Seats test: probe' }
    const bad = await safety.put(`/api/limits/airfields/${code}?dryRun=maybe`, body)
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('dryRun')
    expect((await dispatcher.put(`/api/limits/airfields/${code}?dryRun=1`, body)).status).toBe(403)
    expect((await new ApiClient().put('/api/limits/organisation?dryRun=1', body)).status).toBe(401)
  })
})

describe('inbox as a worklist', () => {
  it('following an airfield puts its active alerts in the inbox once, however often one follows', async () => {
    const { code } = await fieldWithProfile()
    expect((await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 15 }, reason: 'Seats test: two active alerts' })).status).toBe(200)
    const active = await alertsAt(code)
    expect(active).toHaveLength(2)
    const pilot = await newUser(admin, 'pilot', 'follow')
    const mine = async () => ((await pilot.client.get(`/api/alerts/inbox?airfield=${code}`)).body.items as { alert: { id: number }, event: string }[])

    const first = await pilot.client.put(`/api/subscriptions/${code}`, { email: false, push: false })
    expect(first.status).toBe(200)
    expect(first.body.activeAlertsDelivered).toBe(2)
    expect((await mine()).map(i => `${i.event} ${i.alert.id}`).sort()).toEqual(active.map(a => `raised ${a.id}`).sort())
    expect((await pilot.client.put(`/api/subscriptions/${code}`, { email: true, push: false })).body.activeAlertsDelivered).toBe(0)
    expect((await pilot.client.delete(`/api/subscriptions/${code}`)).status).toBe(204)
    expect((await pilot.client.put(`/api/subscriptions/${code}`, { email: false, push: false })).body.activeAlertsDelivered).toBe(0)
    expect(await mine()).toHaveLength(2)
  })

  it('acknowledge all of an airfield, or a list of ids, touches only the caller\'s own entries', async () => {
    const { code } = await fieldWithProfile()
    const a = await newUser(admin, 'pilot', 'acka')
    const b = await newUser(admin, 'pilot', 'ackb')
    for (const u of [a, b]) expect((await u.client.put(`/api/subscriptions/${code}`, { email: false, push: false })).status).toBe(200)
    expect((await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 15 }, reason: 'Seats test: alerts for two pilots' })).status).toBe(200)
    const itemsOf = async (u: typeof a, q = '') => (await u.client.get(`/api/alerts/inbox?airfield=${code}${q}`)).body.items as { id: number, acknowledgedAt: string | null }[]
    expect(await itemsOf(a)).toHaveLength(2)
    const bIds = (await itemsOf(b)).map(i => i.id)
    expect(bIds).toHaveLength(2)

    // a tries b's ids: nothing acknowledged.
    const foreign = await a.client.post('/api/alerts/inbox/acknowledge', { ids: bIds })
    expect(foreign.status).toBe(200)
    expect(foreign.body.acknowledged).toBe(0)
    const all = await a.client.post('/api/alerts/inbox/acknowledge', { airfieldCode: code })
    expect(all.status).toBe(200)
    expect(all.body.acknowledged).toBe(2)
    expect((await itemsOf(a)).every(i => i.acknowledgedAt)).toBe(true)
    expect(await itemsOf(a, '&unacknowledged=1')).toEqual([])
    expect((await itemsOf(b)).every(i => i.acknowledgedAt == null)).toBe(true)
    // b acknowledges one of its own by id.
    const one = await b.client.post('/api/alerts/inbox/acknowledge', { ids: [bIds[0]] })
    expect(one.body.acknowledged).toBe(1)
    expect(await itemsOf(b, '&unacknowledged=1')).toHaveLength(1)

    const both = await a.client.post('/api/alerts/inbox/acknowledge', { airfieldCode: code, ids: [1] })
    expect(both.status).toBe(422)
    expect(both.body.data.issues[0].message).toBe('Give either airfieldCode or ids')
    expect((await a.client.post('/api/alerts/inbox/acknowledge', {})).status).toBe(422)
    expect((await a.client.post('/api/alerts/inbox/acknowledge', { airfieldCode: 'XQQQ' })).status).toBe(404)
    expect((await new ApiClient().post('/api/alerts/inbox/acknowledge', { airfieldCode: code })).status).toBe(401)
  })

  it('the inbox pages on the server and filters by kind', async () => {
    const { code } = await fieldWithProfile()
    const p = await newUser(admin, 'pilot', 'page')
    expect((await p.client.put(`/api/subscriptions/${code}`, { email: false, push: false })).status).toBe(200)
    expect((await safety.put(`/api/limits/airfields/${code}`, { values: { maxCrosswindKt: 15 }, reason: 'Seats test: paging' })).status).toBe(200)
    const page1 = (await p.client.get('/api/alerts/inbox?pageSize=1')).body
    const page2 = (await p.client.get('/api/alerts/inbox?pageSize=1&page=2')).body
    expect(page1.total).toBe(2)
    expect(page1.items).toHaveLength(1)
    expect(page2.items).toHaveLength(1)
    expect(page2.items[0].id).toBeLessThan(page1.items[0].id)
    expect((await p.client.get('/api/alerts/inbox?kind=tailwind')).body.items).toEqual([])
    expect((await p.client.get('/api/alerts/inbox?kind=crosswind')).body.total).toBe(2)
    expect((await p.client.get('/api/alerts/inbox?pageSize=0')).status).toBe(422)
  })
})
