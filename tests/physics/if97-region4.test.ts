import { describe, expect, it } from 'vitest';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import {
  saturationPressurePa,
  saturationPressureSlopePaPerK,
  saturationTemperatureK,
} from '../../generator/physics/if97-region4.ts';
import {
  saturatedLiquidDensityKgM3,
  saturatedVapourDensityKgM3,
} from '../../generator/physics/saturation.ts';
import { CELSIUS_OFFSET_K } from '../../generator/physics/constants.ts';
import { expectRelative } from '../helpers/close.ts';

const IF97 = 'IAPWS R7-97(2012)';

describe('IAPWS-IF97 Region 4, Table 35 — saturationPressurePa (IAPWS R7-97(2012))', () => {
  const rows: [number, number][] = [
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ];
  it.each(rows)('saturationPressurePa(%d K) = %f MPa to 1e-8', (temperatureK, pMPa) => {
    expectRelative(
      saturationPressurePa(temperatureK),
      pMPa * 1e6,
      1e-8,
      `saturationPressurePa(${temperatureK} K), ${IF97} Table 35`,
    );
  });
});

describe('IAPWS-IF97 Region 4, Table 36 — saturationTemperatureK (IAPWS R7-97(2012))', () => {
  const rows: [number, number][] = [
    [0.1, 0.372755919e3],
    [1, 0.453035632e3],
    [10, 0.584149488e3],
  ];
  it.each(rows)('saturationTemperatureK(%f MPa) = %f K to 1e-8', (pMPa, temperatureK) => {
    expectRelative(
      saturationTemperatureK(pMPa * 1e6),
      temperatureK,
      1e-8,
      `saturationTemperatureK(${pMPa} MPa), ${IF97} Table 36`,
    );
  });
});

describe('saturationPressureSlopePaPerK (analytic derivative of IF97 eq. 30)', () => {
  const temperatures = [273.16, 300, 373.15, 450, 550, 640];
  it.each(temperatures)('saturationPressureSlopePaPerK(%d K) matches a central difference', (t) => {
    // Closed-form check: step 1e-3 K; truncation (≈h²·p‴/6p′) and rounding (≈ε·p/h) are
    // both below 1e-9 relative here.
    const step = 1e-3;
    const difference =
      (saturationPressurePa(t + step) - saturationPressurePa(t - step)) / (2 * step);
    expectRelative(saturationPressureSlopePaPerK(t), difference, 1e-8, `dp_sat/dT(${t} K)`);
  });

  // Clausius–Clapeyron, dp/dT = h_fg / (T·(1/ρ″ − 1/ρ′)), with h_fg printed in the CRC
  // Handbook, 94th ed., Table 6-10 (IAPWS-95 based) and ρ′, ρ″ from IAPWS SR1-86(1992).
  // A loose, independent check: the CRC digits (≈2e-5) and SR1-86's densities (≈1e-5)
  // allow far less than the 1e-3 asked here.
  const crc: [number, number][] = [
    [25, 2441.7e3],
    [60, 2357.7e3],
    [100, 2256.4e3],
    [120, 2202.1e3],
  ];
  it.each(crc)('at %d °C is consistent with Clausius–Clapeyron (CRC h_fg) to 1e-3', (t, hfg) => {
    const temperatureK = t + CELSIUS_OFFSET_K;
    const volumeChange =
      1 / saturatedVapourDensityKgM3(temperatureK) - 1 / saturatedLiquidDensityKgM3(temperatureK);
    expectRelative(
      saturationPressureSlopePaPerK(temperatureK),
      hfg / (temperatureK * volumeChange),
      1e-3,
      `dp_sat/dT(${temperatureK} K) vs Clausius–Clapeyron with CRC Table 6-10 h_fg`,
    );
  });
});

describe('IF97 eqs. 30 and 31 are inverses (both solve eq. 29)', () => {
  it.each([273.16, 300, 373.15, 500, 647])(
    'saturationTemperatureK(saturationPressurePa(%d K))',
    (t) => {
      expectRelative(
        saturationTemperatureK(saturationPressurePa(t)),
        t,
        1e-12,
        `round trip ${t} K`,
      );
    },
  );
});

describe('Region 4 out of range', () => {
  it('saturationPressurePa below 273.15 K, above 647.096 K and NaN throws OutOfRangeError', () => {
    for (const t of [273.14, 647.1, Number.NaN]) {
      expect(() => saturationPressurePa(t)).toThrow(OutOfRangeError);
      expect(() => saturationPressureSlopePaPerK(t)).toThrow(OutOfRangeError);
    }
    expect(() => saturationPressurePa(700)).toThrow(
      'IAPWS-IF97 Region 4: temperature 700 K is outside 273.15–647.096 K',
    );
  });
  it('saturationTemperatureK below 611.213 Pa or above 22.064 MPa throws OutOfRangeError', () => {
    for (const p of [611.2, 22.065e6, Number.NaN]) {
      expect(() => saturationTemperatureK(p)).toThrow(OutOfRangeError);
    }
  });
});
