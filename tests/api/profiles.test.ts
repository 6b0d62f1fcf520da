import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { closeDb, countRows, makeAirfield, profileBody } from '../support/airfields'

afterAll(closeDb)

describe('filing profiles as JSON', () => {
  it('files a profile: 201 with the public shape, levels as filed, components computed by the engine', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const body = profileBody(0, 3, { notes: 'morning run' })
    const res = await dispatcher.post(`/api/airfields/${code}/profiles`, body)
    expect(res.status).toBe(201)
    expect(res.body.profile).toMatchObject({
      airfieldCode: code, validFrom: body.validFrom, validTo: body.validTo, source: 'wind-profiler', heightReference: 'AGL',
      status: 'active', supersededIds: [], levels: body.levels,
    })
    expect(res.body.profile.validFrom).toMatch(/Z$/)
    expect(Array.isArray(res.body.warnings)).toBe(true)
    expect(await countRows('profile_levels', 'profile_id = ?', [res.body.profile.id])).toBe(4)

    const one = await (await signedIn('pilot')).get(`/api/profiles/${res.body.profile.id}`)
    expect(one.status).toBe(200)
    expect(one.body.profile.levels).toEqual(body.levels)

    const list = await dispatcher.get(`/api/airfields/${code}/profiles`)
    expect(list.body.total).toBe(1)
    expect(list.body.profiles[0].briefingUrl).toBe(`/briefings/${code}?profile=${res.body.profile.id}`)
  })

  it('answers 422 naming the level and field, and saves nothing', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const before = await countRows('profiles')
    const bad = profileBody()
    bad.levels[2] = { heightM: 300, directionDeg: 400, speedKt: 35 }
    const res = await dispatcher.post(`/api/airfields/${code}/profiles`, bad)
    expect(res.status).toBe(422)
    expect(res.body.data.issues).toEqual([expect.objectContaining({ field: 'levels[2].directionDeg', index: 2 })])
    // The engine's own rule: a gust only on the surface level
    const gustAloft = profileBody()
    gustAloft.levels[3] = { heightM: 600, directionDeg: 250, speedKt: 40, gustKt: 55 }
    const res2 = await dispatcher.post(`/api/airfields/${code}/profiles`, gustAloft)
    expect(res2.status).toBe(422)
    expect(res2.body.data.issues[0]).toMatchObject({ index: 3 })
    const inverted = profileBody(0, 3)
    const swapped = { ...inverted, validFrom: inverted.validTo, validTo: inverted.validFrom }
    expect((await dispatcher.post(`/api/airfields/${code}/profiles`, swapped)).body.data.issues[0].field).toBe('validTo')
    expect(await countRows('profiles')).toBe(before)
  })

  it('refuses a pilot with 403 and a signed-out caller with 401, before reading the body', async () => {
    const pilot = await signedIn('pilot')
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const res = await pilot.post(`/api/airfields/${code}/profiles`, profileBody())
    expect(res.status).toBe(403)
    expect((await new ApiClient().post(`/api/airfields/${code}/profiles`, 'not json')).status).toBe(401)
    expect(await countRows('profiles', 'airfield_id = (SELECT id FROM airfields WHERE code = ?)', [code])).toBe(0)
  })

  it('refuses a body over 2 MB with 413 and more than 5,000 levels with 422', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const huge = JSON.stringify({ ...profileBody(), notes: 'x'.repeat(2 * 1024 * 1024 + 10) })
    const res = await dispatcher.post(`/api/airfields/${code}/profiles`, huge, { 'content-type': 'application/json' })
    expect(res.status).toBe(413)
    const levels = Array.from({ length: 5001 }, (_, i) => ({ heightM: i, directionDeg: 180, speedKt: 10 }))
    const many = await dispatcher.post(`/api/airfields/${code}/profiles`, { ...profileBody(), levels })
    expect(many.status).toBe(422)
    expect(many.body.data.issues[0]).toMatchObject({ field: 'levels' })
    expect(many.body.data.issues[0].message).toContain('5000')
  })
})

describe('supersession and withdrawal', () => {
  it('supersedes an overlapping active profile, links it to its successor, and leaves audit entries', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const first = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3))
    const apart = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(5, 2))
    const second = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 4))
    expect(second.status).toBe(201)
    // 0-4 h covers all of 0-3 h (supersession by time: the whole of it); 5-7 h does not overlap
    expect(second.body.profile.supersededIds).toEqual([first.body.profile.id])
    const old = await dispatcher.get(`/api/profiles/${first.body.profile.id}`)
    expect(old.body.profile).toMatchObject({ status: 'superseded', supersededById: second.body.profile.id })
    expect(old.body.profile.supersededAt).toMatch(/Z$/)
    expect((await dispatcher.get(`/api/profiles/${apart.body.profile.id}`)).body.profile.status).toBe('active')

    const withdrawNoReason = await dispatcher.post(`/api/profiles/${apart.body.profile.id}/withdraw`, {})
    expect(withdrawNoReason.status).toBe(422)
    const withdrawn = await dispatcher.post(`/api/profiles/${apart.body.profile.id}/withdraw`, { reason: 'instrument fault' })
    expect(withdrawn.status).toBe(200)
    expect(withdrawn.body.profile).toMatchObject({ status: 'withdrawn', withdrawnReason: 'instrument fault' })
    expect((await dispatcher.post(`/api/profiles/${apart.body.profile.id}/withdraw`, { reason: 'again' })).status).toBe(409)
    expect((await dispatcher.post(`/api/profiles/${first.body.profile.id}/withdraw`, { reason: 'old' })).status).toBe(409)
    expect((await (await signedIn('pilot')).post(`/api/profiles/${second.body.profile.id}/withdraw`, { reason: 'no' })).status).toBe(403)

    // nothing deleted: all three rows remain
    expect(await countRows('profiles', 'airfield_id = (SELECT id FROM airfields WHERE code = ?)', [code])).toBe(3)

    const safety = await signedIn('safety')
    const audit = await safety.get(`/api/audit?entityType=profile&q=${code}`)
    expect(audit.status).toBe(200)
    const actions = audit.body.entries.map((e: { action: string, entityId: string }) => `${e.action}:${e.entityId}`)
    expect(actions).toEqual(expect.arrayContaining([
      `profile.file:${first.body.profile.id}`, `profile.file:${second.body.profile.id}`,
      `profile.supersede:${first.body.profile.id}`,
    ]))
    const byId = await safety.get(`/api/audit?entityType=profile&q=${apart.body.profile.id}&action=profile.withdraw`)
    expect(byId.body.entries[0]).toMatchObject({ action: 'profile.withdraw', actorLabel: 'dispatch@veerline.example' })
    expect(byId.body.entries[0].details.reason).toBe('instrument fault')
    expect((await dispatcher.get('/api/audit')).status).toBe(403)
  })

  it('lists with filters by source and time range, sorting and pages', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    for (let i = 0; i < 3; i++) await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(i * 4, 2))
    await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(20, 2, { source: 'radiosonde' }))
    const all = await dispatcher.get(`/api/airfields/${code}/profiles?sort=validFrom&order=asc&pageSize=2`)
    expect(all.body.total).toBe(4)
    expect(all.body.profiles).toHaveLength(2)
    expect(Date.parse(all.body.profiles[0].validFrom)).toBeLessThan(Date.parse(all.body.profiles[1].validFrom))
    const page2 = await dispatcher.get(`/api/airfields/${code}/profiles?sort=validFrom&order=asc&pageSize=2&page=2`)
    expect(page2.body.profiles[1].source).toBe('radiosonde')
    expect((await dispatcher.get(`/api/airfields/${code}/profiles?source=radiosonde`)).body.total).toBe(1)
    const start = new Date(Date.now() + 3.5 * 3600_000).toISOString()
    const end = new Date(Date.now() + 9 * 3600_000).toISOString()
    // windows 0-2, 4-6, 8-10, 20-22 h: 3.5-9 h meets the second and third
    expect((await dispatcher.get(`/api/airfields/${code}/profiles?from=${start}&to=${end}`)).body.total).toBe(2)
    expect((await dispatcher.get(`/api/airfields/${code}/profiles?source=balloon`)).status).toBe(422)
  })
})

describe('the token feed', () => {
  it('files with a bearer token, replays a repeated Idempotency-Key, and refuses a revoked token', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const made = await dispatcher.post('/api/tokens', { name: 'profiler feed' })
    expect(made.status).toBe(201)
    const secret: string = made.body.token.secret
    expect(secret.length).toBeGreaterThan(30)
    // shown once: the list never carries it, and only its SHA-256 is stored
    const list = await dispatcher.get('/api/tokens')
    expect(JSON.stringify(list.body)).not.toContain(secret)
    const { createHash } = await import('node:crypto')
    expect(await countRows('api_tokens', 'token_hash = ?', [createHash('sha256').update(secret).digest('hex')])).toBe(1)

    const feed = new ApiClient()
    const body = profileBody(1, 2)
    const headers = { 'authorization': `Bearer ${secret}`, 'idempotency-key': `run-${code}-1` }
    const first = await feed.post(`/api/airfields/${code}/profiles`, body, headers)
    expect(first.status).toBe(201)
    const again = await feed.post(`/api/airfields/${code}/profiles`, body, headers)
    expect(again.status).toBe(201)
    expect(again.body).toEqual(first.body)
    expect(again.headers.get('idempotent-replayed')).toBe('true')
    expect(await countRows('profiles', 'airfield_id = (SELECT id FROM airfields WHERE code = ?)', [code])).toBe(1)
    const otherBody = await feed.post(`/api/airfields/${code}/profiles`, profileBody(1, 1), headers)
    expect(otherBody.status).toBe(422)
    expect(otherBody.body.statusMessage).toContain('Idempotency-Key')

    const audit = await (await signedIn('admin')).get(`/api/audit?entityType=profile&q=${first.body.profile.id}`)
    expect(audit.body.entries[0].actorLabel).toContain(`api-token:${made.body.token.id}`)

    expect((await feed.post(`/api/airfields/${code}/profiles`, body, { authorization: 'Bearer vlt_nonsense' })).status).toBe(401)
    const revoke = await dispatcher.post(`/api/tokens/${made.body.token.id}/revoke`)
    expect(revoke.status).toBe(200)
    const refused = await feed.post(`/api/airfields/${code}/profiles`, profileBody(4, 1), { authorization: `Bearer ${secret}` })
    expect(refused.status).toBe(401)
    expect(refused.body.statusMessage).toContain('revoked')
    const tokenAudit = await (await signedIn('admin')).get(`/api/audit?entityType=api-token&q=${made.body.token.id}`)
    expect(tokenAudit.body.entries.map((e: { action: string }) => e.action)).toEqual(expect.arrayContaining(['api-token.create', 'api-token.revoke']))
  })
})
