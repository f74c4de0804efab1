import { describe, expect, it } from 'vitest';
import {
  barToPa,
  celsiusToK,
  gramsPerGramToKgPerKg,
  gramsPerMlToKgPerM3,
  gramsToKg,
  millilitresToM3,
  millimetresToM,
} from '../../generator/content/units.ts';

// Exact SI definitions (SI Brochure, 9th ed.): 1 mL = 1e-6 m³, 1 mm = 1e-3 m, 1 g = 1e-3 kg,
// 1 bar = 1e5 Pa, T/K = t/°C + 273.15. Tolerance: relative 2.2e-16 (one rounding).
describe('trade units → SI', () => {
  it.each([
    ['millilitresToM3(260)', millilitresToM3(260), 2.6e-4],
    ['millilitresToM3(200)', millilitresToM3(200), 2e-4],
    ['millimetresToM(84)', millimetresToM(84), 0.084],
    ['gramsToKg(180)', gramsToKg(180), 0.18],
    ['barToPa(1.5)', barToPa(1.5), 150_000],
    ['celsiusToK(20)', celsiusToK(20), 293.15],
    ['celsiusToK(-40)', celsiusToK(-40), 233.15],
    ['gramsPerMlToKgPerM3(0.38)', gramsPerMlToKgPerM3(0.38), 380],
    ['gramsPerGramToKgPerKg(1.2)', gramsPerGramToKgPerKg(1.2), 1.2],
  ])('%s = %s', (_call, actual, expected) => {
    const relative = Math.abs(actual - expected) / Math.abs(expected);
    expect(relative, `actual ${actual}, expected ${expected}`).toBeLessThanOrEqual(Number.EPSILON);
  });
});
