import { describe, expect, it } from 'vitest'
import { parseCoordinate } from '../../shared/utils/coordinates'
import { airfieldCreateSchema } from '../../shared/utils/airfield-schema'

// 1° = 60′ = 3600″; north and east positive, south and west negative (common practice).
describe('latitude and longitude as people write them', () => {
  it('decimal degrees, signed or with a hemisphere letter', () => {
    expect(parseCoordinate('46.2083', 'lat')).toBe(46.2083)
    expect(parseCoordinate('46.2083 N', 'lat')).toBe(46.2083)
    expect(parseCoordinate('S 12.5', 'lat')).toBe(-12.5)
    expect(parseCoordinate('-7,25', 'lon')).toBe(-7.25)
    expect(parseCoordinate('7.25W', 'lon')).toBe(-7.25)
  })

  it('degrees, minutes and seconds: 46°12′30″N = 46 + 12/60 + 30/3600 = 46.208333°', () => {
    expect(parseCoordinate('46°12′30″N', 'lat')).toBeCloseTo(46 + 12 / 60 + 30 / 3600, 12)
    expect(parseCoordinate('46 12 30 N', 'lat')).toBeCloseTo(46.2083333, 6)
    expect(parseCoordinate('46°12\'30"N', 'lat')).toBeCloseTo(46.2083333, 6)
    expect(parseCoordinate('7°18.75′W', 'lon')).toBeCloseTo(-(7 + 18.75 / 60), 12)
    expect(parseCoordinate('W 007 18 45', 'lon')).toBeCloseTo(-7.3125, 12)
  })

  it('refuses anything else: a letter of the other axis, 60 minutes, a sign with a letter, words', () => {
    for (const bad of ['46 12 30 E', '46 60 00 N', '-46.2 N', 'north', '46.5 12 N', '', '46 12 30 40 N']) {
      expect(parseCoordinate(bad, 'lat'), bad).toBeNull()
    }
  })

  it('the airfield schema takes either form and refuses the rest with an example in the field\'s words', () => {
    const base = { code: 'XTAA', name: 'Test', elevation: 100, elevationUnit: 'm' as const }
    const ok = airfieldCreateSchema.safeParse({ ...base, latitudeDeg: '46°12′30″N', longitudeDeg: '7 18 45 E' })
    expect(ok.success && ok.data.latitudeDeg).toBeCloseTo(46.2083333, 6)
    expect(ok.success && ok.data.longitudeDeg).toBeCloseTo(7.3125, 12)
    const bad = airfieldCreateSchema.safeParse({ ...base, latitudeDeg: 'north of the lake', longitudeDeg: 7.3 })
    expect(bad.success).toBe(false)
    const issue = bad.success ? null : bad.error.issues[0]!
    expect(issue!.path).toEqual(['latitudeDeg'])
    expect(issue!.message).toContain('46°12′30″N')
    const far = airfieldCreateSchema.safeParse({ ...base, latitudeDeg: '91 N', longitudeDeg: 7.3 })
    expect(far.success ? '' : far.error.issues[0]!.message).toBe('Latitude must be from -90 to 90°')
  })
})
