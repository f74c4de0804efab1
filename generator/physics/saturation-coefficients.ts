/**
 * Coefficients of the auxiliary equations for the saturation properties of water.
 * Source: IAPWS SR1-86(1992), Revised Supplementary Release on Saturation Properties of
 * Ordinary Water Substance (W. Wagner & A. Pruß, "International equations for the
 * saturation properties of ordinary water substance. Revised according to the
 * International Temperature Scale of 1990", J. Phys. Chem. Ref. Data 22, 783 (1993)).
 * Reference constants T_c = 647.096 K, p_c = 22.064 MPa, ρ_c = 322 kg/m³ are in
 * constants.ts.
 */

/** Vapour-pressure equation (1), a1…a6 of τ, τ^1.5, τ³, τ^3.5, τ⁴, τ^7.5. */
export const SR186_A = {
  a1: -7.85951783,
  a2: 1.84408259,
  a3: -11.7866497,
  a4: 22.6807411,
  a5: -15.9618719,
  a6: 1.80122502,
} as const;

/** Saturated-liquid density equation (2), b1…b6 of τ^(1/3), τ^(2/3), τ^(5/3), τ^(16/3), τ^(43/3), τ^(110/3). */
export const SR186_B = {
  b1: 1.99274064,
  b2: 1.09965342,
  b3: -0.510839303,
  b4: -1.75493479,
  b5: -45.5170352,
  b6: -6.7469445e5,
} as const;

/** Saturated-vapour density equation (3), c1…c6 of τ^(2/6), τ^(4/6), τ^(8/6), τ^(18/6), τ^(37/6), τ^(71/6). */
export const SR186_C = {
  c1: -2.0315024,
  c2: -2.6830294,
  c3: -5.38626492,
  c4: -17.2991605,
  c5: -44.7586581,
  c6: -63.9201063,
} as const;

/** Auxiliary quantity α for the enthalpy, equation (4), α0 = 1000 J/kg; of θ⁻¹⁹, θ, θ^4.5, θ⁵, θ^54.5. */
export const SR186_D = {
  dAlpha: -1135.905627715,
  d1: -5.65134998e-8,
  d2: 2690.66631,
  d3: 127.287297,
  d4: -135.003439,
  d5: 0.981825814,
} as const;

export const SR186_ALPHA0_J_PER_KG = 1000;
