import { describe, expect, it } from 'vitest'
import { parseProfileCsv } from '../../server/domain/profiles/import/csv'
import { jsonErrorOffset, parseProfileJson } from '../../server/domain/profiles/import/json'
import { designatorPairProblem } from '../../shared/utils/airfield-schema'

describe('CSV levels', () => {
  it('reads levels with their lines, skipping comments and blank lines, semicolons allowed', () => {
    const r = parseProfileCsv('# note\nheight_m;direction_deg;speed_mps;gust_mps\n\n10;180;5;9\n300;200;12;\n')
    expect(r.issues).toEqual([])
    expect(r.levels).toEqual([{ heightM: 10, directionDeg: 180, speedMps: 5, gustMps: 9 }, { heightM: 300, directionDeg: 200, speedMps: 12 }])
    expect(r.lines).toEqual([4, 5])
  })
  it('names the line and column of every problem', () => {
    const r = parseProfileCsv('height_ft,direction_deg,speed_kt\n10,180\n20,1e2x,5\n')
    expect(r.issues).toEqual([
      { line: 2, field: 'line', message: '2 values, but the header has 3 columns' },
      { line: 3, field: 'direction_deg', message: 'direction_deg must be a number, got "1e2x"' },
    ])
    expect(parseProfileCsv('height_m,height_ft,direction_deg,speed_kt\n').issues[0]!.message).toContain('one height column')
    expect(parseProfileCsv('').issues[0]!.message).toContain('empty')
  })
})

describe('JSON profile files', () => {
  it('finds the line where each level starts, and the offset of a syntax error', () => {
    const text = '{\n  "source": "estimate",\n  "levels": [\n    { "heightM": 10, "directionDeg": 1, "speedKt": 2 },\n    {\n      "heightM": 20, "directionDeg": 1, "speedKt": 2 }\n  ]\n}'
    const r = parseProfileJson(text)
    expect(r.lines).toEqual([4, 5])
    expect(r.header).toEqual({ source: 'estimate' })
    expect(jsonErrorOffset('[1,2]')).toBe(-1)
    expect(jsonErrorOffset('[1,]')).toBe(3)
    expect(parseProfileJson('{\n"levels": [\n  01 ]}').issues[0]).toMatchObject({ line: 3, field: 'file' })
  })
})

describe('runway designator pairs (FAA AC 150/5340-1: designator = magnetic azimuth / 10, parallel runways L/C/R)', () => {
  it('pairs ends 18 apart, L with R, C with C', () => {
    expect(designatorPairProblem('09', '27')).toBeNull()
    expect(designatorPairProblem('18L', '36R')).toBeNull()
    expect(designatorPairProblem('04C', '22C')).toBeNull()
    expect(designatorPairProblem('09', '28')).toContain('18 apart')
    expect(designatorPairProblem('09L', '27L')).toContain('L is opposite R')
    expect(designatorPairProblem('09', '27R')).toContain('L is opposite R')
    expect(designatorPairProblem('00', '18')).toContain('01 to 36')
  })
})
