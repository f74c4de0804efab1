/**
 * Dynamic viscosity of water and steam, IAPWS R12-08, without the critical enhancement.
 */
import { requireInRange } from './errors.ts';
import {
  VISCOSITY_H,
  VISCOSITY_HIJ,
  VISCOSITY_REFERENCE_DENSITY_KG_M3,
  VISCOSITY_REFERENCE_PA_S,
  VISCOSITY_REFERENCE_TEMPERATURE_K,
} from './viscosity-coefficients.ts';

const CORRELATION = 'IAPWS R12-08 viscosity';
const MIN_TEMPERATURE_K = 273.15;
const MAX_TEMPERATURE_K = 1173.15;
const MAX_DENSITY_KG_M3 = 1250;

const [H0, H1, H2, H3] = VISCOSITY_H as [number, number, number, number];
const HIJ_I = Int32Array.from(VISCOSITY_HIJ, ([i]) => i);
const HIJ_J = Int32Array.from(VISCOSITY_HIJ, ([, j]) => j);
const HIJ = Float64Array.from(VISCOSITY_HIJ, ([, , h]) => h);
const HIJ_COUNT = HIJ.length;
const temperaturePowers = new Float64Array(6); // (1/T̄ − 1)^i, i = 0…5
const densityPowers = new Float64Array(7); // (ρ̄ − 1)^j, j = 0…6

/**
 * Dynamic viscosity μ = μ*·μ̄0(T̄)·μ̄1(T̄, ρ̄) (R12-08 eq. 10 with the critical factor
 * μ̄2 = 1), where T̄ = T/647.096 K, ρ̄ = ρ/322 kg/m³,
 * μ̄0 = 100·√T̄ / Σ_{i=0..3} H_i/T̄^i (eq. 11) and
 * μ̄1 = exp[ρ̄·Σ_{i=0..5} (1/T̄ − 1)^i·Σ_{j=0..6} H_ij·(ρ̄ − 1)^j] (eq. 12).
 * Leaving out μ̄2 is what the release recommends for industrial use; it matters only very
 * near the critical point (about 645.9–650.8 K and 246–405 kg/m³, from memory), far from
 * any state this engine meets.
 *
 * @param temperatureK temperature T, K; valid 273.15 ≤ T ≤ 1173.15 K
 * @param densityKgM3  density ρ, kg/m³ (from an equation of state at the state's p, T);
 *                     valid 0 ≤ ρ ≤ 1250 kg/m³ (ρ = 0 is the dilute-gas limit μ*·μ̄0). The release bounds its range in p (to
 *                     1000 MPa) and T; a (T, ρ) function cannot check p, so this bound is
 *                     this module's own and includes the release's densest check point
 *                     (1200 kg/m³ at 298.15 K).
 * @returns μ, Pa·s
 * @throws OutOfRangeError outside either range
 * Source: IAPWS R12-08, eqs. 10–12, Tables 1–2; check values in Table 4.
 * Worked value: T = 298.15 K, ρ = 998 kg/m³ → 889.735100 µPa·s (Table 4).
 */
export function waterViscosityPaS(temperatureK: number, densityKgM3: number): number {
  requireInRange(
    CORRELATION,
    'temperature',
    temperatureK,
    MIN_TEMPERATURE_K,
    MAX_TEMPERATURE_K,
    'K',
  );
  requireInRange(CORRELATION, 'density', densityKgM3, 0, MAX_DENSITY_KG_M3, 'kg/m³');
  const t = temperatureK / VISCOSITY_REFERENCE_TEMPERATURE_K;
  const d = densityKgM3 / VISCOSITY_REFERENCE_DENSITY_KG_M3;
  const tInverse = 1 / t;
  const dilute = (100 * Math.sqrt(t)) / (H0 + tInverse * (H1 + tInverse * (H2 + tInverse * H3)));

  const x = tInverse - 1;
  const y = d - 1;
  temperaturePowers[0] = 1;
  for (let i = 1; i < temperaturePowers.length; i++) {
    temperaturePowers[i] = temperaturePowers[i - 1]! * x;
  }
  densityPowers[0] = 1;
  for (let j = 1; j < densityPowers.length; j++) densityPowers[j] = densityPowers[j - 1]! * y;
  let sum = 0;
  for (let k = 0; k < HIJ_COUNT; k++) {
    sum += HIJ[k]! * temperaturePowers[HIJ_I[k]!]! * densityPowers[HIJ_J[k]!]!;
  }
  return VISCOSITY_REFERENCE_PA_S * dilute * Math.exp(d * sum);
}
