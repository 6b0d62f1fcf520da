import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { defineComponent, h, nextTick } from 'vue'
import { readBody, setResponseStatus } from 'h3'
import { levelsFromCoded, rekeyLevel, sortedLevels, useProfileEntry } from '~/composables/useProfileEntry'
import { previewRequestOf } from '~/composables/useProfilePreview'
import { analyseProfile, WindValidationError } from '#shared/wind'

type Entry = ReturnType<typeof useProfileEntry>

const mounted: { unmount: () => void }[] = []
/** Mounts a bare component that runs the entry composable, and hands the composable back to the test. */
async function mountEntry(code = 'XTST', options: Parameters<typeof useProfileEntry>[1] = {}) {
  let entry: Entry | undefined
  const Harness = defineComponent({
    setup() {
      entry = useProfileEntry(code, { now: Date.UTC(2026, 2, 1, 6, 25), ...options })
      return () => h('div')
    },
  })
  mounted.push(await mountSuspended(Harness))
  return entry!
}

const rows = (e: Entry) => e.fields.value.map(f => f.value)

// The preview endpoint as the server answers it: the real engine on the body, runway 18 (true heading 180°).
let previewBodies: { airfield?: string }[] = []
const bodiesFor = (code: string) => previewBodies.filter(b => b.airfield === code)
// Endpoints registered by a test, taken away after it (a later registration of the same path does not replace one).
let unregister: (() => void)[] = []
function endpoint(...args: Parameters<typeof registerEndpoint>) {
  unregister.push(registerEndpoint(...args))
}
function enginePreview() {
  endpoint('/api/wind/preview', {
    method: 'POST',
    async handler(event) {
      const body = await readBody(event)
      previewBodies.push(body)
      try {
        return { analysis: analyseProfile({ levels: body.levels, heightReference: body.heightReference, runwayEnds: [{ designator: '18', trueHeadingDeg: 180 }] }), declination: null }
      }
      catch (err) {
        if (!(err instanceof WindValidationError)) throw err
        setResponseStatus(event, 422)
        return { statusCode: 422, statusMessage: 'The levels cannot be analysed', data: { issues: err.issues } }
      }
    },
  })
}
beforeEach(() => {
  previewBodies = []
})
afterEach(() => {
  vi.useRealTimers()
  for (const w of mounted.splice(0)) w.unmount()
  for (const off of unregister) off()
  unregister = []
})

describe('profile entry: the level table', () => {
  it('starts with this hour for 3 hours, UTC, and two blank levels at 10 m and 300 m', async () => {
    const e = await mountEntry()
    expect(e.values.validFrom).toBe('2026-03-01T06:00:00Z')
    expect(e.values.validTo).toBe('2026-03-01T09:00:00Z')
    expect(rows(e)).toEqual([{ heightM: 10 }, { heightM: 300 }])
  })

  it('keeps the figures as typed when the units change, under the new unit\'s keys', async () => {
    const e = await mountEntry()
    e.fields.value.forEach((_f, i) => Object.assign(e.fields.value[i]!.value, { directionDeg: 200 + i * 10, speedKt: 12 + i }))
    e.units.height = 'heightFt'
    e.units.speed = 'speedMps'
    await nextTick()
    expect(rows(e)).toEqual([{ heightFt: 10, directionDeg: 200, speedMps: 12 }, { heightFt: 300, directionDeg: 210, speedMps: 13 }])
    expect(e.unitLabels.value).toEqual({ height: 'ft', speed: 'm/s' })
    expect(e.gustKey.value).toBe('gustMps')
    expect(rekeyLevel({ heightM: 10, directionDeg: 90, speedKt: 8, gustKt: 18 }, { height: 'heightM', speed: 'speedKt' }, { height: 'heightM', speed: 'speedMps' }))
      .toEqual({ heightM: 10, directionDeg: 90, speedMps: 8, gustMps: 18 })
  })

  it('sorts pressure levels from the ground up: 1000, 925, 850 hPa', async () => {
    // ICAO standard atmosphere (Doc 7488; table in the domain notes): 1000 hPa 111 m, 925 hPa 762 m, 850 hPa 1457 m.
    const e = await mountEntry()
    e.units.height = 'pressureHpa'
    await nextTick()
    e.addLevel()
    const typed = [850, 1000, 925]
    typed.forEach((hPa, i) => Object.assign(e.fields.value[i]!.value, { pressureHpa: hPa, directionDeg: 270, speedKt: 20 }))
    e.sortRows()
    await nextTick()
    expect(rows(e).map(r => r.pressureHpa)).toEqual([1000, 925, 850])
    expect(sortedLevels([{ heightM: 300 }, { heightM: undefined }, { heightM: 10 }], 'heightM').map(r => r.heightM)).toEqual([10, 300, undefined])
  })

  it('takes levels read from coded reports in metres and knots: WS020/27035KT is 609.6 m, 270° at 35 kt', async () => {
    // NWS TAF guidance: WS020/27035KT = shear from the surface to 2,000 ft, wind at the top 270° at 35 kt;
    // 2,000 ft x 0.3048 m/ft (exact) = 609.6 m.
    const e = await mountEntry()
    e.units.height = 'heightFt'
    await e.fromCoded([{ heightM: 0, directionDeg: 130, speedKt: 8 }, { heightFt: 2000, directionDeg: 270, speedKt: 35 }])
    expect(e.units.height).toBe('heightM')
    expect(e.entry.value).toBe('coded')
    expect(rows(e)).toEqual([{ heightM: 0, directionDeg: 130, speedKt: 8 }, { heightM: 609.6, directionDeg: 270, speedKt: 35 }])
    expect(levelsFromCoded([{ heightM: 0, directionDeg: 80, speedKt: 32, gustKt: 45 }])[0]).toEqual({ heightM: 0, directionDeg: 80, speedKt: 32, gustKt: 45 })
  })
})

describe('profile entry: the live preview', () => {
  it('asks for nothing until every level has a height, a direction and a speed', () => {
    expect(previewRequestOf('XTST', 'AGL', [{ heightM: 10, directionDeg: 220 }, { heightM: 300, directionDeg: 220, speedKt: 30 }])).toBeNull()
    expect(previewRequestOf('XTST', 'AGL', [{ heightM: 10, directionDeg: 220, speedKt: 30 }])).toBeNull()
    expect(previewRequestOf('XTST', 'MSL', [{ heightM: 10, directionDeg: 220, speedKt: 30, gustKt: undefined }, { heightM: 300, directionDeg: 230, speedKt: 35 }]))
      .toEqual({ airfield: 'XTST', heightReference: 'MSL', levels: [{ heightM: 10, directionDeg: 220, speedKt: 30 }, { heightM: 300, directionDeg: 230, speedKt: 35 }] })
  })

  it('asks once when the typing settles, and shows the engine\'s figures (FAA example: 220° at 30 kt on 18)', async () => {
    enginePreview()
    vi.useFakeTimers()
    // Its own airfield code, so only this entry's requests are counted.
    const e = await mountEntry('XDEB', { previewDebounceMs: 400 })
    Object.assign(e.fields.value[0]!.value, { directionDeg: 220, speedKt: 30 })
    Object.assign(e.fields.value[1]!.value, { directionDeg: 220, speedKt: 25 })
    await nextTick()
    await vi.advanceTimersByTimeAsync(100)
    // A second change inside the quiet time: still one request, with the last figures.
    e.fields.value[1]!.value.speedKt = 30
    await nextTick()
    await vi.advanceTimersByTimeAsync(399)
    expect(bodiesFor('XDEB')).toHaveLength(0)
    await vi.advanceTimersByTimeAsync(1)
    vi.useRealTimers()
    await vi.waitUntil(() => e.preview.analysis.value !== null, { timeout: 20_000, interval: 10 })
    expect(bodiesFor('XDEB')).toHaveLength(1)
    expect(bodiesFor('XDEB')[0]).toMatchObject({ levels: [{ speedKt: 30 }, { speedKt: 30 }] })
    const surface = e.preview.analysis.value!.runwayEnds[0]!.surface!
    // FAA knowledge-test crosswind chart example, exact values 22.98 and 19.28 kt.
    expect(surface.headwindKt).toBeCloseTo(22.98, 2)
    expect(surface.crosswindKt).toBeCloseTo(19.28, 2)
    expect(e.preview.failure.value).toBe('')
  })

  it('says why there is no preview when the server refuses the levels', async () => {
    endpoint('/api/wind/preview', {
      method: 'POST',
      handler(event) {
        setResponseStatus(event, 422)
        return { statusCode: 422, statusMessage: 'The levels cannot be analysed', data: { issues: [{ field: 'levels[1].heightM', message: 'Level 2: heights must rise' }] } }
      },
    })
    const e = await mountEntry('XTST', { previewDebounceMs: 0 })
    Object.assign(e.fields.value[0]!.value, { directionDeg: 220, speedKt: 30 })
    Object.assign(e.fields.value[1]!.value, { directionDeg: 220, speedKt: 30 })
    await nextTick()
    expect(e.preview.request.value).not.toBeNull()
    await e.preview.run()
    expect(e.preview.failure.value).toBe('The levels cannot be analysed')
    expect(e.preview.analysis.value).toBeNull()
  })
})

describe('profile entry: filing', () => {
  it('puts the server\'s 422 issues beside their cells (levels[1].directionDeg) and keeps the others listed', async () => {
    endpoint('/api/airfields/XTST/profiles', {
      method: 'POST',
      handler(event) {
        setResponseStatus(event, 422)
        return {
          statusCode: 422,
          statusMessage: 'The profile is not valid',
          data: { issues: [{ field: 'levels[1].directionDeg', message: 'Direction must be from 0 to 360', index: 1 }, { field: 'runwayEnds', message: 'The airfield has no runway' }] },
        }
      },
    })
    const e = await mountEntry()
    Object.assign(e.fields.value[0]!.value, { directionDeg: 220, speedKt: 30 })
    Object.assign(e.fields.value[1]!.value, { directionDeg: 220, speedKt: 30 })
    await e.submit()
    expect(e.failure.value).toBe('The profile is not valid')
    expect(e.errors.value['levels[1].directionDeg' as keyof typeof e.errors.value]).toBe('Direction must be from 0 to 360')
    expect(e.failureIssues.value).toEqual([{ field: 'runwayEnds', message: 'The airfield has no runway' }])
  })

  it('checks the form with the API\'s own schema first: a level without a direction is not sent', async () => {
    let sent = 0
    endpoint('/api/airfields/XTST/profiles', { method: 'POST', handler: () => ({ sent: ++sent }) })
    const e = await mountEntry()
    Object.assign(e.fields.value[0]!.value, { speedKt: 30 })
    await e.submit()
    expect(sent).toBe(0)
    expect(Object.keys(e.errors.value).some(k => k.startsWith('levels[0]'))).toBe(true)
  })
})
