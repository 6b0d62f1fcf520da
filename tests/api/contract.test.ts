// The one error contract (422 with data.issues, plain 401), 405 for methods a route lacks, and filing as one
// pipeline (one alert evaluation per filing). Status codes per RFC 9110: 405 carries Allow (section 15.5.6),
// 422 is unprocessable content (section 15.5.21).
import { afterAll, describe, expect, it } from 'vitest'
import { ApiClient, signedIn } from '../support/api'
import { closeDb, countRows, makeAirfield, profileBody } from '../support/airfields'

afterAll(closeDb)

describe('error contract', () => {
  it('a bad path parameter is 422 naming the parameter, not 400 with a raw dump', async () => {
    const pilot = await signedIn('pilot')
    const res = await pilot.get('/api/airfields/X1')
    expect(res.status).toBe(422)
    expect(res.body.data.issues).toEqual([{ field: 'code', message: 'Code must be four letters, e.g. XVAL' }])
    expect(res.body.statusMessage).toContain('code: Code must be four letters')
  })

  it('a bad query value is 422 naming the query parameter', async () => {
    const safety = await signedIn('safety')
    const res = await safety.get('/api/audit?page=0&from=yesterday')
    expect(res.status).toBe(422)
    const fields = res.body.data.issues.map((i: { field: string }) => i.field).sort()
    expect(fields).toEqual(['from', 'page'])
    expect(res.body.data.issues.find((i: { field: string }) => i.field === 'from').message).toMatch(/^from must be an ISO 8601 date and time/)
  })

  it('a bad body is 422 with every field and list positions in brackets, and saves nothing', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    const before = await countRows('runways')
    const res = await dispatcher.post(`/api/airfields/${code}/runways`, { lengthM: 2400, ends: [{ designator: '09', trueHeadingDeg: 90 }, { designator: '', trueHeadingDeg: 270 }] })
    expect(res.status).toBe(422)
    expect(res.body.data.issues.length).toBeGreaterThan(0)
    for (const issue of res.body.data.issues) {
      expect(issue.field).not.toMatch(/\.\d/)
      expect(typeof issue.message).toBe('string')
    }
    expect(res.body.data.issues.map((i: { field: string }) => i.field)).toContain('ends[1].designator')
    expect(await countRows('runways')).toBe(before)
    const notJson = await dispatcher.request('PATCH', `/api/airfields/${code}`, '{"name": ', { 'content-type': 'application/json' })
    expect(notJson.status).toBe(422)
    expect(notJson.body.data.issues).toEqual([{ field: '(body)', message: 'The body is not valid JSON' }])
  })

  it('a bad sign-in body is 422 with the form\'s words', async () => {
    const res = await new ApiClient().post('/api/session', { email: 'not-an-address' })
    expect(res.status).toBe(422)
    expect(res.body.data.issues).toEqual(expect.arrayContaining([
      { field: 'email', message: 'Enter a valid e-mail address' },
      { field: 'password', message: 'Password is required' },
    ]))
    expect(res.body.statusMessage).toMatch(/^Enter an e-mail and a password/)
  })

  it('signed out is 401 with a plain message, before any validation', async () => {
    const res = await new ApiClient().get('/api/airfields/X1')
    expect(res.status).toBe(401)
    expect(res.body.statusMessage).toBe('Sign in first')
  })
})

describe('methods', () => {
  it('OPTIONS on an API route is 405 with Allow, never a redirect', async () => {
    const res = await new ApiClient().request('OPTIONS', '/api/airfields')
    expect(res.status).toBe(405)
    expect(res.headers.get('location')).toBeNull()
    expect(res.headers.get('allow')).toBe('GET, POST')
  })

  it('a method a route lacks is 405 with Allow; an unknown API path is 404, both as JSON', async () => {
    const dispatcher = await signedIn('dispatcher')
    const del = await dispatcher.delete('/api/airfields')
    expect(del.status).toBe(405)
    expect(del.headers.get('location')).toBeNull()
    expect(del.headers.get('allow')).toBe('GET, POST')
    const put = await dispatcher.put('/api/airfields/XVAL/trend', {})
    expect(put.status).toBe(405)
    expect(put.headers.get('allow')).toBe('GET')
    const none = await dispatcher.get('/api/no-such-thing')
    expect(none.status).toBe(404)
    expect(none.headers.get('location')).toBeNull()
    expect(none.body.statusMessage).toBe('There is no API route at /api/no-such-thing')
  })
})

describe('filing as one pipeline', () => {
  it('a filing that supersedes 3 profiles evaluates the airfield exactly once', async () => {
    const dispatcher = await signedIn('dispatcher')
    const { code } = await makeAirfield(dispatcher)
    // Three one-hour profiles back to back, then one three-hour profile over all of them.
    for (const offsetH of [0, 1, 2]) {
      const res = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(offsetH, 1))
      expect(res.status).toBe(201)
    }
    const evaluations = () => countRows('audit_log',
      'action = \'alerts.evaluate\' AND entity_type = \'airfield\' AND entity_id = (SELECT CAST(id AS CHAR) FROM airfields WHERE code = ?)', [code])
    expect(await evaluations()).toBe(3)
    const over = await dispatcher.post(`/api/airfields/${code}/profiles`, profileBody(0, 3))
    expect(over.status).toBe(201)
    expect(over.body.profile.supersededIds).toHaveLength(3)
    expect(await evaluations()).toBe(4)
  })
})
