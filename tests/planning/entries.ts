/**
 * Entries for planner tests, built from the brew reference fixtures (tests/brew/fixtures.ts; not demo
 * content): a typical three-cup aluminium pot, a permeable stovetop grind, and stoves whose
 * levels span gentle to strong heat.
 */
import type {
  CoffeeEntry,
  PotEntry,
  StoveEntry,
  StoveKind,
} from '../../generator/content/types.ts';
import type { BedModel, PotModel } from '../../generator/brew/types.ts';
import { C, permeableBed, referencePot } from '../brew/fixtures.ts';

const source = (file: string) => ({ file, line: 1, column: 1 });

export function potEntry(model: Partial<PotModel> = {}, extra: Partial<PotEntry> = {}): PotEntry {
  const m = { ...referencePot, sealedVolumeM3: 260e-6, ...model };
  return {
    kind: 'pot',
    id: 'test-pot',
    name: 'Test three-cup pot',
    source: source('pots/test-pot.yaml'),
    hash: 'pot',
    cups: 3,
    model: m,
    valveOpeningAssumed: false,
    inductionReady: m.baseMaterial === 'stainless-steel',
    ...extra,
  };
}

export function coffeeEntry(bed: Partial<BedModel> = {}): CoffeeEntry {
  return {
    kind: 'coffee',
    id: 'test-coffee',
    name: 'Test coffee',
    source: source('coffees/test-coffee.yaml'),
    hash: 'coffee',
    roast: 'medium',
    grind: 'medium',
    bed: { ...permeableBed, targetBandK: [90 + C, 96 + C], ...bed },
    permeabilityAssumed: false,
    deliveryWindowS: [60, 150],
  };
}

/** Levels given as heat reaching the pot, W (efficiency 1 so power = heat). */
export function stoveEntry(heatsW: number[], stoveKind: StoveKind = 'gas'): StoveEntry {
  return {
    kind: 'stove',
    id: `test-${stoveKind}`,
    name: `Test ${stoveKind} stove`,
    source: source(`stoves/test-${stoveKind}.yaml`),
    hash: stoveKind,
    stoveKind,
    efficiency: 1,
    efficiencyAssumed: false,
    levels: heatsW.map((w, i) => ({ label: `L${i + 1}`, powerW: w, heatToPotW: w, fitted: false })),
  };
}

export const seaLevel = { ambientK: 20 + C, altitudeM: 0 };
