import { describe, expect, it } from 'vitest'
import { ApiClient, DEMO, LOCKOUT_TEST_ADDRESS, signedIn } from '../support/api'

describe('sign-in and sessions', () => {
  it('signs in with the right password and reports the user and role', async () => {
    const client = new ApiClient()
    const res = await client.signIn(DEMO.pilot)
    expect(res.body.user).toMatchObject({ email: DEMO.pilot, role: 'pilot' })
    const me = await client.get('/api/session')
    expect(me.status).toBe(200)
    expect(me.body.user.role).toBe('pilot')
  })

  it('refuses a wrong password and an unknown e-mail with the same generic message', async () => {
    const wrong = await new ApiClient().post('/api/session', { email: DEMO.pilot, password: 'not-the-password' })
    const unknown = await new ApiClient().post('/api/session', { email: 'nobody@veerline.example', password: 'whatever-it-is' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.statusMessage).toBe(unknown.body.statusMessage)
  })

  it('signs out: the session no longer works', async () => {
    const client = await signedIn('dispatcher')
    expect((await client.delete('/api/session')).status).toBe(204)
    expect((await client.get('/api/session')).status).toBe(401)
  })

  it('answers 401 signed out and 403 for a role that may not, before validating anything', async () => {
    const anonymous = new ApiClient()
    expect((await anonymous.get('/api/users')).status).toBe(401)
    expect((await anonymous.post('/api/users', { nonsense: true })).status).toBe(401)
    const pilot = await signedIn('pilot')
    const denied = await pilot.post('/api/users', { nonsense: true })
    expect(denied.status).toBe(403)
    expect(denied.body.statusMessage).toMatch(/admin/)
  })

  it('locks out after 5 failures for one e-mail within 15 minutes with 429 and the time to wait', async () => {
    const admin = await signedIn('admin')
    const email = `lockout-${Date.now()}@veerline.example`
    const created = await admin.post('/api/users', { email, name: 'Lockout Probe', role: 'pilot', password: 'correct-horse-1' })
    expect(created.status).toBe(201)
    for (let i = 0; i < 5; i++) {
      // a fresh client address each time: the e-mail counter alone must trigger the lockout
      const res = await new ApiClient().post('/api/session', { email, password: `wrong-${i}` })
      expect(res.status).toBe(401)
    }
    const locked = await new ApiClient().post('/api/session', { email, password: 'correct-horse-1' })
    expect(locked.status).toBe(429)
    expect(Number(locked.headers.get('retry-after'))).toBeGreaterThan(800)
    expect(locked.body.statusMessage).toMatch(/Try again in 1[45] minutes/)
  })

  it('locks out one client address after 5 failures, whatever the e-mails', async () => {
    const client = new ApiClient(undefined, LOCKOUT_TEST_ADDRESS)
    for (let i = 0; i < 5; i++) {
      expect((await client.post('/api/session', { email: `ghost${i}@veerline.example`, password: 'x' })).status).toBe(401)
    }
    const locked = await client.post('/api/session', { email: DEMO.pilot, password: 'veerline-demo' })
    expect(locked.status).toBe(429)
  })

  it('a disabled user cannot sign in and an open session stops working', async () => {
    const admin = await signedIn('admin')
    const email = `disable-${Date.now()}@veerline.example`
    const created = await admin.post('/api/users', { email, name: 'Disable Probe', role: 'dispatcher', password: 'correct-horse-2' })
    const user = new ApiClient()
    await user.signIn(email, 'correct-horse-2')
    expect((await user.get('/api/session')).status).toBe(200)

    const off = await admin.patch(`/api/users/${created.body.user.id}`, { disabled: true })
    expect(off.status).toBe(200)
    expect((await user.get('/api/session')).status).toBe(401)
    const again = await new ApiClient().post('/api/session', { email, password: 'correct-horse-2' })
    expect(again.status).toBe(401)
  })

  it('admin changes a role: the open session ends on its next request and the next sign-in has the new role', async () => {
    const admin = await signedIn('admin')
    const email = `role-${Date.now()}@veerline.example`
    const created = await admin.post('/api/users', { email, name: 'Role Probe', role: 'pilot', password: 'correct-horse-3' })
    const user = new ApiClient()
    await user.signIn(email, 'correct-horse-3')
    await admin.patch(`/api/users/${created.body.user.id}`, { role: 'safety' })
    expect((await user.get('/api/session')).status).toBe(401)
    await user.signIn(email, 'correct-horse-3')
    expect((await user.get('/api/session')).body.user.role).toBe('safety')
  })

  it('rejects a bad new user with field messages and a duplicate e-mail with 409', async () => {
    const admin = await signedIn('admin')
    const bad = await admin.post('/api/users', { email: 'not-an-email', name: '', role: 'captain', password: 'short' })
    expect(bad.status).toBe(422)
    const fields = bad.body.data.issues.map((i: { field: string }) => i.field).sort()
    expect(fields).toEqual(['email', 'name', 'password', 'role'])
    const dup = await admin.post('/api/users', { email: DEMO.pilot, name: 'Dup', role: 'pilot', password: 'long-enough-pass' })
    expect(dup.status).toBe(409)
  })
})
