import { WindValidationError } from './errors'

// ICAO standard atmosphere (Doc 7488) constants.
const T0_K = 288.15
const P0_HPA = 1013.25
const LAPSE_K_PER_M = 0.0065
const G0 = 9.80665
const R_AIR = 287.05287
const EXPONENT = (R_AIR * LAPSE_K_PER_M) / G0 // 0.190263
const TROPOPAUSE_M = 11000
const T11_K = T0_K - LAPSE_K_PER_M * TROPOPAUSE_M // 216.65 K
const P11_HPA = P0_HPA * Math.pow(T11_K / T0_K, 1 / EXPONENT) // 226.32 hPa
const UPPER_LIMIT_M = 20000

/**
 * Pressure altitude in metres above mean sea level for a pressure in hPa, ICAO standard atmosphere:
 * troposphere H = (T0/L)[1 - (p/p0)^(RL/g0)], isothermal layer above 11 km. Valid up to 20 km.
 */
export function pressureToHeightM(pressureHpa: number): number {
  if (typeof pressureHpa !== 'number' || !Number.isFinite(pressureHpa) || pressureHpa <= 0) {
    throw new WindValidationError([{ field: 'pressureHpa', message: 'pressure must be a positive number of hPa' }])
  }
  if (pressureHpa >= P11_HPA) return (T0_K / LAPSE_K_PER_M) * (1 - Math.pow(pressureHpa / P0_HPA, EXPONENT))
  return TROPOPAUSE_M + ((R_AIR * T11_K) / G0) * Math.log(P11_HPA / pressureHpa)
}

/** Inverse of `pressureToHeightM` (hPa for a pressure altitude in metres, up to 20 km). */
export function heightToPressureHpa(heightM: number): number {
  if (typeof heightM !== 'number' || !Number.isFinite(heightM) || heightM > UPPER_LIMIT_M) {
    throw new WindValidationError([{ field: 'heightM', message: 'height must be a number up to 20 000 m' }])
  }
  if (heightM <= TROPOPAUSE_M) return P0_HPA * Math.pow(1 - (LAPSE_K_PER_M * heightM) / T0_K, 1 / EXPONENT)
  return P11_HPA * Math.exp((-G0 * (heightM - TROPOPAUSE_M)) / (R_AIR * T11_K))
}

/** Gas constant of dry air used by the hypsometric equation, J/(kg·K) (AMS Glossary, "hypsometric equation"). */
export const RD_J_PER_KG_K = 287.05
export const G0_MPS2 = G0

/**
 * Height above the reference pressure's level, in metres, by the ICAO standard atmosphere referred to another
 * reference pressure: what an altimeter set to QNH (or QFE) shows, H = (T0/L)[1 - (p/ref)^(RL/g0)] (troposphere).
 */
export function heightAboveReferenceM(pressureHpa: number, referenceHpa: number): number {
  return (T0_K / LAPSE_K_PER_M) * (1 - Math.pow(pressureHpa / referenceHpa, EXPONENT))
}

/** Pressure at an elevation in the standard atmosphere referred to QNH (inverse of `heightAboveReferenceM`). */
export function pressureAtElevationHpa(qnhHpa: number, elevationM: number): number {
  return qnhHpa * Math.pow(1 - (LAPSE_K_PER_M * elevationM) / T0_K, 1 / EXPONENT)
}

/**
 * Thickness in metres of the layer from p1 up to p2 (hPa) with the mean temperature of the layer in kelvin:
 * the hypsometric equation Δz = (Rd·T̄/g0)·ln(p1/p2). Air temperature stands in for the virtual temperature:
 * no humidity is filed (the difference is under about 1 %).
 */
export function hypsometricThicknessM(p1Hpa: number, p2Hpa: number, meanTemperatureK: number): number {
  return ((RD_J_PER_KG_K * meanTemperatureK) / G0) * Math.log(p1Hpa / p2Hpa)
}
