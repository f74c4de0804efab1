/**
 * Coefficients of the Dormand–Prince 5(4) pair "RK5(4)7M" (the method of the DOPRI5 code).
 *
 * Sources:
 * - Butcher tableau, 5th-order weights b and embedded 4th-order weights b̂:
 *   J. R. Dormand and P. J. Prince, "A family of embedded Runge–Kutta formulae",
 *   J. Comput. Appl. Math. 6 (1980) 19–26, method RK5(4)7M; reproduced in E. Hairer,
 *   S. P. Nørsett and G. Wanner, Solving Ordinary Differential Equations I, 2nd ed.
 *   (Springer, 1993), §II.5.
 * - Dense output: Hairer, Nørsett & Wanner, §II.6, as coded in the DOPRI5 routine's CONTD5
 *   (coefficients D1…D7, attributed there to L. F. Shampine, "Some practical Runge–Kutta
 *   formulas", Math. Comp. 46 (1986) 135–150).
 *
 * Seven stages; the 7th stage is evaluated at the accepted solution ("first same as last",
 * FSAL), so its derivative is the next step's first stage: A7j = Bj.
 *
 * Error weights: Ej = Bj − B̂j (5th-order minus 4th-order weight); the local error estimate
 * of a step of size h is h·Σ Ej·kj. E2 = 0 (both weight vectors skip stage 2).
 *
 * Dense output on [t0, t0 + h], θ = (t − t0)/h, θ' = 1 − θ:
 *   y(θ) = r1 + θ·(r2 + θ'·(r3 + θ·(r4 + θ'·r5)))
 * with r1 = y0, r2 = y1 − y0, r3 = h·k1 − r2, r4 = r2 − h·k7 − r3,
 *      r5 = h·(D1·k1 + D3·k3 + D4·k4 + D5·k5 + D6·k6 + D7·k7).
 * It is a continuous extension of order 4 that matches y0, y1, and the derivatives k1, k7 at
 * both ends (so the interpolant is C¹ across steps).
 *
 * All values are exact rationals as published; the tableau test checks the order conditions.
 */

/** Nodes cᵢ (c1 = 0, c7 = 1). */
export const C2 = 1 / 5;
export const C3 = 3 / 10;
export const C4 = 4 / 5;
export const C5 = 8 / 9;

/** Stage coefficients aᵢⱼ (row i uses k1…k(i−1)); rows sum to cᵢ. */
export const A21 = 1 / 5;

export const A31 = 3 / 40;
export const A32 = 9 / 40;

export const A41 = 44 / 45;
export const A42 = -56 / 15;
export const A43 = 32 / 9;

export const A51 = 19372 / 6561;
export const A52 = -25360 / 2187;
export const A53 = 64448 / 6561;
export const A54 = -212 / 729;

export const A61 = 9017 / 3168;
export const A62 = -355 / 33;
export const A63 = 46732 / 5247;
export const A64 = 49 / 176;
export const A65 = -5103 / 18656;

/** 5th-order weights bⱼ (b2 = b7 = 0); also row 7 of the tableau (FSAL). */
export const B1 = 35 / 384;
export const B3 = 500 / 1113;
export const B4 = 125 / 192;
export const B5 = -2187 / 6784;
export const B6 = 11 / 84;

/** Embedded 4th-order weights b̂ⱼ (b̂2 = 0), kept for reference and for the tableau test. */
export const BHAT1 = 5179 / 57600;
export const BHAT3 = 7571 / 16695;
export const BHAT4 = 393 / 640;
export const BHAT5 = -92097 / 339200;
export const BHAT6 = 187 / 2100;
export const BHAT7 = 1 / 40;

/** Error weights Eⱼ = bⱼ − b̂ⱼ, as printed in DOPRI5. */
export const E1 = 71 / 57600;
export const E3 = -71 / 16695;
export const E4 = 71 / 1920;
export const E5 = -17253 / 339200;
export const E6 = 22 / 525;
export const E7 = -1 / 40;

/** Dense-output coefficients of r5 (DOPRI5 CONTD5; D2 = 0). */
export const D1 = -12715105075 / 11282082432;
export const D3 = 87487479700 / 32700410799;
export const D4 = -10690763975 / 1880347072;
export const D5 = 701980252875 / 199316789632;
export const D6 = -1453857185 / 822651844;
export const D7 = 69997945 / 29380423;
