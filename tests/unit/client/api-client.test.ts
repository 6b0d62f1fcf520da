import { describe, expect, it } from 'vitest'
import { ApiError, apiErrorFromResponse, fetchFailure } from '../../../utils/api-error'
import { safeReturnPath, signInPathFor } from '../../../utils/return-path'

// The way back after signing in must stay on this site. OWASP Unvalidated Redirects and Forwards Cheat Sheet:
// accept only local paths. RFC 3986 §4.2: a reference starting with "//" is a network-path reference (another
// host). WHATWG URL Standard: for special schemes (http, https) a backslash is read as a slash, so "/\host" is
// another host too.
describe('return path after sign-in', () => {
  it('keeps a path on this site with its query and fragment', () => {
    expect(safeReturnPath('/airfields/XVAL/file')).toBe('/airfields/XVAL/file')
    expect(safeReturnPath('/briefings/XCST?at=2026-03-01T06:00:00Z#r18')).toBe('/briefings/XCST?at=2026-03-01T06:00:00Z#r18')
  })

  it('refuses other hosts, schemes and tricks', () => {
    for (const raw of ['//evil.example/x', '/\\evil.example', 'https://evil.example/', 'javascript:alert(1)', 'airfields', '/\t/evil.example', '', null, 42, ['/a']]) {
      expect(safeReturnPath(raw), String(raw)).toBeNull()
    }
    // Percent-encoded text stays text in the path.
    expect(safeReturnPath('/audit?q=%2F%2Fevil.example')).toBe('/audit?q=%2F%2Fevil.example')
  })

  it('never sends the caller back to the sign-in page itself', () => {
    expect(safeReturnPath('/sign-in?next=/x')).toBeNull()
    expect(signInPathFor('/tokens')).toEqual({ path: '/sign-in', query: { next: '/tokens' } })
    expect(signInPathFor('/')).toEqual({ path: '/sign-in', query: {} })
    expect(signInPathFor('//evil.example')).toEqual({ path: '/sign-in', query: {} })
  })
})

// The error contract (Veerline's API, README "API"): 422 `{ statusMessage, data: { issues: [{ field, message,
// line?, index? }] } }`; h3 sends errors as JSON `{ statusCode, statusMessage, message, data }` (h3 documentation,
// createError). Retry-After as delay-seconds: RFC 9110 §10.2.3.
describe('API errors as { message, issues }', () => {
  it('keeps the server\'s plain words and its issues by field', () => {
    const e = apiErrorFromResponse(422, {
      statusCode: 422,
      statusMessage: 'The profile is not valid',
      data: { issues: [{ field: 'levels[1].directionDeg', message: 'Direction must be from 0 to 360', index: 1 }, { nonsense: true }] },
    })
    expect(e).toBeInstanceOf(ApiError)
    expect(e.status).toBe(422)
    expect(e.message).toBe('The profile is not valid')
    expect(e.issues).toEqual([{ field: 'levels[1].directionDeg', message: 'Direction must be from 0 to 360', index: 1 }])
  })

  it('puts words of its own in place of bare defaults such as "Server Error" on a 401', () => {
    expect(apiErrorFromResponse(401, { statusCode: 401, statusMessage: 'Server Error' }).message).toBe('You are signed out: sign in again')
    expect(apiErrorFromResponse(403, {}).message).toBe('Your role may not do this')
    expect(apiErrorFromResponse(502, '<html>').message).toBe('The server could not do this just now: try again')
  })

  it('reads Retry-After in seconds (a date form is left unread)', () => {
    expect(apiErrorFromResponse(429, { statusMessage: 'Too many sign-in attempts: wait 15 minutes' }, '900').retryAfterS).toBe(900)
    expect(apiErrorFromResponse(503, {}, 'Wed, 21 Oct 2015 07:28:00 GMT').retryAfterS).toBeNull()
  })

  it('reads the same from what useFetch keeps and from a plain fetch error', () => {
    // Nuxt's createError copies statusCode, statusMessage, message and data from the thrown ApiError.
    const kept = { statusCode: 422, statusMessage: 'Bad levels', message: 'Bad levels', data: { issues: [{ field: 'levels[0].speedKt', message: 'Speed is required' }] } }
    expect(fetchFailure(kept, 'fallback')).toEqual({ message: 'Bad levels', status: 422, issues: [{ field: 'levels[0].speedKt', message: 'Speed is required' }] })
    // ofetch's FetchError: the server's JSON body in `data`.
    const raw = { statusCode: 409, message: '[POST] "/api/airfields": 409 Conflict', data: { statusCode: 409, statusMessage: 'An airfield with the code XVAL exists' } }
    expect(fetchFailure(raw, 'fallback')).toEqual({ message: 'An airfield with the code XVAL exists', status: 409, issues: [] })
    // Anything that is not an answer from the API (a bug, a lost connection) gets the form's own words.
    expect(fetchFailure(new TypeError('Cannot read properties of undefined'), 'The token was not made').message).toBe('The token was not made')
    expect(fetchFailure(undefined, 'The token was not made')).toEqual({ message: 'The token was not made', status: 0, issues: [] })
  })
})
