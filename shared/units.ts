/** Exact conversion factors: international nautical mile 1852 m (1929), international foot 0.3048 m (1959). */
export const MPS_PER_KT = 1852 / 3600
export const M_PER_FT = 0.3048
export const KMH_PER_KT = 1.852
export const KMH_PER_MPS = 3.6

export const ktToMps = (speedKt: number): number => speedKt * MPS_PER_KT
export const mpsToKt = (speedMps: number): number => speedMps / MPS_PER_KT
export const ktToKmh = (speedKt: number): number => speedKt * KMH_PER_KT
export const kmhToKt = (speedKmh: number): number => speedKmh / KMH_PER_KT
export const mpsToKmh = (speedMps: number): number => speedMps * KMH_PER_MPS
export const kmhToMps = (speedKmh: number): number => speedKmh / KMH_PER_MPS
export const ftToM = (heightFt: number): number => heightFt * M_PER_FT
export const mToFt = (heightM: number): number => heightM / M_PER_FT
