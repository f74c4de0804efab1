import { describe, expect, it } from 'vitest';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { region2SpecificVolumeM3PerKg } from '../../generator/physics/if97-region2.ts';
import { expectRelative } from '../helpers/close.ts';

describe('IAPWS-IF97 Region 2, Table 15, specific volume (IAPWS R7-97(2012))', () => {
  // source: IAPWS R7-97(2012), Table 15, the v column (only v is implemented); the digits
  // agree with those quoted by independent public IF97 test suites (freesteam's among them).
  const rows: [number, number, number][] = [
    [300, 0.0035, 0.394913866e2],
    [700, 0.0035, 0.923015898e2],
    [700, 30, 0.542946619e-2],
  ];
  it.each(rows)('region2SpecificVolumeM3PerKg(%d K, %f MPa) = %f m³/kg to 1e-8', (t, pMPa, v) => {
    expectRelative(
      region2SpecificVolumeM3PerKg(t, pMPa * 1e6),
      v,
      1e-8,
      `v(${t} K, ${pMPa} MPa), IAPWS R7-97(2012) Table 15`,
    );
  });
});

describe('region2SpecificVolumeM3PerKg out of range', () => {
  it('throws OutOfRangeError outside 273.15–1073.15 K, at p ≤ 0 and above the Region 2 bound', () => {
    const cases: [number, number][] = [
      [273.14, 500],
      [1073.16, 1e5],
      [300, 0],
      [300, 4000], // above p_sat(300 K) = 3.537 kPa: liquid
      [700, 31e6], // above the B23 boundary, 30.48 MPa at 700 K: Region 3
      [900, 100.1e6],
      [Number.NaN, 1e5],
    ];
    for (const [t, p] of cases) {
      expect(() => region2SpecificVolumeM3PerKg(t, p), `v(${t} K, ${p} Pa)`).toThrow(
        OutOfRangeError,
      );
    }
  });
});
