/**
 * Test setups for the brew model: a reference situation of our own (about 100 mL of air
 * over about 150 mL of water in a three-cup-sized base, a permeable stovetop grind,
 * moderate heat), not demo content. Its proportions are common practice, no source: a
 * three-cup pot filled to just under its valve.
 */
import type { BedModel, BrewSetup, PotModel } from '../../generator/brew/types.ts';

export const C = 273.15;

/** A three-cup-sized aluminium base: 250 mL sealed, 84 mm across, valve 32 mm up. */
export const referencePot: PotModel = {
  sealedVolumeM3: 250e-6,
  baseInnerDiameterM: 0.084,
  valveHeightM: 0.032,
  valveOpeningGaugePa: 1.5e5,
  baseMaterial: 'aluminium',
  baseMassKg: 0.18,
  basketDiameterM: 0.056,
  basketDepthM: 0.015,
  tubeInnerDiameterM: 0.007,
  tubeGapM: 0.004,
  spoutHeightM: 0.115,
  upperCapacityM3: 200e-6,
  heatLossWPerK: 0.12,
};

/** "A permeable stovetop grind": k around 1e-12 m² (from memory, an order of magnitude). */
export const permeableBed: BedModel = {
  permeabilityM2: 1e-12,
  bulkDensityKgM3: 380,
  retentionKgPerKg: 1.2,
  targetBandK: [90 + C, 96 + C],
};

export const seaLevelRoom = { ambientK: 20 + C, ambientPa: 101325 };

/**
 * 150 mL of cold water (100 mL of air above it), 250 W reaching the pot ("moderate heat":
 * a medium ring of about 700 W at a gas burner's 0.32–0.40 efficiency, ENERGY STAR
 * Emerging Technology Award, residential induction cooktops, 2021–2022).
 */
export function referenceSetup(overrides: Partial<BrewSetup> = {}): BrewSetup {
  return {
    pot: referencePot,
    bed: permeableBed,
    room: seaLevelRoom,
    heatInputW: 250,
    fillVolumeM3: 150e-6,
    startK: 20 + C,
    collectSeries: true,
    ...overrides,
  };
}

/** Share of the cup extracted below a temperature, from the cup curve (linear pieces). */
export function shareBelow(
  curve: readonly { cupM3: number; extractionK: number }[],
  k: number,
): number {
  let below = 0;
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!,
      b = curve[i]!;
    const dv = b.cupM3 - a.cupM3;
    const lo = Math.min(a.extractionK, b.extractionK),
      hi = Math.max(a.extractionK, b.extractionK);
    if (k >= hi) below += dv;
    else if (k > lo) below += (dv * (k - lo)) / (hi - lo);
  }
  return below / (curve[curve.length - 1]!.cupM3 - curve[0]!.cupM3);
}
