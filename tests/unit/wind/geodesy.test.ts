import geodesic from 'geographiclib-geodesic'
import { describe, expect, it } from 'vitest'
import { WindValidationError, runwayTrueBearingDeg } from '../../../shared/wind'

describe('runway true bearing by the geodesic inverse (geographiclib-geodesic, WGS84)', () => {
  it('(-30°, 0°) to (29.9°, 179.8°): azi1 161.89052473633° (Karney 2013, J. Geodesy 87:43, inverse example)', () => {
    expect(runwayTrueBearingDeg(-30, 0, 29.9, 179.8)).toBeCloseTo(161.89052473633, 9)
  })

  it('the same line backwards starts at azi2 + 180 = 198.09073724574° (Karney 2013, azi2 18.09073724574°)', () => {
    expect(runwayTrueBearingDeg(29.9, 179.8, -30, 0)).toBeCloseTo(198.09073724574, 9)
  })

  it('the library gives s12 19989832.827610 m for that line (Karney 2013)', () => {
    expect(geodesic.Geodesic.WGS84.Inverse(-30, 0, 29.9, 179.8).s12).toBeCloseTo(19989832.82761, 5)
  })

  // The GeodTest line as published (more digits than a double holds, so kept as text).
  const GEODTEST = '18.725775553796 0 98.927919777265 18.724785210853172866 .006615636046166963 98.930043600815390181 706.2676803'.split(' ').map(Number)

  it('a 706 m line, runway-sized: azi1 98.927919777265° (Karney GeodTest data line)', () => {
    expect(runwayTrueBearingDeg(GEODTEST[0]!, GEODTEST[1]!, GEODTEST[3]!, GEODTEST[4]!)).toBeCloseTo(GEODTEST[2]!, 9)
    const r = geodesic.Geodesic.WGS84.Inverse(GEODTEST[0]!, GEODTEST[1]!, GEODTEST[3]!, GEODTEST[4]!)
    expect(r.s12).toBeCloseTo(GEODTEST[6]!, 6)
    expect(r.azi2).toBeCloseTo(GEODTEST[5]!, 9)
  })

  it('the direct problem from 40°N, azimuth 30°, 10 000 km ends at 41.79331020506°, 137.84490004377° (Karney 2013)', () => {
    const d = geodesic.Geodesic.WGS84.Direct(40, 0, 30, 10e6)
    expect(d.lat2).toBeCloseTo(41.79331020506, 9)
    expect(d.lon2).toBeCloseTo(137.84490004377, 9)
    // and the inverse back gives the starting azimuth
    expect(runwayTrueBearingDeg(40, 0, d.lat2!, d.lon2!)).toBeCloseTo(30, 9)
  })

  it('refuses coincident thresholds and latitudes past the pole with its own error', () => {
    expect(() => runwayTrueBearingDeg(10, 10, 10, 10)).toThrow(WindValidationError)
    expect(() => runwayTrueBearingDeg(91, 0, 0, 0)).toThrow(WindValidationError)
  })
})
