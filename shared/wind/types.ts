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
  /**
   * Pressure level in hPa. Placed by the hypsometric equation where temperatures are given, else by the standard
   * atmosphere referred to the QNH (or station pressure), else by the standard atmosphere (with a warning).
   * With a height given as well, the height wins.
   */
  pressureHpa?: number
  /** Air temperature at the level, °C (used to place pressure levels). */
  temperatureC?: number
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
  /** QNH of the time, hPa: pressure levels are placed as an altimeter set to it shows. */
  qnhHpa?: number
  /** Station pressure (QFE) at the airfield elevation, hPa; preferred to the QNH when both are given. */
  surfacePressureHpa?: number
  /** Approach and departure geometry (per airfield); defaults in `DEFAULT_PATH_SETTINGS`. */
  paths?: Partial<PathSettings>
}

/** Geometry of the final approach and initial climb used for the corridor check and the F-factor. */
export interface PathSettings {
  /** Length of the final approach / initial climb corridor from the threshold, NM (about 3 NM: common practice). */
  corridorNm: number
  arrivalGlidePathDeg: number
  arrivalTrueAirspeedKt: number
  departureClimbDeg: number
  departureTrueAirspeedKt: number
}

/** The geometry used, with the heights at the corridor's far end. */
export interface PathGeometry extends PathSettings {
  arrivalCorridorTopM: number
  departureCorridorTopM: number
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
    | 'surface-below-elevation'

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
  /** Air temperature as filed, °C. */
  temperatureC?: number
  /** How the height was found: as filed, or from the pressure (hypsometric, QNH, station pressure, standard). */
  heightFrom: HeightSource
  /** Index of the level in the input array. */
  sourceIndex: number
}

export type HeightSource = 'filed' | 'hypsometric' | 'qnh' | 'station-pressure' | 'standard-atmosphere'

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
  /** Final approach corridor (within `corridorNm` of the threshold): the 15 kt check applies here. */
  arrivalCorridor: PathChange | null
  /** Initial climb corridor (within `corridorNm` of the threshold). */
  departureCorridor: PathChange | null
  /** 1 km averaged F-factor along each path, horizontal wind only. */
  fFactor: { arrival: FFactorResult | null, departure: FFactorResult | null }
}

/**
 * Largest 1 km averaged F-factor along a path, horizontal wind only: no vertical wind is known, so the downdraft
 * term (-w/V) is left out. F = (Wx at the stretch's end - Wx at its start) x GS / (g x 1000 m), Wx the tailwind
 * along the runway heading, GS = true airspeed - headwind at the stretch's middle height. Positive = performance
 * decreasing.
 */
export interface FFactorResult {
  basis: 'horizontal-wind-only'
  maxF: number
  /** Distances from the threshold along the track, in the direction of flight (an arrival starts farther out). */
  startTrackM: number
  endTrackM: number
  startHeightM: number
  endHeightM: number
  groundSpeedKt: number
  /** Stretches the data covered / stretches of the path. */
  stretchesCovered: number
  stretchesTotal: number
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
  paths: PathGeometry
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
export type CodedSpeedUnit = 'KT' | 'MPS' | 'KMH'

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
  unit: CodedSpeedUnit
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
  unit: CodedSpeedUnit
}

export interface CodedRunwayShear {
  allRunways: boolean
  /** Runway designators named in WS Rnn / WS LDG RWYnn / WS TKOF RWYnn groups, e.g. ["24", "07R"]. */
  runways: string[]
  /** The groups as written, e.g. ["WS R24", "WS LDG RWY27"]. */
  groups: string[]
}

/** One period of a TAF that gives a wind: the opening conditions, an FM group or a BECMG group. */
export interface CodedPeriod {
  change: 'BASE' | 'FM' | 'BECMG'
  /** The group that opened the period as written ("FM121500", "BECMG 1218/1220"); "" for the opening conditions. */
  group: string
  /** ISO times (UTC); null when the report's times could not be read. */
  from: string | null
  to: string | null
  surfaceWind: CodedSurfaceWind | null
  shearLevels: CodedShearLevel[]
  runwayShear: CodedRunwayShear | null
  /** Levels of this period, as `CodedReport.levels`. */
  levels: LevelInput[]
  notes: string[]
}

export interface CodedReport {
  kind: CodedReportKind
  /** Station identifier (the four-letter location indicator after the report type), or null. */
  station: string | null
  /** METAR/SPECI observation time or TAF issue time, ISO UTC; null without a ddhhmmZ group. */
  observedAt: string | null
  /** TAF validity, ISO UTC. */
  validFrom: string | null
  validTo: string | null
  /** Minutes from `observedAt` to the `now` given to the parser; null without either. */
  ageMinutes: number | null
  /** First surface wind group of the report (the prevailing one for a TAF). */
  surfaceWind: CodedSurfaceWind | null
  /** Later wind groups (TAF change groups), in order. */
  laterWinds: CodedSurfaceWind[]
  /** TAF WShhh/dddffKT groups of the opening conditions. */
  shearLevels: CodedShearLevel[]
  /** METAR WS Rnn / WS ALL RWY groups; null when none. */
  runwayShear: CodedRunwayShear | null
  /** TAF periods that give a wind (BASE, FM, BECMG) in order; one BASE period for a METAR. */
  periods: CodedPeriod[]
  /**
   * Levels ready for `analyseProfile` with heightReference 'AGL': the surface wind at 10 m (WMO standard
   * anemometer height, common practice) when its direction is known, then the WS levels.
   */
  levels: LevelInput[]
  /** TEMPO and PROB groups (shown, not used) and other remarks on the reading. */
  notes: string[]
}
