import { describe, expect, it } from 'vitest'
import {
  KMH_PER_KT, M_PER_FT, MPS_PER_KT, ftToM, kmhToKt, ktToKmh, ktToMps, mToFt, mpsToKmh, mpsToKt,
} from '../../../shared/wind'

describe('unit factors are the exact legal definitions', () => {
  it('1 kt = 1852/3600 m/s (international nautical mile of 1852 m, 1929)', () => {
    expect(MPS_PER_KT).toBe(1852 / 3600)
    expect(ktToMps(1)).toBeCloseTo(0.514444444444, 12)
    expect(mpsToKt(1852 / 3600)).toBeCloseTo(1, 14)
  })

  it('1 ft = 0.3048 m exactly (international yard and pound agreement, 1959)', () => {
    expect(M_PER_FT).toBe(0.3048)
    expect(ftToM(1000)).toBeCloseTo(304.8, 12)
    expect(mToFt(0.3048)).toBeCloseTo(1, 14)
  })

  it('1 kt = 1.852 km/h and 1 m/s = 3.6 km/h (same definitions)', () => {
    expect(KMH_PER_KT).toBe(1.852)
    expect(ktToKmh(100)).toBeCloseTo(185.2, 12)
    expect(kmhToKt(185.2)).toBeCloseTo(100, 12)
    expect(mpsToKmh(10)).toBeCloseTo(36, 12)
  })

  it('100 ft is 30.48 m: the shear scale between "per 30 m" and "per 100 ft" (same definition)', () => {
    expect(ftToM(100)).toBeCloseTo(30.48, 12)
  })
})
