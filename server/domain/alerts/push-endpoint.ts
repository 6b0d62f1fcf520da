// Which push endpoints Veerline will send to. A push subscription names a URL the server later POSTs to, so it is
// held to: https, the default port, a host on the allow-list of push services (VEERLINE_PUSH_HOSTS), and at send
// time every address the host resolves to must be a public one (no loopback, private, link-local or metadata
// address), with the connection made to the address that was checked. The local push stand-in (plain http on
// loopback) is allowed only where the stand-ins run, i.e. outside production.
import { isIP } from 'node:net'

/**
 * The hosted push services of the common browsers (their subscription endpoints, as the browsers hand them out):
 * Chrome and other Chromium browsers (Firebase Cloud Messaging), Firefox (Mozilla autopush), Safari (Apple), Edge
 * (Windows Push Notification Services). `*.` allows any sub-domain.
 */
export const DEFAULT_PUSH_HOSTS = [
  'fcm.googleapis.com',
  'android.googleapis.com',
  'updates.push.services.mozilla.com',
  'web.push.apple.com',
  '*.push.apple.com',
  '*.notify.windows.com',
] as const

export function pushHostAllowList(env: Record<string, string | undefined> = process.env): string[] {
  const raw = env.VEERLINE_PUSH_HOSTS?.trim()
  if (!raw) return [...DEFAULT_PUSH_HOSTS]
  return raw.split(',').map(h => h.trim().toLowerCase()).filter(Boolean)
}

export function hostAllowed(host: string, allowList: string[]): boolean {
  const h = host.toLowerCase().replace(/\.$/, '')
  return allowList.some(entry => entry.startsWith('*.') ? h.endsWith(entry.slice(1)) && h.length > entry.length - 1 : h === entry)
}

export type EndpointRules = { allowList: string[], standinOrigin: string | null }

export type EndpointVerdict
  = | { ok: true, url: URL, standin: boolean }
    | { ok: false, message: string }

/** Whether an endpoint may be stored and sent to (before any name resolution). */
export function checkPushEndpoint(endpoint: string, rules: EndpointRules): EndpointVerdict {
  let url: URL
  try {
    url = new URL(endpoint)
  }
  catch {
    return { ok: false, message: 'endpoint must be a URL' }
  }
  if (url.username || url.password) return { ok: false, message: 'endpoint must not carry a user name or password' }
  if (rules.standinOrigin && url.origin === rules.standinOrigin && url.pathname.startsWith('/push/')) return { ok: true, url, standin: true }
  if (url.protocol !== 'https:') return { ok: false, message: 'endpoint must be an https: URL of a push service' }
  if (url.port !== '') return { ok: false, message: 'endpoint must use the default https port' }
  const host = url.hostname.replace(/^\[|\]$/g, '')
  if (isIP(host)) return { ok: false, message: 'endpoint must name a push service by its host name, not an address' }
  if (!hostAllowed(host, rules.allowList)) {
    return { ok: false, message: `endpoint host ${host} is not one of the allowed push services (${rules.allowList.join(', ')})` }
  }
  return { ok: true, url, standin: false }
}

function ipv4Parts(address: string): number[] | null {
  const parts = address.split('.').map(Number)
  return parts.length === 4 && parts.every(p => Number.isInteger(p) && p >= 0 && p <= 255) ? parts : null
}

/**
 * Why an address may not be sent to, or null when it is a public unicast address. Ranges: RFC 1122 (0/8, 127/8),
 * RFC 1918 (10/8, 172.16/12, 192.168/16), RFC 6598 (100.64/10), RFC 3927 (169.254/16, where cloud metadata services
 * answer), RFC 5736 / 6890 (192.0.0/24), RFC 5737 (documentation), RFC 2544 (198.18/15), 224/4 multicast, 240/4
 * reserved; IPv6: ::1, ::, fc00::/7 (RFC 4193), fe80::/10, ff00::/8, IPv4-mapped and NAT64 forms of the above.
 */
export function nonPublicReason(address: string): string | null {
  const family = isIP(address)
  if (family === 4) {
    const [a, b, c] = ipv4Parts(address)!
    if (a === 0) return 'an unspecified address'
    if (a === 127) return 'a loopback address'
    if (a === 10 || (a === 172 && b! >= 16 && b! <= 31) || (a === 192 && b === 168)) return 'a private address'
    if (a === 100 && b! >= 64 && b! <= 127) return 'a shared (carrier-grade NAT) address'
    if (a === 169 && b === 254) return 'a link-local or metadata address'
    if (a === 192 && b === 0 && (c === 0 || c === 2)) return 'a reserved address'
    if ((a === 198 && (b === 18 || b === 19)) || (a === 198 && b === 51 && c === 100) || (a === 203 && b === 0 && c === 113)) return 'a reserved address'
    if (a! >= 224) return 'a multicast or reserved address'
    return null
  }
  if (family === 6) {
    const v6 = address.toLowerCase()
    if (v6 === '::1') return 'a loopback address'
    if (v6 === '::') return 'an unspecified address'
    const mapped = /^(?:::ffff:|64:ff9b::)(\d+\.\d+\.\d+\.\d+)$/.exec(v6)
    if (mapped) return nonPublicReason(mapped[1]!)
    if (/^::ffff:[0-9a-f]{1,4}:[0-9a-f]{1,4}$/.test(v6)) {
      const [hi, lo] = v6.slice(7).split(':').map(h => Number.parseInt(h, 16))
      return nonPublicReason(`${hi! >> 8}.${hi! & 255}.${lo! >> 8}.${lo! & 255}`)
    }
    const first = Number.parseInt(v6.split(':')[0] || '0', 16)
    if ((first & 0xFE00) === 0xFC00) return 'a private (unique local) address'
    if ((first & 0xFFC0) === 0xFE80) return 'a link-local address'
    if ((first & 0xFF00) === 0xFF00) return 'a multicast address'
    return null
  }
  return 'not an IP address'
}

/** A failed send's record: the status code and a short reason of our own words, never the reply's body. */
export function shortFailure(status: number, statusText: string | undefined): string {
  const reason = (statusText ?? '').replace(/[^\x20-\x7E]/g, '').slice(0, 40).trim()
  return `the push service answered ${status}${reason ? ` ${reason}` : ''}`
}
