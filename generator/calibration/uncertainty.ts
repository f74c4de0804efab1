/**
 * How far a brew log's readings may be from the truth: one standard deviation per kind of
 * reading, in SI. These are our assumptions (no published source; common practice for
 * kitchen instruments): a person with a stopwatch starts, stops and notices the first
 * coffee or the sputter within about 2 s; a kitchen scale reads to 1 g; a probe thermometer
 * in the base to about 1 °C; a yield read off a jug or cup marking to about 3 mL.
 * Each residual is divided by its σ, so every observation counts in units of its own
 * uncertainty.
 */
export const ASSUMED_SIGMA = {
  /** Stopwatch: first coffee, sputter, s. */
  stopwatchS: 2,
  /** Kitchen scale under the cup, kg (1 g). */
  scaleKg: 1e-3,
  /** Probe in the water of the base, K (1 °C). */
  probeK: 1,
  /** Yield read off a measuring jug, m³ (3 mL). */
  yieldM3: 3e-6,
} as const;
