/**
 * "Which input moves what", for the troubleshooting page: one card's recipe re-simulated
 * with one input changed at a time (grind as bed permeability ±30 %, a fifth less water,
 * one heat setting up or down, cold water instead of hot), everything else as the card
 * says, including the moment the pot comes off the heat. Each row is one brew simulation.
 * Returns codes and SI facts; generator/render/moves.ts words and formats them.
 */
import { BrewDidNotFinishError, BrewSetupError } from '../brew/errors.ts';
import { simulateBrew } from '../brew/simulate.ts';
import type { BrewResult } from '../brew/types.ts';
import type { Catalogue } from '../content/types.ts';
import { brewSetup, roomModel } from './setup.ts';
import type { AcceptedPlan } from './types.ts';

/** The one input a row changes ('baseline': the card's own recipe). */
export type MoveCode =
  'baseline' | 'finer' | 'coarser' | 'less-water' | 'less-heat' | 'more-heat' | 'cold-start';

interface Variant {
  readonly change: MoveCode;
  readonly permeabilityScale?: number;
  readonly fillScale?: number;
  readonly levelStep?: number;
  readonly cold?: boolean;
}

const VARIANTS: readonly Variant[] = [
  { change: 'baseline' },
  { change: 'finer', permeabilityScale: 0.7 },
  { change: 'coarser', permeabilityScale: 1.3 },
  { change: 'less-water', fillScale: 0.8 },
  { change: 'less-heat', levelStep: -1 },
  { change: 'more-heat', levelStep: 1 },
  { change: 'cold-start', cold: true },
];

/** One re-simulated brew, SI. */
export interface MoveFacts {
  readonly change: MoveCode;
  /** null: no coffee before the off-heat time. */
  readonly firstCoffeeS: number | null;
  readonly meanK: number | null;
  readonly inBandShare: number | null;
  readonly peakGaugePa: number;
}

/** The rows that could be simulated (a level beyond the knob's ends is left out); null below two. */
export function sensitivityMoves(plan: AcceptedPlan, catalogue: Catalogue): MoveFacts[] | null {
  const pot = catalogue.pots.get(plan.potId)!;
  const coffee = catalogue.coffees.get(plan.coffeeId)!;
  const stove = catalogue.stoves.get(plan.stoveId)!;
  const room = roomModel(catalogue.site.room);

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

  const rows: MoveFacts[] = [];
  for (const variant of VARIANTS) {
    const result = simulate(variant);
    if (!result) continue;
    const e = result.extraction;
    rows.push({
      change: variant.change,
      firstCoffeeS: result.firstCoffeeS,
      meanK: e ? e.meanK : null,
      inBandShare: e ? e.inBandShare : null,
      peakGaugePa: result.peakGaugePa,
    });
  }
  return rows.length < 2 ? null : rows;
}
