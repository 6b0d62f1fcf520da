import type { Ref } from 'vue'

export type LiveState = 'connecting' | 'live' | 'reconnecting' | 'stopped'

const KIND_WORDS: Record<string, string> = {
  filed: 'a new profile was filed',
  superseded: 'a profile was superseded',
  withdrawn: 'a profile was withdrawn',
  profile: 'a profile changed',
  limits: 'the limits or the runway data changed',
}

/** "a new profile was filed and a profile was superseded" from the stream's change kinds. */
export function changeWords(kinds: string[]): string {
  const words = kinds.map(k => KIND_WORDS[k] ?? 'something changed')
  return words.length > 1 ? `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}` : (words[0] ?? 'something changed')
}

/**
 * An open briefing follows its airfield (GET /api/airfields/{code}/events, Server-Sent Events): on a change it reads
 * the briefing again and says when and why; the header's alert count follows too. The browser's EventSource
 * reconnects by itself (the server ends each stream after a while, so the session is checked again).
 */
export function useBriefingLive(code: Ref<string>, onChange: () => Promise<unknown>) {
  const state = ref<LiveState>('connecting')
  const updatedAt = ref<string | null>(null)
  const updatedWhat = ref<string | null>(null)
  const alerts = useNuxtData<{ unacknowledged: number }>('alerts-count')
  let source: EventSource | null = null

  const readAlerts = (e: MessageEvent) => {
    const n = Number(JSON.parse(e.data).alerts)
    if (Number.isFinite(n)) alerts.data.value = { unacknowledged: n }
  }
  function open() {
    source?.close()
    state.value = 'connecting'
    const s = new EventSource(`/api/airfields/${encodeURIComponent(code.value)}/events`)
    source = s
    s.addEventListener('hello', (e) => {
      state.value = 'live'
      readAlerts(e as MessageEvent)
    })
    s.addEventListener('change', async (e) => {
      const d = JSON.parse((e as MessageEvent).data) as { at: string, kinds?: string[] }
      await onChange()
      updatedAt.value = d.at
      updatedWhat.value = changeWords(d.kinds ?? [])
      readAlerts(e as MessageEvent)
    })
    s.addEventListener('alerts', e => readAlerts(e as MessageEvent))
    s.onerror = () => {
      state.value = s.readyState === EventSource.CLOSED ? 'stopped' : 'reconnecting'
    }
  }
  onMounted(open)
  watch(code, open)
  onBeforeUnmount(() => source?.close())
  return { state, updatedAt, updatedWhat, reconnect: open }
}
