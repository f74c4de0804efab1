import { describe, expect, it } from 'vitest';
import { loadStoveFile } from '../../generator/content/index.ts';
import { DEFAULT_STOVE_EFFICIENCY } from '../../generator/content/stove-efficiency.ts';
import { contentWords } from '../../generator/words/content.ts';
import { expectIssue, rejection, STOVE, tempFile, withLine } from './helpers.ts';

// Mid-points of the boil-test ranges (ENERGY STAR Emerging Technology
// Award, residential induction cooktops 2021–2022; US DOE cooking-product test data).
describe('DEFAULT_STOVE_EFFICIENCY', () => {
  it.each([
    ['gas', 0.32, 0.4],
    ['electric-coil', 0.74, 0.8],
    ['radiant', 0.74, 0.8],
    ['induction', 0.84, 0.9],
  ] as const)('%s is the mid-point of %s–%s', (kind, low, high) => {
    expect(DEFAULT_STOVE_EFFICIENCY[kind]).toBeCloseTo((low + high) / 2, 12);
  });
});

describe('loadStoveFile', () => {
  // source: ENERGY STAR Emerging Technology Award, residential induction cooktops (2021–2022), boil-test mid-points
  it('uses the kind’s efficiency when none is given, and flags it', async () => {
    const stove = await loadStoveFile(await tempFile('bar-gas.yaml', STOVE));
    expect(stove).toMatchObject({
      kind: 'stove',
      id: 'bar-gas',
      stoveKind: 'gas',
      efficiency: 0.36,
      efficiencyAssumed: true,
    });
    expect(stove.levels.map((level) => level.label)).toEqual(['low', 'medium', 'high']);
    expect(stove.levels[0]!.heatToPotW).toBeCloseTo(600 * 0.36, 9);
    expect(stove.levels.every((level) => !level.fitted)).toBe(true);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('uses a fitted heat_to_pot_w where calibration wrote one', async () => {
    const text = withLine(
      withLine(STOVE, 'kind', 'kind: gas\nefficiency: 0.38'),
      '- { label: high',
      '  - { label: high, power_w: 1500, heat_to_pot_w: 590 }',
    );
    const stove = await loadStoveFile(await tempFile('bar-gas.yaml', text));
    expect(stove.efficiencyAssumed).toBe(false);
    expect(stove.levels[1]!.heatToPotW).toBeCloseTo(380, 9);
    expect(stove.levels[2]).toEqual({ label: 'high', powerW: 1500, heatToPotW: 590, fitted: true });
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('reads numbered levels as labels', async () => {
    const text = [
      'name: Radiant',
      'kind: radiant',
      'levels:',
      '  - { label: 1, power_w: 300 }',
      '  - { label: 2, power_w: 550 }',
    ].join('\n');
    const stove = await loadStoveFile(await tempFile('radiant.yaml', text));
    expect(stove.levels.map((level) => level.label)).toEqual(['1', '2']);
    expect(stove.efficiency).toBe(0.77);
  });

  it('a label used twice is refused at the second', async () => {
    const path = await tempFile(
      'bar-gas.yaml',
      withLine(STOVE, '- { label: high', '  - { label: medium, power_w: 1500 }'),
    );
    const { issues } = await rejection(loadStoveFile(path));
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: path,
      line: 6,
      column: 14,
      field: 'levels[2].label',
      code: 'repeated',
      wording: contentWords.repeatedLevel('medium', 5),
    });
  });

  it('a level not stronger than the one before is refused', async () => {
    const path = await tempFile(
      'bar-gas.yaml',
      withLine(STOVE, '- { label: high', '  - { label: high, power_w: 1000 }'),
    );
    const { issues } = await rejection(loadStoveFile(path));
    expectIssue(issues, {
      file: path,
      line: 6,
      field: 'levels[2].power_w',
      code: 'order',
      wording: contentWords.powerNotIncreasing(1000, 'medium', 1000),
    });
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a power out of range is refused', async () => {
    const path = await tempFile(
      'bar-gas.yaml',
      withLine(STOVE, '- { label: high', '  - { label: high, power_w: 15000 }'),
    );
    const { issues } = await rejection(loadStoveFile(path));
    expectIssue(issues, { file: path, line: 6, field: 'levels[2].power_w', code: 'out-of-range' });
  });
});
