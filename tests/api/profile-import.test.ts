import { readFileSync } from 'node:fs'
import { afterAll, describe, expect, it } from 'vitest'
import { signedIn } from '../support/api'
import { closeDb, countRows, makeAirfield, profileBody } from '../support/airfields'

afterAll(closeDb)

const headerQuery = (extra = '') => {
  const b = profileBody(0, 3)
  return `validFrom=${encodeURIComponent(b.validFrom)}&validTo=${encodeURIComponent(b.validTo)}&source=radiosonde&heightReference=AGL${extra}`
}

describe('importing a file', () => {
  it('files the CSV template in one go and keeps the file as filed', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const csv = readFileSync('public/templates/profile-template.csv', 'utf8')
    const preview = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=preview&${headerQuery()}`, csv, { 'content-type': 'text/csv' })
    expect(preview.status).toBe(200)
    expect(preview.body.issues).toEqual([])
    expect(preview.body.levels).toHaveLength(4)
    // comment lines 1-2, header line 3: the first level is on line 4
    expect(preview.body.lines).toEqual([4, 5, 6, 7])
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=file&${headerQuery()}`, csv, { 'content-type': 'text/csv' })
    expect(filed.status).toBe(201)
    expect(filed.body.profile.levels[0]).toEqual({ heightM: 10, directionDeg: 200, speedKt: 12, gustKt: 22 })
    expect(filed.body.profile.entryMethod).toBe('file')
  })

  it('answers 422 naming the one bad line of a CSV, and the database is unchanged', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const csv = 'height_ft,direction_deg,speed_mps\n33,180,5\n500,190,abc\n1000,200,12\n2000,210,15\n'
    const tables = ['profiles', 'profile_levels', 'audit_log']
    const before = await Promise.all(tables.map(t => countRows(t)))
    const preview = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=preview&${headerQuery()}`, csv)
    expect(preview.status).toBe(200)
    expect(preview.body.issues).toEqual([{ line: 3, field: 'speed_mps', message: 'speed_mps must be a number, got "abc"' }])
    const res = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=file&${headerQuery()}`, csv)
    expect(res.status).toBe(422)
    expect(res.body.data.issues).toEqual([expect.objectContaining({ line: 3, field: 'speed_mps' })])
    expect(res.body.statusMessage).toContain('line 3')
    // a line that parses but breaks the engine's rules (direction 361) is named too
    const engineBad = 'height_m,direction_deg,speed_kt\n10,180,5\n150,361,10\n300,200,12\n'
    const res2 = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=file&${headerQuery()}`, engineBad)
    expect(res2.status).toBe(422)
    expect(res2.body.data.issues[0]).toMatchObject({ line: 3, index: 1 })
    // ... in the file's own words: its column and line, never the API's path (levels[1].directionDeg).
    expect(res2.body.data.issues[0].field).toBe('direction_deg')
    expect(res2.body.statusMessage).toContain('line 3: direction_deg:')
    expect(JSON.stringify(res2.body)).not.toContain('levels[')
    const shown = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=preview&${headerQuery()}`, engineBad)
    expect(shown.body.columns).toEqual(['height_m', 'direction_deg', 'speed_kt'])
    expect(shown.body.rows[1]).toEqual({ line: 3, cells: { height_m: 150, direction_deg: 361, speed_kt: 10 } })
    expect(shown.body.issues[0]).toMatchObject({ line: 3, field: 'direction_deg' })
    expect(await Promise.all(tables.map(t => countRows(t)))).toEqual(before)
  })

  it('files a JSON file and names the line of a bad level', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const body = profileBody(0, 2)
    const good = JSON.stringify(body, null, 2)
    expect((await dispatcher.post(`/api/airfields/${code}/profiles/import?format=json&mode=file`, good)).status).toBe(201)
    const bad = { ...profileBody(3, 2) }
    bad.levels[1] = { heightM: 150, directionDeg: 220, speedKt: -4 }
    const text = JSON.stringify(bad, null, 2)
    const res = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=json&mode=file`, text)
    expect(res.status).toBe(422)
    // pretty-printed: the level's "{" is three lines above its speedKt line (heightM, directionDeg between)
    const expectedLine = text.split('\n').findIndex(l => l.includes('-4')) + 1 - 3
    expect(text.split('\n')[expectedLine - 1]!.trim()).toBe('{')
    expect(res.body.data.issues[0]).toMatchObject({ index: 1, line: expectedLine })
    const broken = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=json&mode=preview`, '{\n "levels": [\n oops ]}')
    expect(broken.body.issues[0]).toMatchObject({ field: 'file', line: 3 })
  })

  it('refuses a file over 2 MB with 413', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const line = '100,180,10\n'
    const big = `height_m,direction_deg,speed_kt\n${line.repeat(Math.ceil(2.1 * 1024 * 1024 / line.length))}`
    const res = await dispatcher.post(`/api/airfields/${code}/profiles/import?format=csv&mode=preview&${headerQuery()}`, big)
    expect(res.status).toBe(413)
  })
})

describe('coded-report paste', () => {
  it('turns a METAR surface wind and a TAF WShhh/dddffKT group into levels that file', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const text = `METAR ${code} 010550Z 32012G22KT 280V350 9999 FEW030 12/05 Q1015\nTAF ${code} 010500Z 0106/0206 31010KT 9999 SCT030 WS020/27035KT`
    const res = await dispatcher.post('/api/wind/coded', { text })
    expect(res.status).toBe(200)
    // 32012G22KT: 320 deg 12 kt gusting 22 (FAA AIM 7-1 example); the WMO standard anemometer height 10 m is common practice.
    // WS020/27035KT: shear to 2,000 ft, 270 deg 35 kt at the top (NWS TAF course, lesson 3.7).
    expect(res.body.levels).toEqual([
      { heightM: 10, directionDeg: 320, speedKt: 12, gustKt: 22 },
      { heightFt: 2000, directionDeg: 270, speedKt: 35 },
    ])
    expect(res.body.lines).toEqual([1, 2])
    // the TAF's own surface wind is at the same height as the METAR's: it is left out, and said so
    expect(res.body.reports[1].notes.join(' ')).toContain('line 1')
    const filed = await dispatcher.post(`/api/airfields/${code}/profiles?entry=coded`, { ...profileBody(0, 2, { source: 'estimate' }), levels: res.body.levels })
    expect(filed.status).toBe(201)
    expect(filed.body.profile.entryMethod).toBe('coded')

    const bad = await dispatcher.post('/api/wind/coded', { text: `METAR ${code} 010550Z 32012KT\nTAF ${code} WS020/2735KT` })
    expect(bad.status).toBe(422)
    expect(bad.body.data.issues[0]).toMatchObject({ line: 2, field: 'shearGroup' })
    expect((await (await signedIn('pilot')).post('/api/wind/coded', { text })).status).toBe(403)
  })
})

describe('the wind preview', () => {
  it('computes components for given runway ends and saves nothing', async () => {
    const pilot = await signedIn('pilot')
    const before = await countRows('profiles')
    const res = await pilot.post('/api/wind/preview', {
      heightReference: 'AGL',
      levels: [{ heightM: 10, directionDeg: 220, speedKt: 30 }, { heightM: 300, directionDeg: 240, speedKt: 40 }],
      runwayEnds: [{ designator: '18', trueHeadingDeg: 180 }],
    })
    expect(res.status).toBe(200)
    // FAA crosswind chart worked example: runway 18, wind 220 at 30 kt: 22.98 kt head, 19.28 kt cross (DOMAIN.md)
    expect(res.body.analysis.runwayEnds[0].surface.headwindKt).toBeCloseTo(22.98, 2)
    expect(res.body.analysis.runwayEnds[0].surface.crosswindKt).toBeCloseTo(19.28, 2)
    expect(await countRows('profiles')).toBe(before)
    const msl = await pilot.post('/api/wind/preview', { heightReference: 'MSL', levels: [{ heightM: 10, directionDeg: 220, speedKt: 30 }, { heightM: 300, directionDeg: 240, speedKt: 40 }] })
    expect(msl.status).toBe(422)
    expect(msl.body.data.issues[0].field).toBe('elevationM')
  })
})
