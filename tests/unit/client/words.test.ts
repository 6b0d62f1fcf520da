import { describe, expect, it } from 'vitest'
import { words, wordOptions } from '../../../shared/utils/words'
import { alertStates, outboxKinds, outboxStates } from '../../../server/db/schema/alerts'
import { profileStatuses } from '../../../server/db/schema/profiles'
import { ROLES } from '../../../shared/utils/roles'

// Every stored state, kind, source and role has plain words in the one map, so no page shows an internal slug.
describe('the words map', () => {
  const cases: [Parameters<typeof words>[0], readonly string[]][] = [
    ['alertState', alertStates], ['deliveryKind', outboxKinds], ['deliveryState', outboxStates],
    ['profileStatus', profileStatuses], ['role', ROLES],
  ]
  for (const [category, values] of cases) {
    it(`${category}: every stored value has words`, () => {
      const known = new Set(wordOptions(category).map(o => o.value))
      for (const v of values) expect(known.has(v), `${category} ${v}`).toBe(true)
    })
  }

  it('alert kinds read as words, e.g. airspeed-loss-arrival', () => {
    expect(words('alertKind', 'airspeed-loss-arrival')).toBe('Airspeed loss on arrival')
    for (const o of wordOptions('alertKind')) expect(o.label).not.toMatch(/^[a-z]+(-[a-z]+)+$/)
  })

  it('an unknown value shows without dashes rather than as a slug', () => {
    expect(words('alertKind', 'some-new-kind')).toBe('some new kind')
    expect(words('alertKind', null)).toBe('')
  })
})
