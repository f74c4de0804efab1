/**
 * Derived geometry of a pot: the heights and volumes the brew model needs, from the
 * entry's dimensions (cylindrical base, funnel tube and upper column of the tube's bore).
 *
 *   z = 0            floor of the base
 *   z = tubeGap      lower end of the funnel tube (water below it stays in the base)
 *   z = baseHeight   top of the base's water space = bottom of the coffee bed,
 *                    baseHeight = sealed volume / base cross-section (equivalent cylinder)
 *   z = bedTop       baseHeight + basket depth
 *   z = spout        outlet of the upper column into the upper chamber
 */
import type { PotModel } from './types.ts';

export interface PotGeometry {
  readonly baseAreaM2: number;
  readonly baseHeightM: number;
  readonly bedAreaM2: number;
  readonly bedTopM: number;
  readonly tubeAreaM2: number;
  /** Funnel tube from its lower end to the bed, m. */
  readonly tubeLengthM: number;
  /** Upper column from the bed's top to the spout, m (same bore as the tube). */
  readonly columnLengthM: number;
  /** Volume of a level, untamped basket, m³. */
  readonly basketVolumeM3: number;
  /** Liquid volume at which the level reaches the valve's lowest edge, m³. */
  readonly volumeAtValveM3: number;
  /** Liquid volume at which the level reaches the tube's lower end (sputter), m³. */
  readonly volumeAtTubeEndM3: number;
}

export function potGeometry(pot: PotModel): PotGeometry {
  const baseAreaM2 = circleArea(pot.baseInnerDiameterM);
  const baseHeightM = pot.sealedVolumeM3 / baseAreaM2;
  const bedAreaM2 = circleArea(pot.basketDiameterM);
  const bedTopM = baseHeightM + pot.basketDepthM;
  return {
    baseAreaM2,
    baseHeightM,
    bedAreaM2,
    bedTopM,
    tubeAreaM2: circleArea(pot.tubeInnerDiameterM),
    tubeLengthM: baseHeightM - pot.tubeGapM,
    columnLengthM: Math.max(0, pot.spoutHeightM - bedTopM),
    basketVolumeM3: bedAreaM2 * pot.basketDepthM,
    volumeAtValveM3: baseAreaM2 * pot.valveHeightM,
    volumeAtTubeEndM3: baseAreaM2 * pot.tubeGapM,
  };
}

function circleArea(diameterM: number): number {
  return (Math.PI * diameterM * diameterM) / 4;
}
