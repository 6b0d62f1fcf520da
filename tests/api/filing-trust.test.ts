import { afterAll, describe, expect, it } from 'vitest'
import { signedIn, type ApiClient } from '../support/api'
import { closeDb, countRows, makeAirfield } from '../support/airfields'

afterAll(closeDb)

const minute = 60_000
const utcStamp = (d: Date) => `${String(d.getUTCDate()).padStart(2, '0')}${String(d.getUTCHours()).padStart(2, '0')}${String(d.getUTCMinutes()).padStart(2, '0')}Z`
const levels = [
  { heightM: 10, directionDeg: 200, speedKt: 12 },
  { heightM: 300, directionDeg: 240, speedKt: 30 },
  { heightM: 600, directionDeg: 250, speedKt: 35 },
]

describe('supersession by time', () => {
  it('20 parallel filings with shifted windows leave exactly one profile in force for every 5-minute slot', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const start = Math.ceil(Date.now() / (5 * minute)) * 5 * minute + 60 * minute
    const windows = Array.from({ length: 20 }, (_, k) => ({ from: start + k * 15 * minute, to: start + k * 15 * minute + 90 * minute }))
    const answers = await Promise.all(windows.map(w => api.post(`/api/airfields/${code}/profiles`, {
      validFrom: new Date(w.from).toISOString(), validTo: new Date(w.to).toISOString(), source: 'estimate', heightReference: 'AGL', levels,
    })))
    expect(answers.map(a => a.status)).toEqual(windows.map(() => 201))
    const filed = await Promise.all(answers.map(async a => (await api.get(`/api/profiles/${a.body.profile.id}`)).body.profile))
    const end = windows[19]!.to
    let slots = 0
    for (let at = start + 2.5 * minute; at < end; at += 5 * minute) {
      slots++
      // In force from the records: valid then, not withdrawn, and no supersession period covering the moment.
      const inForce = filed.filter(p => p.status !== 'withdrawn' && Date.parse(p.validFrom) <= at && at < Date.parse(p.validTo)
        && !p.supersededPeriods.some((s: { from: string, to: string }) => Date.parse(s.from) <= at && at < Date.parse(s.to)))
      expect(inForce, `slot at ${new Date(at).toISOString()}`).toHaveLength(1)
      // ... it is the newest profile filed for that moment, and the briefing uses it.
      const newest = Math.max(...filed.filter(p => Date.parse(p.validFrom) <= at && at < Date.parse(p.validTo)).map(p => p.id))
      expect(inForce[0]!.id).toBe(newest)
      if (slots % 12 === 1) {
        const b = await api.get(`/api/airfields/${code}/briefing?at=${new Date(at).toISOString()}`)
        expect(b.body.briefing.profile.id).toBe(newest)
      }
    }
    expect(slots).toBe(75)
  })

  it('a later profile overlapping part of an active one leaves the older in force for the rest of its validity', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const t0 = Math.floor(Date.now() / minute) * minute + 30 * minute
    const iso = (m: number) => new Date(t0 + m * minute).toISOString()
    const first = await api.post(`/api/airfields/${code}/profiles`, { validFrom: iso(0), validTo: iso(180), source: 'estimate', heightReference: 'AGL', levels })
    const second = await api.post(`/api/airfields/${code}/profiles`, { validFrom: iso(120), validTo: iso(300), source: 'estimate', heightReference: 'AGL', levels })
    expect(second.body.profile.supersededIds).toEqual([first.body.profile.id])
    const older = (await api.get(`/api/profiles/${first.body.profile.id}`)).body.profile
    expect(older.status).toBe('active')
    expect(older.supersededPeriods).toEqual([{ from: iso(120), to: iso(180), byId: second.body.profile.id }])
    expect((await api.get(`/api/airfields/${code}/briefing?at=${iso(60)}`)).body.briefing.profile.id).toBe(first.body.profile.id)
    expect((await api.get(`/api/airfields/${code}/briefing?at=${iso(150)}`)).body.briefing.profile.id).toBe(second.body.profile.id)
  })
})

describe('the engine through the API', () => {
  it('a gust on a calm mean keeps its direction: a 15 kt gust from 200° on runway 09 is 14.1 kt crosswind from the right, not a gust from the north', async () => {
    const api = await signedIn('dispatcher')
    const res = await api.post('/api/wind/preview', { heightReference: 'AGL', runwayEnds: [{ designator: '09', trueHeadingDeg: 90 }], levels: [{ heightM: 0, directionDeg: 200, speedKt: 0, gustKt: 15 }, { heightM: 300, directionDeg: 220, speedKt: 20 }] })
    expect(res.status).toBe(200)
    // 15·sin(200° - 90°) = 14.1 kt from the right (the issue's figure; V·sin θ).
    expect(res.body.analysis.runwayEnds[0].surface.gustCrosswindKt).toBeCloseTo(14.1, 1)
  })

  it('qnhHpa lifts a 1000 hPa level of a sea-level field to 248.6 m (ICAO standard atmosphere referred to QNH)', async () => {
    const api = await signedIn('dispatcher')
    const body = { heightReference: 'AGL', elevationM: 0, runwayEnds: [{ designator: '18', trueHeadingDeg: 180 }], levels: [{ heightM: 0, directionDeg: 200, speedKt: 10 }, { pressureHpa: 1000, directionDeg: 230, speedKt: 25 }] }
    const withQnh = await api.post('/api/wind/preview', { ...body, qnhHpa: 1030 })
    expect(withQnh.body.analysis.levels[1].heightAglM).toBeCloseTo(248.6, 1)
    const without = await api.post('/api/wind/preview', body)
    expect(without.body.analysis.warnings.map((w: { message: string }) => w.message).join(' ')).toMatch(/no QNH given/)
  })

  it('files a profile with QNH and temperatures and keeps them; an MSL level 0.2 m below the elevation is the surface', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api, { elevation: 457.2, elevationUnit: 'm' })
    const start = new Date(Math.floor(Date.now() / minute) * minute)
    const res = await api.post(`/api/airfields/${code}/profiles`, {
      validFrom: start.toISOString(), validTo: new Date(start.getTime() + 3600_000).toISOString(), source: 'radiosonde', heightReference: 'MSL', qnhHpa: 1021,
      levels: [{ heightM: 457, directionDeg: 200, speedKt: 8, temperatureC: 12 }, { pressureHpa: 925, temperatureC: 9, directionDeg: 230, speedKt: 25 }, { heightM: 1200, pressureHpa: 880, directionDeg: 250, speedKt: 30 }],
    })
    expect(res.status).toBe(201)
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain('surface-below-elevation')
    const got = (await api.get(`/api/profiles/${res.body.profile.id}`)).body.profile
    expect(got.qnhHpa).toBe(1021)
    expect(got.levels[1]).toMatchObject({ pressureHpa: 925, temperatureC: 9 })
    expect(got.levels[2]).toMatchObject({ heightM: 1200, pressureHpa: 880 })
  })
})

describe('coded reports, checked and kept', () => {
  async function setup() {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    return { api, code }
  }

  it('POST /api/wind/coded with the airfield: another station and a seven-hour-old report are warnings', async () => {
    const { api, code } = await setup()
    const old = new Date(Date.now() - 7 * 3600_000)
    const res = await api.post('/api/wind/coded', { airfield: code, text: `METAR XVAL ${utcStamp(old)} 23020KMH 9999 WS R18` })
    expect(res.status).toBe(200)
    const codes = res.body.warnings.map((w: { code: string }) => w.code)
    expect(codes).toEqual(expect.arrayContaining(['other-station', 'report-old']))
    expect(res.body.warnings[0].message).toContain(`not ${code}`)
    // 23020KMH is read: 20 km/h = 10.8 kt (1 kt = 1.852 km/h)
    expect(res.body.levels[0].speedKt).toBeCloseTo(10.8, 1)
    expect(res.body.reports[0].runwayShear.groups).toEqual(['WS R18'])
  })

  it('00000G15KT is refused with the reason, WS LDG RWY18 is kept', async () => {
    const { api, code } = await setup()
    const bad = await api.post('/api/wind/coded', { airfield: code, text: `METAR ${code} ${utcStamp(new Date())} 00000G15KT 9999` })
    expect(bad.status).toBe(422)
    expect(JSON.stringify(bad.body.data.issues)).toMatch(/gust on a calm wind/)
    const older = await api.post('/api/wind/coded', { airfield: code, text: `METAR ${code} ${utcStamp(new Date())} 18010KT 9999 WS LDG RWY18` })
    expect(older.status).toBe(200)
    expect(older.body.reports[0].runwayShear.runways).toEqual(['18'])
  })

  it('a report for another station is refused at filing until confirmed; then kept raw, with reported wind shear raising its own alert', async () => {
    const { api, code } = await setup()
    const now = new Date()
    const text = `METAR XVAL ${utcStamp(now)} 18012KT 9999 WS R36`
    const body = {
      validFrom: new Date(now.getTime() - 5 * minute).toISOString(), validTo: new Date(now.getTime() + 55 * minute).toISOString(),
      source: 'coded-report', heightReference: 'AGL', levels: [{ heightM: 10, directionDeg: 180, speedKt: 12 }, { heightM: 300, directionDeg: 200, speedKt: 20 }],
      codedReport: { text },
    }
    const before = await countRows('profiles')
    const refused = await api.post(`/api/airfields/${code}/profiles?entry=coded`, body)
    expect(refused.status).toBe(422)
    expect(refused.body.data.issues[0]).toMatchObject({ field: 'codedReport.confirmWarnings', line: 1 })
    expect(await countRows('profiles')).toBe(before)
    const filed = await api.post(`/api/airfields/${code}/profiles?entry=coded`, { ...body, codedReport: { text, confirmWarnings: true } })
    expect(filed.status).toBe(201)
    expect(filed.body.profile).toMatchObject({ source: 'coded-report', rawReport: text })
    expect(filed.body.profile.reportedWindShear).toMatchObject({ allRunways: false, runways: ['36'], groups: ['WS R36'] })
    expect(filed.body.alertsRaised).toBeGreaterThanOrEqual(1)
    const briefing = (await api.get(`/api/airfields/${code}/briefing`)).body.briefing
    expect(briefing.profile.rawReport).toBe(text)
    // The limit checks are read per runway end in the default (trade precision) answer.
    const checksOf = (d: string) => briefing.runwayEnds.find((e: { designator: string }) => e.designator === d).checks as { kind: string, state: string }[]
    expect(checksOf('36').find(c => c.kind === 'reported-wind-shear')!.state).toBe('exceeded')
    expect(checksOf('18').some(c => c.kind === 'reported-wind-shear')).toBe(false)
    const safety = await signedIn('safety')
    const alerts = (await safety.get(`/api/alerts?airfield=${code}&state=active`)).body.alerts
    expect(alerts.some((a: { kind: string, designator: string }) => a.kind === 'reported-wind-shear' && a.designator === '36')).toBe(true)
  })

  it('source coded-report without the report lines is refused by name', async () => {
    const { api, code } = await setup()
    const now = new Date()
    const res = await api.post(`/api/airfields/${code}/profiles`, { validFrom: now.toISOString(), validTo: new Date(now.getTime() + 3600_000).toISOString(), source: 'coded-report', heightReference: 'AGL', levels })
    expect(res.status).toBe(422)
    expect(res.body.data.issues.map((i: { field: string }) => i.field)).toContain('codedReport')
  })

  it('the reporting station is an airfield setting (default: its code)', async () => {
    const { api, code } = await setup()
    expect((await api.get(`/api/airfields/${code}`)).body.airfield.reportingStation).toBe(code)
    const patched = await api.patch(`/api/airfields/${code}`, { reportingStation: 'xval' })
    expect(patched.status).toBe(200)
    const res = await api.post('/api/wind/coded', { airfield: code, text: `METAR XVAL ${utcStamp(new Date())} 18010KT` })
    expect(res.body.warnings).toEqual([])
    const bad = await api.patch(`/api/airfields/${code}`, { reportingStation: 'X1' })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('reportingStation')
  })
})

describe('the F-factor and the corridor on the briefing', () => {
  it('shows the F-factor per runway end and path, and checks it against the 0.1 default limit (from memory)', async () => {
    const api: ApiClient = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const now = new Date()
    // A headwind on runway 18 collapsing from 80 kt at 100 m to calm at the ground: a strong performance loss on arrival.
    const res = await api.post(`/api/airfields/${code}/profiles`, {
      validFrom: new Date(now.getTime() - minute).toISOString(), validTo: new Date(now.getTime() + 3600_000).toISOString(), source: 'estimate', heightReference: 'AGL',
      levels: [{ heightM: 0, directionDeg: 180, speedKt: 0 }, { heightM: 100, directionDeg: 180, speedKt: 80 }, { heightM: 600, directionDeg: 180, speedKt: 80 }],
    })
    expect(res.status).toBe(201)
    const briefing = (await api.get(`/api/airfields/${code}/briefing`)).body.briefing
    const end18 = briefing.runwayEnds.find((e: { designator: string }) => e.designator === '18')
    expect(end18.fFactor.arrival.basis).toBe('horizontal-wind-only')
    expect(end18.fFactor.arrival.maxF).toBeGreaterThan(0.1)
    const check = end18.checks.find((c: { kind: string }) => c.kind === 'f-factor-arrival')
    expect(check).toMatchObject({ limit: 0.1, state: 'exceeded', unit: 'F' })
  })
})

describe('TAF periods filed in one step', () => {
  const hh = (d: Date) => `${String(d.getUTCDate()).padStart(2, '0')}${String(d.getUTCHours()).padStart(2, '0')}`
  it('FM and BECMG each give a profile over their period with their own surface wind (and WS group); TEMPO is only a note', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const start = new Date(Math.floor(Date.now() / 3600_000) * 3600_000)
    const at = (h: number) => new Date(start.getTime() + h * 3600_000)
    // The TAF layout of ICAO Annex 3 / WMO-No. 306 FM 51 (from memory): validity ddhh/ddhh, FMddhhmm, BECMG and TEMPO
    // with ddhh/ddhh; WShhh/dddffKT a wind shear level aloft (hhh in hundreds of feet).
    const text = `TAF ${code} ${utcStamp(new Date())} ${hh(at(0))}/${hh(at(24))} 18010KT 9999 WS020/24040KT `
      + `FM${hh(at(6))}00 22015KT 9999 WS R18 BECMG ${hh(at(12))}/${hh(at(14))} 25020KT TEMPO ${hh(at(16))}/${hh(at(18))} 27030G45KT`
    const evaluations = () => countRows('audit_log',
      'action = \'alerts.evaluate\' AND entity_type = \'airfield\' AND entity_id = (SELECT CAST(id AS CHAR) FROM airfields WHERE code = ?)', [code])
    const before = await evaluations()
    const res = await api.post(`/api/airfields/${code}/profiles/periods`, { text, levelsAloft: [{ heightM: 300, directionDeg: 260, speedKt: 30 }] })
    expect(res.status).toBe(201)
    const filed = res.body.profiles.map((f: { profile: any }) => f.profile)
    expect(filed.map((p: any) => [p.validFrom, p.validTo])).toEqual([
      [at(0).toISOString(), at(6).toISOString()], [at(6).toISOString(), at(12).toISOString()], [at(12).toISOString(), at(24).toISOString()],
    ])
    const surface = (p: any) => p.levels.find((l: any) => l.heightM === 10)
    expect(filed.map((p: any) => [surface(p).directionDeg, surface(p).speedKt])).toEqual([[180, 10], [220, 15], [250, 20]])
    // WS020: a level at 2,000 ft in the opening period only; the table's 300 m level in every one.
    expect(filed[0].levels.find((l: any) => l.heightFt === 2000)).toMatchObject({ directionDeg: 240, speedKt: 40 })
    expect(filed[1].levels.some((l: any) => l.heightFt === 2000)).toBe(false)
    for (const p of filed) expect(p.levels.find((l: any) => l.heightM === 300)).toMatchObject({ directionDeg: 260, speedKt: 30 })
    // WS R18 belongs to the FM period (and BECMG carries it on, as it does not change it).
    expect(filed[0].reportedWindShear).toBeNull()
    expect(filed[1].reportedWindShear).toMatchObject({ runways: ['18'], groups: ['WS R18'] })
    expect(filed[2].reportedWindShear).toMatchObject({ runways: ['18'] })
    expect(filed.every((p: any) => p.source === 'coded-report' && p.rawReport === text)).toBe(true)
    expect(filed[2].notes).toContain('BECMG')
    // One evaluation per profile filed.
    expect(await evaluations() - before).toBe(3)
    expect(res.body.alertsRaised).toBe(res.body.profiles.reduce((n: number, f: { alertsRaised: number }) => n + f.alertsRaised, 0))
  })

  it('a refused period refuses them all, naming the period; nothing is saved', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const start = new Date(Math.floor(Date.now() / 3600_000) * 3600_000)
    const at = (h: number) => new Date(start.getTime() + h * 3600_000)
    // The FM period's surface wind alone is one level: a profile needs two.
    const text = `TAF ${code} ${utcStamp(new Date())} ${hh(at(0))}/${hh(at(12))} 18010KT 9999 WS020/24040KT FM${hh(at(6))}00 22015KT 9999`
    const before = await countRows('profiles')
    const res = await api.post(`/api/airfields/${code}/profiles/periods`, { text })
    expect(res.status).toBe(422)
    expect(res.body.data.issues[0].field).toMatch(/^periods\[1\]\.levels/)
    expect(res.body.data.issues[0].message).toContain(`FM${hh(at(6))}00`)
    expect(await countRows('profiles')).toBe(before)
    const notTaf = await api.post(`/api/airfields/${code}/profiles/periods`, { text: `METAR ${code} ${utcStamp(new Date())} 18010KT` })
    expect(notTaf.status).toBe(422)
    expect(notTaf.body.data.issues[0].message).toContain('No TAF')
  })

  it('a TAF for another station needs confirming, as a single filing does', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const start = new Date(Math.floor(Date.now() / 3600_000) * 3600_000)
    const at = (h: number) => new Date(start.getTime() + h * 3600_000)
    const text = `TAF XVAL ${utcStamp(new Date())} ${hh(at(0))}/${hh(at(12))} 18010KT 9999 WS020/24040KT`
    const refused = await api.post(`/api/airfields/${code}/profiles/periods`, { text })
    expect(refused.status).toBe(422)
    expect(refused.body.data.issues[0]).toMatchObject({ field: 'codedReport.confirmWarnings', line: 1 })
    const filed = await api.post(`/api/airfields/${code}/profiles/periods`, { text, confirmWarnings: true })
    expect(filed.status).toBe(201)
    expect(filed.body.profiles).toHaveLength(1)
  })
})

describe('before filing: what the new profile will supersede', () => {
  it('names each active profile it would take over, for which time, and whether wholly; saves nothing', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const t0 = Math.floor(Date.now() / minute) * minute + 30 * minute
    const iso = (m: number) => new Date(t0 + m * minute).toISOString()
    const a = await api.post(`/api/airfields/${code}/profiles`, { validFrom: iso(0), validTo: iso(120), source: 'estimate', heightReference: 'AGL', levels })
    const b = await api.post(`/api/airfields/${code}/profiles`, { validFrom: iso(120), validTo: iso(240), source: 'estimate', heightReference: 'AGL', levels })
    const before = await countRows('profile_supersessions')
    const res = await api.get(`/api/airfields/${code}/profiles/supersedes?validFrom=${iso(60)}&validTo=${iso(240)}`)
    expect(res.status).toBe(200)
    expect(res.body.supersedes).toEqual([
      { id: a.body.profile.id, validFrom: iso(0), validTo: iso(120), from: iso(60), to: iso(120), whole: false },
      { id: b.body.profile.id, validFrom: iso(120), validTo: iso(240), from: iso(120), to: iso(240), whole: true },
    ])
    expect(await countRows('profile_supersessions')).toBe(before)
    // ... and the filing then does just that.
    const filed = await api.post(`/api/airfields/${code}/profiles`, { validFrom: iso(60), validTo: iso(240), source: 'estimate', heightReference: 'AGL', levels })
    expect(filed.body.profile.supersededIds).toEqual([a.body.profile.id, b.body.profile.id])
    const bad = await api.get(`/api/airfields/${code}/profiles/supersedes?validFrom=${iso(60)}&validTo=${iso(0)}`)
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0].field).toBe('validTo')
    expect((await (await signedIn('pilot')).get(`/api/airfields/${code}/profiles/supersedes?validFrom=${iso(60)}&validTo=${iso(240)}`)).status).toBe(403)
  })
})

describe('the 15 kt check on the approach and climb corridor', () => {
  // A headwind on runway 36 growing evenly from calm at the ground to 20 kt at 600 m.
  const steady = [{ heightM: 0, directionDeg: 360, speedKt: 0 }, { heightM: 600, directionDeg: 360, speedKt: 20 }]
  const file = async (api: ApiClient, code: string) => {
    const now = Date.now()
    const res = await api.post(`/api/airfields/${code}/profiles`, {
      validFrom: new Date(now - minute).toISOString(), validTo: new Date(now + 3600_000).toISOString(), source: 'estimate', heightReference: 'AGL', levels: steady,
    })
    expect(res.status).toBe(201)
    const b = (await api.get(`/api/airfields/${code}/briefing`)).body.briefing
    return b.runwayEnds.find((e: { designator: string }) => e.designator === '36')
  }

  it('a wind strengthening steadily with height: 20 kt over 0-600 m stays information; 9.7 kt within 3 NM is within the limit', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api)
    const end = await file(api, code)
    // 0-600 m: the whole 20 kt, shown, not checked.
    expect(end.arrival.maxAirspeedLossKt).toBeCloseTo(20, 6)
    // Within 3 NM on a 3° path the path reaches 3 x 1852 x tan 3° = 291.2 m: 20 x 291.2 / 600 = 9.71 kt.
    const check = end.checks.find((c: { kind: string }) => c.kind === 'airspeed-loss-arrival')
    // The briefing answers in the trade's precision (0.1 kt).
    expect(check.value).toBeCloseTo(20 * 5556 * Math.tan(3 * Math.PI / 180) / 600, 1)
    expect(check).toMatchObject({ limit: 15, state: 'within' })
    expect(check.message).toContain('within 3 NM of the threshold')
  })

  it('the corridor and path geometry are airfield settings: 6 NM reaches 582.4 m, and the same wind then exceeds 15 kt', async () => {
    const api = await signedIn('dispatcher')
    const { code } = await makeAirfield(api, { pathSettings: { corridorNm: 6 } })
    expect((await api.get(`/api/airfields/${code}`)).body.airfield.pathSettings).toEqual({ corridorNm: 6 })
    const end = await file(api, code)
    const check = end.checks.find((c: { kind: string }) => c.kind === 'airspeed-loss-arrival')
    expect(check.value).toBeCloseTo(20 * 11112 * Math.tan(3 * Math.PI / 180) / 600, 1)
    expect(check.state).toBe('exceeded')
    const bad = await api.patch(`/api/airfields/${code}`, { pathSettings: { arrivalGlidePathDeg: 12 } })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0]).toMatchObject({ field: 'pathSettings.arrivalGlidePathDeg', message: 'Glide path must be from 1 to 8°' })
  })
})

describe('the F-factor limit is set like the others', () => {
  it('the safety office sets maxFFactor per airfield; the briefing checks against it; out of range is refused by name', async () => {
    const api = await signedIn('dispatcher')
    const safety = await signedIn('safety')
    const { code } = await makeAirfield(api)
    const set = await safety.put(`/api/limits/airfields/${code}`, { values: { maxFFactor: 0.15 }, reason: 'Test field: F-factor limit for this type' })
    expect(set.status).toBe(200)
    const now = Date.now()
    await api.post(`/api/airfields/${code}/profiles`, {
      validFrom: new Date(now - minute).toISOString(), validTo: new Date(now + 3600_000).toISOString(), source: 'estimate', heightReference: 'AGL',
      levels: [{ heightM: 0, directionDeg: 180, speedKt: 0 }, { heightM: 100, directionDeg: 180, speedKt: 80 }, { heightM: 600, directionDeg: 180, speedKt: 80 }],
    })
    const end18 = (await api.get(`/api/airfields/${code}/briefing`)).body.briefing.runwayEnds.find((e: { designator: string }) => e.designator === '18')
    expect(end18.checks.find((c: { kind: string }) => c.kind === 'f-factor-arrival').limit).toBe(0.15)
    const bad = await safety.put(`/api/limits/airfields/${code}`, { values: { maxFFactor: 0.9 }, reason: 'Test field: too high' })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues.map((i: { field: string }) => i.field)).toContain('values.maxFFactor')
  })
})
