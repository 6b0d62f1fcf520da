// Briefings against what was filed, and read receipts across a supersession.
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { closeDb, makeAirfield, profileBody } from '../support/airfields'

afterAll(closeDb)

describe('briefing input is what was filed', () => {
  for (const code of ['XVAL', 'XCST', 'XHGH']) {
    it(`${code}: the levels the briefing computed from are the stored levels of that profile version`, async () => {
      const pilot = await signedIn('pilot')
      const res = await pilot.get(`/api/airfields/${code}/briefing?precision=full`)
      expect(res.status).toBe(200)
      const { briefing } = res.body
      const filed = await pilot.get(`/api/profiles/${briefing.profile.id}`)
      expect(filed.status).toBe(200)
      expect(briefing.input.levels).toEqual(filed.body.profile.levels)
      expect(briefing.input.heightReference).toBe(filed.body.profile.heightReference)
    })
  }
})

describe('read receipts across versions', () => {
  it('a receipt is current while its profile is in force and stale once a newer profile supersedes it', async () => {
    // One rule for receipts and briefings (supersession by time, issue 11): a profile is superseded at a moment when a
    // newer profile filed for that moment took it over; a receipt is stale while its profile is superseded now.
    const dispatcher = await signedIn('dispatcher')
    const pilot = await signedIn('pilot')
    const { code } = await makeAirfield(dispatcher)
    const first = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3))
    expect(first.status).toBe(201)
    const firstId = first.body.profile.id

    const read = await pilot.post('/api/receipts', { profileId: firstId })
    expect(read.status).toBeLessThan(300)
    let seen = await dispatcher.get(`/api/receipts?profile=${firstId}`)
    expect(seen.status).toBe(200)
    expect(seen.body.receipts).toHaveLength(1)
    expect(seen.body.receipts[0]).toMatchObject({ profileId: firstId, stale: false, user: { email: 'pilot@veerline.example' } })

    // A newer profile for the last hour only: the first is still the one in force now, so the receipt stays current.
    const later = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(2, 3, { source: 'aircraft-reports' }))
    expect(later.status).toBe(201)
    expect(later.body.profile.supersededIds).toEqual([firstId])
    seen = await dispatcher.get(`/api/receipts?profile=${firstId}`)
    expect(seen.body.receipts[0]).toMatchObject({ stale: false, staleReason: null })
    expect((await pilot.get(`/api/airfields/${code}/briefing?profile=${firstId}`)).body.briefing.profile.status).toBe('current')

    // A newer profile for now: the receipt is stale and says by which profile; the old briefing says superseded.
    const second = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 1, { source: 'aircraft-reports' }))
    expect(second.status).toBe(201)
    expect(second.body.profile.supersededIds).toEqual([firstId])
    seen = await dispatcher.get(`/api/receipts?profile=${firstId}`)
    expect(seen.body.receipts[0].stale).toBe(true)
    expect(seen.body.receipts[0].staleReason).toContain(`superseded by profile ${second.body.profile.id}`)
    // The briefing of the old version says so in plain words.
    const old = await pilot.get(`/api/airfields/${code}/briefing?profile=${firstId}`)
    expect(old.body.briefing.profile.status).toBe('superseded')
    expect(old.body.briefing.profile.supersededById).toBe(second.body.profile.id)
    // It is still in force between the two newer ones (hour 1 to 2): the briefing for then uses it.
    const between = new Date(Date.parse(first.body.profile.validFrom) + 90 * 60_000).toISOString()
    expect((await pilot.get(`/api/airfields/${code}/briefing?at=${between}`)).body.briefing.profile.id).toBe(firstId)
  })

  it('dispatchers see every pilot\'s receipt; a pilot sees only their own', async () => {
    const dispatcher = await signedIn('dispatcher')
    const admin = await signedIn('admin')
    const { code } = await makeAirfield(dispatcher)
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 2))
    const profileId = filed.body.profile.id
    const email = `second-pilot-${Date.now()}@veerline.example`
    expect((await admin.post('/api/users', { email, name: 'Second Pilot', role: 'pilot', password: 'second-pilot-pass' })).status).toBe(201)
    const pilot = await signedIn('pilot')
    const secondPilot = new ApiClient()
    await secondPilot.signIn(email, 'second-pilot-pass')
    await pilot.post('/api/receipts', { profileId })
    await secondPilot.post('/api/receipts', { profileId })

    const mine = await pilot.get(`/api/receipts?profile=${profileId}`)
    expect(mine.body.receipts.map((r: { user: { email: string } }) => r.user.email)).toEqual(['pilot@veerline.example'])
    const all = await dispatcher.get(`/api/receipts?profile=${profileId}`)
    expect(all.body.receipts.map((r: { user: { email: string } }) => r.user.email).sort()).toEqual(['pilot@veerline.example', email].sort())
  })
})
