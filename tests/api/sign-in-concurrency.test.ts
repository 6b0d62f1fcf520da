// The sign-in lockout holds when the attempts come at the same moment (through any instance or database node):
// README "Sessions and users" sets the rule, 5 failures for one e-mail within 15 minutes, then 429 with
// Retry-After (RFC 6585 §4: 429 Too Many Requests may carry Retry-After). Checking and counting an attempt is one
// transaction on the e-mail's turn row, so parallel attempts cannot all pass the check before any is counted.
import { describe, expect, it } from 'vitest'
import { ApiClient } from '../support/api'

describe('sign-in lockout under parallel attempts', () => {
  it('12 wrong passwords for one e-mail at once: exactly 5 are checked (401), the other 7 are refused (429)', async () => {
    const email = `parallel-${Date.now()}-${Math.floor(Math.random() * 1e6)}@veerline.example`
    // Each from its own address (random in 198.18.0.0/15, see tests/support/api.ts), so only the e-mail's count can lock them out.
    const answers = await Promise.all(Array.from({ length: 12 }, () =>
      new ApiClient().post('/api/session', { email, password: 'not-the-password' })))
    const statuses = answers.map(a => a.status)
    expect(statuses.filter(s => s === 401)).toHaveLength(5)
    expect(statuses.filter(s => s === 429)).toHaveLength(7)
    for (const a of answers.filter(x => x.status === 429)) expect(Number(a.headers.get('retry-after'))).toBeGreaterThan(0)
  })
})
