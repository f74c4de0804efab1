/**
 * The saturation line of water from IAPWS-IF97 Region 4: the basic equation (eq. 29),
 * solved for pressure (eq. 30) and for temperature (eq. 31), and the slope dp_sat/dT.
 *
 * Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997 for
 * the Thermodynamic Properties of Water and Steam, section 8.1. Reference values
 * p* = 1 MPa, T* = 1 K.
 */
import { requireInRange } from './errors.ts';
import { REGION4_N } from './if97-region4-coefficients.ts';

const { n1, n2, n3, n4, n5, n6, n7, n8, n9, n10 } = REGION4_N;

const CORRELATION = 'IAPWS-IF97 Region 4';
const REFERENCE_PRESSURE_PA = 1e6;
const MIN_TEMPERATURE_K = 273.15;
const MAX_TEMPERATURE_K = 647.096;
const MIN_PRESSURE_PA = 611.213;
const MAX_PRESSURE_PA = 22.064e6;

/**
 * Saturation pressure of water, IF97 eq. 30:
 * p_sat/p* = [2C / (−B + √(B² − 4AC))]⁴ with ϑ = T/T* + n9/(T/T* − n10),
 * A = ϑ² + n1·ϑ + n2, B = n3·ϑ² + n4·ϑ + n5, C = n6·ϑ² + n7·ϑ + n8.
 *
 * @param temperatureK temperature T, K; valid 273.15 ≤ T ≤ 647.096 K
 * @returns saturation pressure, Pa
 * @throws OutOfRangeError outside the range
 * Source: IAPWS R7-97(2012), eq. 30; check values in Table 35.
 * Worked value: T = 500 K → 2.63889776 MPa (Table 35).
 */
export function saturationPressurePa(temperatureK: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  const theta = temperatureK + n9 / (temperatureK - n10);
  const theta2 = theta * theta;
  const a = theta2 + n1 * theta + n2;
  const b = n3 * theta2 + n4 * theta + n5;
  const c = n6 * theta2 + n7 * theta + n8;
  const x = (2 * c) / (-b + Math.sqrt(b * b - 4 * a * c));
  const x2 = x * x;
  return x2 * x2 * REFERENCE_PRESSURE_PA;
}

/**
 * Slope of the saturation line dp_sat/dT, the analytic derivative of IF97 eq. 30.
 * With β = (p_sat/p*)^¼, eq. 29 reads A·β² + B·β + C = 0; differentiating it at fixed
 * coefficients gives dβ/dϑ = −(A′·β² + B′·β + C′)/(2A·β + B), where A′ = 2ϑ + n1,
 * B′ = 2n3·ϑ + n4, C′ = 2n6·ϑ + n7, and dϑ/dT = 1 − n9/(T − n10)². Then
 * dp_sat/dT = 4β³·p*·(dβ/dϑ)·(dϑ/dT).
 *
 * @param temperatureK temperature T, K; valid 273.15 ≤ T ≤ 647.096 K
 * @returns dp_sat/dT, Pa/K
 * @throws OutOfRangeError outside the range
 * Source: derived here from IAPWS R7-97(2012), eqs. 29–30.
 * Worked value: T = 373.15 K → 3.61919e3 Pa/K.
 */
export function saturationPressureSlopePaPerK(temperatureK: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  const shift = temperatureK - n10;
  const theta = temperatureK + n9 / shift;
  const theta2 = theta * theta;
  const a = theta2 + n1 * theta + n2;
  const b = n3 * theta2 + n4 * theta + n5;
  const c = n6 * theta2 + n7 * theta + n8;
  const beta = (2 * c) / (-b + Math.sqrt(b * b - 4 * a * c));
  const dBetaDTheta =
    -((2 * theta + n1) * beta * beta + (2 * n3 * theta + n4) * beta + (2 * n6 * theta + n7)) /
    (2 * a * beta + b);
  const dThetaDT = 1 - n9 / (shift * shift);
  return 4 * beta * beta * beta * REFERENCE_PRESSURE_PA * dBetaDTheta * dThetaDT;
}

/**
 * Saturation temperature of water, IF97 eq. 31 (the backward form of eq. 29):
 * T_sat/T* = [n10 + D − √((n10 + D)² − 4(n9 + n10·D))]/2 with β = (p/p*)^¼,
 * E = β² + n3·β + n6, F = n1·β² + n4·β + n7, G = n2·β² + n5·β + n8,
 * D = 2G / (−F − √(F² − 4EG)).
 *
 * @param pressurePa pressure p, Pa; valid 611.213 Pa ≤ p ≤ 22.064 MPa
 * @returns saturation temperature, K
 * @throws OutOfRangeError outside the range
 * Source: IAPWS R7-97(2012), eq. 31; check values in Table 36.
 * Worked value: p = 1 MPa → 453.035632 K (Table 36).
 */
export function saturationTemperatureK(pressurePa: number): number {
  requireInRange(CORRELATION, 'pressure', pressurePa, MIN_PRESSURE_PA, MAX_PRESSURE_PA, 'Pa');
  const beta = Math.sqrt(Math.sqrt(pressurePa / REFERENCE_PRESSURE_PA));
  const beta2 = beta * beta;
  const e = beta2 + n3 * beta + n6;
  const f = n1 * beta2 + n4 * beta + n7;
  const g = n2 * beta2 + n5 * beta + n8;
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g));
  const s = n10 + d;
  return (s - Math.sqrt(s * s - 4 * (n9 + n10 * d))) / 2;
}
