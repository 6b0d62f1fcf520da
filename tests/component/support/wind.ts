// Test data for the display pieces, made by the project's own wind engine from a few levels, so a component is
// checked on the figures the server would send (the engine itself is checked against references in tests/unit).
import { analyseProfile, runwayComponents, MPS_PER_KT } from '#shared/wind'
import type { LevelInput, RunwayEndInput } from '#shared/wind'

export { MPS_PER_KT }

/** The briefing's level points and one runway end's components per level, as the briefing route assembles them. */
export function polarData(levels: LevelInput[], end: RunwayEndInput) {
  const analysis = analyseProfile({ levels, heightReference: 'AGL', runwayEnds: [end] })
  const endAnalysis = analysis.runwayEnds[0]!
  return {
    analysis,
    levels: analysis.levels,
    endLevels: analysis.levels.map(l => ({ sourceIndex: l.sourceIndex, heightAglM: l.heightAglM, ...runwayComponents(l.directionDeg, l.speedKt, end.trueHeadingDeg) })),
    byHeight: endAnalysis.byHeight,
    grid: analysis.grid,
  }
}
