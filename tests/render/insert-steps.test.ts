/**
 * The insert's steps and its heat in words, on invented stoves and rows. What a cook calls
 * gentle, medium, strong and full heat is common practice, no source: the lowest third or
 * so of a knob's power is "gentle", the top setting "full".
 */
import { describe, expect, it } from 'vitest';
import {
  heatFeel,
  insertSteps,
  labelNeedsFeel,
  type StepRowTexts,
} from '../../generator/render/insert-steps.ts';
import { INSERT_STEP_ORDER, pictogramSvg } from '../../generator/render/pictograms.ts';
import { cardWords } from '../../generator/words/card.ts';

const levels = (...watts: number[]) => ({
  levels: watts.map((powerW, i) => ({
    label: String(i + 1),
    powerW,
    heatToPotW: powerW * 0.5,
    fitted: false,
  })),
});

describe('heatFeel(stove, level)', () => {
  it('calls a weak gas ring’s simmer gentle and its top full (common practice, no source)', () => {
    const ring = levels(250, 600, 1000, 1500);
    expect([0, 1, 2, 3].map((i) => heatFeel(ring, i))).toEqual([
      'gentle',
      'medium',
      'strong',
      'full',
    ]);
  });

  it('reads a nine-step plate by its share of the top power, not by the step number', () => {
    const plate = levels(100, 150, 250, 400, 600, 900, 1300, 1700, 2000);
    expect(heatFeel(plate, 0)).toBe('gentle');
    expect(heatFeel(plate, 3)).toBe('gentle'); // 400 / 2000 = 20 %
    expect(heatFeel(plate, 5)).toBe('medium'); // 45 %
    expect(heatFeel(plate, 6)).toBe('medium'); // 65 %
    expect(heatFeel(plate, 7)).toBe('strong'); // 85 %
    expect(heatFeel(plate, 8)).toBe('full');
  });

  it('calls the only level of a one-setting stove full', () => {
    expect(heatFeel(levels(1200), 0)).toBe('full');
  });
});

describe('labelNeedsFeel(label)', () => {
  it('adds the heat in words to a knob number or code, never to a label that is words', () => {
    // Own rule: a maker's "low" on a strong burner is a medium share of its top power, and
    // "low · medium heat" would say two things; "2" or "P5" says nothing to a stranger.
    expect(['2', 'P5', '6 of 9'].map(labelNeedsFeel)).toEqual([true, true, true]);
    expect(['low', 'simmer', 'medium-high', 'suave'].map(labelNeedsFeel)).toEqual([
      false,
      false,
      false,
      false,
    ]);
  });
});

const row = (over: Partial<StepRowTexts> = {}): StepRowTexts => ({
  start: '85 °C',
  room: false,
  fill: '155 mL',
  dose: '14.0 g',
  setting: 'low · medium heat',
  offHeat: '0:25–0:55',
  ...over,
});
const columns = cardWords.insert.columns;

describe('insertSteps(rows, columns)', () => {
  it('gives seven steps in the order a person works, each with its own drawing', () => {
    const steps = insertSteps([row()], columns);
    expect(steps.map((s) => s.code)).toEqual(INSERT_STEP_ORDER);
    expect(steps.map((s) => s.n)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    expect(new Set(steps.map((s) => s.pictogramSvg)).size).toBe(7);
    for (const step of steps) expect(step.pictogramSvg).toBe(pictogramSvg(step.code));
  });

  it('prints a row’s own numbers when every row agrees (a one-pot insert)', () => {
    const steps = insertSteps([row(), row({ setting: 'low · medium heat' })], columns);
    const text = steps.map((s) => s.text).join('\n');
    for (const value of ['85 °C', '155 mL', '14.0 g', 'low · medium heat', '0:25–0:55'])
      expect(text).toContain(value);
  });

  it('points at the table’s columns where the rows differ (a 1-cup and a 9-cup pot)', () => {
    const steps = insertSteps(
      [row({ fill: '57 mL', dose: '5.3 g' }), row({ fill: '480 mL', start: '90 °C' })],
      columns,
    );
    const byCode = Object.fromEntries(steps.map((s) => [s.code, s.text]));
    expect(byCode.kettle).toContain(columns.start);
    expect(byCode.fill).toContain(columns.fill);
    expect(byCode.basket).toContain(columns.dose);
    expect(byCode.heat).toContain('low · medium heat');
    expect(byCode.time).toContain('0:25–0:55');
  });

  it('says no kettle is needed when every row starts at room temperature', () => {
    const steps = insertSteps(
      [row({ room: true, start: cardWords.insert.roomTemperature })],
      columns,
    );
    expect(steps[0]!.text).toBe(cardWords.insert.steps.roomWater);
  });

  it('always tells a stranger the safety points of the method', () => {
    const text = insertSteps([row()], columns)
      .map((s) => s.text)
      .join('\n');
    expect(text).toMatch(/under the valve/);
    expect(text).toMatch(/Do not tamp/);
    expect(text).toMatch(/cloth/);
    expect(text).toMatch(/no wider than the base/);
    expect(text).toMatch(/cold tap/);
  });
});
