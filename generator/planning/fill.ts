/**
 * How much water a pot may take. The fill line must stay below the safety valve's lowest
 * edge even after the water has warmed and expanded, with a margin for sloshing, a
 * not-quite-level stove and reading the line by eye.
 */
import type { PotModel } from '../brew/types.ts';
import { potGeometry } from '../brew/geometry.ts';
import { region1 } from '../physics/if97-region1.ts';
import { saturationTemperatureK } from '../physics/if97-region4.ts';

/** Margin kept between the warmed water and the valve's lowest edge, m (our choice: 3 mm). */
export const VALVE_MARGIN_M = 0.003;

export interface FillLimit {
  /** Most water at the start temperature, m³. */
  readonly maxFillM3: number;
  /** Its height above the floor when poured, m. */
  readonly fillHeightM: number;
  /** Temperature the expansion allowance is computed for, K. */
  readonly hottestK: number;
}

/**
 * The hottest the water in the base can get before the valve opens: the boiling point at
 * the room pressure plus the valve's opening pressure (IF97 Region 4). Expansion is
 * allowed for up to that temperature, so the limit holds whatever the heat.
 */
export function hottestWaterK(pot: PotModel, ambientPa: number): number {
  return saturationTemperatureK(ambientPa + pot.valveOpeningGaugePa);
}

/** The largest safe fill for water poured at `startK`. */
export function maxSafeFill(pot: PotModel, startK: number, ambientPa: number): FillLimit {
  const g = potGeometry(pot);
  const hottestK = hottestWaterK(pot, ambientPa);
  const limitVolume = g.baseAreaM2 * (pot.valveHeightM - VALVE_MARGIN_M);
  const pressure = ambientPa + pot.valveOpeningGaugePa;
  const expansion =
    region1(startK, pressure).densityKgM3 / region1(hottestK - 1e-6, pressure).densityKgM3;
  const maxFillM3 = Math.max(0, limitVolume / expansion);
  return { maxFillM3, fillHeightM: maxFillM3 / g.baseAreaM2, hottestK };
}

/** Height of a fill above the floor and below the valve's lowest edge, m. */
export function fillHeights(
  pot: PotModel,
  fillM3: number,
): { heightM: number; belowValveM: number } {
  const heightM = fillM3 / potGeometry(pot).baseAreaM2;
  return { heightM, belowValveM: pot.valveHeightM - heightM };
}
