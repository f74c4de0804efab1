/**
 * The simulation's water tables (generator/physics/water-table.ts) against the exact
 * correlations they are made from: IAPWS-IF97 Region 1, IAPWS R12-08 and IAPWS SR1-86 as
 * implemented in generator/physics, which the other files here check against the
 * IAPWS releases' own verification tables. What is checked is the interpolation.
 */
import { describe, expect, it } from 'vitest';
import {
  exactLiquid,
  liquidAt,
  newLiquidSample,
  saturatedLiquidViscosityPaS,
  tabulatedVaporisationEnthalpyJPerKg,
} from '../../generator/physics/water-table.ts';
import { saturationPressurePa } from '../../generator/physics/if97-region4.ts';
import { region1 } from '../../generator/physics/if97-region1.ts';
import { waterViscosityPaS } from '../../generator/physics/viscosity.ts';
import {
  saturatedLiquidDensityKgM3,
  vaporisationEnthalpyJPerKg,
} from '../../generator/physics/saturation.ts';
import { seeded } from '../../bench/catalogue.ts';

/** Points over the tables' range: 0.01–200 °C, saturation to 6 bar above it. */
function points(count: number): { t: number; p: number; pSat: number }[] {
  const random = seeded(20261201);
  return Array.from({ length: count }, () => {
    const t = 273.16 + 200 * random();
    const pSat = saturationPressurePa(t);
    return { t, p: pSat + 6e5 * random(), pSat };
  });
}

describe('water tables against the exact correlations', () => {
  const table = newLiquidSample();
  const exact = newLiquidSample();
  const sample = points(20_000);

  it('give Region 1 density, heat capacity and R12-08 viscosity to a relative 1e-8', () => {
    let worst = 0;
    for (const { t, p, pSat } of sample) {
      liquidAt(t, p, pSat, table);
      exactLiquid(t, p, exact);
      for (const key of ['densityKgM3', 'isobaricHeatCapacityJPerKgK', 'viscosityPaS'] as const) {
        worst = Math.max(worst, Math.abs(table[key] / exact[key] - 1));
      }
    }
    expect(worst).toBeLessThan(1e-8);
  });

  // own rule: the tables against the correlations they tabulate, not an outside value
  it('give enthalpy to 1e-3 J/kg and expansivity to 1e-10 /K (both pass through zero)', () => {
    let worstH = 0;
    let worstAlpha = 0;
    for (const { t, p, pSat } of sample) {
      liquidAt(t, p, pSat, table);
      exactLiquid(t, p, exact);
      worstH = Math.max(worstH, Math.abs(table.enthalpyJPerKg - exact.enthalpyJPerKg));
      worstAlpha = Math.max(worstAlpha, Math.abs(table.expansivityPerK - exact.expansivityPerK));
    }
    expect(worstH).toBeLessThan(1e-3);
    expect(worstAlpha).toBeLessThan(1e-10);
  });

  // own rule: the tables against the correlations they tabulate, not an outside value
  it('give the saturated liquid’s viscosity and h_fg to a relative 1e-8', () => {
    for (const { t } of sample.slice(0, 5_000)) {
      const mu = waterViscosityPaS(t, saturatedLiquidDensityKgM3(t));
      expect(Math.abs(saturatedLiquidViscosityPaS(t) / mu - 1)).toBeLessThan(1e-8);
      const hfg = vaporisationEnthalpyJPerKg(t);
      expect(Math.abs(tabulatedVaporisationEnthalpyJPerKg(t) / hfg - 1)).toBeLessThan(1e-8);
    }
  });

  // source: IAPWS R7-97(2012) range of validity (the correlations answer outside the tables)
  it('hand states outside the tables to the correlations, range checks included', () => {
    const hot = 480;
    const p = saturationPressurePa(hot) + 1e5;
    expect(liquidAt(hot, p, saturationPressurePa(hot), table).densityKgM3).toBe(
      region1(hot, p).densityKgM3,
    );
    // Below saturation is not liquid: Region 1 refuses it, and so do the tables.
    const t = 360;
    expect(() => liquidAt(t, saturationPressurePa(t) - 10, saturationPressurePa(t), table)).toThrow(
      /outside/,
    );
  });
});
