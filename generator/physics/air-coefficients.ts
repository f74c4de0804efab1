/**
 * NASA Glenn 9-coefficient polynomial for the ideal-gas heat capacity of dry air, the
 * 200–1000 K interval: c_p°/R = a1·T⁻² + a2·T⁻¹ + a3 + a4·T + a5·T² + a6·T³ + a7·T⁴ (T in K).
 * Source: B. J. McBride, M. J. Zehe & S. Gordon, "NASA Glenn Coefficients for Calculating
 * Thermodynamic Properties of Individual Species", NASA/TP-2002-211556 (2002), species
 * "Air" (N2 78.084 %, O2 20.9476 %, Ar 0.9365 %, CO2 0.0319 % by mole; M = 28.9651159 g/mol).
 */
export const NASA_AIR_CP_COEFFICIENTS = {
  a1: 1.00995016e4,
  a2: -1.96827561e2,
  a3: 5.00915511,
  a4: -5.76101373e-3,
  a5: 1.06685993e-5,
  a6: -7.94029797e-9,
  a7: 2.18523191e-12,
} as const;

export const NASA_AIR_MIN_TEMPERATURE_K = 200;
export const NASA_AIR_MAX_TEMPERATURE_K = 1000;
