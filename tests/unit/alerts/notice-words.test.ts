import { describe, expect, it } from 'vitest'
import { alertTitle, renderAlertEmail, renderAlertPush, type AlertNoticeData } from '../../../server/domain/alerts/messages'
import { figureText, withUnit } from '../../../shared/limits'
import { VEERLINE_CAUTION } from '../../../shared/utils/caution'

// How a notice writes its figures. The F-factor is a dimensionless number (FAA AC 00-54, Pilot Windshear Guide:
// F = (Wx/g) - (w/V); 0.1 or more averaged over about 1 km is hazardous), so it carries no unit and needs three
// decimals to tell 0.105 from its 0.1 limit. Winds in knots to 0.1 kt is common practice.
const base: AlertNoticeData = {
  event: 'raised',
  airfield: { code: 'XCST', name: 'Coastmere' },
  designator: '27',
  kind: 'f-factor-arrival',
  value: 0.1049,
  limit: 0.1,
  unit: 'F',
  excess: 0.0049,
  message: 'F-factor (1 km, horizontal wind only) on arrival runway 27 0.105 exceeds the limit of 0.1 by 0.005',
  profile: { id: 7, validFrom: new Date('2026-12-02T06:00:00Z'), validTo: new Date('2026-12-02T09:00:00Z'), source: 'manual' },
  appUrl: 'http://127.0.0.1:3000',
}

describe('notice figures', () => {
  it('writes the F-factor without a unit and to three decimals (FAA AC 00-54: dimensionless, threshold 0.1)', () => {
    expect(figureText(0.1049, 'F')).toBe('0.105')
    expect(alertTitle(base)).toBe('XCST runway 27: F-factor (1 km, horizontal wind only) on arrival 0.105 over the 0.1 limit')
    const mail = renderAlertEmail(base)
    expect(mail.text).toContain('0.105')
    expect(mail.text).not.toMatch(/0\.1 F|\d F\b/)
    expect(renderAlertPush(base).value).toBe(0.105)
  })

  it('writes winds to 0.1 kt with their unit (common practice)', () => {
    const d = { ...base, kind: 'crosswind', value: 19.28, limit: 15, unit: 'kt', excess: 4.28 }
    expect(alertTitle(d)).toBe('XCST runway 27: Crosswind 19.3 kt over the 15 kt limit')
    expect(withUnit(15, 'kt')).toBe('15 kt')
    expect(withUnit(0.1, '')).toBe('0.1')
  })

  it('names a wind shear report without inventing a figure for it, and keeps the caution', () => {
    const d = { ...base, kind: 'reported-wind-shear', value: 1, limit: 0, unit: 'report', excess: 1 }
    expect(alertTitle(d)).toBe('XCST runway 27: Wind shear reported in a coded report')
    const mail = renderAlertEmail(d)
    expect(mail.text).not.toContain('1.0 report')
    expect(mail.text).toContain(VEERLINE_CAUTION)
  })
})
