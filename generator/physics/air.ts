/**
 * Dry air as an ideal gas: molar heat capacities at constant pressure and volume.
 */
import {
  NASA_AIR_CP_COEFFICIENTS,
  NASA_AIR_MAX_TEMPERATURE_K,
  NASA_AIR_MIN_TEMPERATURE_K,
} from './air-coefficients.ts';
import { MOLAR_GAS_CONSTANT } from './constants.ts';
import { requireInRange } from './errors.ts';

const { a1, a2, a3, a4, a5, a6, a7 } = NASA_AIR_CP_COEFFICIENTS;
const CORRELATION = 'NASA Glenn polynomial for air';

/**
 * Ideal-gas isobaric molar heat capacity of dry air,
 * c_p° = R·(a1·T⁻² + a2·T⁻¹ + a3 + a4·T + a5·T² + a6·T³ + a7·T⁴).
 * The polynomial gives c_p°/R; R here is CODATA 2018 (the NASA tables used an earlier
 * CODATA value, which differs by less than 1e-5 relative).
 *
 * @param temperatureK temperature T, K; valid 200 ≤ T ≤ 1000 K
 * @returns c_p°, J/(mol·K)
 * @throws OutOfRangeError outside the range
 * Source: McBride, Zehe & Gordon, NASA/TP-2002-211556 (2002), species "Air", 200–1000 K.
 * Worked value: T = 300 K → 29.104 J/(mol·K), i.e. 1.0048 kJ/(kg·K) with M = 28.96546 g/mol
 * (NBS Circular 564: 1.005).
 */
export function airIsobaricMolarHeatCapacity(temperatureK: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    NASA_AIR_MIN_TEMPERATURE_K,
    NASA_AIR_MAX_TEMPERATURE_K,
    'K',
  );
  const t = temperatureK;
  const tInverse = 1 / t;
  const reduced = tInverse * (a2 + tInverse * a1) + a3 + t * (a4 + t * (a5 + t * (a6 + t * a7)));
  return MOLAR_GAS_CONSTANT * reduced;
}

/**
 * Ideal-gas isochoric molar heat capacity of dry air, c_v° = c_p° − R (Mayer's relation
 * for an ideal gas), with c_p° from airIsobaricMolarHeatCapacity.
 *
 * @param temperatureK temperature T, K; valid 200 ≤ T ≤ 1000 K
 * @returns c_v°, J/(mol·K)
 * @throws OutOfRangeError outside the range
 * Source: as airIsobaricMolarHeatCapacity.
 * Worked value: T = 300 K → 20.790 J/(mol·K), i.e. 0.7177 kJ/(kg·K) (NBS Circular 564: 0.718).
 */
export function airIsochoricMolarHeatCapacity(temperatureK: number): number {
  return airIsobaricMolarHeatCapacity(temperatureK) - MOLAR_GAS_CONSTANT;
}
