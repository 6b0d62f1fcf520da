import { defineStore } from 'pinia'

// The signed-in reader's display units, kept in the database (GET/PUT /api/preferences).
export const usePreferencesStore = defineStore('preferences', () => {
  // Taken when the store is first used (inside a component or plugin), so each server render uses its own visitor's.
  const { $api } = useNuxtApp()
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
    const res = await $api('/api/preferences')
    apply(res.preferences)
    loaded.value = true
    return true
  }

  async function save(change: Partial<DisplayPreferences>) {
    error.value = null
    try {
      const res = await $api('/api/preferences', { method: 'PUT', body: change })
      apply(res.preferences)
    }
    catch (err) {
      error.value = fetchFailure(err, 'The preferences could not be saved').message
    }
  }

  return { speedUnit, heightUnit, headingRef, loaded, error, load, save }
})
