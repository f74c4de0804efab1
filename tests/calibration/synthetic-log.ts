/**
 * Brew logs made by the simulator from known "true" values, for the calibration tests and
 * for the demo log (content/logs/first-morning.yaml). Each brew is simulated with the true
 * permeability, heat and U·A; what a person would have seen is read off the run the same way
 * the fit reads it (generator/calibration/observations.ts), optionally disturbed by seeded
 * noise, and rounded the way the instruments read: stopwatch to 1 s, scale to 1 g, probe to
 * 0.1 °C, yield to 1 mL.
 *
 * Noise, when asked for: uniform on ±2 s (stopwatch), ±1 g (scale), ±0.5 °C (probe) and
 * ±2 mL (yield), from a seeded mulberry32 generator, so a seed always gives the same log.
 */
import { stringify } from 'yaml';
import type { BrewYaml } from '../../generator/content/log.ts';
import type { CoffeeEntry, LoggedBrew, PotEntry } from '../../generator/content/types.ts';
import { simulateLoggedBrew } from '../../generator/calibration/model.ts';
import { predictObservations, type Observation } from '../../generator/calibration/observations.ts';
import type { ModelValues } from '../../generator/calibration/parameters.ts';
import { celsiusToK, millilitresToM3 } from '../../generator/content/units.ts';

export interface Truth {
  readonly permeabilityM2: number;
  /** Heat reaching the pot per level label, W. */
  readonly heatW: Readonly<Record<string, number>>;
  readonly heatLossWPerK: number;
  /** The bed's final share, for a coffee that turns the tightening on (else its own bed). */
  readonly finalShare?: number;
}

/** One brew to make: what was set, and what to record. */
export interface BrewPlan {
  readonly level: string;
  readonly fillMl: number;
  readonly startC: number;
  readonly roomC: number;
  readonly offHeatS?: number;
  /** Record first coffee, sputter (when the run sputters) and yield; default all true. */
  readonly firstCoffee?: boolean;
  readonly sputter?: boolean;
  readonly yield?: boolean;
  readonly cupAtS?: readonly number[];
  readonly probeAtS?: readonly number[];
}

export interface Noise {
  /** Uniform on [0, 1). */
  readonly random: () => number;
}

export interface SyntheticOptions {
  /** Seeded noise to add before rounding. */
  readonly noise?: Noise;
  /** Skip the instruments' rounding (exact readings, for closed-loop checks). */
  readonly exact?: boolean;
}

/** mulberry32 (Tommy Ettinger, public domain): a small seeded PRNG, uniform on [0, 1). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The brews of a log, in trade units as a person would write them. */
export function syntheticBrews(
  pot: PotEntry,
  coffee: CoffeeEntry,
  truth: Truth,
  plans: readonly BrewPlan[],
  options: SyntheticOptions = {},
): BrewYaml[] {
  const { noise, exact = false } = options;
  const round = (value: number, step: number): number =>
    exact ? value : Number((Math.round(value / step) * step).toFixed(6));
  const values: ModelValues = {
    permeabilityM2: truth.permeabilityM2,
    heatW: new Map(Object.entries(truth.heatW)),
    heatLossWPerK: truth.heatLossWPerK,
    finalShare: truth.finalShare ?? null,
  };
  const jitter = (halfWidth: number): number => (noise ? (2 * noise.random() - 1) * halfWidth : 0);
  return plans.map((plan) => {
    const brew: LoggedBrew = {
      source: { file: 'synthetic', line: 1, column: 1 },
      level: plan.level,
      fillVolumeM3: millilitresToM3(plan.fillMl),
      startK: celsiusToK(plan.startC),
      ambientK: celsiusToK(plan.roomC),
      ...(plan.offHeatS !== undefined ? { heatOffS: plan.offHeatS } : {}),
    };
    const result = simulateLoggedBrew(brew, 0, pot.model, coffee, values, true);
    const reading = (kind: Observation['kind'], atS: number): number =>
      predictObservations(result, [
        { brew: 0, kind, path: [], field: '', atS, seen: 0, sigma: 1, source: brew.source },
      ])[0]!;
    const out: Record<string, unknown> = {
      level: plan.level,
      fill_ml: plan.fillMl,
      start_c: plan.startC,
      room_c: plan.roomC,
    };
    if (plan.firstCoffee !== false && result.firstCoffeeS !== null) {
      out.first_coffee_s = round(result.firstCoffeeS + jitter(2), 1);
    }
    if (plan.offHeatS !== undefined) out.off_heat_s = plan.offHeatS;
    if (plan.sputter !== false && result.sputterS !== null) {
      out.sputter_s = round(result.sputterS + jitter(2), 1);
    }
    if (plan.yield !== false) out.yield_ml = round(result.yieldM3 * 1e6 + jitter(2), 1);
    if (plan.cupAtS) {
      out.cup_g = plan.cupAtS.map((t) => [
        t,
        Math.max(0, round(reading('cup-mass', t) * 1e3 + jitter(1), 1)),
      ]);
    }
    if (plan.probeAtS) {
      out.water_c = plan.probeAtS.map((t) => [
        t,
        round(reading('water-temperature', t) - 273.15 + jitter(0.5), 0.1),
      ]);
    }
    return out as unknown as BrewYaml;
  });
}

/** A whole log file's text. */
export function logText(
  ids: { pot: string; coffee: string; stove: string },
  brews: readonly BrewYaml[],
): string {
  return stringify({ ...ids, brews }, { flowCollectionPadding: false });
}
