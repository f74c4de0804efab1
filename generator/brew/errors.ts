/**
 * Typed failures of the brew simulation, as codes and facts. The words are
 * generator/words/brew.ts, said by the CLI; `message` is for developers only.
 */

/** Why a setup cannot be brewed at all. */
export type BrewSetupCode =
  | 'boils-before-sealing'
  | 'freezes'
  | 'below-funnel-tube'
  | 'no-air-space'
  | 'negative-heat'
  | 'non-positive-permeability'
  | 'bad-tightening'
  | 'heat-on-run-with-off-time';

/** The setup cannot be brewed at all (e.g. the water would boil before sealing). */
export class BrewSetupError extends Error {
  override readonly name = 'BrewSetupError';
  constructor(
    /** The BrewSetup field at fault, e.g. `startK`. */
    readonly field: string,
    readonly code: BrewSetupCode,
  ) {
    super(`brew setup ${code} (${field})`);
  }
}

/** The integrator gave up (step limit or step-size underflow): a model or input defect. */
export class BrewDidNotFinishError extends Error {
  override readonly name = 'BrewDidNotFinishError';
  constructor(
    readonly outcome: string,
    readonly atS: number,
  ) {
    super(`brew did not finish: ${outcome} at ${atS} s`);
  }
}
