import { watchDebounced } from '@vueuse/core'
import type { PreviewAnalysis } from '~/types/briefing'

type LevelDraft = Record<string, number | undefined>

/**
 * The body of a preview request for the levels being typed, or null while they cannot be analysed yet
 * (fewer than two levels, or a level without its height, direction and speed).
 */
export function previewRequestOf(code: string, heightReference: 'AGL' | 'MSL' | undefined, drafts: LevelDraft[] | undefined,
  pressures: { qnhHpa?: number, surfacePressureHpa?: number } = {}) {
  const levels = (drafts ?? []).map(l => Object.fromEntries(Object.entries(l).filter(([, v]) => v !== undefined && Number.isFinite(v))) as Record<string, number>)
  if (levels.length < 2 || levels.some(l => Object.keys(l).filter(k => k !== 'temperatureC').length < 3)) return null
  const given = Object.fromEntries(Object.entries(pressures).filter(([, v]) => typeof v === 'number' && Number.isFinite(v)))
  return { airfield: code, heightReference: heightReference ?? 'AGL', levels, ...given }
}

/**
 * Live preview of a profile being entered: the server runs the engine (POST /api/wind/preview) once the typing
 * settles for `debounceMs`; nothing is saved.
 */
export function useProfilePreview(code: string, source: () => { heightReference?: 'AGL' | 'MSL', levels?: LevelDraft[], qnhHpa?: number, surfacePressureHpa?: number }, options: { debounceMs?: number } = {}) {
  const { $api } = useNuxtApp()
  const analysis = ref<PreviewAnalysis | null>(null)
  const failure = ref('')
  const busy = ref(false)
  const request = computed(() => {
    const s = source()
    return previewRequestOf(code, s.heightReference, s.levels, { qnhHpa: s.qnhHpa, surfacePressureHpa: s.surfacePressureHpa })
  })

  async function run() {
    const body = request.value
    if (!body) return
    busy.value = true
    try {
      analysis.value = (await $api('/api/wind/preview', { method: 'POST', body })).analysis
      failure.value = ''
    }
    catch (err) {
      failure.value = fetchFailure(err, 'No preview').message
    }
    finally {
      busy.value = false
    }
  }

  // Only the request's content matters: compare it as text so unrelated reactivity does not ask again.
  watchDebounced(() => JSON.stringify(request.value), run, { debounce: options.debounceMs ?? 400, immediate: true })
  return { analysis, failure, busy, request, run }
}
