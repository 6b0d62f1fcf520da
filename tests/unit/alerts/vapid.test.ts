import { describe, expect, it } from 'vitest'
import webpush from 'web-push'
import { checkVapid } from '../../../scripts/standins/push'

// The stand-in's VAPID check (RFC 8292) against headers made by the web-push library (a general-purpose reference).
describe('push stand-in VAPID check', () => {
  const keys = webpush.generateVAPIDKeys()
  const audience = 'http://127.0.0.1:8443'
  const header = (aud = audience, k = keys) => webpush.getVapidHeaders(aud, 'mailto:alerts@veerline.example', k.publicKey, k.privateKey, 'aes128gcm').Authorization

  it('accepts a token signed by the key it names, for its own origin', () => {
    expect(checkVapid(header(), audience)).toMatchObject({ subject: 'mailto:alerts@veerline.example', audience, publicKey: keys.publicKey })
  })
  it('refuses another audience, a key that did not sign, and a missing header', () => {
    expect(() => checkVapid(header('http://127.0.0.1:9999'), audience)).toThrow(/audience/)
    const other = webpush.generateVAPIDKeys()
    const forged = header().replace(/k=.*$/, `k=${other.publicKey}`)
    expect(() => checkVapid(forged, audience)).toThrow(/signature/)
    expect(() => checkVapid(undefined, audience)).toThrow(/missing/)
  })
})
