/**
 * Typed failures of a calibration, as codes and facts. The words are generator/words/fit.ts,
 * said by the CLI (`stovecard fit`); `message` is for developers only.
 */
import type { BrewSetupCode } from '../brew/errors.ts';
import type { SourceRef } from '../content/types.ts';

/** A logged brew the simulation cannot run as written (e.g. filled below the funnel tube). */
export class BrewNotSimulatedError extends Error {
  override readonly name = 'BrewNotSimulatedError';
  constructor(
    readonly source: SourceRef,
    readonly field: string,
    readonly code: BrewSetupCode,
  ) {
    super(`logged brew not simulated: ${code} (${source.file}:${source.line} ${field})`);
  }
}
