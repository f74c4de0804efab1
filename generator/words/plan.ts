/**
 * User-facing words of the planner: refusals, suggestions and model-range warnings. The
 * planner returns codes and SI facts (generator/planning/notices.ts); generator/render/
 * plan-text.ts formats the numbers in the output's units and calls these with the text.
 * Every argument here is already formatted ("150 mL", "1.50 bar"): words do no arithmetic.
 */
import type { CheckedQuantity, RefusalCode } from '../planning/types.ts';
import type { GrindClass } from '../content/types.ts';

/** A refusal as a barista reads it. */
export interface RefusalText {
  readonly code: RefusalCode;
  /** Why no recipe is printed. */
  readonly reason: string;
  /** The nearest change that would fix it. */
  readonly suggestion: string;
}

const coarser: Record<GrindClass, GrindClass> = {
  fine: 'medium-fine',
  'medium-fine': 'medium',
  medium: 'medium-coarse',
  'medium-coarse': 'coarse',
  coarse: 'coarse',
};

const quantityNames: Record<CheckedQuantity, string> = {
  permeabilityM2: 'coffee bed permeability',
  heatToPotW: 'heat reaching the pot',
  altitudeM: 'altitude',
  sealedVolumeM3: 'sealed base volume',
  ambientK: 'room temperature',
};

export const planWords = {
  inductionNeedsMagneticBase: (potName: string): RefusalText => ({
    code: 'induction-needs-magnetic-base',
    reason: `${potName}: an induction hob cannot heat its aluminium base.`,
    suggestion:
      'Use a pot with a stainless-steel (magnetic) base, or brew this pot on gas or electric. If this pot’s base has a steel induction plate, say so in the pot’s description and the cards will use it on induction.',
  }),
  /** `limit` is rounded down by the caller: a limit is never overstated. */
  fillAboveValve: (asked: string, limit: string, margin: string): RefusalText => ({
    code: 'fill-above-valve',
    reason: `${asked} of water would rise to or above the safety valve once it warms and expands.`,
    suggestion: `Fill at most ${limit} (the level stays ${margin} below the valve when hot).`,
  }),
  pressureNearValve: (peak: string, valve: string, grind: GrindClass): RefusalText => ({
    code: 'pressure-near-valve',
    reason: `Even at the gentlest setting the pressure would reach ${peak}, more than half of the valve's ${valve}: the bed is too tight for this pot.`,
    suggestion:
      grind === 'coarse'
        ? 'Use a more open coffee (lower bulk density or a fresh, less compact grind) or a pot with a larger basket.'
        : `Grind coarser (${coarser[grind]} instead of ${grind}) and never tamp the basket.`,
  }),
  noDelivery: (): RefusalText => ({
    code: 'no-delivery',
    reason: 'No setting delivers coffee to the upper chamber before the water runs out.',
    suggestion: 'Fill the base closer to the line, or use a coarser grind.',
  }),
  noPlanFits: (low: string, high: string, tooFast: boolean): RefusalText => ({
    code: 'no-plan-fits',
    reason: `No setting keeps the flow of coffee between ${low} and ${high}.`,
    suggestion: tooFast
      ? 'The coffee runs through too fast: grind finer or use a lower heat setting.'
      : 'The coffee runs too slowly: grind coarser or use a higher heat setting.',
  }),
  /** `value`, `low` and `high` are formatted with their units. */
  outsideCheckedRange: (what: CheckedQuantity, value: string, low: string, high: string): string =>
    `The ${quantityNames[what]}, ${value}, is outside the range the model was checked for (${low} to ${high}); treat the timings as rough.`,
  coolCup: (share: string): string =>
    `Only ${share} of the cup reaches the target band: even the gentlest setting brews this pot too fast for hot water. A lower flame or a heat diffuser would allow a hotter start.`,
  smallFill: (): string =>
    'The fill is barely above the funnel tube; the model was not checked for such small brews.',
};
