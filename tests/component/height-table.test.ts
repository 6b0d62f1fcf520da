import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import type { VueWrapper } from '@vue/test-utils'
import BriefingHeightTable from '~/components/briefing/BriefingHeightTable.vue'
import { usePreferencesStore } from '~/stores/preferences'
import { runwayComponents } from '#shared/wind'
import { polarData } from './support/wind'

// A steady wind from 220° at 30 kt at every height, on runway 18 and its reciprocal 36: the FAA knowledge-test
// crosswind chart's worked example (runway 18, 220° at 30 kt: about 23 kt headwind and 19 kt crosswind; exact
// 22.98 and 19.28). On 36 the same wind is a 23 kt tailwind with the crosswind from the left.
const steady = [
  { heightM: 10, directionDeg: 220, speedKt: 30 },
  { heightM: 600, directionDeg: 220, speedKt: 30 },
]
const M_PER_FT = 0.3048 // international foot, 1959 agreement (exact)

/** The briefing's 100 ft steps for a steady wind: every 100 ft from the ground while at or below 600 m. */
function feetStepsSteady(designators: { designator: string, trueHeadingDeg: number }[]) {
  const rows = []
  for (let ft = 0; ft * M_PER_FT <= 600; ft += 100) {
    rows.push({
      heightAglFt: ft, heightAglM: ft * M_PER_FT, directionDeg: 220, speedKt: 30,
      components: designators.map(d => ({ designator: d.designator, ...runwayComponents(220, 30, d.trueHeadingDeg) })),
    })
  }
  return rows
}

function table(wrapper: Pick<VueWrapper, 'findAll'>): string[][] {
  return wrapper.findAll('[data-test=height-table] tbody tr').map(tr => tr.findAll('td').map(td => td.text()))
}

describe('height table (components up to 600 m)', () => {
  const ends = [{ designator: '18', trueHeadingDeg: 180 }, { designator: '36', trueHeadingDeg: 360 }]

  beforeEach(() => {
    const prefs = usePreferencesStore()
    prefs.speedUnit = 'kt'
    prefs.headingRef = 'true'
  })

  it('in feet: one row every 100 ft from 0 to 1,900 ft (2,000 ft = 609.6 m is above 600 m)', async () => {
    usePreferencesStore().heightUnit = 'ft'
    const d = polarData(steady, ends[0]!)
    const wrapper = await mountSuspended(BriefingHeightTable, {
      props: { designator: '18', byHeight: d.byHeight, grid: d.grid, feetSteps: feetStepsSteady(ends), declinationDeg: 0 },
    })
    const rows = table(wrapper)
    expect(rows.map(r => r[0])).toEqual(Array.from({ length: 20 }, (_, k) => String(k * 100)))
    expect(wrapper.find('summary').text()).toContain('every 100 ft')
    for (const r of rows) expect(r.slice(1)).toEqual(['220°T', '30', '23 kt headwind', '19 kt from the right'])
  })

  it('shows the reciprocal end\'s own components from the same steps: runway 36 has the tailwind, wind from the left', async () => {
    usePreferencesStore().heightUnit = 'ft'
    const d = polarData(steady, ends[1]!)
    const wrapper = await mountSuspended(BriefingHeightTable, {
      props: { designator: '36', byHeight: d.byHeight, grid: d.grid, feetSteps: feetStepsSteady(ends), declinationDeg: 0 },
    })
    expect(table(wrapper)[5]!.slice(3)).toEqual(['23 kt tailwind', '19 kt from the left'])
  })

  it('in metres: the engine\'s 30 m steps only, 30 to 600 m (the filed 10 m level is left to the level table)', async () => {
    usePreferencesStore().heightUnit = 'm'
    const d = polarData(steady, ends[0]!)
    // The engine's grid holds the 30 m steps and the filed levels (shared/wind/types.ts, GridPoint).
    expect(d.byHeight.some(b => b.heightAglM === 10)).toBe(true)
    const wrapper = await mountSuspended(BriefingHeightTable, {
      props: { designator: '18', byHeight: d.byHeight, grid: d.grid, feetSteps: [], declinationDeg: 0 },
    })
    const rows = table(wrapper)
    // The grid starts at the lowest filed level (10 m), so the first 30 m step shown is 30 m.
    expect(rows.map(r => r[0])).toEqual(Array.from({ length: 20 }, (_, k) => String((k + 1) * 30)))
    expect(wrapper.find('summary').text()).toContain('every 30 m')
    expect(rows[9]).toEqual(['300', '220°T', '30', '23 kt headwind', '19 kt from the right'])
  })

  it('gives headings in the reader\'s reference and speeds in m/s when asked', async () => {
    const prefs = usePreferencesStore()
    prefs.heightUnit = 'm'
    prefs.headingRef = 'magnetic'
    prefs.speedUnit = 'mps'
    const d = polarData(steady, ends[0]!)
    const wrapper = await mountSuspended(BriefingHeightTable, {
      props: { designator: '18', byHeight: d.byHeight, grid: d.grid, feetSteps: [], declinationDeg: -5 },
    })
    // 220°T with 5° W variation is 225°M (magnetic = true - east variation); 30 kt = 15.4 m/s, 22.98 kt = 11.8 m/s,
    // 19.28 kt = 9.9 m/s (1 kt = 1852/3600 m/s exactly).
    expect(table(wrapper)[0]).toEqual(['30', '225°M', '15.4', '11.8 m/s headwind', '9.9 m/s from the right'])
  })
})
