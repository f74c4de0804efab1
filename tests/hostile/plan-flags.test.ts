/** `stovecard plan` flags outside the model's range, and a cold start that delivers nothing. */
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planSummary } from '../../generator/cli/plan.ts';
import { loadCoffeeFile, loadPotFile, loadStoveFile } from '../../generator/content/index.ts';
import { planCard } from '../../generator/planning/plan.ts';
import { DEFAULT_ROOM } from '../../generator/planning/setup.ts';
import { faultWords } from '../../generator/words/build-faults.ts';
import { DEMO_CONTENT, expectCleanFailure, lines, runMain } from './cli-run.ts';

const files = [
  '--pot',
  path.join(DEMO_CONTENT, 'pots', 'three-cup.yaml'),
  '--coffee',
  path.join(DEMO_CONTENT, 'coffees', 'house-blend.yaml'),
  '--stove',
  path.join(DEMO_CONTENT, 'stoves', 'bar-gas.yaml'),
];

describe('plan flags outside the model', () => {
  // 0 °C is below water's triple point, 273.16 K (IAPWS R14-08): no liquid-water table covers it.
  for (const [flag, value, min, max, unit] of [
    ['--ambient-c', '0', 1, 45, '°C'],
    ['--ambient-c', '-40', 1, 45, '°C'],
    ['--altitude-m', '9000', -500, 5000, 'm'],
  ] as const) {
    it(`${flag} ${value} names the flag and its range, not a property table`, async () => {
      const run = await runMain(['plan', ...files, `${flag}=${value}`]);
      expectCleanFailure(run, `${flag} ${value}`);
      expect(lines(run.stderr)).toEqual([
        `stovecard: ${faultWords.flagOutOfRange(flag, Number(value), min, max, unit)}`,
      ]);
      expect(run.stderr).not.toMatch(/IAPWS|K is outside/);
    });
  }
});

describe('a cold start that delivers no coffee', () => {
  it('the summary says so instead of "NaN °C"', async () => {
    const [pot, coffee, stove] = await Promise.all([
      loadPotFile(path.join(DEMO_CONTENT, 'pots', 'three-cup.yaml')),
      loadCoffeeFile(path.join(DEMO_CONTENT, 'coffees', 'house-blend.yaml')),
      loadStoveFile(path.join(DEMO_CONTENT, 'stoves', 'bar-gas.yaml')),
    ]);
    const plan = planCard({ pot, coffee, stove, room: DEFAULT_ROOM });
    if (plan.refused) throw new Error('the demo plan is refused');
    // What the planner records when the cold start delivers nothing (plan-cache.ts).
    const nothing = {
      ...plan,
      coldStart: { ...plan.coldStart, meanK: Number.NaN, inBandShare: 0 },
    };
    const text = planSummary(nothing, false);
    expect(text).not.toContain('NaN');
    expect(text).toContain(faultWords.coldStartNoCoffee);
  });
});
