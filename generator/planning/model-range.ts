/**
 * The ranges the model was checked for. Inputs outside them still get a plan, with a
 * warning on the card and in the build log rather than a silent extrapolation.
 */
import type { PlanRequest } from './plan.ts';
import { distinctWarnings, planNotices } from './notices.ts';
import type { PlanWarning } from './types.ts';
import { potGeometry } from '../brew/geometry.ts';

/** Checked ranges (SI). Permeability: the stovetop beds our checks cover. */
export const CHECKED = {
  permeabilityM2: [2e-13, 5e-12],
  heatToPotW: [50, 1200],
  altitudeM: [-100, 3000],
  sealedVolumeM3: [60e-6, 1000e-6],
  ambientK: [283.15, 308.15],
} as const;

/** Warnings for a request; `levelIndex` names the chosen level (null: before choosing). */
export function modelRangeWarnings(request: PlanRequest, levelIndex: number | null): PlanWarning[] {
  const warnings: PlanWarning[] = [];
  const outside = (what: keyof typeof CHECKED, value: number): void => {
    const [lo, hi] = CHECKED[what];
    if (value < lo || value > hi)
      warnings.push(planNotices.outsideCheckedRange(what, value, lo, hi));
  };
  outside('permeabilityM2', request.coffee.bed.permeabilityM2);
  const level = levelIndex === null ? undefined : request.stove.levels[levelIndex];
  if (level) outside('heatToPotW', level.heatToPotW);
  outside('altitudeM', request.room.altitudeM);
  outside('sealedVolumeM3', request.pot.model.sealedVolumeM3);
  outside('ambientK', request.room.ambientK);
  if (
    request.fillM3 !== undefined &&
    request.fillM3 < 2 * potGeometry(request.pot.model).volumeAtTubeEndM3
  ) {
    warnings.push(planNotices.smallFill());
  }
  return distinctWarnings(warnings);
}
