/** Typed failures of a calibration. Wording lives in generator/words/fit.ts. */
import type { SourceRef } from '../content/types.ts';
import { fitWords } from '../words/fit.ts';

/** A logged brew the simulation cannot run as written (e.g. filled below the funnel tube). */
export class BrewNotSimulatedError extends Error {
  override readonly name = 'BrewNotSimulatedError';
  constructor(
    readonly source: SourceRef,
    readonly field: string,
    readonly problem: string,
  ) {
    super(fitWords.brewNotSimulated(source, field, problem));
  }
}
