import type { LocationQueryRaw } from 'vue-router'

/**
 * The briefing page's state: the airfield, the runway end in use and the time of arrival or departure, both in the
 * URL (`?end=27&at=2026-12-02T14:00:00Z`) so that a briefing can be shared; the end is remembered per airfield and
 * user (a cookie, so the server renders the same end); the briefing itself at that time.
 */
export async function useBriefingPage() {
  const route = useRoute()
  const router = useRouter()
  const code = computed(() => String(route.params.code).toUpperCase())
  const { user } = useUserSession()
  const { remembered, remember } = useRememberedEnd(user.value?.id ?? 0, code.value)

  const at = computed(() => (typeof route.query.at === 'string' && route.query.at ? route.query.at : null))
  const asked = computed(() => (typeof route.query.end === 'string' && route.query.end ? route.query.end.toUpperCase() : null))
  // The answer details only the end the page shows (the others come as their ranking and verdict): before the
  // first answer that is the end asked or remembered (the server falls back to the best-ranked), then the one chosen.
  const endParam = ref<string>(asked.value ?? remembered.value ?? 'best')
  const query = computed(() => ({
    ...(at.value ? { at: at.value } : {}),
    ...(route.query.profile ? { profile: String(route.query.profile) } : {}),
    end: endParam.value,
  }))
  const { data, error, refresh } = await useApi(() => `/api/airfields/${code.value}/briefing`, { query, key: `briefing-${code.value}` })
  const b = computed(() => data.value?.briefing ?? null)
  // Every end of the airfield in the engine's order (the verdict lists them all; runwayEnds holds the detailed one).
  const designators = computed(() => b.value?.verdict.ends.map(e => e.designator) ?? [])

  /** The end briefed first: the URL's, else the remembered one, else the best-ranked. */
  const endDesignator = computed(() => {
    if (asked.value && designators.value.includes(asked.value)) return asked.value
    if (remembered.value && designators.value.includes(remembered.value)) return remembered.value
    return b.value?.ranking[0]?.designator ?? designators.value[0] ?? null
  })
  // While the answer for a newly chosen end is on its way, the card keeps the end it has (it names its end).
  const end = computed(() => b.value?.runwayEnds.find(e => e.designator === endDesignator.value) ?? b.value?.runwayEnds[0] ?? null)
  // Ask again only when the answer lacks the detail of the end to show (a new choice, or an end asked that the
  // airfield lacks while a remembered one exists), never for the end it already details.
  watch(endDesignator, (d) => {
    if (d && b.value && !b.value.runwayEnds.some(e => e.designator === d)) endParam.value = d
  }, { immediate: true })
  const verdict = computed(() => b.value?.verdict.ends.find(v => v.designator === end.value?.designator) ?? null)
  const change = computed(() => b.value?.change?.ends.find(e => e.designator === end.value?.designator) ?? null)

  const replaceQuery = (q: LocationQueryRaw) => router.replace({ query: { ...route.query, ...q } })
  function chooseEnd(designator: string) {
    remember(designator)
    return replaceQuery({ end: designator })
  }
  /** `iso` null: now (the default). */
  function chooseTime(iso: string | null) {
    return replaceQuery({ at: iso ?? undefined })
  }

  return { code, at, data, error, refresh, b, designators, endDesignator, end, verdict, change, chooseEnd, chooseTime }
}
