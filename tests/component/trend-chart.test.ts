import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import TrendChart from '~/components/trend/TrendChart.vue'
import { runwayComponents } from '#shared/wind'

// Two profiles of a steady 220° at 30 kt on runway 18/36: the FAA crosswind chart's worked example (runway 18:
// 19.28 kt crosswind, 22.98 kt headwind; on 36 the same as a tailwind). The chart shows the end the page briefs.
function point(at: string) {
  const ends = [['18', 180], ['36', 360]] as const
  return {
    profileId: 1, at, validTo: at, source: 'wind-profiler', status: 'current', strongestShearKtPer100ft: 0, strongestShearIntensity: 'light',
    strongestLayer: null,
    ends: ends.map(([designator, headingDeg]) => {
      const c = runwayComponents(220, 30, headingDeg)
      return { designator, crosswindKt: Math.abs(c.crosswindKt), gustCrosswindKt: null, tailwindKt: Math.max(0, -c.headwindKt), gustTailwindKt: null }
    }),
  }
}
const props = {
  date: '2026-12-03',
  designators: ['18', '36'],
  points: [point('2026-12-03T06:00:00.000Z'), point('2026-12-03T09:00:00.000Z')],
  limits: { source: 'organisation', maxLayerShearKtPer100ft: 8, perEnd: [
    { designator: '18', maxCrosswindKt: 25, maxTailwindKt: 10 }, { designator: '36', maxCrosswindKt: 25, maxTailwindKt: 10 }] },
}

describe('the day\'s trend chart', () => {
  it('shows the runway end the page briefs, and follows it when the page changes end', async () => {
    const wrapper = await mountSuspended(TrendChart, { props: { ...props, chosen: '36' } as any })
    const select = () => (wrapper.find('select').element as HTMLSelectElement).value
    expect(select()).toBe('36')
    await wrapper.setProps({ chosen: '18' })
    expect(select()).toBe('18')
    // An end the trend does not know falls back to its first end.
    await wrapper.setProps({ chosen: '09' })
    expect(select()).toBe('18')
  })
})
