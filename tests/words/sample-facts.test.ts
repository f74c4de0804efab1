/**
 * Every function of every words catalogue returns real text for sample facts: not empty,
 * no "undefined", "null", "NaN" or "[object" left from a missing fact, and each
 * case of a switch (every binding cause, every grind, a value or a column) answered.
 * The samples must cover every function English has, so a new message without a sample
 * fails here. Own rule: the catalogues' contract (generator/words/catalogue.ts).
 */
import { describe, expect, it } from 'vitest';
import { LANGUAGES, wordsFor } from '../../generator/words/catalogue.ts';

const GRINDS = ['fine', 'medium-fine', 'medium', 'medium-coarse', 'coarse'] as const;
const KINDS = ['gas', 'electric', 'induction'] as const;
const CAUSES = [
  'bed-too-open',
  'bed-too-tight',
  'gentlest-heat-too-strong',
  'pot-too-small-for-window',
  'pressure-margin-binds',
  'band-out-of-reach',
] as const;
const QUANTITIES = [
  'permeabilityM2',
  'heatToPotW',
  'altitudeM',
  'sealedVolumeM3',
  'ambientK',
] as const;
const cause = {
  share: '22 %',
  band: '90–96 °C',
  mean: '84 °C',
  delivery: '41 s',
  window: '60–120 s',
  cups: '3',
  gentlest: '180 W',
  shareAtHalfHeat: '48 %',
  shareAtHalfPermeability: '51 %',
  shareIfAllowed: '40 %',
  highCorner: '0,92 bar',
  limit: '0,75 bar',
};
const example = {
  coffee: 'Casa',
  pot: 'Tres tazas',
  stove: 'Gas',
  start: '80 °C',
  planFirst: '1:40',
  planShare: '70 %',
  coldFirst: '3:10',
  coldShare: '30 %',
  band: '90–96 °C',
};

const exerciseCard = {
  card: 'Coffee C, in Pot A · on Stove B',
  pot: 'Pot A',
  temperature: '85 °C',
  fill: '155 mL',
  fillMass: '(150 g on a scale)',
  dose: '14.0 g',
  level: '2',
  firstCoffee: '0:15–0:30',
  offHeat: '0:25–0:55',
  yield: '109 mL',
};
const exerciseMove = { change: 'The card', firstCoffee: '0:20', peak: '0.12 bar' };

/** Sample facts per function path: each entry is one call's arguments. */
const SAMPLES: Record<string, readonly (readonly unknown[])[]> = {
  'format.date': [['2026-12-03']],
  'card.stationSubtitle': [['Pot A', 'Stove B']],
  'card.insertSubtitle': [
    ...GRINDS.map((g) => ['dark', g]),
    ...['light', 'medium-light', 'medium', 'medium-dark'].map((r) => [r, 'medium']),
  ],
  'card.water.kettlePreset': [['80 °C']],
  'card.water.thermometer': [['86 °C']],
  'card.water.roomTemperatureNote': [['20 °C']],
  'card.water.fillMass': [['150 g']],
  'card.water.fillLine': [['41 mm', '6 mm']],
  'card.coffee.grind': GRINDS.map((g) => [g]),
  'card.heat.on': [['Stove B']],
  'card.chart.xTitle': [['mL']],
  'card.chart.yTitle': [['°C']],
  'card.chart.band': [['90–96 °C']],
  'card.chart.alt': [['70 %', '30 %', '90–96 °C']],
  'card.expect.inBand': [['90–96 °C']],
  'card.expect.inBandValue': [['70 %', '30 %']],
  'card.expect.peakPressureValue': [
    ['0.40 bar', '1.50 bar'],
    ['0.40 bar', '1.50 bar', '0.55 bar'],
  ],
  'card.expect.peakPressureAssumedValue': [
    ['0.40 bar', '1.5 bar'],
    ['0.40 bar', '1.5 bar', '0.55 bar'],
  ],
  'card.expect.bindingCause': CAUSES.map((c) => [c, cause]),
  'card.expect.boilingValue': [['93 °C', '2000 m']],
  'card.expect.measured': [
    [[{ what: 'grind', percent: '7,5', log: 'first-morning', date: '2026-12-01' }]],
    [
      [
        { what: 'grind', percent: '7.5', log: 'a', date: '2026-12-01' },
        { what: 'heat', percent: '12', log: 'b', date: '2026-12-02' },
      ],
    ],
  ],
  'card.expect.assumed': [
    ['medium', true],
    ['fine', false],
    [null, true],
  ],
  'card.footer.printedBy': [['Roaster', 'cards@roaster.example']],
  'card.footer.built': [['2026-12-03', 'abcd1234']],
  'card.footer.logoAlt': [['Test Roasters']],
  'card.planner.link': [['Coffee C']],
  'card.crossSection.title': [['Pot A']],
  'card.crossSection.margin': [['6 mm']],
  'card.insert.heatKind': KINDS.map((k) => [k]),
  'card.insert.web': [['https://cards.example/']],
  'card.insert.cups': [[1], [3]],
  'card.insert.rowName': [['3-cup', 'Gas']],
  'card.insert.rowWarning': [[['3-cup gas', '6-cup gas'], 'Check the fill.']],
  'card.insert.setting': [['3', 'medium heat']],
  'card.insert.steps.kettle': [
    ['80 °C', 'Water temp.'],
    [null, 'Water temp.'],
  ],
  'card.insert.steps.fill': [
    ['150 mL', 'Water'],
    [null, 'Water'],
  ],
  'card.insert.steps.basket': [
    ['15.0 g', 'Coffee'],
    [null, 'Coffee'],
  ],
  'card.insert.steps.heat': [
    ['3', 'Setting'],
    [null, 'Setting'],
  ],
  'card.insert.steps.time': [
    ['2:30', 'Off heat'],
    [null, 'Off heat'],
  ],
  'card.insert.unsuitable': [['6-cup', 'on induction', 'too tight']],
  'card.index.intro': [['Roaster']],
  'method.example': [[example]],
  'troubleshooting.movesIntro': [['Pot A', 'Coffee C', 'Stove B']],
  'plan.inductionNeedsMagneticBase': [['Pot A']],
  'plan.fillAboveValve': [['200 mL', '150 mL', '3 mm']],
  'plan.pressureNearValve': GRINDS.map((g) => ['0.80 bar', '1.50 bar', g]),
  'plan.noDelivery': [[]],
  'plan.noPlanFits': [
    ['60 s', '120 s', true],
    ['60 s', '120 s', false],
  ],
  'plan.outsideCheckedRange': QUANTITIES.map((q) => [q, '1', '2', '3']),
  'plan.coolCup': [['12 %']],
  'plan.smallFill': [[]],
  'print.leftOut': [[['fill-above-valve']], [['no-delivery', 'no-delivery', 'no-plan-fits']]],
  'print.setPdf': [[true], [false]],
  'print.sheetLink': [
    [2, 'A4'],
    [8, 'US letter'],
  ],
  'binder.cover.from': [['Roaster R']],
  'binder.cover.built': [['03/12/2026']],
  'binder.logSheet.readingsIntro': [['Cup, g']],
  'binder.logSheet.readingUnit': [['Cup, g']],
  'binder.exercises.tableCard': [['Coffee C', 'Pot A', 'Stove B']],
  'binder.exercises.hotCold': [[exerciseCard, { label: 'Brewed at 90–96 °C', value: '70 %' }]],
  'binder.exercises.finer': [
    [exerciseCard, exerciseMove, { ...exerciseMove, change: 'Finer' }, null],
    [exerciseCard, exerciseMove, { ...exerciseMove, change: 'Finer' }, 'Coffee C in Pot A'],
  ],
  'binder.exercises.fillLine': [
    [exerciseCard, 'Up to 27 mm above the floor: 4 mm below the valve.'],
  ],
  'binder.exercises.logThree': [[exerciseCard, 'Brew log sheet']],
  'pdf.stationTitle': [['Coffee C', 'in Pot A']],
  'pdf.insertTitle': [['Coffee C']],
  'pdf.setTitle': [['Bar']],
  'pdf.sheetTitle': [['Bar', 4, 'A4']],
  'pdf.crossSectionAlt': [['Cross-section', 'Fill line']],
  'pdf.qrAlt': [['https://cards.example/']],
  'pdf.stepNumber': [[3]],
  'pdf.listNumber': [[3]],
  'pdf.contents.intro': [[1], [12]],
  'pdf.contents.station': [['Coffee C', 'in Pot A']],
  'pdf.contents.refused': [['Coffee C', 'no recipe']],
  'pdf.doesNotFit': [['card', 'A6', 500.2, 400.7]],
  'pdf.pageNumber': [[2, 9]],
  'planner.pageTitle': [['Coffee C']],
  'planner.pot.cupsOption': [
    [1, 'Pot A'],
    [6, 'Pot A'],
  ],
  'planner.stove.ownName': ['gas', 'electric-coil', 'radiant', 'induction'].flatMap((k) =>
    ['gentle', 'usual', 'strong'].map((p) => [k, p]),
  ),
  'planner.kettle.presets': [['metric'], ['us']],
  'planner.kettle.altitude': [['metric'], ['us']],
  'planner.form.badList': [['70; x']],
  'planner.form.badAltitude': [
    ['9000', 'metric'],
    ['30000', 'us'],
  ],
  'planner.timer.start': [['metric'], ['us']],
  'planner.timer.fill': [['metric'], ['us']],
  'planner.timer.room': [['metric'], ['us']],
  'planner.timer.elapsed': [[42]],
  'planner.timer.mark': [['First coffee', 42]],
  'planner.timer.comment': [['Pot A', 'Coffee C', 'Stove B']],
};

function functions(value: unknown, at = ''): Map<string, (...args: unknown[]) => unknown> {
  const out = new Map<string, (...args: unknown[]) => unknown>();
  if (typeof value === 'function') out.set(at, value as (...args: unknown[]) => unknown);
  else if (value !== null && typeof value === 'object' && !Array.isArray(value))
    for (const [k, v] of Object.entries(value))
      functions(v, at === '' ? k : `${at}.${k}`).forEach((f, p) => out.set(p, f));
  return out;
}

/** The texts of a function's answer (a string, or a refusal's reason and suggestion). */
function texts(answer: unknown): string[] {
  if (typeof answer === 'string') return [answer];
  if (answer !== null && typeof answer === 'object')
    return Object.entries(answer)
      .filter(([k]) => k !== 'code')
      .map(([, v]) => String(v));
  return [String(answer)];
}

describe('words functions say something for sample facts', () => {
  it('a set page says nothing about left-out cards when none were left out', () => {
    for (const language of LANGUAGES) expect(wordsFor(language).print.leftOut([])).toBeNull();
  });

  it('every function of the English catalogue has sample facts here', () => {
    const paths = [...functions(wordsFor('en')).keys()];
    expect(paths.filter((p) => !(p in SAMPLES))).toEqual([]);
    expect(Object.keys(SAMPLES).filter((p) => !paths.includes(p))).toEqual([]);
  });

  it.each(LANGUAGES)(
    '%s: every function returns non-empty text with every fact used',
    (language) => {
      const fns = functions(wordsFor(language));
      const bad: string[] = [];
      for (const [path, calls] of Object.entries(SAMPLES)) {
        const fn = fns.get(path);
        if (!fn) {
          bad.push(`${path}: missing`);
          continue;
        }
        for (const args of calls)
          for (const text of texts(fn(...args)))
            if (text.trim() === '' || /undefined|null|NaN|\[object/.test(text))
              bad.push(`${path}(${JSON.stringify(args)}) → ${JSON.stringify(text)}`);
      }
      expect(bad).toEqual([]);
    },
  );

  it('Spanish is not English: the sentences differ where they hold words', () => {
    const en = functions(wordsFor('en'));
    const es = functions(wordsFor('es'));
    // Only data in, data out (numbers, titles, page numbers): the same in every language.
    const same = new Set([
      'format.date',
      'card.insert.setting',
      'card.insert.rowName',
      'card.insert.rowWarning',
      'card.expect.boilingValue',
      'card.insert.heatKind',
      'pdf.stationTitle',
      'pdf.setTitle',
      'pdf.crossSectionAlt',
      'pdf.stepNumber',
      'pdf.listNumber',
      'pdf.contents.station',
      'pdf.contents.refused',
      'pdf.pageNumber',
      'binder.logSheet.readingUnit',
    ]);
    const unchanged = Object.entries(SAMPLES)
      .filter(([path]) => !same.has(path))
      .filter(([path, calls]) =>
        calls.some(
          (args) =>
            JSON.stringify(texts(en.get(path)!(...args))) ===
            JSON.stringify(texts(es.get(path)!(...args))),
        ),
      )
      .map(([path]) => path);
    expect(unchanged).toEqual([]);
  });
});
