/** User-facing words of the brew simulation. */
export const brewWords = {
  setup: (field: string, problem: string): string => `cannot brew this setup (${field}): ${problem}`,
  didNotFinish: (outcome: string, atS: number): string =>
    `the simulation stopped early (${outcome} at ${atS.toFixed(1)} s); check the inputs for extreme values`,
};
