import { describe, expect, it } from 'vitest';
import { ambientPressurePa } from '../../generator/physics/atmosphere.ts';
import { STANDARD_GRAVITY } from '../../generator/physics/constants.ts';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { expectRelative } from '../helpers/close.ts';

// ISO 2533 base values: T0 = 288.15 K, p0 = 101325 Pa, lapse rate L = 0.0065 K/m,
// molar mass of air M = 0.0289644 kg/mol, gas constant R* = 8.31432 J/(mol·K).
const T0 = 288.15;
const LAPSE = 0.0065;
const M = 0.0289644;
const R_STAR = 8.31432;

describe('ISO 2533 / ICAO standard atmosphere, troposphere', () => {
  it('ambientPressurePa(0) is the standard sea-level pressure 101325 Pa', () => {
    expect(ambientPressurePa(0)).toBe(101325);
  });
  it('matches the exact barometric formula p0·(1 − L·h/T0)^(g0·M/(R*·L)) to 1e-5', () => {
    // The published constants 2.25577e-5 and 5.25588 are L/T0 and g0·M/(R*·L) rounded to
    // six digits; over −500…11 000 m that rounding moves p by under 2e-6.
    const exponent = (STANDARD_GRAVITY * M) / (R_STAR * LAPSE);
    for (const h of [-500, 0, 500, 1000, 2000, 3000, 5000, 8000, 11000]) {
      const exact = 101325 * Math.pow(1 - (LAPSE * h) / T0, exponent);
      expectRelative(ambientPressurePa(h), exact, 1e-5, `p(${h} m), ISO 2533 barometric formula`);
    }
  });
  it('matches the standard-atmosphere table at 1000 m and 11 000 m (values from memory)', () => {
    // From memory of the ICAO table: 898.746 hPa at 1000 m, 226.32 hPa at 11 000 m; held as
    // a plausible range (0.2 %), not as the printed table's digits.
    expectRelative(ambientPressurePa(1000), 89874.6, 2e-3, 'p(1000 m), ICAO table (from memory)');
    expectRelative(ambientPressurePa(11000), 22632, 2e-3, 'p(11 000 m), ICAO table (from memory)');
  });
  it('throws OutOfRangeError below −500 m, above 11 000 m and for NaN', () => {
    for (const h of [-501, 11001, Number.NaN]) {
      expect(() => ambientPressurePa(h)).toThrow(OutOfRangeError);
    }
  });
});
