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
