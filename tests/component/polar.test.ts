import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import PolarWindPlot from '~/components/polar/PolarWindPlot.vue'
import PolarLevelTable from '~/components/polar/PolarLevelTable.vue'
import { usePreferencesStore } from '~/stores/preferences'
import { MPS_PER_KT, polarData } from './support/wind'

// The polar display: SVG 360 px square, centre (180, 180), outer ring 140 px (PolarWindPlot.vue). Screen y grows
// downwards. A point sits toward the direction the wind comes FROM (WMO convention: direction = where the wind blows
// from, clockwise from north), so its offset from the centre is (-u, +v) in screen terms, u east and v north.
const C = 180

async function plot(levels: Parameters<typeof polarData>[0], end = { designator: '18', trueHeadingDeg: 180 }, declinationDeg = 0) {
  const d = polarData(levels, end)
  const wrapper = await mountSuspended(PolarWindPlot, {
    props: { levels: d.levels, endLevels: d.endLevels, designator: end.designator, reciprocalDesignator: '36', trueHeadingDeg: end.trueHeadingDeg, declinationDeg, convective: null },
  })
  return { wrapper, d }
}

function point(wrapper: Awaited<ReturnType<typeof plot>>['wrapper'], index: number) {
  const p = wrapper.find(`[data-test=polar-point][data-level-index="${index}"]`)
  return { el: p, x: Number(p.attributes('cx')) - C, y: Number(p.attributes('cy')) - C }
}

/** Radius in px of the ring labelled `label` (e.g. "10 m/s"), read from the drawing itself. */
function ringRadius(wrapper: Awaited<ReturnType<typeof plot>>['wrapper'], label: string) {
  const labels = wrapper.findAll('[data-test=polar-ring-label]').map(l => l.text())
  const i = labels.indexOf(label)
  expect(i, `a ring labelled ${label} among ${labels.join(', ')}`).toBeGreaterThanOrEqual(0)
  return Number(wrapper.findAll('[data-test=polar-ring]')[i]!.attributes('r'))
}

describe('polar wind display: geometry', () => {
  beforeEach(() => {
    const prefs = usePreferencesStore()
    prefs.speedUnit = 'mps'
    prefs.heightUnit = 'm'
    prefs.headingRef = 'true'
  })

  it('puts 10 m/s from 225° where MetPy\'s components put it: u = v = +7.0711 m/s, drawn to the south-west', async () => {
    // MetPy documentation, wind_components example: 10 m/s from 225° gives u = 7.0711, v = 7.0711 m/s.
    const { wrapper } = await plot([
      { heightM: 10, directionDeg: 225, speedMps: 10 },
      { heightM: 300, directionDeg: 225, speedMps: 10 },
    ])
    const r = ringRadius(wrapper, '10 m/s')
    const p = point(wrapper, 0)
    expect(p.x / r).toBeCloseTo(-7.0711 / 10, 3)
    expect(p.y / r).toBeCloseTo(7.0711 / 10, 3)
  })

  it('draws 20 m/s from 360° straight up and 25 kt from 090° to the right (MetPy: (0, -20) and (-25, 0))', async () => {
    // Computed with MetPy 1.6.3 (Veerline's domain notes): 20 m/s from 360° -> u 0, v -20; 25 kt from 090° -> u -25, v 0.
    const { wrapper } = await plot([
      { heightM: 10, directionDeg: 360, speedMps: 20 },
      { heightM: 300, directionDeg: 90, speedKt: 25 },
    ])
    const r20 = ringRadius(wrapper, '20 m/s')
    const north = point(wrapper, 0)
    expect(north.x).toBeCloseTo(0, 6)
    expect(north.y / r20).toBeCloseTo(-1, 6)
    const east = point(wrapper, 1)
    // 25 kt = 12.861 m/s (1 kt = 1852/3600 m/s exactly); the same px per m/s as the 20 m/s ring.
    expect(east.x / r20).toBeCloseTo((25 * MPS_PER_KT) / 20, 4)
    expect(east.y).toBeCloseTo(0, 6)
  })

  it('turns the picture by the declination when headings are magnetic (magnetic = true - east variation)', async () => {
    // Domain notes (ICAO Annex 3 / FAA AIM 4-3-6): tower winds are magnetic; magnetic = true - east declination.
    usePreferencesStore().headingRef = 'magnetic'
    const { wrapper } = await plot([
      { heightM: 10, directionDeg: 100, speedMps: 10 },
      { heightM: 300, directionDeg: 100, speedMps: 10 },
    ], { designator: '18', trueHeadingDeg: 180 }, 10)
    const r = ringRadius(wrapper, '10 m/s')
    const p = point(wrapper, 0)
    // 100°T with 10° E is 090°M: the point lies due east of the centre.
    expect(p.x / r).toBeCloseTo(1, 6)
    expect(p.y / r).toBeCloseTo(0, 6)
    expect(wrapper.findAll('[data-test=polar-compass]')[0]!.text()).toContain('M')
  })
})

describe('polar wind display: readout and legs', () => {
  beforeEach(() => {
    const prefs = usePreferencesStore()
    prefs.speedUnit = 'kt'
    prefs.heightUnit = 'ft'
    prefs.headingRef = 'true'
  })

  it('reads out the FAA crosswind-chart example: runway 18, 220° at 30 kt -> about 23 kt headwind, 19 kt crosswind', async () => {
    // FAA knowledge-test crosswind chart worked example (chart reading 23 and 19 kt; exact 22.98 and 19.28).
    const { wrapper } = await plot([
      { heightM: 10, directionDeg: 220, speedKt: 30 },
      { heightM: 300, directionDeg: 220, speedKt: 30 },
    ])
    expect(wrapper.find('[data-test=polar-readout]').text()).toMatch(/^Select a level/)
    await point(wrapper, 0).el.trigger('click')
    const text = wrapper.find('[data-test=polar-readout]').text()
    // 10 m = 32.8 ft (1 ft = 0.3048 m exactly).
    expect(text).toBe('33 ft AGL · from 220°T at 30 kt · runway 18: 23 kt headwind, crosswind 19 kt from the right')
  })

  it('splits the selected wind into a headwind leg along the runway and a crosswind leg to the point', async () => {
    const { wrapper } = await plot([
      { heightM: 10, directionDeg: 220, speedKt: 30 },
      { heightM: 300, directionDeg: 220, speedKt: 30 },
    ])
    await point(wrapper, 0).el.trigger('click')
    const head = wrapper.find('[data-test=polar-leg-head]')
    const cross = wrapper.find('[data-test=polar-leg-cross]')
    const q = { x: Number(head.attributes('x2')) - C, y: Number(head.attributes('y2')) - C }
    const p = { x: Number(cross.attributes('x2')) - C, y: Number(cross.attributes('y2')) - C }
    const pxPerKt = Math.hypot(p.x, p.y) / 30
    // Headwind leg: toward runway 18's heading (180°, straight down), 22.98 kt long (FAA example, exact value).
    expect(q.x).toBeCloseTo(0, 6)
    expect(q.y / pxPerKt).toBeCloseTo(22.98, 2)
    // Crosswind leg: square to the runway, 19.28 kt long.
    expect(Math.hypot(p.x - q.x, p.y - q.y) / pxPerKt).toBeCloseTo(19.28, 2)
    expect((p.x - q.x) * 0 + (p.y - q.y) * 1).toBeCloseTo(0, 6)
  })

  it('marks a tailwind leg: 25 kt from 360° on runway 18 is a 25 kt tailwind', async () => {
    // Runway components: headwind = V cos(wind - heading); 360 - 180 = 180° gives -V (domain notes, common practice).
    const { wrapper } = await plot([
      { heightM: 10, directionDeg: 360, speedKt: 25 },
      { heightM: 300, directionDeg: 360, speedKt: 25 },
    ])
    await point(wrapper, 1).el.trigger('mouseenter')
    expect(wrapper.find('[data-test=polar-leg-head]').classes()).toContain('stroke-flare-500')
    expect(wrapper.find('[data-test=polar-readout]').text()).toContain('runway 18: 25 kt tailwind, crosswind 0 kt crosswind')
  })
})

describe('polar level table', () => {
  it('lists each level with its components in the reader\'s units', async () => {
    const prefs = usePreferencesStore()
    prefs.speedUnit = 'mps'
    prefs.heightUnit = 'ft'
    prefs.headingRef = 'true'
    const d = polarData([
      { heightM: 10, directionDeg: 220, speedKt: 30 },
      { heightM: 300, directionDeg: 225, speedMps: 10 },
    ], { designator: '18', trueHeadingDeg: 180 })
    const wrapper = await mountSuspended(PolarLevelTable, { props: { levels: d.levels, endLevels: d.endLevels, designator: '18', declinationDeg: 0 } })
    const cells = (row: number, col: string) => wrapper.find(`tr[data-level-index="${row}"] [data-col=${col}]`).text()
    // 300 m = 984.25 ft (1 ft = 0.3048 m).
    expect(cells(1, 'height')).toBe('984')
    expect(cells(1, 'direction')).toBe('225°T')
    // MetPy's example wind: 10 m/s from 225°; on runway 18 (45° off) head and cross are both 10 cos 45° = 7.07 m/s.
    expect(cells(1, 'speed')).toBe('10.0')
    expect(cells(1, 'headwind')).toBe('7.1')
    expect(cells(1, 'crosswind')).toBe('7.1')
    // FAA example in m/s: 22.98 kt = 11.82 m/s, 19.28 kt = 9.92 m/s (1 kt = 1852/3600 m/s).
    expect(cells(0, 'headwind')).toBe('11.8')
    expect(cells(0, 'crosswind')).toBe('9.9')
    await wrapper.find('tr[data-level-index="1"]').trigger('click')
    expect(wrapper.find('tr[data-level-index="1"]').classes()).toContain('bg-ochre-100')
  })
})
