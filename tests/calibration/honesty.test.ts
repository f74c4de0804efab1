/**
 * Honest calibration: on synthetic logs made at a known truth (TRUTH in fixtures.ts) with
 * seeded stopwatch, scale and probe noise, every value reported as fitted lies within 3σ of
 * the truth (for a normal error, 99.7 % of cases: the three-sigma rule), across log kinds;
 * a wrong fixed input (the grounds' retention) is flagged as a misfit naming the brews;
 * a log of three brews gets a leave-one-brew-out prediction error.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitLog } from '../../generator/calibration/fit.ts';
import type { FitReport } from '../../generator/calibration/types.ts';
import { rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { loadLogFile } from '../../generator/content/index.ts';
import {
  FIRST_COFFEE_ONLY,
  IDS,
  PROBED,
  SHORT_UNPROBED,
  syntheticInput,
  testContent,
  testEntries,
  TRUTH,
  WELL_OBSERVED,
} from './fixtures.ts';
import { logText, mulberry32, syntheticBrews, type BrewPlan } from './synthetic-log.ts';

let dir: string;
beforeAll(async () => {
  dir = await testContent();
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

const truthOf = (id: string): number =>
  id === 'permeability'
    ? TRUTH.permeabilityM2
    : id === 'heat-loss'
      ? TRUTH.heatLossWPerK
      : TRUTH.heatW[id.slice('heat:'.length)]!;

function fittedWithin3Sigma(report: FitReport, label: string): number {
  let fitted = 0;
  for (const e of report.estimates) {
    if (e.status !== 'fitted') continue;
    fitted++;
    const error = Math.log(e.value / truthOf(e.parameter.id));
    expect(
      Math.abs(error),
      `${label}: ${e.parameter.id} off by ${(error * 100).toFixed(1)} %, σ ${(e.relativeSigma * 100).toFixed(1)} %`,
    ).toBeLessThanOrEqual(3 * e.relativeSigma);
  }
  return fitted;
}

/** Three cold-start brews timed only (first coffee and sputter): permeability and heat entangle. */
const TIMED_ONLY: readonly BrewPlan[] = [
  { level: 'low', fillMl: 150, startC: 20, roomC: 21, yield: false },
  { level: 'medium', fillMl: 150, startC: 20, roomC: 21, yield: false },
  { level: 'high', fillMl: 140, startC: 20, roomC: 21, yield: false },
];
const THREE_WEIGHED: readonly BrewPlan[] = [
  ...WELL_OBSERVED,
  { level: 'medium', fillMl: 140, startC: 60, roomC: 21 },
];

const kinds: [string, readonly BrewPlan[]][] = [
  ['first coffee only', FIRST_COFFEE_ONLY],
  ['timed only, three brews', TIMED_ONLY],
  ['weighed and probed', WELL_OBSERVED],
  ['probed, long and short', PROBED],
  ['weighed, no probe', SHORT_UNPROBED],
  ['three weighed brews', THREE_WEIGHED],
];

describe('fitted values cover the truth within 3σ', () => {
  for (const [name, plans] of kinds) {
    it(`${name} (seeds 11–13)`, async () => {
      let fitted = 0;
      for (const seed of [11, 12, 13]) {
        const input = await syntheticInput(
          dir,
          `honest-${name.replace(/\W+/g, '-')}-${seed}`,
          plans,
          {
            noise: { random: mulberry32(seed) },
          },
        );
        fitted += fittedWithin3Sigma(
          fitLog(input, { leaveOneOut: false }),
          `${name}, seed ${seed}`,
        );
      }
      expect(fitted).toBeGreaterThan(0);
    });
  }

  // own rule: how the fit reports its uncertainty (our specification)
  it('propagates what is held: a first-coffee time alone gives the heat a σ well above the stopwatch’s', async () => {
    const input = await syntheticInput(dir, 'held-prior', FIRST_COFFEE_ONLY, {
      noise: { random: mulberry32(5) },
    });
    const report = fitLog(input, { leaveOneOut: false });
    const heats = report.estimates.filter(
      (e) => e.parameter.kind === 'heat' && e.status === 'fitted',
    );
    expect(heats.length).toBeGreaterThan(0);
    for (const heat of heats) {
      if (heat.status !== 'fitted') continue;
      expect(heat.relativeSigma).toBeGreaterThan(1.5 * heat.statisticalRelativeSigma);
      expect(heat.entangledWith.length).toBeGreaterThan(0);
    }
  });
});

describe('misfit and prediction', () => {
  it('flags a brew that disagrees with the others (its stove level ran 40 % hotter that day) and names it', async () => {
    const entries = await testEntries(dir);
    const noise = { noise: { random: mulberry32(3) } };
    const hotter = { ...TRUTH, heatW: { ...TRUTH.heatW, high: 1.4 * TRUTH.heatW.high! } };
    const brews = [
      ...syntheticBrews(entries.pot, entries.coffee, TRUTH, WELL_OBSERVED, noise),
      ...syntheticBrews(entries.pot, entries.coffee, hotter, [WELL_OBSERVED[1]!], noise),
    ];
    const path = join(dir, 'logs', 'disagreeing.yaml');
    await writeFile(path, logText(IDS, brews));
    const report = fitLog({ ...entries, log: await loadLogFile(path) }, { leaveOneOut: false });
    expect(report.misfit).not.toBeNull();
    expect(report.misfit!.brews).toContain(2);
    const agreeing = await syntheticInput(dir, 'agreeing', WELL_OBSERVED, noise);
    expect(fitLog(agreeing, { leaveOneOut: false }).misfit).toBeNull();
  });

  // own rule: how the fit reports its uncertainty (our specification)
  it('reports a leave-one-brew-out error for a log of three brews, of the order of the readings’ σ', async () => {
    const input = await syntheticInput(dir, 'three-lobo', THREE_WEIGHED, {
      noise: { random: mulberry32(9) },
    });
    const report = fitLog(input);
    expect(report.leaveOneOut).not.toBeNull();
    expect(report.leaveOneOut!.perBrew.map((b) => b.brew)).toEqual([0, 1, 2]);
    expect(report.leaveOneOut!.rmsNormalised).toBeGreaterThan(0);
    expect(report.leaveOneOut!.rmsNormalised).toBeLessThan(10);
    const two = await syntheticInput(dir, 'two-lobo', WELL_OBSERVED, {
      noise: { random: mulberry32(9) },
    });
    expect(fitLog(two).leaveOneOut).toBeNull();
  });
});
