/**
 * How content/logs/first-morning.yaml was made: the true values and the brews behind its
 * invented numbers. To make them again (after a change of the simulator or of the demo
 * pot), run `npx tsx tests/calibration/demo-log.ts` and copy the printed values into the log.
 */
import { pathToFileURL } from 'node:url';
import { loadCoffeeFile, loadPotFile } from '../../generator/content/index.ts';
import { defaultHeatLossWPerK } from '../../generator/content/pot-defaults.ts';
import { syntheticBrews, type BrewPlan, type Truth } from './synthetic-log.ts';

/**
 * Near the demo entries' own values: permeability 1.3 × house-blend's 0.8e-12 m²; heat
 * 0.9 × bar-gas's medium (1000 W) and high (1500 W) × the gas default efficiency 0.36;
 * U·A the three-cup pot's default, 10 W/(m²·K) × its side area (260 mL, 84 mm: 0.1238 W/K).
 */
export const DEMO_TRUTH: Truth = {
  permeabilityM2: 1.04e-12,
  heatW: { medium: 324, high: 486 },
  heatLossWPerK: defaultHeatLossWPerK(260e-6, 0.084),
};

export const DEMO_PLANS: readonly BrewPlan[] = [
  {
    level: 'medium',
    fillMl: 150,
    startC: 20,
    roomC: 21,
    offHeatS: 120,
    cupAtS: [80, 90, 100, 110, 120, 130, 140],
    probeAtS: [30, 60, 90, 120],
  },
  { level: 'high', fillMl: 150, startC: 20, roomC: 21 },
];

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const content = new URL('../../content/', import.meta.url);
  const pot = await loadPotFile(new URL('pots/three-cup.yaml', content).pathname);
  const coffee = await loadCoffeeFile(new URL('coffees/house-blend.yaml', content).pathname);
  for (const brew of syntheticBrews(pot, coffee, DEMO_TRUTH, DEMO_PLANS)) {
    process.stdout.write(`${JSON.stringify(brew)}\n`);
  }
}
