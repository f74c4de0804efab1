/**
 * How long the delivery phase (first coffee → off the heat) may take in a given pot: the
 * coffee's window (its `delivery_window_s`, or 60–150 s, common practice, no source) is
 * the window of a three-cup pot, and a smaller pot's is in proportion to its cups. A
 * one-cup pot holds a third of the water, so the same gentle flow is over in a third of
 * the time; held to the three-cup window, a small pot could only meet it from cold water,
 * and its card would tell people not to preheat. Bigger pots keep the three-cup window
 * (modelling choice: the window's upper end only bounds the off-heat time, and a longer
 * lower end would push big pots to cooler starts with no source to say their coffee
 * needs it).
 */
import type { CoffeeEntry, PotEntry } from '../content/types.ts';

export const THREE_CUP_DELIVERY_WINDOW_S: readonly [number, number] = [60, 150];
const REFERENCE_CUPS = 3;

export function deliveryWindowS(
  coffee: Pick<CoffeeEntry, 'deliveryWindowS'>,
  pot: Pick<PotEntry, 'cups'>,
): readonly [number, number] {
  const scale = Math.min(1, pot.cups / REFERENCE_CUPS);
  const [shortest, longest] = coffee.deliveryWindowS ?? THREE_CUP_DELIVERY_WINDOW_S;
  return [shortest * scale, longest * scale];
}
