/**
 * "Which input moves what", for the troubleshooting page: one card's recipe re-simulated
 * with one input changed at a time (grind as bed permeability ±30 %, a fifth less water,
 * one heat setting up or down, cold water instead of hot), everything else as the card
 * says, including the moment the pot comes off the heat. Each row is one brew simulation.
 */
import { BrewDidNotFinishError, BrewSetupError } from '../brew/errors.ts';
import { simulateBrew } from '../brew/simulate.ts';
import type { BrewResult } from '../brew/types.ts';
import type { Catalogue } from '../content/types.ts';
import { brewSetup, roomModel } from '../planning/setup.ts';
import type { AcceptedPlan } from '../planning/types.ts';
import { clock, pressure, share, temperature } from '../render/format.ts';
import type { MoveRow, MovesView } from '../render/site-view.ts';
import { troubleshootingWords } from '../words/card.ts';

interface Variant {
  readonly change: string;
  readonly permeabilityScale?: number;
  readonly fillScale?: number;
  readonly levelStep?: number;
  readonly cold?: boolean;
}

export function sensitivityMoves(plan: AcceptedPlan, catalogue: Catalogue): MovesView | null {
  const pot = catalogue.pots.get(plan.potId)!;
  const coffee = catalogue.coffees.get(plan.coffeeId)!;
  const stove = catalogue.stoves.get(plan.stoveId)!;
  const units = catalogue.site.units;
  const room = roomModel(catalogue.site.room);
  const words = troubleshootingWords.moves;
  const variants: Variant[] = [
    { change: words.baseline },
    { change: words.finer, permeabilityScale: 0.7 },
    { change: words.coarser, permeabilityScale: 1.3 },
    { change: words.lessWater, fillScale: 0.8 },
    { change: words.lessHeat, levelStep: -1 },
    { change: words.moreHeat, levelStep: 1 },
    { change: words.coldStart, cold: true },
  ];

  const simulate = (v: Variant): BrewResult | null => {
    const level = stove.levels[plan.levelIndex + (v.levelStep ?? 0)];
    if (!level) return null;
    try {
      return simulateBrew(
        brewSetup(
          pot.model,
          { ...coffee.bed, permeabilityM2: coffee.bed.permeabilityM2 * (v.permeabilityScale ?? 1) },
          room,
          {
            fillVolumeM3: plan.fillM3 * (v.fillScale ?? 1),
            startK: v.cold ? room.ambientK : plan.startK,
            heatInputW: level.heatToPotW,
            heatOffAtS: plan.offHeatS.midS,
          },
        ),
      );
    } catch (error) {
      if (error instanceof BrewSetupError || error instanceof BrewDidNotFinishError) return null;
      throw error;
    }
  };

  const rows: MoveRow[] = [];
  for (const variant of variants) {
    const result = simulate(variant);
    if (!result) continue;
    const e = result.extraction;
    rows.push({
      change: variant.change,
      firstCoffee:
        result.firstCoffeeS === null ? troubleshootingWords.noCoffee : clock(result.firstCoffeeS),
      meanTemperature: e ? temperature(e.meanK, units).text : '—',
      inBand: e ? share(e.inBandShare).text : '—',
      peak: pressure(result.peakGaugePa, units).text,
    });
  }
  if (rows.length < 2) return null;
  return {
    heading: troubleshootingWords.movesHeading,
    intro: troubleshootingWords.movesIntro(pot.name, coffee.name, stove.name),
    columns: troubleshootingWords.movesColumns,
    rows,
  };
}
