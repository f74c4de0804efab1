import { describe, expect, it } from 'vitest';
import { OutOfRangeError } from '../../generator/physics/errors.ts';
import { metalDensityKgM3, metalSpecificHeatJPerKgK } from '../../generator/physics/metals.ts';
import { expectAbsolute, halfUnitOfLastDigit } from '../helpers/close.ts';

const SOURCE = 'Incropera & DeWitt Table A.1';

describe('Metals — Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, Table A.1', () => {
  it('pure aluminium at 300 K: c_p = 903 J/(kg·K), ρ = 2702 kg/m³ (printed digits)', () => {
    expectAbsolute(
      metalSpecificHeatJPerKgK('aluminium', 300),
      903,
      halfUnitOfLastDigit('903'),
      `c_p(aluminium, 300 K), ${SOURCE}`,
    );
    expectAbsolute(
      metalDensityKgM3('aluminium'),
      2702,
      halfUnitOfLastDigit('2702'),
      `ρ(aluminium), ${SOURCE}`,
    );
  });
  it('AISI 304 at 300 K lies in a plausible range (477 J/(kg·K), 7900 kg/m³ are from memory)', () => {
    // The stainless entries are from memory (Incropera & DeWitt, Table A.1): a range, not an exact value.
    const cp = metalSpecificHeatJPerKgK('stainless-steel', 300);
    expect(cp).toBeGreaterThan(450);
    expect(cp).toBeLessThan(510);
    const rho = metalDensityKgM3('stainless-steel');
    expect(rho).toBeGreaterThan(7800);
    expect(rho).toBeLessThan(8100);
  });
});

describe('metalSpecificHeatJPerKgK interpolation (closed form)', () => {
  it('is linear between table rows: the 350 K value is the mean of the 300 K and 400 K rows', () => {
    for (const metal of ['aluminium', 'stainless-steel'] as const) {
      const mean =
        (metalSpecificHeatJPerKgK(metal, 300) + metalSpecificHeatJPerKgK(metal, 400)) / 2;
      expectAbsolute(metalSpecificHeatJPerKgK(metal, 350), mean, 1e-9, `c_p(${metal}, 350 K)`);
    }
  });
  it('rises monotonically over 250–600 K', () => {
    for (const metal of ['aluminium', 'stainless-steel'] as const) {
      let previous = -Infinity;
      for (let t = 250; t <= 600; t += 10) {
        const cp = metalSpecificHeatJPerKgK(metal, t);
        expect(cp, `${metal} at ${t} K`).toBeGreaterThan(previous);
        previous = cp;
      }
    }
  });
  it('throws OutOfRangeError outside 250–600 K and for NaN', () => {
    for (const t of [249.9, 600.1, Number.NaN]) {
      expect(() => metalSpecificHeatJPerKgK('aluminium', t)).toThrow(OutOfRangeError);
    }
  });
});
