/**
 * Default Darcy permeability of a stovetop bed (level basket, not tamped, wet) by grind
 * class, m², for coffees whose entry gives no permeability_m2. The card flags the value
 * as assumed (CoffeeEntry.permeabilityAssumed).
 *
 * Sources:
 * - fine: 1e-13 m², the top of the 1e-14–1e-13 m² range measured for espresso-fine packed
 *   beds by Corrochano, Melrose, Bentley, Fryer & Bakalis, J. Food Eng. 150 (2015)
 *   106–116. A looser, untamped stovetop bed sits at the top of that range.
 * - medium: 1e-12 m², from memory: the order of magnitude usually quoted for a looser,
 *   coarser stovetop bed (no published measurement found; an order of magnitude only).
 * - medium-fine 5e-13, medium-coarse 2e-12, coarse 4e-12 m²: interpolated by us between
 *   and beyond those two values (roughly ×2 per class); no published source.
 */
import type { GrindClass } from './types.ts';

export const GRIND_PERMEABILITY_M2: Readonly<Record<GrindClass, number>> = {
  fine: 1e-13,
  'medium-fine': 5e-13,
  medium: 1e-12,
  'medium-coarse': 2e-12,
  coarse: 4e-12,
};
