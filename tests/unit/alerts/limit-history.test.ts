import { describe, expect, it } from 'vitest'
import { DEFAULT_LIMITS } from '../../../shared/limits'
import { effectiveAroundChanges } from '../../../server/domain/alerts/limit-views'

// The history's "effective before -> after": replaying the changes in order gives what was in force at each change's
// own scope (runway end over airfield over organisation over the built-in defaults).
const none = { maxCrosswindKt: null, maxTailwindKt: null, maxLayerShearKtPer100ft: null, maxVectorDiff600mKt: null, maxAirspeedLossKt: null, nearLimitMarginPct: null, maxFFactor: null }

describe('effective limits around each change', () => {
  it('an airfield override of an inherited figure reads as the inherited value to the new one, not "inherit -> 12"', () => {
    const out = effectiveAroundChanges([
      { id: 1, scopeKey: 'airfield:7', airfieldId: 7, designator: null, newValues: { ...none, maxCrosswindKt: 12 } },
    ])
    expect(out.get(1)!.before.maxCrosswindKt).toBe(DEFAULT_LIMITS.maxCrosswindKt)
    expect(out.get(1)!.after.maxCrosswindKt).toBe(12)
  })

  it('an organisation change reaches an end that inherits, and an end override shadows a later airfield change', () => {
    const out = effectiveAroundChanges([
      { id: 1, scopeKey: 'org', airfieldId: null, designator: null, newValues: { ...none, maxTailwindKt: 8 } },
      { id: 2, scopeKey: 'airfield:7:27', airfieldId: 7, designator: '27', newValues: { ...none, maxTailwindKt: 5 } },
      { id: 3, scopeKey: 'airfield:7', airfieldId: 7, designator: null, newValues: { ...none, maxTailwindKt: 6 } },
      { id: 4, scopeKey: 'airfield:7:27', airfieldId: 7, designator: '27', newValues: { ...none } },
    ])
    expect(out.get(1)).toMatchObject({ before: { maxTailwindKt: DEFAULT_LIMITS.maxTailwindKt }, after: { maxTailwindKt: 8 } })
    expect(out.get(2)).toMatchObject({ before: { maxTailwindKt: 8 }, after: { maxTailwindKt: 5 } })
    expect(out.get(3)).toMatchObject({ before: { maxTailwindKt: 8 }, after: { maxTailwindKt: 6 } })
    // Removing the end's override hands it back to the airfield's 6 kt.
    expect(out.get(4)).toMatchObject({ before: { maxTailwindKt: 5 }, after: { maxTailwindKt: 6 } })
  })
})
