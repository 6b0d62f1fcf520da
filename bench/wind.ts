/**
 * Wind engine bench: one complete `analyseProfile` on a 200-level profile from 10 m to 10 km with 4 runway ends
 * (every figure: grid, shear, turn, components, arrival/departure, the corridor check, the F-factor of both paths,
 * convective context).
 * Prints the median time of one computation and the total for 10,000. Run: npx tsx bench/wind.ts
 */
import { performance } from 'node:perf_hooks'
import { analyseProfile } from '../shared/wind'
import type { LevelInput, ProfileAnalysisInput } from '../shared/wind'

const LEVELS = 200
const RUNS = 10_000
const WARMUP = 2_000

// Invented profile: a low-level jet near 300 m, veering with height, strengthening aloft.
function profile(): ProfileAnalysisInput {
  const levels: LevelInput[] = []
  for (let i = 0; i < LEVELS; i++) {
    const heightM = 10 + (i * (10_000 - 10)) / (LEVELS - 1)
    const jetKt = 25 * Math.exp(-(((heightM - 300) / 150) ** 2))
    levels.push({
      heightM,
      directionDeg: (170 + 90 * Math.min(1, heightM / 3000) + 3 * Math.sin(i)) % 360 || 360,
      speedKt: 8 + jetKt + heightM / 200,
      ...(i === 0 ? { gustKt: 22 } : {}),
    })
  }
  return {
    heightReference: 'AGL',
    levels,
    runwayEnds: [
      { designator: '04', trueHeadingDeg: 41.3, magneticHeadingDeg: 38.2 },
      { designator: '22', trueHeadingDeg: 221.3, magneticHeadingDeg: 218.2 },
      { designator: '13', trueHeadingDeg: 133.9, magneticHeadingDeg: 130.8 },
      { designator: '31', trueHeadingDeg: 313.9, magneticHeadingDeg: 310.8 },
    ],
  }
}

const input = profile()
let sink = 0
for (let i = 0; i < WARMUP; i++) sink += analyseProfile(input).shear.layers.length

const timesMs = new Float64Array(RUNS)
const t0 = performance.now()
for (let i = 0; i < RUNS; i++) {
  const start = performance.now()
  const r = analyseProfile(input)
  timesMs[i] = performance.now() - start
  sink += r.runwayEnds.length
}
const totalMs = performance.now() - t0
timesMs.sort()
const median = (timesMs[RUNS / 2 - 1]! + timesMs[RUNS / 2]!) / 2
const check = analyseProfile(input)
if (!check.convective.available || check.runwayEnds.length !== 4 || check.levels.length !== LEVELS
  || check.runwayEnds.some(e => !e.fFactor.arrival || !e.fFactor.departure || !e.arrivalCorridor)) {
  throw new Error('bench profile did not produce every figure')
}
console.log(`wind engine: ${LEVELS} levels to 10 km, ${input.runwayEnds!.length} runway ends, every figure (F-factor of both paths included)`)
console.log(`median of one computation: ${(median * 1000).toFixed(1)} µs (${median.toFixed(4)} ms; target < 0.5 ms)`)
console.log(`median / 0.5 ms target: ${(median / 0.5).toFixed(2)} (under 1 meets it)`)
console.log(`p95 of one computation:    ${(timesMs[Math.floor(RUNS * 0.95)]! * 1000).toFixed(1)} µs`)
console.log(`total for ${RUNS.toLocaleString('en')} computations: ${totalMs.toFixed(1)} ms`)
if (sink < 0) console.log(sink)
