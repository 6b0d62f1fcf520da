// The app's API client, `$api`: the one way pages, components and stores call the server (through `useApi` for
// reads, `$api` in actions). A failed call throws an ApiError `{ status, message, issues }` (utils/api-error.ts);
// a 401 outside the public pages sends the caller to sign-in with the way back (`?next=`, a same-site path).
export default defineNuxtPlugin({
  name: 'veerline-api',
  setup(nuxtApp) {
    // During server rendering the call goes straight to Nitro: pass on who the visitor is.
    const forwarded = import.meta.server ? useRequestHeaders(['cookie', 'x-forwarded-for', 'user-agent']) : {}

    async function toSignIn() {
      const route = useRouter().currentRoute.value
      if (route.meta.public) return
      const session = useUserSession()
      await session.fetch()
      await navigateTo(signInPathFor(route.fullPath))
    }

    const api = $fetch.create({
      onRequest({ options }) {
        for (const [name, value] of Object.entries(forwarded)) {
          if (value && !options.headers.has(name)) options.headers.set(name, value)
        }
      },
      onRequestError({ error }) {
        if (error.name === 'AbortError') return
        throw new ApiError(0, statusWords(0))
      },
      async onResponseError({ response }) {
        const failure = apiErrorFromResponse(response.status, response._data, response.headers.get('retry-after'))
        if (response.status === 401) await nuxtApp.runWithContext(toSignIn)
        throw failure
      },
    })
    return { provide: { api } }
  },
})
