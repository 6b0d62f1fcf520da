import { describe, expect, it } from 'vitest'
import { cookieAssignment, cookieValue } from '../../../utils/cookie-text'

// The Cookie header's syntax: `name=value` pairs separated by "; " (RFC 6265 §4.2.1; the example header
// "SID=31d4d96e407aad42; lang=en-US" is the RFC's own, §3.1, from memory). Values are percent-encoded with
// encodeURIComponent (RFC 3986 §2.1).
describe('the remembered runway end in a cookie', () => {
  it('finds one cookie among several, by its exact name', () => {
    expect(cookieValue('SID=31d4d96e407aad42; lang=en-US', 'lang')).toBe('en-US')
    expect(cookieValue('SID=31d4d96e407aad42; lang=en-US', 'SID')).toBe('31d4d96e407aad42')
    // document.cookie joins with "; " too; a name that only starts like another is not it.
    expect(cookieValue('vl-end-3-XAAA2=09; vl-end-3-XAAA=27L', 'vl-end-3-XAAA')).toBe('27L')
    expect(cookieValue('lang=en-US', 'SID')).toBeNull()
    expect(cookieValue('', 'lang')).toBeNull()
    expect(cookieValue(undefined, 'lang')).toBeNull()
  })

  it('keeps a designator as text, leading zero and all', () => {
    expect(cookieValue('vl-end-3-XAAA=04', 'vl-end-3-XAAA')).toBe('04')
    expect(cookieValue('vl-end-3-XAAA=26', 'vl-end-3-XAAA')).toBe('26')
  })

  it('reads the values Nuxt\'s useCookie wrote before: a text that reads as a number, as JSON', () => {
    // nuxt/dist/app/composables/cookie.js (Nuxt 4.4) encodes "26" as encodeURIComponent(JSON.stringify("26")).
    expect(cookieValue(`vl-end-3-XAAA=${encodeURIComponent(JSON.stringify('26'))}`, 'vl-end-3-XAAA')).toBe('26')
    expect(cookieValue('vl-end-3-XAAA=%2226%22', 'vl-end-3-XAAA')).toBe('26')
  })

  it('gives up on a value that is not valid percent-encoding', () => {
    expect(cookieValue('vl-end-3-XAAA=%E0%A4%A', 'vl-end-3-XAAA')).toBeNull()
  })

  it('writes a year-long, site-wide, same-site cookie whose value reads back', () => {
    const text = cookieAssignment('vl-end-3-XAAA', '09L', 365 * 86400)
    // Max-Age in seconds and Path (RFC 6265 §4.1.1); SameSite=Lax (RFC 6265bis, the browsers' default, common practice).
    expect(text).toBe('vl-end-3-XAAA=09L; Max-Age=31536000; Path=/; SameSite=Lax')
    expect(cookieValue(text.split(';')[0], 'vl-end-3-XAAA')).toBe('09L')
    expect(cookieValue(cookieAssignment('n', 'a b;c', 60).split('; Max-Age')[0], 'n')).toBe('a b;c')
  })
})
