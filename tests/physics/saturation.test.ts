import { describe, expect, it } from 'vitest';
import {
  WATER_CRITICAL_DENSITY_KG_M3,
  WATER_CRITICAL_TEMPERATURE_K,
} from '../../generator/physics/constants.ts';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { saturationTemperatureK } from '../../generator/physics/if97-region4.ts';
import {
  saturatedLiquidDensityKgM3,
  saturatedLiquidEnthalpyJPerKg,
  saturatedVapourDensityKgM3,
  saturatedVapourEnthalpyJPerKg,
  vaporisationEnthalpyJPerKg,
} from '../../generator/physics/saturation.ts';
import { expectAbsolute, expectRelative, halfUnitOfLastDigit } from '../helpers/close.ts';

const SOURCE = 'IAPWS SR1-86(1992) Table 1 check point';
const CHECK_T = 373.1243;

describe('IAPWS SR1-86(1992), saturation properties — check point of Table 1', () => {
  // Printed: T = 373.1243 K, p = 0.101325 MPa, ρ′ = 958.365, ρ″ = 0.597586 kg/m³,
  // h′ = 419.05, h″ = 2675.7 kJ/kg. Each is held to half a unit of its last printed digit.
  it('saturatedLiquidDensityKgM3(373.1243 K) = 958.365 kg/m³', () => {
    const printed = '958.365';
    expectAbsolute(
      saturatedLiquidDensityKgM3(CHECK_T),
      Number(printed),
      halfUnitOfLastDigit(printed),
      `ρ′(${CHECK_T} K), ${SOURCE}`,
    );
  });
  it('saturatedVapourDensityKgM3(373.1243 K) = 0.597586 kg/m³', () => {
    const printed = '0.597586';
    expectAbsolute(
      saturatedVapourDensityKgM3(CHECK_T),
      Number(printed),
      halfUnitOfLastDigit(printed),
      `ρ″(${CHECK_T} K), ${SOURCE}`,
    );
  });
  it('saturatedLiquidEnthalpyJPerKg(373.1243 K) = 419.05 kJ/kg', () => {
    const printed = '419.05';
    expectAbsolute(
      saturatedLiquidEnthalpyJPerKg(CHECK_T) / 1e3,
      Number(printed),
      halfUnitOfLastDigit(printed),
      `h′(${CHECK_T} K) in kJ/kg, ${SOURCE}`,
    );
  });
  it('saturatedVapourEnthalpyJPerKg(373.1243 K) = 2675.7 kJ/kg', () => {
    const printed = '2675.7';
    expectAbsolute(
      saturatedVapourEnthalpyJPerKg(CHECK_T) / 1e3,
      Number(printed),
      halfUnitOfLastDigit(printed),
      `h″(${CHECK_T} K) in kJ/kg, ${SOURCE}`,
    );
  });
  it('vaporisationEnthalpyJPerKg(373.1243 K) = 2675.7 − 419.05 kJ/kg', () => {
    // Tolerance: the two printed half-units added.
    expectAbsolute(
      vaporisationEnthalpyJPerKg(CHECK_T) / 1e3,
      2675.7 - 419.05,
      0.05 + 0.005,
      `h_fg(${CHECK_T} K) in kJ/kg, ${SOURCE}`,
    );
  });
  it('IF97 saturationTemperatureK(0.101325 MPa) is the check point temperature 373.1243 K', () => {
    // The check point's p = 0.101325 MPa, read backwards through IF97 eq. 31.
    expectAbsolute(
      saturationTemperatureK(101325),
      CHECK_T,
      halfUnitOfLastDigit('373.1243'),
      `T_sat(0.101325 MPa) from IF97 vs ${SOURCE}`,
    );
  });
});

describe('SR1-86 closed-form limits and identities', () => {
  it('vaporisationEnthalpyJPerKg(T) is h″(T) − h′(T)', () => {
    for (const t of [273.16, 300, 400, 500, 600, 647]) {
      expectRelative(
        vaporisationEnthalpyJPerKg(t),
        saturatedVapourEnthalpyJPerKg(t) - saturatedLiquidEnthalpyJPerKg(t),
        1e-12,
        `h_fg(${t} K) vs h″ − h′`,
      );
    }
  });
  it('at the critical point ρ′ = ρ″ = ρ_c and h_fg = 0', () => {
    const tc = WATER_CRITICAL_TEMPERATURE_K;
    expectRelative(saturatedLiquidDensityKgM3(tc), WATER_CRITICAL_DENSITY_KG_M3, 1e-15, 'ρ′(T_c)');
    expectRelative(saturatedVapourDensityKgM3(tc), WATER_CRITICAL_DENSITY_KG_M3, 1e-15, 'ρ″(T_c)');
    expect(vaporisationEnthalpyJPerKg(tc)).toBe(0);
  });
});

describe('SR1-86 out of range', () => {
  const functions = [
    saturatedLiquidDensityKgM3,
    saturatedVapourDensityKgM3,
    saturatedLiquidEnthalpyJPerKg,
    saturatedVapourEnthalpyJPerKg,
    vaporisationEnthalpyJPerKg,
  ];
  it('every function throws OutOfRangeError below the triple point, above T_c and for NaN', () => {
    for (const f of functions) {
      for (const t of [273.15, 647.1, Number.NaN]) {
        expect(() => f(t), `${f.name}(${t})`).toThrow(OutOfRangeError);
      }
    }
  });
});
