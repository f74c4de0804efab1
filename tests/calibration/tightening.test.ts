/**
 * Fitting a bed's tightening (its final share) from synthetic logs made at a known truth
 * (TRUTH of fixtures.ts with final share 0.6 over 40 mL) with seeded stopwatch and scale
 * noise: reported as fitted only within 3σ of the truth; a log of first-coffee times only
 * leaves it at the entry's value as not identifiable.
 */
import { rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitLog } from '../../generator/calibration/fit.ts';
import {
  COFFEE_TEXT,
  FIRST_COFFEE_ONLY,
  IDS,
  syntheticInput,
  testContent,
  TRUTH,
  WELL_OBSERVED,
} from './fixtures.ts';
import { mulberry32 } from './synthetic-log.ts';

let dir: string;
beforeAll(async () => {
  dir = await testContent();
  // The coffee turns the tightening on at no tightening (final share 1): the fit's prior.
  await writeFile(
    join(dir, 'coffees', `${IDS.coffee}.yaml`),
    `${COFFEE_TEXT}bed: { tightening: { final_share: 1, over_ml: 40 } }\n`,
  );
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

const TRUE_SHARE = 0.6;

describe('fit of the final share', () => {
  // source: the three-sigma rule (99.7 % of a normal error lies within 3σ)
  it('weighed brews: when reported as fitted, within 3σ of the truth', async () => {
    const input = await syntheticInput(
      dir,
      'weighed',
      WELL_OBSERVED,
      { noise: { random: mulberry32(11) } },
      { ...TRUTH, finalShare: TRUE_SHARE },
    );
    const report = fitLog(input, { leaveOneOut: false });
    const share = report.estimates.find((e) => e.parameter.id === 'tightening')!;
    expect(share).toBeDefined();
    if (share.status === 'fitted') {
      expect(Math.abs(Math.log(share.value / TRUE_SHARE))).toBeLessThanOrEqual(
        3 * share.relativeSigma,
      );
    }
  });

  // own rule: a parameter the observations cannot pin down is reported as kept, never fitted
  it('first-coffee times only: not identifiable, kept at the prior', async () => {
    const input = await syntheticInput(
      dir,
      'first-only',
      FIRST_COFFEE_ONLY,
      { noise: { random: mulberry32(11) } },
      { ...TRUTH, finalShare: TRUE_SHARE },
    );
    const share = fitLog(input, { leaveOneOut: false }).estimates.find(
      (e) => e.parameter.id === 'tightening',
    )!;
    expect(share.status).toBe('kept');
    expect(share.value).toBe(1); // own rule: the entry's value (the prior) is kept
  });

  // own rule: off by default, a coffee without bed.tightening has no such parameter
  it('is no candidate when the coffee leaves the tightening out', async () => {
    const plain = await testContent();
    try {
      const input = await syntheticInput(plain, 'plain', FIRST_COFFEE_ONLY);
      expect(
        fitLog(input, { leaveOneOut: false }).estimates.map((e) => e.parameter.id),
      ).not.toContain('tightening');
    } finally {
      await rm(plain, { recursive: true, force: true });
    }
  });
});
