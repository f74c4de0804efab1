/**
 * Hydraulic resistances R = Δp / Q (Pa·s/m³) of the two paths the coffee takes: the
 * funnel tube (laminar pipe flow) and the coffee bed (Darcy flow through a porous bed).
 * They add in series.
 */

/**
 * Darcy's law for a uniform bed: Q = k·A·Δp / (μ·L), so R = μ·L / (k·A).
 *
 * @param viscosityPaS  dynamic viscosity μ of the water, Pa·s
 * @param bedHeightM    bed depth L along the flow, m
 * @param permeabilityM2 Darcy permeability k, m²
 * @param bedAreaM2     cross-section A, m²
 * Valid for creeping flow through the pores (pore Reynolds number ≪ 1), which holds for
 * coffee beds at stovetop flow rates of a few mL/s.
 * Source: H. Darcy (1856), Les fontaines publiques de la ville de Dijon; any porous-media
 * text (e.g. Bear, Dynamics of Fluids in Porous Media, eq. 5.1.5).
 * Worked value: μ = 3.15e-4 Pa·s, L = 0.015 m, k = 1e-12 m², A = 2.463e-3 m²
 * → R = 1.918e9 Pa·s/m³ (2 mL/s needs 3.84 kPa).
 */
export function darcyBedResistance(
  viscosityPaS: number,
  bedHeightM: number,
  permeabilityM2: number,
  bedAreaM2: number,
): number {
  return (viscosityPaS * bedHeightM) / (permeabilityM2 * bedAreaM2);
}

/**
 * Hagen–Poiseuille resistance of a straight round tube in laminar flow:
 * R = 128·μ·ℓ / (π·d⁴).
 *
 * @param viscosityPaS dynamic viscosity μ, Pa·s
 * @param lengthM      tube length ℓ, m
 * @param diameterM    inner diameter d, m
 * Valid for fully developed laminar flow (Re = 4ρQ/(πμd) < ~2000; a stovetop tube carries
 * Re of a few hundred at most). Source: e.g. White, Fluid Mechanics, 7th ed., eq. 6.44.
 * Worked value: μ = 1.0016e-3 Pa·s, ℓ = 0.043 m, d = 0.007 m → R = 7.318e5 Pa·s/m³.
 */
export function poiseuilleTubeResistance(
  viscosityPaS: number,
  lengthM: number,
  diameterM: number,
): number {
  const d2 = diameterM * diameterM;
  return (128 * viscosityPaS * lengthM) / (Math.PI * d2 * d2);
}
