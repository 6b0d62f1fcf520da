// While the database is out of reach a page answers 503 with Retry-After (as the API does), so that a load balancer
// or a browser knows to come back, rather than 200 with an empty page or a redirect to sign-in.
import { setResponseHeader, setResponseStatus } from 'h3'

const OUTAGE_MESSAGE = 'The database is not answering just now; try again in 5 seconds'

export default defineNuxtPlugin({
  name: 'database-outage',
  // After nuxt-auth-utils has read the session: it reads "no session" when the session route failed.
  dependsOn: ['session-fetch-plugin'],
  async setup(nuxtApp) {
    const event = useRequestEvent()
    const { loggedIn } = useUserSession()
    if (event && !loggedIn.value && /(?:^|;\s*)nuxt-session=[^;]/.test(event.headers.get('cookie') ?? '')) {
      // A session cookie but no session: ended, or the database did not answer. Only the second is a 503.
      const status = await useRequestFetch()('/api/_auth/session', { retry: false, headers: { accept: 'application/json' } })
        .then(() => 200, (err: { statusCode?: number, response?: { status?: number } }) => err?.statusCode ?? err?.response?.status ?? 0)
      if (status === 503) throw createError({ statusCode: 503, statusMessage: OUTAGE_MESSAGE, fatal: true })
    }
    nuxtApp.hook('app:rendered', ({ ssrContext }) => {
      const e = ssrContext?.event
      if (!e) return
      const errors = Object.values(nuxtApp.payload._errors ?? {}) as ({ statusCode?: number } | null | undefined)[]
      const pageError = nuxtApp.payload.error as { statusCode?: number } | null | undefined
      if (!errors.some(x => x?.statusCode === 503) && pageError?.statusCode !== 503) return
      setResponseStatus(e, 503, OUTAGE_MESSAGE)
      setResponseHeader(e, 'retry-after', 5)
    })
  },
})
