import { describe, expect, it } from 'vitest';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { vaporisationEnthalpyIf97JPerKg } from '../../generator/physics/if97-vaporisation.ts';

// The published-table check of this function is crc-saturated-water.test.ts. (The SR1-86
// Table 1 check point is no check for it: those printed h′, h″ are SR1-86's own values,
// 0.1–0.2 kJ/kg away from IAPWS-95 near 100 °C.)
describe('vaporisationEnthalpyIf97JPerKg out of range', () => {
  it('throws OutOfRangeError outside 273.15–623.15 K and for NaN', () => {
    for (const t of [273.14, 623.16, Number.NaN]) {
      expect(() => vaporisationEnthalpyIf97JPerKg(t)).toThrow(OutOfRangeError);
    }
  });
});
