import { describe, expect, it } from 'vitest'
import { uvToWind, windToUV } from '../../../shared/wind'

describe('wind vector components (meteorological convention, WMO)', () => {
  it('10 m/s from 225° gives u = v = +7.0711 m/s (MetPy wind_components documentation example)', () => {
    const { u, v } = windToUV(225, 10)
    expect(u).toBeCloseTo(7.0711, 4)
    expect(v).toBeCloseTo(7.0711, 4)
  })

  it('15 kt from 240° gives u 12.9904, v 7.5 kt (MetPy 1.6.3 wind_components, per DOMAIN.md)', () => {
    const { u, v } = windToUV(240, 15)
    expect(u).toBeCloseTo(12.9904, 4)
    expect(v).toBeCloseTo(7.5, 4)
  })

  it('20 m/s from 360° gives (0, -20) and 25 kt from 090° gives (-25, 0) (MetPy 1.6.3 wind_components)', () => {
    const north = windToUV(360, 20)
    expect(north.u).toBeCloseTo(0, 10)
    expect(north.v).toBeCloseTo(-20, 10)
    const east = windToUV(90, 25)
    expect(east.u).toBeCloseTo(-25, 10)
    expect(east.v).toBeCloseTo(0, 10)
  })

  it('back from u and v: 360 for north and 0 for calm (MetPy wind_direction convention)', () => {
    expect(uvToWind(0, -20)).toEqual({ directionDeg: 360, speed: 20 })
    expect(uvToWind(0, 0)).toEqual({ directionDeg: 0, speed: 0 })
    const sw = uvToWind(7.0710678, 7.0710678)
    expect(sw.directionDeg).toBeCloseTo(225, 6)
    expect(sw.speed).toBeCloseTo(10, 6)
  })
})
