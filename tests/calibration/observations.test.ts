import { describe, expect, it } from 'vitest';
import {
  cumulativeCupKg,
  logObservations,
  predictObservations,
  type Observation,
} from '../../generator/calibration/observations.ts';
import type { BrewResult, SeriesPoint } from '../../generator/brew/types.ts';
import { loadLogFile } from '../../generator/content/index.ts';
import { expectAbsolute, expectRelative, halfUnitOfLastDigit } from '../helpers/close.ts';
import { tempFile } from '../content/helpers.ts';

const point = (tS: number, waterK: number, cupM3: number): SeriesPoint => ({
  tS,
  waterK,
  coffeeK: waterK,
  gaugePa: 0,
  cupM3,
  flowM3PerS: 0,
  baseLiquidM3: 0,
});

describe('cumulativeCupKg', () => {
  it('is ρ′·V at a constant temperature: 100 mL at 373.1243 K is 95.8365 g (IAPWS SR1-86 Table 1, ρ′ = 958.365 kg/m³)', () => {
    const series = [0, 50e-6, 100e-6].map((v, i) => point(i, 373.1243, v));
    const mass = cumulativeCupKg(series);
    const tolerance = halfUnitOfLastDigit('958.365') * 100e-6;
    expectAbsolute(mass[2]!, 0.0958365, tolerance, 'cup mass of 100 mL at 373.1243 K');
    expectAbsolute(mass[1]!, 0.0958365 / 2, tolerance, 'cup mass of 50 mL at 373.1243 K');
    expect(mass[0]).toBe(0);
  });
});

function result(overrides: Partial<BrewResult>): BrewResult {
  return {
    firstCoffeeS: null,
    sputterS: null,
    endS: 100,
    yieldM3: 0,
    series: [],
    ...overrides,
  } as BrewResult;
}

const observation = (kind: Observation['kind'], atS?: number): Observation => ({
  brew: 0,
  kind,
  path: [],
  field: '',
  ...(atS !== undefined ? { atS } : {}),
  seen: 0,
  sigma: 1,
  source: { file: 'x', line: 1, column: 1 },
});

describe('predictObservations', () => {
  // own rule: how readings are compared with a run, not an outside value
  it('takes the end of the run for a first coffee or sputter the model never reached', () => {
    const values = predictObservations(result({ endS: 140 }), [
      observation('first-coffee'),
      observation('sputter'),
    ]);
    expect(values).toEqual([140, 140]);
  });

  // own rule: how readings are compared with a run, not an outside value
  it('interpolates readings linearly between samples and holds them after the run', () => {
    const series = [point(0, 300, 0), point(1, 302, 0), point(2, 306, 0)];
    const values = predictObservations(result({ series }), [
      observation('water-temperature', 0.25),
      observation('water-temperature', 1.5),
      observation('water-temperature', 9),
    ]);
    expect(values).toEqual([300.5, 304, 306]);
  });
});

describe('logObservations', () => {
  // own rule: the assumed reading uncertainties are our choice, not an outside value
  it('gives each reading its assumed σ (2 s, 1 g, 1 °C, 3 mL) and its place in the file', async () => {
    const text = [
      'pot: p', //                               1
      'coffee: c', //                            2
      'stove: s', //                             3
      'brews:', //                               4
      '  - level: medium', //                    5
      '    fill_ml: 150', //                     6
      '    start_c: 20', //                      7
      '    room_c: 21', //                       8
      '    first_coffee_s: 66', //               9
      '    off_heat_s: 120', //                 10
      '    yield_ml: 81', //                    11
      '    cup_g: [[80, 8], [90, 16]]', //      12
      '    water_c: [[30, 32.5]]', //           13
    ].join('\n');
    const log = await loadLogFile(await tempFile('obs.yaml', text));
    const list = logObservations(log);
    expect(list.map((o) => [o.field, o.kind])).toEqual([
      ['brews[0].first_coffee_s', 'first-coffee'],
      ['brews[0].yield_ml', 'yield'],
      ['brews[0].cup_g[0]', 'cup-mass'],
      ['brews[0].cup_g[1]', 'cup-mass'],
      ['brews[0].water_c[0]', 'water-temperature'],
    ]);
    expect(list.map((o) => o.sigma)).toEqual([2, 3e-6, 1e-3, 1e-3, 1]);
    expect(list[3]).toMatchObject({ atS: 90, seen: 0.016, path: ['brews', 0, 'cup_g', 1] });
    expect(list[3]!.source.line).toBe(12);
    expectRelative(list[4]!.seen, 305.65, 1e-12, 'probe reading 32.5 °C in K');
  });
});
