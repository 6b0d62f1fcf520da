const YEAR_S = 365 * 86400

/**
 * The runway end a reader last chose at an airfield, per user and airfield: a cookie, so that the server renders the
 * same end. Read from the request on the server and from `document.cookie` in the browser, written when the reader
 * chooses. (Nuxt's useCookie would bring its serializer, a deep clone and tab syncing, about 2 KB gzip, into the
 * briefing page's first load for this one short text.)
 */
export function useRememberedEnd(userId: number, code: string) {
  const name = `vl-end-${userId}-${code}`
  const header = import.meta.server ? useRequestHeader('cookie') : document.cookie
  const remembered = ref<string | null>(cookieValue(header, name))
  function remember(designator: string) {
    remembered.value = designator
    document.cookie = cookieAssignment(name, designator, YEAR_S)
  }
  return { remembered: readonly(remembered), remember }
}
