/**
 * A bed that tightens as it brews: an optional model form beyond the classic lumped Darcy
 * bed of constant permeability (DEVELOPERS.md, "A bed that tightens as it brews").
 *
 *   k(V) = k0 · s(V),   s(V) = f + (1 − f)·exp(−V / V_c)
 *
 * V is the volume that has passed through the wet bed (the water displaced past the
 * grounds once they hold their retention, counted at the start temperature's density, the
 * same measure as the wet-up thresholds), k0 the permeability as the bed first wets, f the
 * final share of it the bed keeps after much water has passed, V_c the volume over which it
 * gets most (63 %) of the way there. f = 1 is the classic model exactly (s ≡ 1).
 *
 * Why this form: an experimental study of stovetop pots (Navarini et al., Applied Thermal
 * Engineering, 2009; details from memory) reported that the coffee cake's permeability
 * falls during the brew. The causes usually named for it are the grounds swelling as they
 * wet and fines migrating with the flow; both depend on how much water has gone through
 * rather than on the clock, so the share is a function of V, and it levels off (a bed does
 * not close). The exponential is the simplest such curve with one rate and one floor; it is
 * our modelling choice, not a law.
 */

/** The bed's tightening, SI. */
export interface BedTightening {
  /** f: share of the first permeability left after much water has passed, 0 < f ≤ 1. */
  readonly finalShare: number;
  /** V_c: volume passed over which the share falls 63 % of the way to f, m³. */
  readonly overM3: number;
}

/** s(V) = f + (1 − f)·exp(−V/V_c): the share of the first permeability left after V passed. */
export function tighteningShare(tightening: BedTightening, passedM3: number): number {
  const f = tightening.finalShare;
  return f + (1 - f) * Math.exp(-Math.max(0, passedM3) / tightening.overM3);
}

/**
 * σ of ln f for a final share the entry states but no log measured: ±30 % (our choice; a
 * bed's tightening is poorly known without scale readings). One number for both users:
 * the fit's prior (calibration/parameters.ts) and the card's ranges (planning/plan.ts,
 * whose corners take f·e^(∓2σ)).
 */
export const ASSUMED_FINAL_SHARE_SIGMA_LN = 0.3;
