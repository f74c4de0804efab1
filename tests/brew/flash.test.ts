/**
 * Coffee leaves the spout at the room's pressure: at most at the local boiling point, the
 * excess flashing to steam (spoutFlash). Outside values: saturated water at 100 °C has
 * h_fg = 2257 kJ/kg, liquid water at 105 °C has c_p ≈ 4.22 kJ/(kg·K) and ρ ≈ 954.7 kg/m³
 * (IAPWS-IF97 steam tables, as printed in the CRC Handbook; from memory to 3 digits).
 */
import { describe, expect, it } from 'vitest';
import { simulateBrew, spoutFlash } from '../../generator/brew/simulate.ts';
import { C, referenceSetup } from './fixtures.ts';

describe('spoutFlash', () => {
  // from memory: steam-table values (IAPWS-IF97, as printed in the CRC Handbook)
  it('flashes c_p·ΔT/h_fg of a millilitre reaching the spout at 105 °C (about 0.94 %)', () => {
    const curve = [
      { cupM3: 0, extractionK: 105 + C },
      { cupM3: 1e-6, extractionK: 105 + C },
    ];
    const f = spoutFlash(curve, 101325);
    expect(f.boilingK).toBeCloseTo(100 + C, 1);
    const expected = (954.7e-6 * 4.22 * 5) / 2257; // kg
    expect(Math.abs(f.flashedKg - expected) / expected).toBeLessThan(0.02);
    expect(f.aboveBoilingM3).toBeCloseTo(1e-6, 12);
  });

  it('flashes nothing from a cup below boiling', () => {
    expect(
      spoutFlash(
        [
          { cupM3: 0, extractionK: 95 + C },
          { cupM3: 1e-4, extractionK: 99 + C },
        ],
        101325,
      ).flashedKg,
    ).toBe(0);
  });

  it('never lets coffee leave the spout above the local boiling point, even from a tight bed and a hot start', () => {
    const r = simulateBrew(
      referenceSetup({
        startK: 85 + C,
        heatInputW: 450,
        bed: { ...referenceSetup().bed, permeabilityM2: 3e-13 },
      }),
    );
    expect(r.extraction!.p90K).toBeGreaterThan(r.flash.boilingK); // the water at the grounds is hotter
    expect(r.flash.flashedKg).toBeGreaterThan(0);
    for (const p of r.series) expect(p.spoutK).toBeLessThanOrEqual(r.flash.boilingK);
  });
});
