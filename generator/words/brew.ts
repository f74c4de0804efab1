/** User-facing words of the brew simulation's failures (generator/brew/errors.ts codes). */
import type { BrewSetupCode } from '../brew/errors.ts';

const setupProblems: Record<BrewSetupCode, string> = {
  'boils-before-sealing': 'the water would already boil at the room pressure',
  freezes: 'the water would freeze',
  'below-funnel-tube': 'the water does not reach the funnel tube',
  'no-air-space': 'no air space is left in the base',
  'negative-heat': 'heat input must not be negative',
  'non-positive-permeability': 'permeability must be positive',
  'bad-tightening': 'the bed tightening needs a final share above 0 and a positive volume',
  'heat-on-run-with-off-time': 'a heat-on run leaves the heat on: leave heatOffAtS out',
};

export const brewWords = {
  setupProblem: (code: BrewSetupCode): string => setupProblems[code],
  setup: (field: string, code: BrewSetupCode): string =>
    `cannot brew this setup (${field}): ${setupProblems[code]}`,
  didNotFinish: (outcome: string, atS: number): string =>
    `the simulation stopped early (${outcome} at ${atS.toFixed(1)} s); check the inputs for extreme values`,
};
