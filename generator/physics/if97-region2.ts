/**
 * Specific volume of water vapour from the IAPWS-IF97 Region 2 basic equation (eq. 15):
 * γ(π, τ) = γ°(π, τ) + γʳ(π, τ) with π = p/1 MPa, τ = 540 K/T. Only v is implemented,
 * because only v″ is needed (for the Clausius–Clapeyron enthalpy of vaporisation,
 * if97-vaporisation.ts); v needs the ideal-gas part only through γ°_π = 1/π, so neither
 * the ideal-gas coefficients (Table 10) nor any τ-derivative are required.
 *
 * Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997 for
 * the Thermodynamic Properties of Water and Steam, section 6.1; check values in Table 15.
 */
import { WATER_SPECIFIC_GAS_CONSTANT } from './constants.ts';
import { OutOfRangeError, requireInRange } from './errors.ts';
import {
  B23_N,
  REGION2_REDUCING_PRESSURE_PA,
  REGION2_REDUCING_TEMPERATURE_K,
  REGION2_RESIDUAL_TERMS,
  REGION2_TAU_SHIFT,
} from './if97-region2-coefficients.ts';
import { saturationPressurePa } from './if97-region4.ts';
import { fillPowers, paddedPowerCount } from './powers.ts';

const CORRELATION = 'IAPWS-IF97 Region 2';
const MIN_TEMPERATURE_K = 273.15;
const SATURATION_LIMIT_K = 623.15;
const B23_LIMIT_K = 863.15;
const MAX_TEMPERATURE_K = 1073.15;
const MAX_PRESSURE_PA = 100e6;

const TERM_COUNT = REGION2_RESIDUAL_TERMS.length;
const PI_POWER_COUNT = Math.max(...REGION2_RESIDUAL_TERMS.map(([i]) => i)); // π^(I−1), I ≥ 1
const TAU_POWER_COUNT = Math.max(...REGION2_RESIDUAL_TERMS.map(([, j]) => j)) + 1;
const piPowers = new Float64Array(paddedPowerCount(PI_POWER_COUNT));
const tauPowers = new Float64Array(paddedPowerCount(TAU_POWER_COUNT));

const N_TIMES_I = Float64Array.from(REGION2_RESIDUAL_TERMS, ([i, , n]) => n * i);
const PI_POWER_INDEX = Int32Array.from(REGION2_RESIDUAL_TERMS, ([i]) => i - 1);
const TAU_POWER_INDEX = Int32Array.from(REGION2_RESIDUAL_TERMS, ([, j]) => j);

/** Upper pressure bound of Region 2 at T: p_sat (IF97 eq. 30), then B23 (eq. 5), then 100 MPa. */
function maxPressurePa(temperatureK: number): number {
  if (temperatureK <= SATURATION_LIMIT_K) return saturationPressurePa(temperatureK);
  if (temperatureK <= B23_LIMIT_K) {
    const { n1, n2, n3 } = B23_N;
    return (n1 + n2 * temperatureK + n3 * temperatureK * temperatureK) * 1e6;
  }
  return MAX_PRESSURE_PA;
}

/**
 * Specific volume of steam, IF97 Region 2: v = (R·T/p)·π·(γ°_π + γʳ_π) with γ°_π = 1/π and
 * γʳ_π = Σ n_i·I_i·π^(I_i − 1)·(τ − 0.5)^J_i (Table 12).
 *
 * @param temperatureK temperature T, K; valid 273.15 ≤ T ≤ 1073.15 K
 * @param pressurePa   pressure p, Pa; valid 0 < p ≤ p_sat(T) for T ≤ 623.15 K,
 *                     p ≤ p_B23(T) for 623.15 < T ≤ 863.15 K, p ≤ 100 MPa above
 * @returns specific volume v, m³/kg
 * @throws OutOfRangeError outside the range
 * Source: IAPWS R7-97(2012), eq. 15, Tables 11–12; check values in Table 15.
 * Worked value: T = 300 K, p = 3.5 kPa → v = 39.4913866 m³/kg (Table 15).
 */
export function region2SpecificVolumeM3PerKg(temperatureK: number, pressurePa: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  const maxPressure = maxPressurePa(temperatureK);
  if (!(pressurePa > 0 && pressurePa <= maxPressure)) {
    throw new OutOfRangeError(CORRELATION, 'pressure', pressurePa, 0, maxPressure, 'Pa', true);
  }
  const pi = pressurePa / REGION2_REDUCING_PRESSURE_PA;
  const tau = REGION2_REDUCING_TEMPERATURE_K / temperatureK;
  fillPowers(pi, piPowers, 0, 1, PI_POWER_COUNT);
  fillPowers(tau - REGION2_TAU_SHIFT, tauPowers, 0, 1, TAU_POWER_COUNT);
  let residualGammaPi = 0;
  for (let k = 0; k < TERM_COUNT; k++) {
    residualGammaPi +=
      N_TIMES_I[k]! * piPowers[PI_POWER_INDEX[k]!]! * tauPowers[TAU_POWER_INDEX[k]!]!;
  }
  return ((WATER_SPECIFIC_GAS_CONSTANT * temperatureK) / pressurePa) * (1 + pi * residualGammaPi);
}
