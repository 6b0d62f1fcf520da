import { describe, expect, it } from 'vitest'
import { KMH_PER_KT, WindValidationError, parseCodedReport } from '../../../shared/wind'

const issuesOf = (fn: () => unknown): { field: string, message: string, line?: number }[] => {
  try {
    fn()
  }
  catch (e) {
    if (e instanceof WindValidationError) return e.issues
    throw e
  }
  throw new Error('expected a WindValidationError')
}

// The examples below are the model reports of ICAO Annex 3 / WMO-No. 306 for the standard's own fictitious station
// YUDO (Annex 3 Appendix 3 Examples A3-1 and A3-2, Appendix 5 Example A5-1; quoted from memory).
describe('model reports of the standard (ICAO Annex 3 / WMO-No. 306, from memory)', () => {
  it('METAR YUDO 221630Z 24015KMH ...: station, observation time, km/h wind, the BECMG trend only noted', () => {
    const now = new Date('2026-03-22T17:00:00Z')
    const r = parseCodedReport('METAR YUDO 221630Z 24015KMH 0600 R12/1000U DZ FG SCT010 OVC020 17/16 Q1018 BECMG TL1700 0800 FG BECMG AT1800 9999 NSW', 1, { now })
    expect(r).toMatchObject({ kind: 'METAR', station: 'YUDO', observedAt: '2026-03-22T16:30:00.000Z', ageMinutes: 30 })
    // 15 km/h = 15 / 1.852 kt = 8.099 kt (1 kt = 1.852 km/h exactly).
    expect(r.surfaceWind).toMatchObject({ directionDeg: 240, unit: 'KMH' })
    expect(r.surfaceWind!.speedKt).toBeCloseTo(15 / KMH_PER_KT, 12)
    expect(r.periods).toHaveLength(1)
    expect(r.periods[0]).toMatchObject({ change: 'BASE', from: '2026-03-22T16:30:00.000Z', to: '2026-03-22T17:30:00.000Z' })
    expect(r.notes.some(n => n.startsWith('BECMG TL1700 0800 FG') && /not used/.test(n))).toBe(true)
  })

  it('SPECI YUDO 151115Z 05025G37KT ...: gusts, and the TEMPO trend only noted', () => {
    const r = parseCodedReport('SPECI YUDO 151115Z 05025G37KT 3000 1200NE +TSRA BKN005CB 25/22 Q1008 TEMPO TL1200 0600 BECMG AT1200 8000 NSW NSC', 1, { now: new Date('2026-03-15T11:20:00Z') })
    expect(r).toMatchObject({ kind: 'SPECI', station: 'YUDO', observedAt: '2026-03-15T11:15:00.000Z', ageMinutes: 5 })
    expect(r.surfaceWind).toMatchObject({ directionDeg: 50, speedKt: 25, gustKt: 37 })
    expect(r.levels).toEqual([{ heightM: 10, directionDeg: 50, speedKt: 25, gustKt: 37 }])
  })

  it('TAF YUDO 160000Z 1606/1624 ...: validity, the FM period with its own wind; BECMG without wind and TEMPO are not periods', () => {
    const r = parseCodedReport('TAF YUDO 160000Z 1606/1624 13018KT 9000 BKN020 BECMG 1608/1610 SCT015CB BKN020 TEMPO 1608/1612 17025G40KT 1000 TSRA SCT010CB BKN020 FM161230 15015KT 9999 BKN020', 1, { now: new Date('2026-03-16T01:00:00Z') })
    expect(r).toMatchObject({ kind: 'TAF', station: 'YUDO', observedAt: '2026-03-16T00:00:00.000Z', validFrom: '2026-03-16T06:00:00.000Z', validTo: '2026-03-17T00:00:00.000Z' })
    expect(r.periods.map(p => [p.change, p.from, p.to, p.surfaceWind?.group])).toEqual([
      ['BASE', '2026-03-16T06:00:00.000Z', '2026-03-16T12:30:00.000Z', '13018KT'],
      ['FM', '2026-03-16T12:30:00.000Z', '2026-03-17T00:00:00.000Z', '15015KT'],
    ])
    expect(r.periods[1]!.levels).toEqual([{ heightM: 10, directionDeg: 150, speedKt: 15 }])
    expect(r.notes.find(n => n.startsWith('TEMPO 1608/1612 17025G40KT'))).toMatch(/temporary change, shown only, not used/)
  })
})

describe('wind groups in every unit, and the gust rule', () => {
  it('23020KMH is read: 230° at 20 km/h = 10.80 kt (1 kt = 1.852 km/h)', () => {
    const w = parseCodedReport('METAR XVAL 121150Z 23020KMH 9999').surfaceWind!
    expect(w).toMatchObject({ directionDeg: 230, unit: 'KMH' })
    expect(w.speedKt).toBeCloseTo(10.799, 3)
  })

  it('00000G15KT is refused with the reason: a gust group needs a mean wind (WMO-No. 306 FM 15)', () => {
    const issues = issuesOf(() => parseCodedReport('METAR XVAL 121150Z 00000G15KT 9999', 3))
    expect(issues[0]).toMatchObject({ field: 'windGroup', line: 3 })
    expect(issues[0]!.message).toContain('"00000G15KT"')
    expect(issues[0]!.message).toMatch(/gust on a calm wind/)
  })
})

describe('runway wind shear groups (WMO-No. 306 FM 15 WS Rnn / WS ALL RWY; older WS LDG / WS TKOF forms from memory)', () => {
  it('WS LDG RWY27 and WS TKOF RWY09 are kept with their runways, as written', () => {
    const r = parseCodedReport('METAR XVAL 121150Z 27015KT 9999 WS LDG RWY27 WS TKOF RWY09')
    expect(r.runwayShear).toEqual({ allRunways: false, runways: ['27', '09'], groups: ['WS LDG RWY27', 'WS TKOF RWY09'] })
  })

  it('WS R27 and WS ALL RWY on one line', () => {
    expect(parseCodedReport('METAR XVAL 121150Z 27015KT WS R27 WS ALL RWY').runwayShear).toEqual({ allRunways: true, runways: ['27'], groups: ['WS R27', 'WS ALL RWY'] })
  })

  it('a broken older form names itself', () => {
    expect(issuesOf(() => parseCodedReport('METAR XVAL 121150Z 27015KT WS LDG 27'))[0]!.message).toContain('"WS LDG 27"')
  })
})

describe('report times', () => {
  it('a day of month is read against the given time, across a month end', () => {
    const r = parseCodedReport('METAR XVAL 282350Z 27015KT', 1, { now: new Date('2026-03-01T01:00:00Z') })
    expect(r.observedAt).toBe('2026-02-28T23:50:00.000Z')
    expect(r.ageMinutes).toBe(70)
  })

  it('TAF validity to hour 24 ends at midnight; FM and BECMG each open a period with their own wind and WS group', () => {
    const r = parseCodedReport('TAF XVAL 120500Z 1206/1224 18010KT WS015/24040KT BECMG 1210/1212 22015KT FM121800 27020G32KT WS020/30045KT PROB30 TEMPO 1220/1223 29030G45KT', 1, { now: new Date('2026-03-12T05:10:00Z') })
    expect(r.validTo).toBe('2026-03-13T00:00:00.000Z')
    expect(r.periods.map(p => [p.change, p.from, p.to])).toEqual([
      ['BASE', '2026-03-12T06:00:00.000Z', '2026-03-12T10:00:00.000Z'],
      ['BECMG', '2026-03-12T10:00:00.000Z', '2026-03-12T18:00:00.000Z'],
      ['FM', '2026-03-12T18:00:00.000Z', '2026-03-13T00:00:00.000Z'],
    ])
    // BECMG changes the wind; the WS group it does not change carries on. FM replaces everything.
    expect(r.periods[1]!.levels).toEqual([{ heightM: 10, directionDeg: 220, speedKt: 15 }, { heightFt: 1500, directionDeg: 240, speedKt: 40 }])
    expect(r.periods[2]!.levels).toEqual([{ heightM: 10, directionDeg: 270, speedKt: 20, gustKt: 32 }, { heightFt: 2000, directionDeg: 300, speedKt: 45 }])
    expect(r.notes.find(n => n.startsWith('PROB30 TEMPO 1220/1223 29030G45KT'))).toMatch(/probability group/)
  })

  it('a change group without its period is refused by name', () => {
    expect(issuesOf(() => parseCodedReport('TAF XVAL 120500Z 1206/1224 18010KT BECMG 22015KT'))[0]!.message).toContain('"BECMG"')
  })
})
