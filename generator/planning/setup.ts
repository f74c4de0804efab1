/** Builds the physics' BrewSetup from content entries and the room. */
import type { BedModel, BrewSetup, PotModel, RoomModel } from '../brew/types.ts';
import { ambientPressurePa } from '../physics/atmosphere.ts';
import { CELSIUS_OFFSET_K } from '../physics/constants.ts';

export interface Room {
  readonly ambientK: number;
  readonly altitudeM: number;
}

export const DEFAULT_ROOM: Room = { ambientK: 20 + CELSIUS_OFFSET_K, altitudeM: 0 };

export function roomModel(room: Room): RoomModel {
  return { ambientK: room.ambientK, ambientPa: ambientPressurePa(room.altitudeM) };
}

export interface BrewChoice {
  readonly fillVolumeM3: number;
  readonly startK: number;
  readonly heatInputW: number;
  readonly heatOffAtS?: number;
  readonly collectSeries?: boolean;
  readonly relativeTolerance?: number;
}

export function brewSetup(
  pot: PotModel,
  bed: BedModel,
  room: RoomModel,
  choice: BrewChoice,
): BrewSetup {
  return {
    pot,
    bed,
    room,
    fillVolumeM3: choice.fillVolumeM3,
    startK: choice.startK,
    heatInputW: choice.heatInputW,
    ...(choice.heatOffAtS !== undefined ? { heatOffAtS: choice.heatOffAtS } : {}),
    collectSeries: choice.collectSeries ?? false,
    ...(choice.relativeTolerance !== undefined
      ? { relativeTolerance: choice.relativeTolerance }
      : {}),
  };
}
