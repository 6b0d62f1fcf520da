// Client-side shapes of the briefing answer (GET /api/airfields/{code}/briefing), just what the screens read.
export type Side = 'left' | 'right' | 'none'
export type Components = { headwindKt: number, crosswindKt: number, crosswindSide: Side }
export type LevelPoint = { heightAglM: number, directionDeg: number, speedKt: number, sourceIndex: number, gustKt?: number }
export type EndLevel = Components & { heightAglM: number, sourceIndex: number }
export type WindVector = { uKt: number, vKt: number, speedKt: number, directionDeg: number }
export type LimitCheckView = {
  kind: string
  designator: string | null
  value: number
  limit: number
  unit: string
  excess: number
  state: 'exceeded' | 'near' | 'within'
  message: string
}
export type PathChangeView = {
  maxAirspeedLossKt: number
  maxAirspeedGainKt: number
  lossFromHeightM: number | null
  lossToHeightM: number | null
  gainFromHeightM: number | null
  gainToHeightM: number | null
  exceedsAlertingPractice15Kt: boolean
  complete: boolean
}
export type ConvectiveView = { available: false, reason: string } | {
  available: true
  meanWind0to6kmKt: WindVector
  bulkShear0to6kmKt: number
  bunkersRight: WindVector
  bunkersLeft: WindVector
  srh0to1kmM2s2: number
  srh0to3kmM2s2: number
  streamwiseShare0to500m: number
}
export type FeetStep = {
  heightAglFt: number
  heightAglM: number
  directionDeg: number
  speedKt: number
  components: { designator: string, headwindKt: number, crosswindKt: number }[]
}
