/**
 * The live briefing's change stamps: `profiles/inputs`, where `profiles` is "count,newest id,withdrawn,superseded,
 * last withdrawal,last supersession" of an airfield's profiles and `inputs` the digest of its row, runway ends and
 * limits. Plain TypeScript.
 */

export type ChangeKind = 'filed' | 'withdrawn' | 'superseded' | 'profile' | 'limits'

/** What changed between two stamps, in the order a reader cares about (pure; exported for tests). */
export function changeKinds(before: string, after: string): ChangeKind[] {
  const [bp = '', bi = ''] = before.split('/')
  const [ap = '', ai = ''] = after.split('/')
  const kinds: ChangeKind[] = []
  if (bp !== ap) {
    const [bn, bmax, bw, bs] = bp.split(',').map(Number)
    const [an, amax, aw, as] = ap.split(',').map(Number)
    if (an !== bn || amax !== bmax) kinds.push('filed')
    if (aw !== bw) kinds.push('withdrawn')
    if (as !== bs) kinds.push('superseded')
    if (!kinds.length) kinds.push('profile')
  }
  if (bi !== ai) kinds.push('limits')
  return kinds
}
