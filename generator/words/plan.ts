/** User-facing words of the planner: refusals, suggestions and model-range warnings. */
import type { Refusal } from '../planning/types.ts';
import type { GrindClass } from '../content/types.ts';

const ml = (m3: number): string => `${Math.round(m3 * 1e6)} mL`;
/** A limit is never overstated: rounded down. */
const mlAtMost = (m3: number): string => `${Math.floor(m3 * 1e6)} mL`;
const bar = (pa: number): string => `${(pa / 1e5).toFixed(2)} bar`;
const coarser: Record<GrindClass, string> = {
  fine: 'medium-fine',
  'medium-fine': 'medium',
  medium: 'medium-coarse',
  'medium-coarse': 'coarse',
  coarse: 'coarse',
};

const quantityNames: Record<string, string> = {
  permeabilityM2: 'coffee bed permeability (m²)',
  heatToPotW: 'heat reaching the pot (W)',
  altitudeM: 'altitude (m)',
  sealedVolumeM3: 'sealed base volume (m³)',
  ambientK: 'room temperature (K)',
};

export const planWords = {
  inductionNeedsMagneticBase: (potName: string): Refusal => ({
    code: 'induction-needs-magnetic-base',
    reason: `${potName}: an induction hob cannot heat its aluminium base.`,
    suggestion:
      'Use a pot with a stainless-steel (magnetic) base, or brew this pot on gas or electric. If this pot has an induction plate, add induction_plate: true to its base.',
  }),
  fillAboveValve: (askedM3: number, limitM3: number, marginM: number): Refusal => ({
    code: 'fill-above-valve',
    reason: `${ml(askedM3)} of water would rise to or above the safety valve once it warms and expands.`,
    suggestion: `Fill at most ${mlAtMost(limitM3)} (the level stays ${Math.round(marginM * 1000)} mm below the valve when hot).`,
  }),
  pressureNearValve: (peakPa: number, valvePa: number, grind: GrindClass): Refusal => ({
    code: 'pressure-near-valve',
    reason: `Even at the gentlest setting the pressure would reach ${bar(peakPa)}, more than half of the valve's ${bar(valvePa)}: the bed is too tight for this pot.`,
    suggestion:
      grind === 'coarse'
        ? 'Use a more open coffee (lower bulk density or a fresh, less compact grind) or a pot with a larger basket.'
        : `Grind coarser (${coarser[grind]} instead of ${grind}) and never tamp the basket.`,
  }),
  noDelivery: (): Refusal => ({
    code: 'no-delivery',
    reason: 'No setting delivers coffee to the upper chamber before the water runs out.',
    suggestion: 'Fill the base closer to the line, or use a coarser grind.',
  }),
  noPlanFits: (lowS: number, highS: number, tooFast: boolean): Refusal => ({
    code: 'no-plan-fits',
    reason: `No setting keeps the flow of coffee between ${lowS} s and ${highS} s.`,
    suggestion: tooFast
      ? 'The coffee runs through too fast: grind finer or use a lower heat setting.'
      : 'The coffee runs too slowly: grind coarser or use a higher heat setting.',
  }),
  outsideCheckedRange: (what: string, value: number, lo: number, hi: number): string =>
    `${quantityNames[what] ?? what} ${value.toPrecision(3)} is outside the range the model was checked for (${lo}–${hi}); treat the timings as rough.`,
  coolCup: (share: number): string =>
    `Only ${Math.round(share * 100)} % of the cup reaches the target band: even the gentlest setting brews this pot too fast for hot water. A lower flame or a heat diffuser would allow a hotter start.`,
  smallFill: (): string =>
    'The fill is barely above the funnel tube; the model was not checked for such small brews.',
};
