/** Typed failures of the brew simulation. Wording lives in generator/words/brew.ts. */
import { brewWords } from '../words/brew.ts';

/** The setup cannot be brewed at all (e.g. the water would boil before sealing). */
export class BrewSetupError extends Error {
  override readonly name = 'BrewSetupError';
  constructor(
    readonly field: string,
    readonly problem: string,
  ) {
    super(brewWords.setup(field, problem));
  }
}

/** The integrator gave up (step limit or step-size underflow): a model or input defect. */
export class BrewDidNotFinishError extends Error {
  override readonly name = 'BrewDidNotFinishError';
  constructor(
    readonly outcome: string,
    readonly atS: number,
  ) {
    super(brewWords.didNotFinish(outcome, atS));
  }
}
