/**
 * What a brew log saw, as a flat list of observations (SI, each with its σ), and what the
 * simulation says each of them should have been.
 *
 *   first_coffee_s  → BrewResult.firstCoffeeS (the end of the run when no coffee came)
 *   sputter_s       → BrewResult.sputterS (the end of the flow when the model's pot, taken
 *                     off the heat, stops without sputtering)
 *   yield_ml        → BrewResult.yieldM3 (the simulator's yield, the one a card prints)
 *   cup_g [t, g]    → mass in the cup at t: ∫ρ·dV along the run, ρ of the water in the base
 *                     as it leaves (saturated-liquid density); after the run ends, the final mass
 *   water_c [t, °C] → water temperature in the base at t; after the run ends, its last value
 *
 * Series readings are interpolated linearly between the simulation's 1 s samples (the curves
 * are smooth at that scale; the interpolation is continuous in the parameters, which the
 * finite-difference Jacobian needs). off_heat_s is not an observation: it is what was done,
 * and the brew is simulated with the heat taken off then.
 */
import type { BrewResult, SeriesPoint } from '../brew/types.ts';
import type { LogEntry, LoggedBrew, SourceRef } from '../content/types.ts';
import { fieldName, type YamlPath } from '../content/yaml-source.ts';
import { saturatedLiquidDensityKgM3 } from '../physics/saturation.ts';
import { ASSUMED_SIGMA } from './uncertainty.ts';

export type ObservationKind =
  'first-coffee' | 'sputter' | 'yield' | 'cup-mass' | 'water-temperature';

export interface Observation {
  /** Index of the brew in the log. */
  readonly brew: number;
  readonly kind: ObservationKind;
  /** Where in the log file: ['brews', 0, 'cup_g', 2]. */
  readonly path: YamlPath;
  /** The same as a field name, for messages: `brews[0].cup_g[2]`. */
  readonly field: string;
  /** Time of a scale or probe reading, s. */
  readonly atS?: number;
  /** What was seen, SI: s, m³, kg or K. */
  readonly seen: number;
  /** Its assumed standard deviation, same unit. */
  readonly sigma: number;
  /** The brew's position for first coffee, sputter and yield; the reading's for readings. */
  readonly source: SourceRef;
}

/** Every observation of the log, brew by brew, in the order the file lists them. */
export function logObservations(log: LogEntry): Observation[] {
  return log.brews.flatMap((brew, index) => brewObservations(brew, index));
}

function brewObservations(brew: LoggedBrew, index: number): Observation[] {
  const at = ['brews', index] as const;
  const list: Observation[] = [];
  const single = (
    kind: ObservationKind,
    key: string,
    seen: number | undefined,
    sigma: number,
  ): void => {
    if (seen === undefined) return;
    const path = [...at, key];
    list.push({
      brew: index,
      kind,
      path,
      field: fieldName(path),
      seen,
      sigma,
      source: brew.source,
    });
  };
  single('first-coffee', 'first_coffee_s', brew.firstCoffeeS, ASSUMED_SIGMA.stopwatchS);
  single('sputter', 'sputter_s', brew.sputterS, ASSUMED_SIGMA.stopwatchS);
  single('yield', 'yield_ml', brew.yieldM3, ASSUMED_SIGMA.yieldM3);
  brew.cupMass?.forEach((reading, i) => {
    const path = [...at, 'cup_g', i];
    list.push({
      brew: index,
      kind: 'cup-mass',
      path,
      field: fieldName(path),
      atS: reading.tS,
      seen: reading.kg,
      sigma: ASSUMED_SIGMA.scaleKg,
      source: reading.source,
    });
  });
  brew.waterTemperature?.forEach((reading, i) => {
    const path = [...at, 'water_c', i];
    list.push({
      brew: index,
      kind: 'water-temperature',
      path,
      field: fieldName(path),
      atS: reading.tS,
      seen: reading.k,
      sigma: ASSUMED_SIGMA.probeK,
      source: reading.source,
    });
  });
  return list;
}

/** Whether predicting these observations needs the simulation's time series. */
export function needsSeries(observations: readonly Observation[]): boolean {
  return observations.some((o) => o.kind === 'cup-mass' || o.kind === 'water-temperature');
}

/** The simulation's value of each observation (all of one brew), SI. */
export function predictObservations(
  result: BrewResult,
  observations: readonly Observation[],
): number[] {
  const cupMass = needsSeries(observations) ? cumulativeCupKg(result.series) : [];
  return observations.map((o) => {
    switch (o.kind) {
      case 'first-coffee':
        return result.firstCoffeeS ?? result.endS;
      case 'sputter':
        return result.sputterS ?? result.endS;
      case 'yield':
        return result.yieldM3;
      case 'cup-mass':
        return interpolate(result.series, cupMass, o.atS!);
      case 'water-temperature':
        return interpolate(
          result.series,
          result.series.map((p) => p.waterK),
          o.atS!,
        );
    }
  });
}

/**
 * Mass in the cup at each series point, kg: the trapezoid rule on ρ(T)·dV, with V the cup
 * volume the simulation counts (volume of the water as it leaves the base, at its
 * temperature T). Worked value: 100 mL leaving at 90 °C is 96.5 g.
 */
export function cumulativeCupKg(series: readonly SeriesPoint[]): number[] {
  const mass: number[] = [];
  let total = 0;
  series.forEach((point, i) => {
    const previous = series[i - 1];
    if (previous) {
      const density =
        (saturatedLiquidDensityKgM3(previous.waterK) + saturatedLiquidDensityKgM3(point.waterK)) /
        2;
      total += Math.max(0, point.cupM3 - previous.cupM3) * density;
    }
    mass.push(total);
  });
  return mass;
}

/** values[i] belongs to series[i]; linear between points, held beyond either end. */
function interpolate(
  series: readonly SeriesPoint[],
  values: readonly number[],
  tS: number,
): number {
  const n = series.length;
  if (n === 0) return NaN;
  if (tS <= series[0]!.tS) return values[0]!;
  if (tS >= series[n - 1]!.tS) return values[n - 1]!;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (series[mid]!.tS <= tS) lo = mid;
    else hi = mid;
  }
  const t0 = series[lo]!.tS;
  const t1 = series[hi]!.tS;
  const f = t1 > t0 ? (tS - t0) / (t1 - t0) : 0;
  return values[lo]! + f * (values[hi]! - values[lo]!);
}
