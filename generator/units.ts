/**
 * SI → trade units for output (CLI JSON, cards). Inside the engine everything is SI; these
 * are the only conversions out of it. US customary conversions are exact by definition
 * (NIST SP 811, Appendix B): 1 US fl oz = 29.5735295625 mL, 1 oz = 28.349523125 g,
 * 1 in = 25.4 mm, °F = °C × 9/5 + 32.
 */
import { CELSIUS_OFFSET_K } from './physics/constants.ts';

export const ML_PER_US_FL_OZ = 29.5735295625;
export const G_PER_OZ = 28.349523125;
export const MM_PER_IN = 25.4;
/** Pa per pound-force per square inch (NIST SP 811, B.8; exact to the digits given). */
export const PA_PER_PSI = 6894.757293168;
/** Metres per international foot (NIST SP 811, B.8; exact). */
export const M_PER_FT = 0.3048;

export const toCelsius = (k: number): number => k - CELSIUS_OFFSET_K;
export const toFahrenheit = (k: number): number => (k - CELSIUS_OFFSET_K) * 1.8 + 32;
export const fromCelsius = (c: number): number => c + CELSIUS_OFFSET_K;
export const fromFahrenheit = (f: number): number => ((f - 32) * 5) / 9 + CELSIUS_OFFSET_K;
export const toMl = (m3: number): number => m3 * 1e6;
export const toFlOz = (m3: number): number => (m3 * 1e6) / ML_PER_US_FL_OZ;
export const fromMl = (ml: number): number => ml * 1e-6;
export const toGrams = (kg: number): number => kg * 1e3;
export const toOunces = (kg: number): number => (kg * 1e3) / G_PER_OZ;
export const toMm = (m: number): number => m * 1e3;
export const toInches = (m: number): number => (m * 1e3) / MM_PER_IN;
export const toBar = (pa: number): number => pa / 1e5;
export const toPsi = (pa: number): number => pa / PA_PER_PSI;
export const toFeet = (m: number): number => m / M_PER_FT;
/** Temperature difference (K or °C) → °F difference. */
export const toFahrenheitDelta = (dk: number): number => dk * 1.8;

/** Rounds to `digits` decimals, turning -0 into 0 (stable JSON). */
export function round(value: number, digits = 0): number {
  const f = 10 ** digits;
  const r = Math.round(value * f) / f;
  return Object.is(r, -0) ? 0 : r;
}
