/**
 * Figures at the API boundary, rounded to the precision the trade works in, and the levels a page can show.
 * Pure: the engine keeps full precision; `?precision=full` on the briefing route skips both steps.
 */

// Steps by the unit at the end of a field's name. Wind to 0.1 kt and 0.1 m/s, heights to 0.1 m and 1 ft,
// shear rates to 0.01 (kt/100 ft, m/s per 30 m), angles to 0.1°, helicity to 1 m²/s² (common practice: one
// decimal more than reports and forecasts carry, so that sums and differences read back consistently).
const STEP_BY_SUFFIX: [RegExp, number][] = [
  [/KtPer100ft$/, 0.01],
  [/MpsPer30m$/, 0.01],
  [/(latitude|longitude|Lat|Lon)Deg$/, 1e-6],
  [/Kt$/, 0.1],
  [/Mps$/, 0.1],
  [/M2s2$/, 1],
  [/Ft$/, 1],
  [/Deg$/, 0.1],
  [/M$/, 0.1],
  [/Hpa$/, 0.1],
  [/Pct$/, 0.1],
  [/Share0to500m$/, 0.01],
]
// A limit check's value, limit and excess go by the check's unit.
const STEP_BY_UNIT: Record<string, number> = { 'kt': 0.1, 'kt/100 ft': 0.01, '%': 0.1, 'm': 0.1 }

export function roundTo(x: number, step: number): number {
  if (!Number.isFinite(x)) return x
  const decimals = Math.max(0, Math.round(-Math.log10(step)))
  const r = Number(x.toFixed(decimals))
  return Object.is(r, -0) ? 0 : r
}

function stepOf(key: string): number | null {
  for (const [re, step] of STEP_BY_SUFFIX) if (re.test(key)) return step
  return null
}

/** A copy of `value` with every number in a field named by its unit rounded to that unit's step. */
export function roundFigures<T>(value: T): T {
  return walk(value, null) as T
}

function walk(v: unknown, key: string | null, unitStep?: number): unknown {
  if (typeof v === 'number') {
    if (key && unitStep != null && (key === 'value' || key === 'limit' || key === 'excess')) return roundTo(v, unitStep)
    const step = key ? stepOf(key) : null
    return step == null ? v : roundTo(v, step)
  }
  if (Array.isArray(v)) return v.map(x => walk(x, key, unitStep))
  if (v && typeof v === 'object') {
    if (v instanceof Date) return v
    const o = v as Record<string, unknown>
    const step = typeof o.unit === 'string' ? STEP_BY_UNIT[o.unit] : undefined
    const out: Record<string, unknown> = {}
    for (const k of Object.keys(o)) out[k] = walk(o[k], k, step)
    return out
  }
  return v
}

/** At most this many levels go to a page: enough for a polar display and its table to read the profile's shape. */
export const DISPLAY_LEVELS_LOW = 80
export const DISPLAY_LEVELS_HIGH = 40
export const DISPLAY_SPLIT_M = 600

/**
 * Which levels (indexes into `heightsAglM`, sorted by height) to show: all of them when there are few; otherwise up
 * to DISPLAY_LEVELS_LOW spread evenly by index in the lowest 600 m (where wind shear matters for take-off and
 * landing) and DISPLAY_LEVELS_HIGH above, always with the lowest and the highest.
 */
export function displayLevelIndexes(heightsAglM: number[]): number[] {
  const n = heightsAglM.length
  if (n <= DISPLAY_LEVELS_LOW + DISPLAY_LEVELS_HIGH) return heightsAglM.map((_, i) => i)
  const low: number[] = []
  const high: number[] = []
  heightsAglM.forEach((h, i) => (h <= DISPLAY_SPLIT_M ? low : high).push(i))
  const pick = (ids: number[], k: number) => {
    if (ids.length <= k) return ids
    const out: number[] = []
    for (let j = 0; j < k; j++) out.push(ids[Math.round((j * (ids.length - 1)) / (k - 1))]!)
    return [...new Set(out)]
  }
  const chosen = new Set([...pick(low, DISPLAY_LEVELS_LOW), ...pick(high, DISPLAY_LEVELS_HIGH), 0, n - 1])
  return [...chosen].sort((a, b) => a - b)
}

/**
 * Which points of the engine's 0-600 m grid to show: the 30 m steps and the shown levels (a deep profile puts
 * every filed level below 600 m on the grid; the tables read the 30 m steps, the polar display the levels).
 */
export function displayGridIndexes(grid: { heightAglM: number, sourceIndex: number | null }[], shownLevels: Set<number>): number[] {
  const out: number[] = []
  grid.forEach((g, i) => {
    const onStep = Math.abs(g.heightAglM / 30 - Math.round(g.heightAglM / 30)) < 1e-6
    if (onStep || g.sourceIndex == null || shownLevels.has(g.sourceIndex) || i === 0 || i === grid.length - 1) out.push(i)
  })
  return out
}
