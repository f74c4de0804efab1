/**
 * Liquid water from the IAPWS-IF97 Region 1 basic equation, the dimensionless Gibbs free
 * energy γ(π, τ) = g/(R·T) = Σ n_i·(7.1 − π)^I_i·(τ − 1.222)^J_i, with π = p/16.53 MPa and
 * τ = 1386 K/T (eq. 7), and the properties that follow from its derivatives (Table 3).
 *
 * Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997 for
 * the Thermodynamic Properties of Water and Steam, section 5.1; check values in Table 5.
 *
 * Cost: this sits on the simulation's hot path, so the powers of (7.1 − π) and
 * (τ − 1.222) are built by repeated multiplication (powers.ts) into module-level scratch
 * arrays, every γ derivative comes out of one pass over the 34 terms, and a call
 * allocates only the object it returns. The scratch is shared module state; JavaScript
 * runs one call at a time per realm, so no call can see another's half-filled powers.
 */
import { WATER_SPECIFIC_GAS_CONSTANT } from './constants.ts';
import { requireInRange } from './errors.ts';
import {
  REGION1_PI_SHIFT,
  REGION1_REDUCING_PRESSURE_PA,
  REGION1_REDUCING_TEMPERATURE_K,
  REGION1_TAU_SHIFT,
  REGION1_TERMS,
} from './if97-region1-coefficients.ts';
import { saturationPressurePa } from './if97-region4.ts';
import { fillPowers, paddedPowerCount } from './powers.ts';

/** Liquid-water properties at one (T, p), SI. */
export interface LiquidState {
  readonly specificVolumeM3PerKg: number;
  readonly densityKgM3: number;
  readonly enthalpyJPerKg: number;
  readonly internalEnergyJPerKg: number;
  readonly entropyJPerKgK: number;
  readonly isobaricHeatCapacityJPerKgK: number;
  readonly speedOfSoundMPerS: number;
  /** Isobaric cubic expansion coefficient α_v = (1/v)(∂v/∂T)_p, 1/K. */
  readonly expansivityPerK: number;
}

const CORRELATION = 'IAPWS-IF97 Region 1';
const MIN_TEMPERATURE_K = 273.15;
const MAX_TEMPERATURE_K = 623.15;
const MAX_PRESSURE_PA = 100e6;
const R = WATER_SPECIFIC_GAS_CONSTANT;

const TERM_COUNT = REGION1_TERMS.length;
const MAX_I = Math.max(...REGION1_TERMS.map(([i]) => i));
const MIN_J = Math.min(...REGION1_TERMS.map(([, j]) => j));
const MAX_J = Math.max(...REGION1_TERMS.map(([, j]) => j));

// Scratch: piPowers[k] = (7.1 − π)^k; tauPowers[TAU_ZERO + j] = (τ − 1.222)^j, j may be < 0.
const PI_POWER_COUNT = MAX_I + 1;
const TAU_NEGATIVE_COUNT = 1 - MIN_J;
const TAU_POSITIVE_COUNT = MAX_J + 1;
const TAU_ZERO = paddedPowerCount(TAU_NEGATIVE_COUNT) - 1;
const piPowers = new Float64Array(paddedPowerCount(PI_POWER_COUNT));
const tauPowers = new Float64Array(TAU_ZERO + paddedPowerCount(TAU_POSITIVE_COUNT));

// Per-term tables: n_i, where (7.1 − π)^I_i and (τ − 1.222)^J_i sit in the scratch
// arrays, and the integer factors the derivatives bring down.
const N = Float64Array.from(REGION1_TERMS, ([, , n]) => n);
const PI_POWER_INDEX = Int32Array.from(REGION1_TERMS, ([i]) => i);
const TAU_POWER_INDEX = Int32Array.from(REGION1_TERMS, ([, j]) => TAU_ZERO + j);
const I = Float64Array.from(REGION1_TERMS, ([i]) => i);
const J = Float64Array.from(REGION1_TERMS, ([, j]) => j);
const I_I_MINUS_1 = Float64Array.from(REGION1_TERMS, ([i]) => i * (i - 1));
const J_J_MINUS_1 = Float64Array.from(REGION1_TERMS, ([, j]) => j * (j - 1));
const I_J = Float64Array.from(REGION1_TERMS, ([i, j]) => i * j);

/**
 * Fills the scratch powers of a = 7.1 − π and b = τ − 1.222. Inside Region 1,
 * a ≥ 7.1 − 100/16.53 ≈ 1.05 and b ≥ 1386/623.15 − 1.222 ≈ 1.002, so neither is zero.
 */
function fillRegion1Powers(a: number, b: number): void {
  fillPowers(a, piPowers, 0, 1, PI_POWER_COUNT);
  fillPowers(b, tauPowers, TAU_ZERO, 1, TAU_POSITIVE_COUNT);
  fillPowers(1 / b, tauPowers, TAU_ZERO, -1, TAU_NEGATIVE_COUNT);
}

/**
 * Properties of liquid water from IF97 Region 1 (eq. 7 and the relations of Table 3):
 * v = (R·T/p)·π·γ_π, h = R·T·τ·γ_τ, u = R·T·(τ·γ_τ − π·γ_π), s = R·(τ·γ_τ − γ),
 * c_p = −R·τ²·γ_ττ, w² = R·T·γ_π² / [(γ_π − τ·γ_πτ)²/(τ²·γ_ττ) − γ_ππ],
 * α_v = (1 − τ·γ_πτ/γ_π)/T.
 *
 * @param temperatureK temperature T, K; valid 273.15 ≤ T ≤ 623.15 K
 * @param pressurePa   pressure p, Pa; valid p_sat(T) ≤ p ≤ 100 MPa (p_sat from IF97 eq. 30).
 *                     Staying in the liquid is the caller's job: there is no metastable
 *                     margin below p_sat.
 * @throws OutOfRangeError outside either range
 * Source: IAPWS R7-97(2012), eq. 7, Tables 2–3; check values in Table 5.
 * Worked value: T = 300 K, p = 3 MPa → v = 0.100215168e-2 m³/kg, h = 115.331273 kJ/kg,
 * c_p = 4.17301218 kJ/(kg·K), w = 1507.73921 m/s (Table 5).
 */
export function region1(temperatureK: number, pressurePa: number): LiquidState {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  requireInRange(
    CORRELATION,
    'pressure',
    pressurePa,
    saturationPressurePa(temperatureK),
    MAX_PRESSURE_PA,
    'Pa',
  );
  const pi = pressurePa / REGION1_REDUCING_PRESSURE_PA;
  const tau = REGION1_REDUCING_TEMPERATURE_K / temperatureK;
  const a = REGION1_PI_SHIFT - pi;
  const b = tau - REGION1_TAU_SHIFT;
  fillRegion1Powers(a, b);

  // Σ t_i, Σ I·t_i, … with t_i = n_i·a^I_i·b^J_i; the a and b factors the derivatives
  // take off are divided out once at the end.
  let g = 0;
  let gI = 0;
  let gII = 0;
  let gJ = 0;
  let gJJ = 0;
  let gIJ = 0;
  for (let k = 0; k < TERM_COUNT; k++) {
    const t = N[k]! * piPowers[PI_POWER_INDEX[k]!]! * tauPowers[TAU_POWER_INDEX[k]!]!;
    g += t;
    gI += I[k]! * t;
    gII += I_I_MINUS_1[k]! * t;
    gJ += J[k]! * t;
    gJJ += J_J_MINUS_1[k]! * t;
    gIJ += I_J[k]! * t;
  }
  const aInverse = 1 / a;
  const bInverse = 1 / b;
  const gammaPi = -gI * aInverse;
  const gammaPiPi = gII * aInverse * aInverse;
  const gammaTau = gJ * bInverse;
  const gammaTauTau = gJJ * bInverse * bInverse;
  const gammaPiTau = -gIJ * aInverse * bInverse;

  const rt = R * temperatureK;
  const specificVolume = (rt * gammaPi) / REGION1_REDUCING_PRESSURE_PA;
  const tauGammaTau = tau * gammaTau;
  const tau2GammaTauTau = tau * tau * gammaTauTau;
  const cross = gammaPi - tau * gammaPiTau;
  return {
    specificVolumeM3PerKg: specificVolume,
    densityKgM3: 1 / specificVolume,
    enthalpyJPerKg: rt * tauGammaTau,
    internalEnergyJPerKg: rt * (tauGammaTau - pi * gammaPi),
    entropyJPerKgK: R * (tauGammaTau - g),
    isobaricHeatCapacityJPerKgK: -R * tau2GammaTauTau,
    speedOfSoundMPerS: Math.sqrt(
      (rt * gammaPi * gammaPi) / ((cross * cross) / tau2GammaTauTau - gammaPiPi),
    ),
    expansivityPerK: (1 - (tau * gammaPiTau) / gammaPi) / temperatureK,
  };
}
