/**
 * Ambient pressure from altitude in the standard atmosphere.
 */
import { STANDARD_ATMOSPHERE_PA } from './constants.ts';
import { requireInRange } from './errors.ts';

const CORRELATION = 'ISO 2533 standard atmosphere (troposphere)';
const MIN_ALTITUDE_M = -500;
const MAX_ALTITUDE_M = 11000;

/** L/T0 = 0.0065 K/m / 288.15 K, 1/m. */
const LAPSE_OVER_BASE_TEMPERATURE_PER_M = 2.25577e-5;
/** g0·M/(R*·L) = 9.80665·0.0289644/(8.31432·0.0065). */
const PRESSURE_EXPONENT = 5.25588;

/**
 * Pressure of the ISO 2533 standard atmosphere in the troposphere (constant lapse rate
 * L = 0.0065 K/m from T0 = 288.15 K, p0 = 101325 Pa):
 * p = 101325·(1 − 2.25577e-5·h)^5.25588 Pa.
 * h is the standard's geopotential altitude; below 11 km it differs from height above
 * sea level by under 0.2 %, which this engine neglects. Real weather moves the local
 * pressure by a few percent either way.
 *
 * @param altitudeM altitude h, m; valid −500 ≤ h ≤ 11 000 m (11 km is the top of the
 *                  standard's troposphere; −500 m covers the lowest dry land)
 * @returns p, Pa
 * @throws OutOfRangeError outside the range
 * Source: ISO 2533:1975 / ICAO standard atmosphere, troposphere layer.
 * Worked value: h = 1000 m → 89 874.6 Pa.
 */
export function ambientPressurePa(altitudeM: number): number {
  requireInRange(CORRELATION, 'altitude', altitudeM, MIN_ALTITUDE_M, MAX_ALTITUDE_M, 'm');
  return (
    STANDARD_ATMOSPHERE_PA *
    Math.pow(1 - LAPSE_OVER_BASE_TEMPERATURE_PER_M * altitudeM, PRESSURE_EXPONENT)
  );
}
