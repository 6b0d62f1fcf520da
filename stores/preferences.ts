import { defineStore } from 'pinia'

// The signed-in reader's display units, kept in the database (GET/PUT /api/preferences).
export const usePreferencesStore = defineStore('preferences', () => {
  const speedUnit = ref<SpeedUnit>(DEFAULT_PREFERENCES.speedUnit)
  const heightUnit = ref<HeightUnit>(DEFAULT_PREFERENCES.heightUnit)
  const headingRef = ref<HeadingRef>(DEFAULT_PREFERENCES.headingRef)
  const loaded = ref(false)
  const error = ref<string | null>(null)

  function apply(p: DisplayPreferences) {
    speedUnit.value = p.speedUnit
    heightUnit.value = p.heightUnit
    headingRef.value = p.headingRef
  }

  async function load() {
    if (loaded.value) return true
    const fetcher = useRequestFetch()
    const res = await fetcher<{ preferences: DisplayPreferences }>('/api/preferences')
    apply(res.preferences)
    loaded.value = true
    return true
  }

  async function save(change: Partial<DisplayPreferences>) {
    error.value = null
    try {
      const res = await $fetch<{ preferences: DisplayPreferences }>('/api/preferences', { method: 'PUT', body: change })
      apply(res.preferences)
    }
    catch (e) {
      const err = e as { data?: { statusMessage?: string }, message?: string }
      error.value = err.data?.statusMessage ?? err.message ?? 'The preferences could not be saved'
    }
  }

  return { speedUnit, heightUnit, headingRef, loaded, error, load, save }
})
