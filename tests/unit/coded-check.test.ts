import { describe, expect, it } from 'vitest'
import { parseCodedLines } from '../../server/domain/profiles/import/coded'
import { codedAgeLimits, codedReportWarnings } from '../../server/domain/profiles/coded-check'
import { analyseProfile } from '../../shared/wind'
import { DEFAULT_LIMITS, evaluateLimits } from '../../shared/limits'

// Invented reports for the fictitious fields XVAL and XCST.
const now = new Date('2026-03-12T12:00:00Z')

describe('coded reports checked against the airfield', () => {
  it('a METAR for another station, seven hours old, gives two warnings naming the line', () => {
    const read = parseCodedLines('METAR XVAL 120500Z 23020KT 9999', now)
    const w = codedReportWarnings(read.reports, { station: 'XCST', now })
    expect(w.map(x => x.code)).toEqual(['other-station', 'report-old'])
    expect(w[0]!.message).toBe('METAR on line 1 is for XVAL, not XCST (this airfield\'s reporting station).')
    expect(w[1]!.message).toMatch(/7 hours old .* more than 90 minutes/)
  })

  it('a fresh METAR of the station itself gives none; 91 minutes is too old by the 90-minute default', () => {
    expect(codedReportWarnings(parseCodedLines('METAR XCST 121130Z 23020KT', now).reports, { station: 'XCST', now })).toEqual([])
    expect(codedReportWarnings(parseCodedLines('METAR XCST 121029Z 23020KT', now).reports, { station: 'XCST', now }).map(x => x.code)).toEqual(['report-old'])
  })

  it('the age limit is a setting: VEERLINE_METAR_MAX_AGE_MINUTES=120 lets a 91-minute METAR pass; nonsense keeps the default', () => {
    const limits = codedAgeLimits({ VEERLINE_METAR_MAX_AGE_MINUTES: '120' })
    expect(limits).toEqual({ metarMaxAgeMinutes: 120, tafMaxAgeMinutes: 360 })
    expect(codedReportWarnings(parseCodedLines('METAR XCST 121029Z 23020KT', now).reports, { station: 'XCST', now, ...limits })).toEqual([])
    expect(codedAgeLimits({ VEERLINE_METAR_MAX_AGE_MINUTES: 'soon', VEERLINE_TAF_MAX_AGE_MINUTES: '0' })).toEqual({ metarMaxAgeMinutes: 90, tafMaxAgeMinutes: 360 })
  })

  it('a TAF whose validity has ended is a warning', () => {
    const w = codedReportWarnings(parseCodedLines('TAF XCST 120700Z 1206/1212 23020KT', now).reports, { station: 'XCST', now })
    expect(w.map(x => x.code)).toEqual(['taf-expired'])
  })
})

describe('limit checks of the F-factor and of reported wind shear', () => {
  const analysis = analyseProfile({
    heightReference: 'AGL',
    levels: [{ heightM: 0, directionDeg: 180, speedKt: 0 }, { heightM: 100, directionDeg: 180, speedKt: 80 }, { heightM: 600, directionDeg: 180, speedKt: 80 }],
    runwayEnds: [{ designator: '18', trueHeadingDeg: 180 }, { designator: '36', trueHeadingDeg: 360 }],
  })

  it('the F-factor is held against 0.1 per runway end and path (0.1: from memory, the airborne 1 km alerting level)', () => {
    const checks = evaluateLimits(analysis, DEFAULT_LIMITS)
    const arrival18 = checks.find(c => c.kind === 'f-factor-arrival' && c.designator === '18')!
    expect(arrival18.value).toBeCloseTo(analysis.runwayEnds[0]!.fFactor.arrival!.maxF, 12)
    expect(arrival18).toMatchObject({ limit: 0.1, state: 'exceeded', unit: 'F' })
    expect(arrival18.message).toMatch(/on arrival runway 18 \(\d+-\d+ m\) 0\.\d{3} exceeds the limit of 0\.1 by/)
  })

  it('reported wind shear is a check of its own kind for the runway ends named only', () => {
    const checks = evaluateLimits(analysis, DEFAULT_LIMITS, () => DEFAULT_LIMITS, { allRunways: false, runways: ['36'], groups: ['WS R36'], observedAt: '2026-03-12T11:30:00.000Z' })
    const reported = checks.filter(c => c.kind === 'reported-wind-shear')
    expect(reported.map(c => c.designator)).toEqual(['36'])
    expect(reported[0]!.message).toBe('Wind shear reported for runway 36 (WS R36, report of 2026-03-12 11:30Z)')
    const all = evaluateLimits(analysis, DEFAULT_LIMITS, () => DEFAULT_LIMITS, { allRunways: true, runways: [], groups: ['WS ALL RWY'], observedAt: null })
    expect(all.filter(c => c.kind === 'reported-wind-shear').map(c => c.designator)).toEqual(['18', '36'])
  })
})
