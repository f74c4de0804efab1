import { describe, expect, it } from 'vitest';
import { loadLogFile } from '../../generator/content/index.ts';
import { contentWords } from '../../generator/words/content.ts';
import { expectIssue, LOG, rejection, tempFile, withLine, withoutLine } from './helpers.ts';

describe('loadLogFile', () => {
  // source: NIST SP 811, Appendix B (°C, mL, g to SI)
  it('converts each brew to SI with its own source', async () => {
    const path = await tempFile('first-morning.yaml', LOG);
    const log = await loadLogFile(path);
    expect(log).toMatchObject({
      kind: 'log',
      id: 'first-morning',
      potId: 'three-cup',
      coffeeId: 'house-blend',
      stoveId: 'bar-gas',
      altitudeM: 0,
    });
    const [brew] = log.brews;
    expect(brew).toMatchObject({
      level: 'medium',
      fillVolumeM3: 1.5e-4,
      startK: 293.15,
      ambientK: 294.15,
      firstCoffeeS: 96,
    });
    expect(brew!.source).toEqual({ file: path, line: 5, column: 5 });
    expect(brew!.cupMass).toEqual([
      { tS: 110, kg: 0.018, source: { file: path, line: 10, column: 13 } },
      { tS: 130, kg: 0.052, source: { file: path, line: 10, column: 24 } },
    ]);
    expect(brew!.sputterS).toBeUndefined();
  });

  // source: NIST SP 811, Appendix B (°C to K)
  it('reads probe readings in K and the off-heat time', async () => {
    const text = `${LOG}\n    off_heat_s: 150\n    yield_ml: 104\n    water_c: [[60, 48.5]]`;
    const [brew] = (await loadLogFile(await tempFile('first-morning.yaml', text))).brews;
    expect(brew!.heatOffS).toBe(150);
    expect(brew!.yieldM3).toBeCloseTo(1.04e-4, 15);
    expect(brew!.waterTemperature![0]!.k).toBeCloseTo(321.65, 9);
  });

  it('a brew with no observation is refused', async () => {
    const path = await tempFile(
      'first-morning.yaml',
      withoutLine(withoutLine(LOG, 'first_coffee_s'), 'cup_g'),
    );
    const { issues } = await rejection(loadLogFile(path));
    expectIssue(issues, {
      file: path,
      line: 5,
      column: 5,
      field: 'brews[0]',
      wording: contentWords.brewWithoutObservation(),
    });
  });

  it('scale readings out of time order are refused', async () => {
    const path = await tempFile(
      'first-morning.yaml',
      withLine(LOG, 'cup_g', '    cup_g: [[110, 18], [100, 52]]'),
    );
    const { issues } = await rejection(loadLogFile(path));
    expectIssue(issues, {
      file: path,
      line: 10,
      column: 25,
      field: 'brews[0].cup_g[1][0]',
      code: 'order',
      wording: contentWords.readingsOutOfOrder(100, 110),
    });
  });

  it('a sputter before the first coffee is refused', async () => {
    const path = await tempFile('first-morning.yaml', `${LOG}\n    sputter_s: 80`);
    const { issues } = await rejection(loadLogFile(path));
    expectIssue(issues, {
      file: path,
      line: 11,
      field: 'brews[0].sputter_s',
      wording: contentWords.sputterBeforeFirstCoffee(80, 96),
    });
  });

  it('start and room temperatures outside 0–95 °C and 0–45 °C are refused', async () => {
    const text = withLine(withLine(LOG, 'start_c', '    start_c: 99'), 'room_c', '    room_c: 50');
    const path = await tempFile('first-morning.yaml', text);
    const { issues } = await rejection(loadLogFile(path));
    expect(issues.map((issue) => [issue.line, issue.field, issue.code])).toEqual([
      [7, 'brews[0].start_c', 'out-of-range'],
      [8, 'brews[0].room_c', 'out-of-range'],
    ]);
  });
});
