/**
 * Trade units of the YAML files → SI, for the units the project's conversions
 * (../units.ts) do not already cover. Each factor is exact by definition (SI Brochure,
 * 9th ed., 2019; the bar is 10⁵ Pa exactly). Dividing by an exact power of ten rounds once,
 * so 84 mm gives 0.084 m, not 0.08400000000000001 m.
 */
import { fromCelsius } from '../units.ts';

export { fromCelsius as celsiusToK, fromMl as millilitresToM3 } from '../units.ts';

const celsiusToK = fromCelsius;

/** 1 mm = 1e-3 m: millimetresToM(84) = 0.084. */
export const millimetresToM = (mm: number): number => mm / 1e3;

/** 1 g = 1e-3 kg: gramsToKg(180) = 0.18. */
export const gramsToKg = (g: number): number => g / 1e3;

/** 1 bar = 1e5 Pa: barToPa(1.5) = 150000. */
export const barToPa = (bar: number): number => bar * 1e5;

/** 1 g/mL = 1000 kg/m³: gramsPerMlToKgPerM3(0.38) = 380. */
export const gramsPerMlToKgPerM3 = (gPerMl: number): number => gPerMl * 1e3;

/** g of water per g of coffee is a ratio: the same number in kg/kg. */
export const gramsPerGramToKgPerKg = (gPerG: number): number => gPerG;

/** °F → K: (°F − 32) × 5/9 + 273.15 (NIST SP 811, B.8): fahrenheitToK(212) = 373.15. */
export const fahrenheitToK = (f: number): number => celsiusToK(((f - 32) * 5) / 9);
