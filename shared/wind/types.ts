/**
 * Public types of the Veerline wind engine.
 *
 * Conventions (WMO / ICAO): directions are degrees TRUE the wind blows FROM, clockwise from north
 * (360 = north, 0 = calm in outputs). u is positive towards the east, v towards the north.
 * Heights in outputs are metres above ground level (AGL). Every name carries its unit.
 */

export type HeightReference = 'AGL' | 'MSL'

/** One level of a wind profile as filed. Exactly one height field and exactly one speed field. */
export interface LevelInput {
  /** Height in metres (AGL or MSL according to `heightReference`). */
  heightM?: number
  /** Height in feet (AGL or MSL according to `heightReference`). */
  heightFt?: number
  /** Pressure level in hPa, converted with the ICAO standard atmosphere (needs `elevationM`). */
  pressureHpa?: number
  /** Direction the wind blows from, degrees true, 0..360 (ignored when the speed is 0). */
  directionDeg: number
  speedKt?: number
  speedMps?: number
  speedKmh?: number
  /** Optional gust, only on the surface level (within 30 m of the ground). At most one gust field. */
  gustKt?: number
  gustMps?: number
  gustKmh?: number
}

export interface RunwayEndInput {
  /** Runway designator such as "18", "09L", "36R". */
  designator: string
  /** True heading of the runway end (direction of travel on take-off / landing), degrees. */
  trueHeadingDeg: number
  /** Magnetic heading, when known (see `magneticDeclinationDeg` / `magneticFromTrue`). */
  magneticHeadingDeg?: number
}

/**
 * Upper bounds of the vertical shear intensity classes in kt per 100 ft (inclusive).
 * Above `strongMaxKtPer100ft` is severe. Defaults: light 0-4, moderate 5-8, strong 9-12, severe > 12
 * (ICAO Circular 186 / Doc 9817 table, from memory: editable on purpose).
 */
export interface ShearClassBoundsKtPer100ft {
  lightMaxKtPer100ft: number
  moderateMaxKtPer100ft: number
  strongMaxKtPer100ft: number
}

export interface ProfileAnalysisInput {
  levels: LevelInput[]
  heightReference: HeightReference
  /** Airfield elevation above mean sea level in metres: needed for MSL heights and for pressure levels. */
  elevationM?: number
  runwayEnds?: RunwayEndInput[]
  /** Partial override of the default shear class bounds. */
  shearClassBoundsKtPer100ft?: Partial<ShearClassBoundsKtPer100ft>
}

export interface ValidationIssue {
  /** Index of the offending level (or runway end, per `field`) in the input array. */
  index?: number
  /** 1-based line number of a coded report or imported file. */
  line?: number
  /** Dotted path of the field, e.g. "levels[3].speedKt", "runwayEnds[0].designator", "windGroup". */
  field: string
  message: string
}

export type WarningCode
  = | 'levels-merged'
    | 'no-surface-level'
    | 'short-of-600m'
    | 'standard-atmosphere'
    | 'designator-mismatch'
    | 'convective-unavailable'

export interface WindWarning {
  code: WarningCode
  message: string
  /** Level indices (input order) concerned, when any. */
  indices?: number[]
  /** Runway designator concerned, when any. */
  designator?: string
}

/** A level after validation, conversion to AGL metres and knots, sorted by height. */
export interface NormalisedLevel {
  heightAglM: number
  /** 0 for calm, otherwise (0, 360]. */
  directionDeg: number
  speedKt: number
  uKt: number
  vKt: number
  gustKt?: number
  /** Index of the level in the input array. */
  sourceIndex: number
}

/** A point of the 0-600 m analysis grid (every 30 m plus the original levels), linear in u and v. */
export interface GridPoint {
  heightAglM: number
  uKt: number
  vKt: number
  speedKt: number
  directionDeg: number
  /** Input index when the point is an original level, otherwise null (interpolated). */
  sourceIndex: number | null
}

export interface Coverage {
  lowestAglM: number
  highestAglM: number
  /** A level within 30 m of the ground exists. */
  startsAtSurface: boolean
  reaches600m: boolean
  reaches6km: boolean
}

export type ShearIntensity = 'light' | 'moderate' | 'strong' | 'severe'

export interface ShearLayer {
  baseM: number
  topM: number
  /** |vector wind difference| over the layer, scaled to 100 ft (30.48 m). */
  shearKtPer100ft: number
  /** |vector wind difference| over the layer, scaled to 30 m. */
  shearMpsPer30m: number
  intensity: ShearIntensity
}

export interface VectorDifference {
  baseM: number
  topM: number
  /** Magnitude of the vector wind difference top minus base. */
  vectorDiffKt: number
  vectorDiffMps: number
  duKt: number
  dvKt: number
  /** Mean shear rate over the whole layer. */
  meanShearKtPer100ft: number
}

export type TurnSense = 'veering' | 'backing' | 'none'

export interface ShearAnalysis {
  /** 30 m layers of the 0-600 m ladder that the data covers (partial at the ends of the coverage). */
  layers: ShearLayer[]
  strongestLayer: ShearLayer | null
  /** Surface level to 600 m; null (see `surfaceTo600mReason`) without a surface level or data to 600 m. */
  surfaceTo600m: VectorDifference | null
  surfaceTo600mReason: string | null
  /** Magnitude of the accumulated turn of direction with height over the covered part of 0-600 m. */
  directionTurnDeg: number
  /** Signed turn: positive = clockwise with height (veering). */
  directionTurnSignedDeg: number
  turnSense: TurnSense
  turnBaseM: number | null
  turnTopM: number | null
  classBounds: ShearClassBoundsKtPer100ft
}

export type CrosswindSide = 'left' | 'right' | 'none'

export interface RunwayComponents {
  /** Negative = tailwind. */
  headwindKt: number
  /** Positive = from the right. */
  crosswindKt: number
  crosswindSide: CrosswindSide
}

export interface SurfaceComponents extends RunwayComponents {
  heightAglM: number
  gustHeadwindKt?: number
  gustCrosswindKt?: number
}

export interface HeightComponents extends RunwayComponents {
  heightAglM: number
}

/** Change of the headwind component met by a steady aircraft along a path, in path order. */
export interface PathChange {
  /** Largest fall of the headwind component between two points met in order (airspeed loss), >= 0. */
  maxAirspeedLossKt: number
  /** Largest rise of the headwind component between two points met in order (airspeed gain), >= 0. */
  maxAirspeedGainKt: number
  lossFromHeightM: number | null
  lossToHeightM: number | null
  gainFromHeightM: number | null
  gainToHeightM: number | null
  /** Loss or gain of 15 kt or more (airport wind shear alerting practice following ICAO Annex 3). */
  exceedsAlertingPractice15Kt: boolean
  /** Heights of the path ends actually covered by data (the path is 600 m to 0 or 0 to 600 m). */
  startHeightM: number
  endHeightM: number
  /** The data covers the whole path from the surface level to 600 m. */
  complete: boolean
}

export interface DesignatorCheck {
  designatorHeadingDeg: number
  /** Smallest angle between designator heading and magnetic heading, 0..180. */
  differenceDeg: number
  /** More than 10 degrees apart. */
  mismatch: boolean
}

export interface RunwayEndAnalysis {
  designator: string
  trueHeadingDeg: number
  magneticHeadingDeg?: number
  designatorCheck: DesignatorCheck | null
  /** Components at the surface level, or null without a surface level (see `surfaceReason`). */
  surface: SurfaceComponents | null
  surfaceReason: string | null
  /** Components at every grid point. */
  byHeight: HeightComponents[]
  /** 600 m down to the ground; null when fewer than two grid points exist in 0-600 m. */
  arrival: PathChange | null
  /** Ground up to 600 m; null when fewer than two grid points exist in 0-600 m. */
  departure: PathChange | null
}

export interface WindVectorKt {
  uKt: number
  vKt: number
  speedKt: number
  /** Direction the vector points FROM (wind convention); for storm motion the direction it comes from. */
  directionDeg: number
}

export interface ConvectiveAvailable {
  available: true
  meanWind0to6kmKt: WindVectorKt
  /** Magnitude of the wind difference between 6 km and the surface level. */
  bulkShear0to6kmKt: number
  bulkShear0to6kmVectorKt: WindVectorKt
  bunkersRight: WindVectorKt
  bunkersLeft: WindVectorKt
  /** Storm-relative helicity relative to the right mover. */
  srh0to1kmM2s2: number
  srh0to3kmM2s2: number
  /** Streamwise part of the 0-500 m horizontal vorticity relative to the right mover, -1..1. */
  streamwiseShare0to500m: number
}

export interface ConvectiveUnavailable {
  available: false
  reason: string
}

export type ConvectiveContext = ConvectiveAvailable | ConvectiveUnavailable

export interface ProfileAnalysis {
  levels: NormalisedLevel[]
  grid: GridPoint[]
  coverage: Coverage
  surface: NormalisedLevel | null
  surfaceReason: string | null
  shear: ShearAnalysis
  runwayEnds: RunwayEndAnalysis[]
  convective: ConvectiveContext
  warnings: WindWarning[]
}

// ---- Building blocks ----

export interface UV {
  u: number
  v: number
}

export interface WindDirSpeed {
  /** 0 for calm, otherwise (0, 360]. */
  directionDeg: number
  speed: number
}

export interface DeclinationQuery {
  latDeg: number
  lonDeg: number
  /** Height above mean sea level in metres (used as height above the ellipsoid; the difference is negligible). */
  elevationM: number
  date: Date
}

export interface HelicityResult {
  positiveM2s2: number
  negativeM2s2: number
  totalM2s2: number
}

export interface StormMotionMps {
  rightUMps: number
  rightVMps: number
  leftUMps: number
  leftVMps: number
  meanUMps: number
  meanVMps: number
  /** Shear vector from the 0-0.5 km mean wind to the 5.5-6 km mean wind. */
  shearUMps: number
  shearVMps: number
}

// ---- Coded reports ----

export type CodedReportKind = 'METAR' | 'SPECI' | 'TAF' | 'unknown'

export interface CodedSurfaceWind {
  /** The group as written, e.g. "32012G22KT". */
  group: string
  /** null for VRB. 0 for calm. */
  directionDeg: number | null
  variable: boolean
  calm: boolean
  speedKt: number
  /** The speed was coded P99KT / P49MPS: the true speed is at least this. */
  speedAtLeast: boolean
  gustKt?: number
  gustAtLeast?: boolean
  unit: 'KT' | 'MPS'
  /** From the dddVddd group (clockwise from first to second), when present. */
  variableFromDeg?: number
  variableToDeg?: number
}

export interface CodedShearLevel {
  group: string
  heightAglFt: number
  heightAglM: number
  directionDeg: number
  speedKt: number
  unit: 'KT' | 'MPS'
}

export interface CodedRunwayShear {
  allRunways: boolean
  /** Runway designators named in WS Rnn groups, e.g. ["24", "07R"]. */
  runways: string[]
}

export interface CodedReport {
  kind: CodedReportKind
  /** First surface wind group of the report (the prevailing one for a TAF). */
  surfaceWind: CodedSurfaceWind | null
  /** Later wind groups (TAF change groups), in order. */
  laterWinds: CodedSurfaceWind[]
  /** TAF WShhh/dddffKT groups. */
  shearLevels: CodedShearLevel[]
  /** METAR WS Rnn / WS ALL RWY groups; null when none. */
  runwayShear: CodedRunwayShear | null
  /**
   * Levels ready for `analyseProfile` with heightReference 'AGL': the surface wind at 10 m (WMO standard
   * anemometer height, common practice) when its direction is known, then the WS levels.
   */
  levels: LevelInput[]
  notes: string[]
}
