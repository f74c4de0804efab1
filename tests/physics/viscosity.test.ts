import { describe, expect, it } from 'vitest';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { waterViscosityPaS } from '../../generator/physics/viscosity.ts';
import { expectAbsolute, halfUnitOfLastDigit } from '../helpers/close.ts';

describe('IAPWS R12-08 (viscosity, 2008), Table 4 — without the critical enhancement', () => {
  // [T K, ρ kg/m³, μ µPa·s as printed]; held to half a unit of the last printed digit
  // (5e-7 µPa·s, i.e. 6e-10 relative or better).
  const rows: [number, number, string][] = [
    [298.15, 998, '889.735100'],
    [298.15, 1200, '1437.649467'],
    [373.15, 1000, '307.883622'],
    [433.15, 1, '14.538324'],
    [433.15, 1000, '217.685358'],
    [873.15, 1, '32.619287'],
  ];
  it.each(rows)('waterViscosityPaS(%d K, %d kg/m³) = %s µPa·s', (t, rho, printed) => {
    expectAbsolute(
      waterViscosityPaS(t, rho) * 1e6,
      Number(printed),
      halfUnitOfLastDigit(printed),
      `μ(${t} K, ${rho} kg/m³) in µPa·s, IAPWS R12-08 Table 4`,
    );
  });
});

describe('waterViscosityPaS out of range', () => {
  it('throws OutOfRangeError for T outside 273.15–1173.15 K, ρ outside 0–1250 kg/m³, NaN', () => {
    const cases: [number, number][] = [
      [273.14, 998],
      [1173.16, 1],
      [300, -1],
      [300, 1251],
      [Number.NaN, 998],
      [300, Number.NaN],
    ];
    for (const [t, rho] of cases) {
      expect(() => waterViscosityPaS(t, rho), `μ(${t}, ${rho})`).toThrow(OutOfRangeError);
    }
  });
});
