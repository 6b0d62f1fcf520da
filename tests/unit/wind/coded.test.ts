import { describe, expect, it } from 'vitest'
import { MPS_PER_KT, WindValidationError, analyseProfile, parseCodedReport } from '../../../shared/wind'

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

describe('METAR surface wind groups (FAA AIM 7-1 examples; WMO-No. 306 FM 15)', () => {
  it('13008KT: 130° at 8 kt (FAA AIM)', () => {
    const w = parseCodedReport('METAR XQAB 121150Z 13008KT 9999 FEW030 12/08 Q1015').surfaceWind!
    expect(w).toMatchObject({ directionDeg: 130, speedKt: 8, variable: false, calm: false })
    expect(w.gustKt).toBeUndefined()
  })

  it('08032G45KT: 080° at 32 kt gusting 45 (FAA AIM)', () => {
    expect(parseCodedReport('METAR XQAB 121150Z 08032G45KT 5000').surfaceWind).toMatchObject({ directionDeg: 80, speedKt: 32, gustKt: 45 })
  })

  it('VRB04KT: variable at 4 kt, no direction and no profile level (FAA AIM)', () => {
    const r = parseCodedReport('METAR XQAB 121150Z VRB04KT CAVOK')
    expect(r.surfaceWind).toMatchObject({ directionDeg: null, variable: true, speedKt: 4 })
    expect(r.levels).toHaveLength(0)
    expect(r.notes.join(' ')).toMatch(/variable/)
  })

  it('00000KT: calm (FAA AIM)', () => {
    const r = parseCodedReport('METAR XQAB 121150Z 00000KT CAVOK')
    expect(r.surfaceWind).toMatchObject({ directionDeg: 0, speedKt: 0, calm: true })
    expect(r.levels[0]).toMatchObject({ heightM: 10, speedKt: 0 })
  })

  it('210103G130KT: 210° at 103 kt gusting 130 (FAA AIM)', () => {
    expect(parseCodedReport('SPECI XQAB 121150Z 210103G130KT').surfaceWind).toMatchObject({ directionDeg: 210, speedKt: 103, gustKt: 130 })
  })

  it('32012G22KT 280V350: 320° at 12 gusting 22, varying 280° to 350° (FAA AIM)', () => {
    expect(parseCodedReport('METAR XQAB 121150Z 32012G22KT 280V350 9999').surfaceWind).toMatchObject({
      directionDeg: 320, speedKt: 12, gustKt: 22, variableFromDeg: 280, variableToDeg: 350,
    })
  })

  it('P99KT and P49MPS: 100 kt / 50 m/s or more, flagged as lower bounds (WMO-No. 306 FM 15)', () => {
    const kt = parseCodedReport('METAR XQAB 121150Z 250P99KT').surfaceWind!
    expect(kt).toMatchObject({ directionDeg: 250, speedKt: 100, speedAtLeast: true })
    const mps = parseCodedReport('METAR XQAB 121150Z 250P49MPS').surfaceWind!
    expect(mps.speedKt * MPS_PER_KT).toBeCloseTo(50, 9)
    expect(mps.unit).toBe('MPS')
  })

  it('m/s groups are converted with the exact knot (24008MPS = 8 m/s; 1 kt = 1852/3600 m/s)', () => {
    expect(parseCodedReport('METAR XQAB 121150Z 24008MPS').surfaceWind!.speedKt).toBeCloseTo(8 / (1852 / 3600), 12)
  })

  it('a station identifier ending in KT is not a wind group', () => {
    expect(parseCodedReport('METAR XQKT 121150Z 13008KT').surfaceWind!.directionDeg).toBe(130)
  })

  it('a malformed wind group is an error that names the group', () => {
    const issues = issuesOf(() => parseCodedReport('METAR XQAB 121150Z 1308KT 9999', 7))
    expect(issues[0]).toMatchObject({ field: 'windGroup', line: 7 })
    expect(issues[0]!.message).toContain('"1308KT"')
    expect(issuesOf(() => parseCodedReport('METAR XQAB 121150Z 37010KT'))[0]!.message).toContain('"37010KT"')
    expect(issuesOf(() => parseCodedReport('METAR XQAB 121150Z 27020G15KT'))[0]!.message).toContain('gust')
  })
})

describe('wind shear groups', () => {
  it('TAF WS020/27035KT: shear from the surface to 2,000 ft, wind 270° at 35 kt at the top (NWS Training Center TAF course, lesson 3.7)', () => {
    const r = parseCodedReport('TAF XQAB 121130Z 1212/1312 18010KT P6SM SKC WS020/27035KT')
    expect(r.kind).toBe('TAF')
    expect(r.shearLevels[0]).toMatchObject({ heightAglFt: 2000, directionDeg: 270, speedKt: 35 })
    expect(r.shearLevels[0]!.heightAglM).toBeCloseTo(609.6, 9)
    expect(r.levels).toEqual([
      { heightM: 10, directionDeg: 180, speedKt: 10 },
      { heightFt: 2000, directionDeg: 270, speedKt: 35 },
    ])
    // the two levels make a profile the engine accepts
    const a = analyseProfile({ heightReference: 'AGL', levels: r.levels })
    expect(a.coverage.reaches600m).toBe(true)
  })

  it('a malformed WS group is an error that names it', () => {
    expect(issuesOf(() => parseCodedReport('TAF XQAB 121130Z 1212/1312 18010KT WS20/27035KT'))[0]!.message).toContain('"WS20/27035KT"')
  })

  it('METAR WS R24 and WS ALL RWY flag the runways named (WMO-No. 306 FM 15 supplementary group)', () => {
    expect(parseCodedReport('METAR XQAB 121150Z 24015KT 9999 WS R24 WS R07R').runwayShear).toEqual({ allRunways: false, runways: ['24', '07R'], groups: ['WS R24', 'WS R07R'] })
    expect(parseCodedReport('METAR XQAB 121150Z 24015KT 9999 WS ALL RWY').runwayShear).toEqual({ allRunways: true, runways: [], groups: ['WS ALL RWY'] })
    expect(parseCodedReport('METAR XQAB 121150Z 24015KT 9999').runwayShear).toBeNull()
    expect(issuesOf(() => parseCodedReport('METAR XQAB 121150Z 24015KT WS XYZ'))[0]!.message).toContain('"WS XYZ"')
  })

  it('later TAF wind groups are kept apart from the first, and remarks are not read', () => {
    const r = parseCodedReport('TAF XQAB 121130Z 1212/1312 22010KT 9999 TEMPO 1215/1218 24020G32KT FM130000 27008KT=')
    expect(r.surfaceWind!.group).toBe('22010KT')
    expect(r.laterWinds.map(w => w.group)).toEqual(['24020G32KT', '27008KT'])
    expect(parseCodedReport('METAR XQAB 121150Z 22010KT RMK PK WND 1308KT').surfaceWind!.group).toBe('22010KT')
  })
})
