/**
 * Properties of water on the saturation line from the auxiliary equations of IAPWS
 * SR1-86(1992): saturated-liquid and saturated-vapour density, the enthalpies h′ and h″,
 * and the enthalpy of vaporisation h″ − h′ from the Clausius–Clapeyron form.
 *
 * Source: IAPWS SR1-86(1992), Revised Supplementary Release on Saturation Properties of
 * Ordinary Water Substance; W. Wagner & A. Pruß, J. Phys. Chem. Ref. Data 22, 783 (1993).
 * All functions are valid along the whole saturation line, 273.16 K ≤ T ≤ 647.096 K
 * (triple point to critical point), with τ = 1 − T/T_c and θ = T/T_c.
 */
import {
  WATER_CRITICAL_DENSITY_KG_M3,
  WATER_CRITICAL_PRESSURE_PA,
  WATER_CRITICAL_TEMPERATURE_K,
} from './constants.ts';
import { requireInRange } from './errors.ts';
import {
  SR186_A,
  SR186_ALPHA0_J_PER_KG,
  SR186_B,
  SR186_C,
  SR186_D,
} from './saturation-coefficients.ts';

const { a1, a2, a3, a4, a5, a6 } = SR186_A;
const { b1, b2, b3, b4, b5, b6 } = SR186_B;
const { c1, c2, c3, c4, c5, c6 } = SR186_C;
const { dAlpha, d1, d2, d3, d4, d5 } = SR186_D;

const CORRELATION = 'IAPWS SR1-86(1992)';
const MIN_TEMPERATURE_K = 273.16;
const TC = WATER_CRITICAL_TEMPERATURE_K;

/** τ = 1 − T/T_c after checking the range. */
function reducedTau(temperatureK: number): number {
  requireInRange(CORRELATION, 'temperature', temperatureK, MIN_TEMPERATURE_K, TC, 'K');
  return 1 - temperatureK / TC;
}

/** ρ′/ρ_c, SR1-86 eq. (2). */
function reducedLiquidDensity(tau: number): number {
  const third = Math.cbrt(tau); // τ^(1/3)
  const twoThirds = third * third;
  const tau2 = tau * tau;
  const tau5 = tau2 * tau2 * tau;
  const tau7 = tau5 * tau2;
  const tau14 = tau7 * tau7;
  const tau36 = tau14 * tau14 * tau7 * tau;
  return (
    1 +
    b1 * third +
    b2 * twoThirds +
    b3 * tau * twoThirds + // τ^(5/3)
    b4 * tau5 * third + // τ^(16/3)
    b5 * tau14 * third + // τ^(43/3)
    b6 * tau36 * twoThirds // τ^(110/3)
  );
}

/** ln(ρ″/ρ_c), SR1-86 eq. (3). */
function lnReducedVapourDensity(tau: number): number {
  const third = Math.cbrt(tau); // τ^(2/6)
  const sixth = Math.sqrt(third); // τ^(1/6)
  const tau3 = tau * tau * tau;
  const tau6 = tau3 * tau3;
  return (
    c1 * third +
    c2 * third * third + // τ^(4/6)
    c3 * tau * third + // τ^(8/6)
    c4 * tau3 + // τ^(18/6)
    c5 * tau6 * sixth + // τ^(37/6)
    c6 * tau6 * tau3 * tau * tau * third * third * sixth // τ^(71/6) = τ^11·τ^(5/6)
  );
}

/**
 * dp_sat/dT from SR1-86 eq. (1), ln(p/p_c) = (T_c/T)·Σ a_i τ^t_i:
 * dp/dT = −(p/T)·[ln(p/p_c) + Σ a_i t_i τ^(t_i − 1)].
 */
function auxiliarySaturationSlopePaPerK(temperatureK: number, tau: number): number {
  const s = Math.sqrt(tau);
  const tau2 = tau * tau;
  const tau3 = tau2 * tau;
  const tau6 = tau3 * tau3;
  const sum = tau * (a1 + a2 * s + a3 * tau2 + a4 * tau2 * s + a5 * tau3 + a6 * tau6 * s);
  const sumDerivative =
    a1 + 1.5 * a2 * s + 3 * a3 * tau2 + 3.5 * a4 * tau2 * s + 4 * a5 * tau3 + 7.5 * a6 * tau6 * s;
  const lnReducedPressure = (TC / temperatureK) * sum;
  const pressurePa = WATER_CRITICAL_PRESSURE_PA * Math.exp(lnReducedPressure);
  return -(pressurePa / temperatureK) * (lnReducedPressure + sumDerivative);
}

/** α = α0·(d_α + d1·θ⁻¹⁹ + d2·θ + d3·θ^4.5 + d4·θ⁵ + d5·θ^54.5), SR1-86 eq. (4), J/kg. */
function auxiliaryAlphaJPerKg(temperatureK: number): number {
  const theta = temperatureK / TC;
  return (
    SR186_ALPHA0_J_PER_KG *
    (dAlpha +
      d1 * Math.pow(theta, -19) +
      d2 * theta +
      d3 * Math.pow(theta, 4.5) +
      d4 * Math.pow(theta, 5) +
      d5 * Math.pow(theta, 54.5))
  );
}

/**
 * Density of saturated liquid water ρ′, SR1-86 eq. (2):
 * ρ′/ρ_c = 1 + b1·τ^(1/3) + b2·τ^(2/3) + b3·τ^(5/3) + b4·τ^(16/3) + b5·τ^(43/3) + b6·τ^(110/3).
 *
 * @param temperatureK temperature T, K; valid 273.16 ≤ T ≤ 647.096 K
 * @returns ρ′, kg/m³
 * @throws OutOfRangeError outside the range
 * Source: IAPWS SR1-86(1992), eq. (2); check point in Table 1.
 * Worked value: T = 373.1243 K → 958.365 kg/m³ (Table 1).
 */
export function saturatedLiquidDensityKgM3(temperatureK: number): number {
  return WATER_CRITICAL_DENSITY_KG_M3 * reducedLiquidDensity(reducedTau(temperatureK));
}

/**
 * Density of saturated water vapour ρ″, SR1-86 eq. (3):
 * ln(ρ″/ρ_c) = c1·τ^(2/6) + c2·τ^(4/6) + c3·τ^(8/6) + c4·τ^(18/6) + c5·τ^(37/6) + c6·τ^(71/6).
 *
 * @param temperatureK temperature T, K; valid 273.16 ≤ T ≤ 647.096 K
 * @returns ρ″, kg/m³
 * @throws OutOfRangeError outside the range
 * Source: IAPWS SR1-86(1992), eq. (3); check point in Table 1.
 * Worked value: T = 373.1243 K → 0.597586 kg/m³ (Table 1).
 */
export function saturatedVapourDensityKgM3(temperatureK: number): number {
  return WATER_CRITICAL_DENSITY_KG_M3 * Math.exp(lnReducedVapourDensity(reducedTau(temperatureK)));
}

/**
 * Specific enthalpy of saturated liquid h′ = α + (T/ρ′)·dp/dT, SR1-86 eqs. (4) and (6),
 * with dp/dT from eq. (1) and ρ′ from eq. (2). Zero of enthalpy: the liquid's internal
 * energy at the triple point (as IAPWS-95 and IF97).
 *
 * @param temperatureK temperature T, K; valid 273.16 ≤ T ≤ 647.096 K
 * @returns h′, J/kg
 * @throws OutOfRangeError outside the range
 * Source: IAPWS SR1-86(1992), eq. (6); check point in Table 1.
 * Worked value: T = 373.1243 K → 419.05 kJ/kg (Table 1).
 */
export function saturatedLiquidEnthalpyJPerKg(temperatureK: number): number {
  const tau = reducedTau(temperatureK);
  const rhoLiquid = WATER_CRITICAL_DENSITY_KG_M3 * reducedLiquidDensity(tau);
  return (
    auxiliaryAlphaJPerKg(temperatureK) +
    (temperatureK * auxiliarySaturationSlopePaPerK(temperatureK, tau)) / rhoLiquid
  );
}

/**
 * Specific enthalpy of saturated vapour h″ = α + (T/ρ″)·dp/dT, SR1-86 eqs. (4) and (7),
 * with dp/dT from eq. (1) and ρ″ from eq. (3).
 *
 * @param temperatureK temperature T, K; valid 273.16 ≤ T ≤ 647.096 K
 * @returns h″, J/kg
 * @throws OutOfRangeError outside the range
 * Source: IAPWS SR1-86(1992), eq. (7); check point in Table 1.
 * Worked value: T = 373.1243 K → 2675.7 kJ/kg (Table 1).
 */
export function saturatedVapourEnthalpyJPerKg(temperatureK: number): number {
  const tau = reducedTau(temperatureK);
  const rhoVapour = WATER_CRITICAL_DENSITY_KG_M3 * Math.exp(lnReducedVapourDensity(tau));
  return (
    auxiliaryAlphaJPerKg(temperatureK) +
    (temperatureK * auxiliarySaturationSlopePaPerK(temperatureK, tau)) / rhoVapour
  );
}

/**
 * Enthalpy of vaporisation h_fg = h″ − h′ = T·(dp/dT)·(1/ρ″ − 1/ρ′), the Clausius–Clapeyron
 * form of SR1-86 eqs. (6)–(7) (the auxiliary quantity α cancels), with dp/dT from eq. (1),
 * ρ′ from eq. (2) and ρ″ from eq. (3). Zero at the critical point.
 *
 * @param temperatureK temperature T, K; valid 273.16 ≤ T ≤ 647.096 K
 * @returns h_fg, J/kg
 * @throws OutOfRangeError outside the range
 * Source: IAPWS SR1-86(1992), eqs. (1)–(3), (6)–(7).
 * Worked value: T = 373.1243 K → 2256.6 kJ/kg (Table 1: 2675.7 − 419.05).
 */
export function vaporisationEnthalpyJPerKg(temperatureK: number): number {
  const tau = reducedTau(temperatureK);
  const rhoLiquid = WATER_CRITICAL_DENSITY_KG_M3 * reducedLiquidDensity(tau);
  const rhoVapour = WATER_CRITICAL_DENSITY_KG_M3 * Math.exp(lnReducedVapourDensity(tau));
  return (
    temperatureK *
    auxiliarySaturationSlopePaPerK(temperatureK, tau) *
    (1 / rhoVapour - 1 / rhoLiquid)
  );
}
