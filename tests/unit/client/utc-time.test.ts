import { describe, expect, it } from 'vitest'
import { parseUtcText, utcSeconds, utcShort } from '../../../utils/utc-time'

// ISO 8601 extended format with the UTC designator Z (ISO 8601; clause numbers from memory). Aviation writes times
// in UTC on a 24-hour clock with a Z (common practice).
describe('UTC time entry', () => {
  it('shows an ISO instant as a 24-hour UTC time with a Z', () => {
    expect(utcShort('2026-03-01T18:05:00Z')).toBe('2026-03-01 18:05Z')
    expect(utcSeconds('2026-03-01T18:05:07.123Z')).toBe('2026-03-01 18:05:07Z')
    expect(utcShort('', '')).toBe('')
    expect(utcShort(null)).toBe('—')
  })

  it('reads what a dispatcher types back to an ISO 8601 instant', () => {
    expect(parseUtcText('2026-03-01 06:00Z')).toBe('2026-03-01T06:00:00Z')
    expect(parseUtcText('2026-03-01T0600')).toBe('2026-03-01T06:00:00Z')
    expect(parseUtcText(' 2026-03-01 23:59 z ')).toBe('2026-03-01T23:59:00Z')
  })

  it('gives up on anything else, so the form can say what is wrong', () => {
    expect(parseUtcText('01/03/2026 6pm')).toBeNull()
    expect(parseUtcText('2026-03-01')).toBeNull()
  })

  it('round-trips', () => {
    const iso = '2027-11-30T00:30:00Z'
    expect(parseUtcText(utcShort(iso))).toBe(iso)
  })
})
