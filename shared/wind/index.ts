/**
 * Veerline wind engine: runway components, shear in the lowest 600 m and convective context.
 * Plain TypeScript: functions in, numbers out. The only error thrown is `WindValidationError`.
 *
 * Main entry: `analyseProfile(input)`. Building blocks are exported for routes, forms and tests.
 */
export type * from './types'
export { WindValidationError } from './errors'
export {
  MPS_PER_KT, M_PER_FT, KMH_PER_KT, KMH_PER_MPS,
  ktToMps, mpsToKt, ktToKmh, kmhToKt, mpsToKmh, kmhToMps, ftToM, mToFt,
} from '../units'
export { normaliseHeadingDeg, signedAngleDiffDeg } from './angles'
export { windToUV, uvToWind } from './vector'
export { windAtHeightAglM, type WindAtHeight } from './at-height'
export {
  runwayComponents, designatorMismatch, designatorHeadingDeg, reciprocalHeadingDeg, DESIGNATOR_TOLERANCE_DEG,
} from './runway'
export {
  pressureToHeightM, heightToPressureHpa, heightAboveReferenceM, pressureAtElevationHpa, hypsometricThicknessM, RD_J_PER_KG_K,
} from './atmosphere'
export { fFactorOfPath, samplePath, G_MPS2, FFACTOR_HAZARD, FFACTOR_AVERAGE_M, FFACTOR_STEP_M } from './ffactor'
export { magneticDeclinationDeg, magneticFromTrue, trueFromMagnetic, WMM2025_START, WMM2025_END } from './magnetic'
export { runwayTrueBearingDeg, thresholdDistanceM } from './geodesy'
export { stormRelativeHelicity, bunkersStormMotion, streamwiseVorticityShare, BUNKERS_DEVIATION_MPS } from './convective'
export { parseCodedReport } from './coded'
export {
  normaliseProfile, DEFAULT_SHEAR_CLASS_BOUNDS_KT_PER_100FT, SURFACE_LEVEL_MAX_AGL_M, MAX_SPEED_KT, MAX_HEIGHT_AGL_M,
  DEFAULT_PATH_SETTINGS, SURFACE_BELOW_ELEVATION_M,
} from './validate'
export { analyseProfile, classifyShear, pathChange, GRID_STEP_M, GRID_TOP_M, ALERTING_PRACTICE_KT } from './analyse'
