import type { LocationQuery } from 'vue-router'

// The alerts inbox as a worklist: filters in the URL (airfield, kind, unacknowledged, page), the server's page grouped
// by airfield and profile version (newest first, as the server orders), and acknowledging one, a group or an airfield.
export interface InboxItem {
  id: number
  event: 'raised' | 'cleared'
  title: string
  acknowledgedAt: string | null
  createdAt: string
  alert: { id: number, designator: string | null, kind: string, message: string, clearReason: string | null, state: string, profileId: number }
  airfieldCode: string
  airfieldName: string
  validFrom: string
  validTo: string
}
export interface InboxGroup { key: string, airfieldCode: string, airfieldName: string, profileId: number, validFrom: string, validTo: string, items: InboxItem[] }

export const INBOX_PAGE_SIZE = 25

export function inboxQueryOf(q: LocationQuery) {
  const one = (v: unknown) => (Array.isArray(v) ? v[0] : v) as string | undefined
  const page = Math.max(1, Number.parseInt(one(q.page) ?? '1', 10) || 1)
  return { airfield: one(q.airfield) || '', kind: one(q.kind) || '', unacknowledged: one(q.unacknowledged) === '1', page }
}

/** Consecutive items of one airfield and profile version form a group (the server answers newest first). */
export function groupInbox(items: InboxItem[]): InboxGroup[] {
  const groups: InboxGroup[] = []
  for (const item of items) {
    const key = `${item.airfieldCode}#${item.alert.profileId}`
    const last = groups[groups.length - 1]
    if (last && last.key === key) last.items.push(item)
    else groups.push({ key, airfieldCode: item.airfieldCode, airfieldName: item.airfieldName, profileId: item.alert.profileId, validFrom: item.validFrom, validTo: item.validTo, items: [item] })
  }
  return groups
}

export async function useInbox() {
  const route = useRoute()
  const router = useRouter()
  const { $api } = useNuxtApp()
  const filters = computed(() => inboxQueryOf(route.query))
  const query = computed(() => ({
    ...(filters.value.airfield ? { airfield: filters.value.airfield } : {}),
    ...(filters.value.kind ? { kind: filters.value.kind } : {}),
    ...(filters.value.unacknowledged ? { unacknowledged: '1' } : {}),
    page: filters.value.page, pageSize: INBOX_PAGE_SIZE,
  }))
  // Every composable before the await: after it, a plain async function has lost the Nuxt context.
  const count = useNuxtData('alerts-count')
  const { data, refresh, error } = await useApi('/api/alerts/inbox', { query })
  const failure = ref('')
  const notice = ref('')
  const groups = computed(() => groupInbox((data.value?.items ?? []) as unknown as InboxItem[]))
  const pages = computed(() => Math.max(1, Math.ceil((data.value?.total ?? 0) / INBOX_PAGE_SIZE)))

  function setFilter(next: Partial<ReturnType<typeof inboxQueryOf>>) {
    const f = { ...filters.value, page: 1, ...next }
    return router.replace({ query: {
      ...(f.airfield ? { airfield: f.airfield } : {}), ...(f.kind ? { kind: f.kind } : {}),
      ...(f.unacknowledged ? { unacknowledged: '1' } : {}), ...(f.page > 1 ? { page: String(f.page) } : {}),
    } })
  }
  async function settle(answer: { unacknowledged: number }, words: string) {
    notice.value = words
    await refresh()
    if (count.data.value) count.data.value = { unacknowledged: answer.unacknowledged }
  }
  async function acknowledgeOne(id: number) {
    failure.value = ''
    try {
      await $api(`/api/alerts/inbox/${id}/acknowledge`, { method: 'POST' })
      await refresh()
      if (count.data.value) count.data.value = { unacknowledged: data.value?.unacknowledged ?? 0 }
    }
    catch (err) {
      failure.value = fetchFailure(err, 'Not acknowledged').message
    }
  }
  async function acknowledgeMany(body: { ids: number[] } | { airfieldCode: string }, what: string) {
    failure.value = ''
    try {
      const answer = await $api('/api/alerts/inbox/acknowledge', { method: 'POST', body })
      await settle(answer, `${answer.acknowledged} ${answer.acknowledged === 1 ? 'alert' : 'alerts'} of ${what} acknowledged.`)
    }
    catch (err) {
      failure.value = fetchFailure(err, 'Nothing was acknowledged').message
    }
  }
  return { data, error, refresh, filters, groups, pages, failure, notice, setFilter, acknowledgeOne, acknowledgeMany }
}
