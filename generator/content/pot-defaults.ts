/**
 * Defaults for what a pot entry may leave out.
 */

/**
 * Free-convection coefficient from the base to room air, W/(m²·K): a mid value of the
 * 2–25 W/(m²·K) range for free convection of gases in Incropera & DeWitt, Fundamentals of
 * Heat and Mass Transfer, Table 1.1. Calibration replaces the product below with a fit.
 */
export const ROOM_AIR_CONVECTION_W_PER_M2K = 10;

/**
 * Default heat-loss coefficient U·A of a base to room air, W/K: h × π·d·H, the side wall of
 * the equivalent cylinder of height H = V / (π d²/4), which is h × 4V/d (the floor faces
 * the stove, the top the funnel). V in m³ (3e-5–2e-3), d in m (0.03–0.25).
 * Worked value: V = 2.6e-4 m³, d = 0.084 m → side area 0.012381 m², U·A = 0.12381 W/K.
 */
export function defaultHeatLossWPerK(sealedVolumeM3: number, diameterM: number): number {
  const sideAreaM2 = (4 * sealedVolumeM3) / diameterM;
  return ROOM_AIR_CONVECTION_W_PER_M2K * sideAreaM2;
}

/**
 * Gauge opening pressure of the safety valve when the entry gives none, bar. No published
 * source we know of states it (makers do not publish it): it is an assumption, and
 * every card that relies on it says so (PotEntry.valveOpeningAssumed).
 */
export const ASSUMED_VALVE_OPENING_BAR = 1.5;
