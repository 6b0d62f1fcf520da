import type { LimitFieldKey } from '~/utils/limit-form'
import type { LimitEffectItem } from '~~/shared/limits'

export type { LimitEffectItem }

// A limit change in two steps: first a dry run (`?dryRun=1`, nothing saved) that answers which alerts it would raise
// and clear; then the save, which for a lowered limit needs the explicit confirmation of that list.
export interface LimitChangeAnswer {
  dryRun: boolean
  effectiveBefore: Record<LimitFieldKey, number>
  effectiveAfter: Record<LimitFieldKey, number>
  effect: { raised: LimitEffectItem[], cleared: LimitEffectItem[] }
  lowered: LimitFieldKey[]
}
export interface LimitChangeBody { values: Record<string, number | null>, reason: string, designator?: string }

/** "2 alerts raised, 1 cleared", "no alert raised or cleared". */
export function effectWords(effect: LimitChangeAnswer['effect']): string {
  const r = effect.raised.length
  const c = effect.cleared.length
  if (!r && !c) return 'no alert raised or cleared'
  const parts = [r ? `${r} ${r === 1 ? 'alert' : 'alerts'} raised` : '', c ? `${c} cleared` : ''].filter(Boolean)
  return r ? parts.join(', ') : `${c} ${c === 1 ? 'alert' : 'alerts'} cleared`
}

export function useLimitChange(url: () => string) {
  const { $api } = useNuxtApp()
  const review = ref<{ body: LimitChangeBody, answer: LimitChangeAnswer } | null>(null)
  const saved = ref<LimitChangeAnswer | null>(null)
  const failure = ref('')
  const busy = ref(false)

  async function put(body: LimitChangeBody, dryRun: boolean) {
    return await $api(url(), { method: 'PUT', body, query: dryRun ? { dryRun: '1' } : undefined }) as unknown as LimitChangeAnswer
  }
  async function check(body: LimitChangeBody) {
    failure.value = ''
    saved.value = null
    busy.value = true
    try {
      review.value = { body, answer: await put(body, true) }
    }
    catch (err) {
      failure.value = fetchFailure(err, 'The limits were not changed').message
    }
    finally {
      busy.value = false
    }
  }
  async function confirm() {
    if (!review.value) return false
    failure.value = ''
    busy.value = true
    try {
      saved.value = await put(review.value.body, false)
      review.value = null
      return true
    }
    catch (err) {
      failure.value = fetchFailure(err, 'The limits were not changed').message
      return false
    }
    finally {
      busy.value = false
    }
  }
  const cancel = () => {
    review.value = null
  }
  return { review, saved, failure, busy, check, confirm, cancel }
}
