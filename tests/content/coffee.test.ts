import { describe, expect, it } from 'vitest';
import { DEFAULT_TARGET_C } from '../../generator/content/coffee.ts';
import { GRIND_PERMEABILITY_M2 } from '../../generator/content/grind-permeability.ts';
import { loadCoffeeFile } from '../../generator/content/index.ts';
import { contentWords } from '../../generator/words/content.ts';
import { COFFEE, expectIssue, rejection, tempFile } from './helpers.ts';

const load = async (text: string) => loadCoffeeFile(await tempFile('house-blend.yaml', text));

describe('GRIND_PERMEABILITY_M2', () => {
  it('fine is the top of the espresso-fine range, 1e-14–1e-13 m² (Corrochano et al., J. Food Eng. 150 (2015))', () => {
    expect(GRIND_PERMEABILITY_M2.fine).toBe(1e-13);
  });

  it('medium is of the order of 1e-12 m² (from memory: an order of magnitude, held as a range)', () => {
    expect(GRIND_PERMEABILITY_M2.medium).toBeGreaterThanOrEqual(3e-13);
    expect(GRIND_PERMEABILITY_M2.medium).toBeLessThanOrEqual(3e-12);
  });

  it('rises from fine to coarse (the interpolated classes in between)', () => {
    const values = (['fine', 'medium-fine', 'medium', 'medium-coarse', 'coarse'] as const).map(
      (grind) => GRIND_PERMEABILITY_M2[grind],
    );
    expect(values).toEqual([...values].sort((a, b) => a - b));
  });
});

describe('loadCoffeeFile', () => {
  // source: SCA Golden Cup Standard (revised 2015), 93 ± 3 °C, for the default band; the rest converts the YAML (NIST SP 811)
  it('converts to SI and fills the defaults, flagging the permeability', async () => {
    const coffee = await load(COFFEE);
    expect(coffee).toMatchObject({
      kind: 'coffee',
      id: 'house-blend',
      grind: 'medium-fine',
      roast: 'medium',
    });
    expect(coffee.bed.permeabilityM2).toBe(GRIND_PERMEABILITY_M2['medium-fine']);
    expect(coffee.permeabilityAssumed).toBe(true);
    expect(coffee.bed.bulkDensityKgM3).toBeCloseTo(380, 9);
    expect(coffee.bed.retentionKgPerKg).toBe(1.2);
    expect(DEFAULT_TARGET_C).toEqual([90, 96]); // source: SCA Golden Cup Standard (revised 2015), 93 ± 3 °C
    expect(coffee.bed.targetBandK[0]).toBeCloseTo(363.15, 9);
    expect(coffee.bed.targetBandK[1]).toBeCloseTo(369.15, 9);
    expect(coffee.deliveryWindowS).toBeNull(); // the planner's default for the pot applies
    expect(coffee.notes).toBeUndefined();
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('uses what the file gives', async () => {
    const text = `${COFFEE}\npermeability_m2: 1.4e-12\ntarget_c: [88, 94]\ndelivery_window_s: [70, 160]\nnotes: Cocoa`;
    const coffee = await load(text);
    expect(coffee.bed.permeabilityM2).toBe(1.4e-12);
    expect(coffee.permeabilityAssumed).toBe(false);
    expect(coffee.bed.targetBandK[0]).toBeCloseTo(361.15, 9);
    expect(coffee.deliveryWindowS).toEqual([70, 160]);
    expect(coffee.notes).toBe('Cocoa');
  });

  it('a band written high to low is refused', async () => {
    const path = await tempFile('house-blend.yaml', `${COFFEE}\ntarget_c: [96, 90]`);
    const { issues } = await rejection(loadCoffeeFile(path));
    expectIssue(issues, {
      file: path,
      line: 6,
      column: 11,
      field: 'target_c',
      code: 'order',
      wording: contentWords.reversedRange(96, 90),
    });
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a permeability out of range is refused', async () => {
    const path = await tempFile('house-blend.yaml', `${COFFEE}\npermeability_m2: 1e-8`);
    const { issues } = await rejection(loadCoffeeFile(path));
    expectIssue(issues, { file: path, line: 6, field: 'permeability_m2', code: 'out-of-range' });
  });
});
