/**
 * Coefficients of the IAPWS 2008 viscosity correlation for ordinary water.
 * Source: IAPWS R12-08, Release on the IAPWS Formulation 2008 for the Viscosity of
 * Ordinary Water Substance (M. L. Huber et al., J. Phys. Chem. Ref. Data 38, 101 (2009)),
 * Table 1 (H_i of the dilute-gas term μ̄0) and Table 2 (non-zero H_ij of the
 * finite-density term μ̄1). Reference values T* = 647.096 K, ρ* = 322 kg/m³,
 * μ* = 1e-6 Pa·s.
 */

/** H_0…H_3 of μ̄0(T̄) = 100·√T̄ / Σ H_i/T̄^i. */
export const VISCOSITY_H: readonly number[] = [1.67752, 2.20462, 0.6366564, -0.241605];

/** Non-zero H_ij of μ̄1(T̄, ρ̄) = exp[ρ̄·Σ_i (1/T̄ − 1)^i Σ_j H_ij (ρ̄ − 1)^j], as [i, j, H_ij]. */
export const VISCOSITY_HIJ: readonly (readonly [number, number, number])[] = [
  [0, 0, 5.20094e-1],
  [1, 0, 8.50895e-2],
  [2, 0, -1.08374],
  [3, 0, -2.89555e-1],
  [0, 1, 2.22531e-1],
  [1, 1, 9.99115e-1],
  [2, 1, 1.88797],
  [3, 1, 1.26613],
  [5, 1, 1.20573e-1],
  [0, 2, -2.81378e-1],
  [1, 2, -9.06851e-1],
  [2, 2, -7.72479e-1],
  [3, 2, -4.89837e-1],
  [4, 2, -2.5704e-1],
  [0, 3, 1.61913e-1],
  [1, 3, 2.57399e-1],
  [0, 4, -3.25372e-2],
  [3, 4, 6.98452e-2],
  [4, 5, 8.72102e-3],
  [3, 6, -4.35673e-3],
  [5, 6, -5.93264e-4],
];

export const VISCOSITY_REFERENCE_TEMPERATURE_K = 647.096;
export const VISCOSITY_REFERENCE_DENSITY_KG_M3 = 322;
export const VISCOSITY_REFERENCE_PA_S = 1e-6;
