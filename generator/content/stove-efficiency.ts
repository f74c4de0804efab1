/**
 * Default share of a stove's input power that reaches the pot, by kind, for stoves whose
 * entry gives no efficiency (flagged StoveEntry.efficiencyAssumed). Each is the mid-point
 * of the boil-test range from the ENERGY STAR
 * Emerging Technology Award for residential induction cooktops (2021–2022) and US DOE
 * cooking-product test data:
 *   gas 0.32–0.40 → 0.36; electric coil and radiant smooth-top 0.74–0.80 → 0.77;
 *   induction 0.84–0.90 → 0.87.
 * Flame width and pot fit are not in these numbers; calibration (heat_to_pot_w) carries them.
 */
import type { StoveKind } from './types.ts';

export const DEFAULT_STOVE_EFFICIENCY: Readonly<Record<StoveKind, number>> = {
  gas: 0.36,
  'electric-coil': 0.77,
  radiant: 0.77,
  induction: 0.87,
};
