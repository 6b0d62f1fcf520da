import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { closeDb, makeAirfield, uniqueCode, unusedCode } from '../support/airfields'

afterAll(closeDb)

describe('airfields and runways', () => {
  it('creates an airfield (code upper-cased, elevation in ft kept as m) with the magnetic variation for today and its date', async () => {
    const dispatcher = await signedIn('dispatcher')
    const code = await unusedCode()
    const res = await dispatcher.post('/api/airfields', {
      code: code.toLowerCase(), name: 'Test valley', latitudeDeg: 46.2, longitudeDeg: 7.3, elevation: 1000, elevationUnit: 'ft',
    })
    expect(res.status).toBe(201)
    expect(res.body.airfield.code).toBe(code)
    // 1 ft = 0.3048 m exactly (1959 international yard and pound agreement)
    expect(res.body.airfield.elevationM).toBeCloseTo(304.8, 9)
    expect(res.body.airfield.declination.source).toBe('wmm2025')
    expect(res.body.airfield.declination.date).toBe(new Date().toISOString().slice(0, 10))
    expect(typeof res.body.airfield.declination.declinationDeg).toBe('number')

    const again = await dispatcher.post('/api/airfields', {
      code, name: 'Same code', latitudeDeg: 1, longitudeDeg: 1, elevation: 0, elevationUnit: 'm',
    })
    expect(again.status).toBe(409)
    expect(again.body.statusMessage).toContain(code)

    const list = await (await signedIn('pilot')).get(`/api/airfields?q=${code}`)
    expect(list.status).toBe(200)
    expect(list.body.airfields.find((a: { code: string }) => a.code === code)?.profileState.state).toBe('none')
  })

  it('edits an airfield, requiring a reason for a magnetic variation override, and keeps the change in the audit log', async () => {
    const admin = await signedIn('admin')
    const { code } = await makeAirfield(admin)
    const noReason = await admin.patch(`/api/airfields/${code}`, { magVarOverrideDeg: 3 })
    expect(noReason.status).toBe(422)
    expect(noReason.body.data.issues[0].field).toBe('magVarOverrideReason')

    const res = await admin.patch(`/api/airfields/${code}`, { name: 'Renamed field', magVarOverrideDeg: 3, magVarOverrideReason: 'local survey' })
    expect(res.status).toBe(200)
    expect(res.body.airfield.name).toBe('Renamed field')
    expect(res.body.airfield.declination).toMatchObject({ declinationDeg: 3, source: 'override', reason: 'local survey' })
    // entered true heading 180, east variation 3: magnetic = true - east = 177 (DOMAIN.md, common practice)
    const end18 = res.body.airfield.runways[0].ends.find((e: { designator: string }) => e.designator === '18')
    expect(end18.magneticHeadingDeg).toBeCloseTo(177, 9)

    const audit = await admin.get(`/api/audit?entityType=airfield&q=${code}`)
    expect(audit.status).toBe(200)
    expect(audit.body.entries.map((e: { action: string }) => e.action)).toEqual(expect.arrayContaining(['airfield.create', 'airfield.update']))
    expect((await admin.patch('/api/airfields/XQQQ', { name: 'x' })).status).toBe(404)
  })

  it('rejects bad coordinates, naming the field', async () => {
    const dispatcher = await signedIn('dispatcher')
    const res = await dispatcher.post('/api/airfields', { code: uniqueCode(), name: 'Off the globe', latitudeDeg: 95, longitudeDeg: 7, elevation: 0, elevationUnit: 'm' })
    expect(res.status).toBe(422)
    expect(res.body.data.issues).toEqual(expect.arrayContaining([expect.objectContaining({ field: 'latitudeDeg' })]))

    const { code } = await makeAirfield(dispatcher)
    const far = await dispatcher.post(`/api/airfields/${code}/runways`, {
      ends: [{ designator: '09', thresholdLatDeg: 46.2, thresholdLonDeg: 7.3 }, { designator: '27', thresholdLatDeg: 47.2, thresholdLonDeg: 7.3 }],
    })
    expect(far.status).toBe(422)
    expect(far.body.statusMessage).toContain('km from')
    const half = await dispatcher.post(`/api/airfields/${code}/runways`, {
      ends: [{ designator: '09', thresholdLatDeg: 46.2 }, { designator: '27', trueHeadingDeg: 270 }],
    })
    expect(half.status).toBe(422)
  })

  it('checks designator pairs: numbers 18 apart, L opposite R, C opposite C (FAA AC 150/5340-1)', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const post = (a: string, b: string, ha: number, hb: number) => dispatcher.post(`/api/airfields/${code}/runways`, {
      ends: [{ designator: a, trueHeadingDeg: ha }, { designator: b, trueHeadingDeg: hb }],
    })
    const notOpposite = await post('09', '28', 90, 270)
    expect(notOpposite.status).toBe(422)
    expect(notOpposite.body.data.issues[0]).toMatchObject({ field: 'ends[1].designator' })
    expect(notOpposite.body.data.issues[0].message).toContain('18 apart')
    expect((await post('09L', '27L', 90, 270)).status).toBe(422)
    expect((await post('09C', '27R', 90, 270)).status).toBe(422)
    expect((await post('37', '19', 90, 270)).status).toBe(422)
    expect((await post('09L', '27R', 90, 270)).status).toBe(201)
    expect((await post('09C', '27C', 90, 270)).status).toBe(201)
    // 18/36 already exist on the test field: a second runway with those ends is a conflict
    expect((await post('18', '36', 180, 360)).status).toBe(409)
  })

  it('computes the true bearing from threshold coordinates and flags a designator far from the magnetic heading', async () => {
    const dispatcher = await signedIn('dispatcher')
    const code = await unusedCode()
    expect((await dispatcher.post('/api/airfields', { code, name: 'Geodesic test', latitudeDeg: 18.7253, longitudeDeg: 0.0033, elevation: 100, elevationUnit: 'm' })).status).toBe(201)
    // Karney's GeodTest data, a short line (lat1 lon1 azi1 lat2 lon2 azi2 s12), quoted in DOMAIN.md:
    // 18.725775553796 0 98.927919777265 18.724785210853172866 .006615636046166963 98.930043600815390181 706.2676803
    const res = await dispatcher.post(`/api/airfields/${code}/runways`, {
      ends: [
        { designator: '10', thresholdLatDeg: 18.725775553796, thresholdLonDeg: 0 },
        { designator: '28', thresholdLatDeg: 18.724785210853174, thresholdLonDeg: 0.006615636046166963 },
      ],
    })
    expect(res.status).toBe(201)
    const [e10, e28] = res.body.runway.ends
    expect(e10.headingSource).toBe('coordinates')
    // No length given: it is worked out from the two thresholds, s12 of the same GeodTest line.
    expect(res.body.runway.lengthM).toBeCloseTo(706.2676803, 4)
    expect(e10.trueHeadingDeg).toBeCloseTo(98.927919777265, 6)
    // the reverse direction at the far threshold is azi2 + 180
    expect(e28.trueHeadingDeg).toBeCloseTo(98.9300436008154 + 180, 6)
    const decl = res.body.airfield.declination.declinationDeg
    expect(e10.magneticHeadingDeg).toBeCloseTo(98.927919777265 - decl, 6)
    // designator = magnetic azimuth / 10 (FAA AC 150/5340-1); flagged when more than 10 degrees off
    expect(e10.designatorCheck.differenceDeg).toBeCloseTo(Math.abs(100 - (98.927919777265 - decl)), 6)
    expect(e10.designatorCheck.mismatch).toBe(Math.abs(100 - (98.927919777265 - decl)) > 10)

    const skew = await dispatcher.post(`/api/airfields/${code}/runways`, {
      ends: [{ designator: '01', trueHeadingDeg: 40 + decl }, { designator: '19', trueHeadingDeg: 220 + decl }],
    })
    expect(skew.status).toBe(201)
    // magnetic 040 against designator 01 (010): 30 degrees off
    expect(skew.body.runway.ends[0].designatorCheck).toMatchObject({ mismatch: true })
    expect(skew.body.runway.ends[0].designatorCheck.differenceDeg).toBeCloseTo(30, 6)

    // editing a runway: fix the designators to 04/22, now within 10 degrees
    const fixed = await dispatcher.patch(`/api/airfields/${code}/runways/${skew.body.runway.id}`, {
      ends: [{ designator: '04', trueHeadingDeg: 40 + decl }, { designator: '22', trueHeadingDeg: 220 + decl }],
    })
    expect(fixed.status).toBe(200)
    expect(fixed.body.runway.ends.map((e: { designator: string }) => e.designator)).toEqual(['04', '22'])
    expect(fixed.body.runway.ends[0].designatorCheck.mismatch).toBe(false)

    const detail = await (await signedIn('pilot')).get(`/api/airfields/${code}`)
    expect(detail.status).toBe(200)
    expect(detail.body.airfield.runways).toHaveLength(2)
  })

  it('refuses a pilot (403) and a signed-out caller (401) when creating an airfield', async () => {
    const pilot = await signedIn('pilot')
    expect((await pilot.post('/api/airfields', {})).status).toBe(403)
    expect((await new ApiClient().post('/api/airfields', {})).status).toBe(401)
    expect((await new ApiClient().get('/api/airfields')).status).toBe(401)
  })
})
