import type { LocationQuery } from 'vue-router'
import { AIRFIELD_PAGE_SIZE } from '#shared/utils/page-sizes'

// The airfield and briefing lists one page at a time: the search (code or name), "only those I follow" and the page
// live in the URL, so a list can be shared, reloaded and gone back to; the server answers that page and the total.
export type AirfieldListFilters = { q: string, followed: boolean, page: number }

export function airfieldListFiltersOf(q: LocationQuery): AirfieldListFilters {
  const one = (v: unknown) => (Array.isArray(v) ? v[0] : v) as string | undefined
  const page = Math.max(1, Number.parseInt(one(q.page) ?? '1', 10) || 1)
  return { q: (one(q.q) ?? '').trim().slice(0, 60), followed: one(q.followed) === '1', page }
}

export function useAirfieldListPage() {
  const route = useRoute()
  const router = useRouter()
  const filters = computed(() => airfieldListFiltersOf(route.query))
  /** What the API is asked: only what is set, and the page size the list shows. */
  const query = computed(() => ({
    ...(filters.value.q ? { q: filters.value.q } : {}),
    ...(filters.value.followed ? { followed: '1' } : {}),
    page: filters.value.page, pageSize: AIRFIELD_PAGE_SIZE,
  }))
  const pagesOf = (total: number | undefined) => Math.max(1, Math.ceil((total ?? 0) / AIRFIELD_PAGE_SIZE))
  /** A new search or filter starts at page 1; a page move keeps the search. */
  function setFilter(next: Partial<AirfieldListFilters>) {
    const f = { ...filters.value, page: 1, ...next }
    return router.replace({ query: {
      ...(f.q ? { q: f.q } : {}), ...(f.followed ? { followed: '1' } : {}), ...(f.page > 1 ? { page: String(f.page) } : {}),
    } })
  }
  const rangeWords = (shown: number, total: number | undefined, noun: string) => listRangeWords(filters.value.page, AIRFIELD_PAGE_SIZE, shown, total ?? 0, noun)
  return { filters, query, pagesOf, rangeWords, setFilter }
}
