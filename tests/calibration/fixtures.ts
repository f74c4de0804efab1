/**
 * Entries the calibration tests own (so demo edits never move them): a three-cup
 * aluminium pot, a medium-fine coffee at 0.8e-12 m² and a gas ring of three levels, written
 * to a temp content folder and loaded through the content layer. TRUTH is what the
 * synthetic logs are made from: near the entries' own values, as the demo log is.
 */
import { mkdir, mkdtemp, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  loadCoffeeFile,
  loadLogFile,
  loadPotFile,
  loadStoveFile,
} from '../../generator/content/index.ts';
import type { FitInput } from '../../generator/calibration/fit.ts';
import { defaultHeatLossWPerK } from '../../generator/content/pot-defaults.ts';
import {
  logText,
  syntheticBrews,
  type BrewPlan,
  type SyntheticOptions,
  type Truth,
} from './synthetic-log.ts';

export const POT_TEXT = `# a test pot
name: Test three-cup pot
cups: 3
base:
  sealed_volume_ml: 260 # with the funnel seated
  inner_diameter_mm: 84
  valve_height_mm: 32
  material: aluminium
  mass_g: 180

funnel:
  basket_diameter_mm: 56
  basket_depth_mm: 15
  tube_inner_diameter_mm: 7
  tube_gap_mm: 4
upper:
  spout_height_mm: 115
  capacity_ml: 200
`;

export const COFFEE_TEXT = `# a test coffee
name: Test blend
roast: medium
grind: medium-fine
permeability_m2: 0.8e-12 # from the grind chart
bulk_density_g_ml: 0.38
retention_g_per_g: 1.2
target_c: [90, 96]
`;

export const STOVE_TEXT = `# a test ring; efficiency left at the gas default (0.36)
name: Test gas ring
kind: gas
levels: # gentlest first
  - { label: low, power_w: 600 }
  - { label: medium, power_w: 1000 }

  - { label: high, power_w: 1500 } # the big flame
`;

export const IDS = { pot: 'test-pot', coffee: 'test-blend', stove: 'test-ring' } as const;

/** 1.3 × the coffee's permeability, 0.9 × each level's power × 0.36, the pot's default U·A. */
export const TRUTH: Truth = {
  permeabilityM2: 1.3 * 0.8e-12,
  heatW: { low: 0.9 * 600 * 0.36, medium: 0.9 * 1000 * 0.36, high: 0.9 * 1500 * 0.36 },
  heatLossWPerK: defaultHeatLossWPerK(260e-6, 0.084),
};

/** A content folder with the test entries (and logs/ for the log files). */
export async function testContent(): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'stovecard-fit-'));
  for (const folder of ['pots', 'coffees', 'stoves', 'logs']) await mkdir(join(dir, folder));
  await writeFile(join(dir, 'pots', `${IDS.pot}.yaml`), POT_TEXT);
  await writeFile(join(dir, 'coffees', `${IDS.coffee}.yaml`), COFFEE_TEXT);
  await writeFile(join(dir, 'stoves', `${IDS.stove}.yaml`), STOVE_TEXT);
  return dir;
}

/** The test entries as loaded. */
export async function testEntries(dir: string): Promise<Omit<FitInput, 'log'>> {
  const [pot, coffee, stove] = await Promise.all([
    loadPotFile(join(dir, 'pots', `${IDS.pot}.yaml`)),
    loadCoffeeFile(join(dir, 'coffees', `${IDS.coffee}.yaml`)),
    loadStoveFile(join(dir, 'stoves', `${IDS.stove}.yaml`)),
  ]);
  return { pot, coffee, stove };
}

/** A synthetic log made from `truth`, written to logs/<name>.yaml, and the fit input for it. */
export async function syntheticInput(
  dir: string,
  name: string,
  plans: readonly BrewPlan[],
  options: SyntheticOptions = {},
  truth: Truth = TRUTH,
): Promise<FitInput & { path: string }> {
  const entries = await testEntries(dir);
  const brews = syntheticBrews(entries.pot, entries.coffee, truth, plans, options);
  const path = join(dir, 'logs', `${name}.yaml`);
  await writeFile(path, logText(IDS, brews));
  return { ...entries, log: await loadLogFile(path), path };
}

const every = (stepS: number, fromS: number, toS: number): number[] =>
  Array.from({ length: Math.floor((toS - fromS) / stepS) + 1 }, (_, i) => fromS + i * stepS);

/** Two brews (medium, high) with scale readings through the delivery and probe readings. */
export const WELL_OBSERVED: readonly BrewPlan[] = [
  {
    level: 'medium',
    fillMl: 150,
    startC: 20,
    roomC: 21,
    cupAtS: every(10, 70, 120),
    probeAtS: every(10, 10, 120),
  },
  {
    level: 'high',
    fillMl: 150,
    startC: 20,
    roomC: 21,
    cupAtS: every(10, 50, 80),
    probeAtS: every(10, 10, 80),
  },
];

/** A long, gentle brew and a short, hot one, with the probe in the base every 10 s. */
export const PROBED: readonly BrewPlan[] = [
  {
    level: 'low',
    fillMl: 150,
    startC: 20,
    roomC: 21,
    cupAtS: every(20, 150, 230),
    probeAtS: every(10, 10, 240),
  },
  {
    level: 'high',
    fillMl: 150,
    startC: 20,
    roomC: 21,
    cupAtS: every(10, 50, 80),
    probeAtS: every(10, 10, 80),
  },
];

/** Short, hot brews timed and weighed, no probe. */
export const SHORT_UNPROBED: readonly BrewPlan[] = [
  { level: 'medium', fillMl: 150, startC: 20, roomC: 21, cupAtS: every(10, 70, 120) },
  { level: 'high', fillMl: 150, startC: 20, roomC: 21, cupAtS: every(10, 50, 80) },
];

/** One brew, only the first coffee timed. */
export const FIRST_COFFEE_ONLY: readonly BrewPlan[] = [
  { level: 'medium', fillMl: 150, startC: 20, roomC: 21, sputter: false, yield: false },
];
