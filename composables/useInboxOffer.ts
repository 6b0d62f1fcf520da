import type { Ref } from 'vue'

/**
 * How many of the reader's alerts of one airfield are not acknowledged yet, for the briefing's offer to acknowledge
 * them (components/briefing/BriefingInboxOffer.vue). The page loads the offer's code only once there is something to
 * offer; once shown, the offer stays (to say what was acknowledged).
 */
export async function useInboxOffer(code: Ref<string>) {
  const { data, refresh } = await useApi('/api/alerts/inbox', { query: computed(() => ({ airfield: code.value, unacknowledged: '1', pageSize: 1 })) })
  const total = computed(() => data.value?.total ?? 0)
  const shown = ref(false)
  watch(total, (n) => {
    if (n > 0) shown.value = true
  }, { immediate: true })
  return { total, shown, refresh }
}
