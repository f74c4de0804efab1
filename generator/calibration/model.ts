/**
 * The forward model of a calibration: given the parameter values, simulate every brew of
 * the log as it was made (its fill, start and room temperature, level, and the heat taken
 * off at off_heat_s or left on until the sputter) and return the model's value of every
 * observation, divided by the observation's σ (so residuals are in units of σ). A brew the
 * simulation refuses as set up (filled below the funnel tube, water too hot to seal) throws
 * BrewNotSimulatedError naming that brew.
 */
import { BrewSetupError } from '../brew/errors.ts';
import { simulateBrew } from '../brew/simulate.ts';
import type { BedModel, BrewResult, PotModel } from '../brew/types.ts';
import type { CoffeeEntry, LogEntry, LoggedBrew, PotEntry } from '../content/types.ts';
import { brewSetup, roomModel } from '../planning/setup.ts';
import { BrewNotSimulatedError } from './errors.ts';
import { needsSeries, predictObservations, type Observation } from './observations.ts';
import type { ModelValues } from './parameters.ts';

export interface ForwardModel {
  readonly observations: readonly Observation[];
  /** Model value of each observation over its σ, in the order of `observations`. */
  scaledPredictions(values: ModelValues): Float64Array;
  /** Simulations run so far. */
  readonly simulations: () => number;
}

/** One simulated brew of the log, with the heat and U·A of `values`. */
export function simulateLoggedBrew(
  brew: LoggedBrew,
  altitudeM: number,
  pot: PotModel,
  coffee: CoffeeEntry,
  values: ModelValues,
  collectSeries: boolean,
): BrewResult {
  const heatInputW = values.heatW.get(brew.level);
  if (heatInputW === undefined) throw new Error(`no heat for level ${brew.level}`);
  const setup = brewSetup(
    { ...pot, heatLossWPerK: values.heatLossWPerK },
    bedWith(coffee, values),
    roomModel({ ambientK: brew.ambientK, altitudeM }),
    {
      fillVolumeM3: brew.fillVolumeM3,
      startK: brew.startK,
      heatInputW,
      ...(brew.heatOffS !== undefined ? { heatOffAtS: brew.heatOffS } : {}),
      collectSeries,
    },
  );
  return simulateBrew(setup);
}

/** The coffee's bed with the permeability (and, when fitted, the final share) of `values`. */
function bedWith(coffee: CoffeeEntry, values: ModelValues): BedModel {
  const { tightening } = coffee.bed;
  return {
    ...coffee.bed,
    permeabilityM2: values.permeabilityM2,
    ...(tightening && values.finalShare !== null
      ? { tightening: { ...tightening, finalShare: values.finalShare } }
      : {}),
  };
}

export function forwardModel(
  log: LogEntry,
  pot: PotEntry,
  coffee: CoffeeEntry,
  observations: readonly Observation[],
): ForwardModel {
  const indicesOf = log.brews.map((_, i) =>
    observations.flatMap((o, index) => (o.brew === i ? [index] : [])),
  );
  let simulations = 0;
  return {
    observations,
    simulations: () => simulations,
    scaledPredictions(values: ModelValues): Float64Array {
      const out = new Float64Array(observations.length);
      log.brews.forEach((brew, i) => {
        const indices = indicesOf[i]!;
        if (indices.length === 0) return;
        const own = indices.map((index) => observations[index]!);
        simulations += 1;
        const result = simulateOrExplain(brew, i, () =>
          simulateLoggedBrew(brew, log.altitudeM, pot.model, coffee, values, needsSeries(own)),
        );
        predictObservations(result, own).forEach((value, j) => {
          out[indices[j]!] = value / own[j]!.sigma;
        });
      });
      return out;
    },
  };
}

/** A brew the simulation refuses as set up is an input error at that brew of the log. */
function simulateOrExplain(brew: LoggedBrew, index: number, run: () => BrewResult): BrewResult {
  try {
    return run();
  } catch (error) {
    if (!(error instanceof BrewSetupError)) throw error;
    throw new BrewNotSimulatedError(brew.source, `brews[${index}]`, error.code);
  }
}
