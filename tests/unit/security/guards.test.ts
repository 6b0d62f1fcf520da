// Pure security checks: push endpoint rules and address ranges, the Origin verdict, JSON depth, BOM, session limits
// and equal-work sign-in. References beside each table.
import { describe, expect, it } from 'vitest'
import { checkPushEndpoint, DEFAULT_PUSH_HOSTS, hostAllowed, nonPublicReason, shortFailure } from '../../../server/domain/alerts/push-endpoint'
import { jsonDepth, originOf, originVerdict, stripBom, mediaType, isJsonType, bodyLimitFor, acceptedBodyTypes } from '../../../server/utils/request-guard'
import { checkSession, sessionLimits } from '../../../server/domain/accounts/session-store'
import { credentialsMatch } from '../../../server/domain/accounts/credentials'

describe('address ranges a push may not reach', () => {
  // IANA IPv4 and IPv6 Special-Purpose Address Registries (RFC 6890), RFC 1918, RFC 3927, RFC 4193, RFC 6598.
  const nonPublic: [string, string][] = [
    ['127.0.0.1', 'loopback'], ['127.255.255.254', 'loopback'], ['0.0.0.0', 'unspecified'],
    ['10.0.0.1', 'private'], ['172.16.0.1', 'private'], ['172.31.255.255', 'private'], ['192.168.1.1', 'private'],
    ['169.254.169.254', 'link-local'], ['100.64.0.1', 'carrier-grade'], ['192.0.2.10', 'reserved'],
    ['198.18.0.5', 'reserved'], ['203.0.113.9', 'reserved'], ['224.0.0.1', 'multicast'], ['255.255.255.255', 'multicast'],
    ['::1', 'loopback'], ['::', 'unspecified'], ['fc00::1', 'unique local'], ['fd12:3456::1', 'unique local'],
    ['fe80::1', 'link-local'], ['ff02::1', 'multicast'], ['::ffff:127.0.0.1', 'loopback'], ['::ffff:7f00:1', 'loopback'],
    ['::ffff:a9fe:a9fe', 'link-local'], ['64:ff9b::10.0.0.1', 'private'],
  ]
  it.each(nonPublic)('%s is refused (%s)', (address, kind) => {
    expect(nonPublicReason(address)).toContain(kind)
  })
  // Public unicast: 8.8.8.8 and 2001:4860:4860::8888 (Google Public DNS), 172.32.0.1 just past RFC 1918's 172.16/12,
  // 100.128.0.1 just past RFC 6598's 100.64/10.
  it.each(['8.8.8.8', '172.32.0.1', '100.128.0.1', '2001:4860:4860::8888'])('%s is public', (address) => {
    expect(nonPublicReason(address)).toBeNull()
  })
  it('a host name is not an address', () => {
    expect(nonPublicReason('localhost')).toBe('not an IP address')
  })
})

describe('push endpoint rules', () => {
  const rules = { allowList: [...DEFAULT_PUSH_HOSTS], standinOrigin: 'http://127.0.0.1:8531' }
  it('takes the hosted services (their endpoint shapes: W3C Push API as the browsers hand them out)', () => {
    for (const e of ['https://fcm.googleapis.com/fcm/send/abc', 'https://updates.push.services.mozilla.com/wpush/v2/abc',
      'https://web.push.apple.com/QO', 'https://wns2-par02p.notify.windows.com/w/?token=abc']) {
      expect(checkPushEndpoint(e, rules), e).toMatchObject({ ok: true, standin: false })
    }
  })
  it('takes the stand-in only on its own origin and path, and only when it is configured', () => {
    expect(checkPushEndpoint('http://127.0.0.1:8531/push/abc', rules)).toMatchObject({ ok: true, standin: true })
    expect(checkPushEndpoint('http://127.0.0.1:8531/messages', rules).ok).toBe(false)
    expect(checkPushEndpoint('http://127.0.0.1:8532/push/abc', rules).ok).toBe(false)
    expect(checkPushEndpoint('http://127.0.0.1:8531/push/abc', { ...rules, standinOrigin: null }).ok).toBe(false)
  })
  it('refuses http, ports, user info, addresses and look-alike hosts', () => {
    for (const e of ['http://fcm.googleapis.com/x', 'https://fcm.googleapis.com:444/x', 'https://a:b@fcm.googleapis.com/x',
      'https://8.8.8.8/x', 'https://[2001:4860:4860::8888]/x', 'https://fcm.googleapis.com.evil.example/x',
      'https://notify.windows.com.evil.example/x', 'https://evilnotify.windows.com/x', 'javascript:alert(1)', '']) {
      expect(checkPushEndpoint(e, rules).ok, e).toBe(false)
    }
  })
  it('a wildcard entry means a sub-domain, not the bare suffix', () => {
    expect(hostAllowed('a.notify.windows.com', ['*.notify.windows.com'])).toBe(true)
    expect(hostAllowed('notify.windows.com', ['*.notify.windows.com'])).toBe(false)
    expect(hostAllowed('FCM.googleapis.com.', ['fcm.googleapis.com'])).toBe(true)
  })
  it('a failure keeps the status code and a short reason only', () => {
    expect(shortFailure(500, 'Internal Server Error')).toBe('the push service answered 500 Internal Server Error')
    expect(shortFailure(403, `x${'y'.repeat(500)}\n<html>`).length).toBeLessThan(80)
  })
})

describe('cross-site writes: the Origin verdict', () => {
  // Fetch standard: browsers send Origin on every non-GET/HEAD request and Sec-Fetch-Site (Fetch Metadata).
  const own = ['http://127.0.0.1:3131']
  it('same origin passes by Origin or by Sec-Fetch-Site', () => {
    expect(originVerdict({ origin: 'http://127.0.0.1:3131' }, own).ok).toBe(true)
    expect(originVerdict({ origin: 'HTTP://127.0.0.1:3131' }, own).ok).toBe(true)
    expect(originVerdict({ secFetchSite: 'same-origin' }, own).ok).toBe(true)
  })
  it('another origin, an opaque one, same-site and a bare request are refused', () => {
    expect(originVerdict({ origin: 'http://evil.example' }, own).ok).toBe(false)
    expect(originVerdict({ origin: 'http://127.0.0.1:3132' }, own).ok).toBe(false)
    expect(originVerdict({ origin: 'null' }, own).ok).toBe(false)
    expect(originVerdict({ origin: 'http://127.0.0.1:3131', secFetchSite: 'same-site' }, own).ok).toBe(false)
    expect(originVerdict({ secFetchSite: 'cross-site' }, own).ok).toBe(false)
    expect(originVerdict({}, own).ok).toBe(false)
  })
  it('origins are scheme, host and port (RFC 6454 §4)', () => {
    expect(originOf('http://127.0.0.1:3131/a/b?c')).toBe('http://127.0.0.1:3131')
    expect(originOf('https://Veerline.Example:443/')).toBe('https://veerline.example')
    expect(originOf('ftp://x')).toBeNull()
    expect(originOf('nonsense')).toBeNull()
  })
})

describe('bodies', () => {
  it('JSON depth counts arrays and objects, not brackets inside strings (RFC 8259 grammar)', () => {
    expect(jsonDepth('1')).toBe(0)
    expect(jsonDepth('{"a":[1,{"b":2}]}')).toBe(3)
    expect(jsonDepth('{"a":"[[[[{{{{"}')).toBe(1)
    expect(jsonDepth('["\\"[[["]')).toBe(1)
    expect(jsonDepth('['.repeat(1000), 64)).toBe(65)
  })
  it('strips one UTF-8 byte order mark (EF BB BF, Unicode §23.8) and nothing else', () => {
    expect(stripBom(Buffer.from('\uFEFF{"a":1}')).toString()).toBe('{"a":1}')
    expect(stripBom(Buffer.from('{"a":1}')).toString()).toBe('{"a":1}')
  })
  it('media types and per-route limits', () => {
    expect(mediaType('Application/JSON; charset=utf-8')).toBe('application/json')
    expect(isJsonType('application/merge-patch+json')).toBe(true)
    expect(isJsonType('text/plain')).toBe(false)
    expect(acceptedBodyTypes('/api/airfields/XVAL/profiles/import')).toEqual(['application/json', 'text/csv'])
    expect(acceptedBodyTypes('/api/tokens')).toEqual(['application/json'])
    expect(bodyLimitFor('/api/airfields/XVAL/profiles')).toBe(2 * 1024 * 1024)
    expect(bodyLimitFor('/api/users')).toBe(128 * 1024)
  })
})

describe('session limits', () => {
  const limits = sessionLimits({}, 7 * 24 * 3600)
  const t0 = Date.UTC(2026, 0, 1)
  const row = (seenAgoMs: number, endsInMs: number) => ({ lastSeenAt: new Date(t0 - seenAgoMs), expiresAt: new Date(t0 + endsInMs) })
  it('defaults: 12 h idle, 7 days absolute; settings override', () => {
    expect(limits).toEqual({ idleMs: 12 * 3600_000, absoluteMs: 7 * 24 * 3600_000 })
    expect(sessionLimits({ VEERLINE_SESSION_IDLE_MINUTES: '30' }, 3600).idleMs).toBe(30 * 60_000)
    expect(sessionLimits({ VEERLINE_SESSION_IDLE_MINUTES: 'soon' }, 3600).idleMs).toBe(12 * 3600_000)
  })
  it('holds inside both limits, touching at most once a minute; the cookie lives no longer than either limit', () => {
    expect(checkSession(row(30_000, 3600_000), { disabled: false }, t0, limits)).toEqual({ ok: true, touch: false, cookieMaxAgeS: 3600 })
    expect(checkSession(row(61_000, 30 * 3600_000), { disabled: false }, t0, limits)).toEqual({ ok: true, touch: true, cookieMaxAgeS: 12 * 3600 })
  })
  it('ends when idle, past the end, disabled or gone', () => {
    expect(checkSession(row(12 * 3600_000, 3600_000), { disabled: false }, t0, limits)).toMatchObject({ ok: false, reason: 'idle' })
    expect(checkSession(row(0, 0), { disabled: false }, t0, limits)).toMatchObject({ ok: false, reason: 'expired' })
    expect(checkSession(row(0, 3600_000), { disabled: true }, t0, limits)).toMatchObject({ ok: false, reason: 'disabled' })
    expect(checkSession(undefined, undefined, t0, limits)).toMatchObject({ ok: false, reason: 'ended' })
  })
})

describe('equal work at sign-in', () => {
  // Counting verifications, not timing them: every path verifies exactly one hash (OWASP Authentication Cheat Sheet,
  // "authentication responses should take the same time whether or not the user exists").
  const fakeHasher = () => {
    const verified: string[] = []
    return {
      verified,
      hasher: {
        hash: async (p: string) => `dummy:${p.length}`,
        verify: async (hash: string, password: string) => {
          verified.push(hash)
          return hash === `real:${password}`
        },
      },
    }
  }
  it('an unknown, a disabled and a password-less account each verify one (dummy) hash and fail', async () => {
    for (const user of [undefined, { passwordHash: 'real:pw', disabled: true }, { passwordHash: null, disabled: false }]) {
      const { verified, hasher } = fakeHasher()
      expect(await credentialsMatch(user, 'pw', hasher)).toBe(false)
      expect(verified).toHaveLength(1)
    }
  })
  it('a known account verifies its own hash once', async () => {
    const { verified, hasher } = fakeHasher()
    expect(await credentialsMatch({ passwordHash: 'real:pw', disabled: false }, 'pw', hasher)).toBe(true)
    expect(verified).toEqual(['real:pw'])
    expect(await credentialsMatch({ passwordHash: 'real:pw', disabled: false }, 'wrong', hasher)).toBe(false)
  })
})
