import { afterEach, describe, expect, it } from 'vitest'
import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { setResponseStatus } from 'h3'
import type { RoleName } from '#shared/utils/roles'

// The app's API client and the page guard, in the Nuxt environment with its router, plugins and middleware.
// Endpoints are stand-ins registered here; the shapes follow the API's error contract (README, "API").
let unregister: (() => void)[] = []
afterEach(() => {
  for (const off of unregister) off()
  unregister = []
})
function endpoint(...args: Parameters<typeof registerEndpoint>) {
  unregister.push(registerEndpoint(...args))
}

async function signedInAs(role: RoleName | null) {
  endpoint('/api/_auth/session', () => (role ? { user: { id: 7, email: `${role}@veerline.example`, name: 'Test person', role }, loggedInAt: 0 } : {}))
  await useUserSession().fetch()
}

const here = () => useRouter().currentRoute.value.fullPath

describe('page guard (definePageMeta({ can }))', () => {
  it('sends a signed-out visitor to sign-in with the way back', async () => {
    await signedInAs(null)
    await navigateTo('/audit')
    expect(here()).toBe('/sign-in?next=/audit')
  })

  it('sends a role without the capability to its own home page (pilot: /briefings)', async () => {
    endpoint('/api/briefings', () => ({ briefings: [] }))
    await signedInAs('pilot')
    await navigateTo('/audit')
    expect(here()).toBe('/briefings')
  })
})

describe('$api', () => {
  it('turns a refusal into { message, issues } with the field paths as sent', async () => {
    endpoint('/api/test-refusal', (event) => {
      setResponseStatus(event, 422)
      return { statusCode: 422, statusMessage: 'The levels are not valid', data: { issues: [{ field: 'levels[1].directionDeg', message: 'Direction is required', index: 1 }] } }
    })
    const err = await useNuxtApp().$api('/api/test-refusal').catch(e => e)
    expect(err).toBeInstanceOf(ApiError)
    expect(err).toMatchObject({ status: 422, message: 'The levels are not valid', issues: [{ field: 'levels[1].directionDeg', message: 'Direction is required', index: 1 }] })
  })

  it('on a 401 takes the caller to sign-in, to come back to the page afterwards', async () => {
    endpoint('/api/tokens', () => ({ tokens: [] }))
    await signedInAs('dispatcher')
    await navigateTo('/tokens?sort=name')
    expect(here()).toBe('/tokens?sort=name')
    // The session ends on the server: the next call is refused and the session check says signed out.
    await signedInAs(null)
    endpoint('/api/test-expired', (event) => {
      setResponseStatus(event, 401)
      return { statusCode: 401, statusMessage: 'Server Error' }
    })
    const err = await useNuxtApp().$api('/api/test-expired').catch(e => e)
    expect(err).toMatchObject({ status: 401, message: 'You are signed out: sign in again' })
    expect(useRouter().currentRoute.value.path).toBe('/sign-in')
    expect(useRouter().currentRoute.value.query.next).toBe('/tokens?sort=name')
  })

  it('leaves a 401 on a public page to the page (a wrong password on the sign-in form)', async () => {
    await signedInAs(null)
    await navigateTo('/sign-in')
    endpoint('/api/test-wrong-password', (event) => {
      setResponseStatus(event, 401)
      return { statusCode: 401, statusMessage: 'Wrong e-mail or password' }
    })
    const err = await useNuxtApp().$api('/api/test-wrong-password', { method: 'POST' }).catch(e => e)
    expect(err).toMatchObject({ status: 401, message: 'Wrong e-mail or password' })
    expect(here()).toBe('/sign-in')
  })
})
