import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { loadCatalogue } from '../../generator/content/index.ts';
import { contentWords, issueLine, wording } from '../../generator/words/content.ts';
import {
  catalogueIssues,
  contentCopy,
  expectIssue,
  put,
  removeCopy,
  SITE,
  withLine,
  withoutLine,
} from './helpers.ts';

describe('site.yaml', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await contentCopy();
  });
  afterEach(async () => {
    await removeCopy(dir);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('expands every_coffee_with_every_pot sorted by pot then coffee', async () => {
    const { site } = await loadCatalogue(dir);
    const [bar] = site.sets;
    expect(bar!.cards[0]).toEqual({
      potId: 'three-cup',
      coffeeId: 'house-blend',
      stoveId: 'bar-gas',
    });
    const expanded = bar!.cards.slice(1).map((card) => `${card.potId}/${card.coffeeId}`);
    expect(expanded).toEqual([...expanded].sort());
    expect(expanded).toHaveLength(16);
    expect(bar!.coffeeIds).toEqual([
      'house-blend',
      'ember-blend',
      'morning-lantern',
      'slow-river-decaf',
    ]);
    expect(bar!.source).toEqual({ file: 'site.yaml', line: 6, column: 5 });
  });

  it('fills an insert set with its coffees × every pot × every stove', async () => {
    const { site, pots, stoves } = await loadCatalogue(dir);
    const inserts = site.sets[1]!;
    expect(inserts.coffeeIds).toEqual(['house-blend']);
    expect(inserts.cards).toHaveLength(pots.size * stoves.size);
    expect(new Set(inserts.cards.map((card) => card.coffeeId))).toEqual(new Set(['house-blend']));
  });

  it('an insert set may narrow its pots and stoves', async () => {
    await put(dir, 'site.yaml', `${SITE}\n    pots: [three-cup, one-cup]\n    stoves: [bar-gas]`);
    const { site } = await loadCatalogue(dir);
    expect(site.sets[1]!.cards).toEqual([
      { potId: 'three-cup', coffeeId: 'house-blend', stoveId: 'bar-gas' },
      { potId: 'one-cup', coffeeId: 'house-blend', stoveId: 'bar-gas' },
    ]);
  });

  // source: NIST SP 811, Appendix B (°C to K)
  it('converts the room and sorts the kettle presets in K; adds the final / of the base URL', async () => {
    await put(
      dir,
      'site.yaml',
      withLine(
        SITE,
        'paper',
        'paper: A5\nkettle_presets_c: [90, 70, 80]\nbase_url: https://cards.test.example',
      ),
    );
    const { site } = await loadCatalogue(dir);
    expect(site.kettlePresetsK.map((k) => Math.round((k - 273.15) * 1e9) / 1e9)).toEqual([
      70, 80, 90,
    ]);
    expect(site.room).toEqual({ ambientK: 293.15, altitudeM: 0 });
    expect(site.baseUrl).toBe('https://cards.test.example/');
  });

  it('kettle_presets_f in °F gives the same presets in K (°F − 32) × 5/9 + 273.15 (NIST SP 811, B.8)', async () => {
    await put(
      dir,
      'site.yaml',
      withLine(SITE, 'paper', 'paper: A5\nkettle_presets_f: [212, 158, 176]'),
    );
    const { site } = await loadCatalogue(dir);
    // 158 °F = 70 °C, 176 °F = 80 °C, 212 °F = 100 °C exactly
    expect(site.kettlePresetsK.map((k) => Math.round((k - 273.15) * 1e9) / 1e9)).toEqual([
      70, 80, 100,
    ]);
  });

  it('kettle presets in both °C and °F are refused at the °F key', async () => {
    // own rule: one of kettle_presets_c and kettle_presets_f (content README); line 5 is the °F key
    await put(
      dir,
      'site.yaml',
      withLine(SITE, 'paper', 'paper: A5\nkettle_presets_c: [70]\nkettle_presets_f: [158]'),
    );
    const issues = await catalogueIssues(dir);
    expect(issues.map((i) => [i.field, i.code, i.line])).toEqual([
      ['kettle_presets_f', 'repeated', 5],
    ]);
    expect(wording(issues[0]!.message)).toEqual(
      contentWords.bothUnits('kettle_presets_c', 'kettle_presets_f'),
    );
  });

  it('language: en when the site names none; a set without its own takes the site’s', async () => {
    const { site } = await loadCatalogue(dir);
    expect(site.language).toBe('en');
    expect(site.sets.map((set) => set.language)).toEqual(site.sets.map(() => 'en'));
  });

  it('a language there is no catalogue for is refused at its line, listing the ones there are', async () => {
    await put(dir, 'site.yaml', SITE.replace(/^units: /m, 'language: xx\nunits: '));
    const issues = await catalogueIssues(dir);
    expect(issues.map((i) => [i.field, i.code])).toEqual([['language', 'bad-enum']]);
    expect(wording(issues[0]!.message).problem).toContain('`en`');
  });

  it('without base_url there are no QR codes', async () => {
    const { site } = await loadCatalogue(dir);
    expect(site.baseUrl).toBeUndefined();
    expect(site.kettlePresetsK).toEqual([]);
  });

  it('a set id used twice is refused at the second', async () => {
    await put(dir, 'site.yaml', withLine(SITE, '- id: inserts', '  - id: bar'));
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 12,
      column: 9,
      field: 'sets[1].id',
      code: 'repeated',
      wording: contentWords.repeatedSetId('bar', 6),
    });
  });

  it('a card with a pot but no coffee is refused', async () => {
    await put(
      dir,
      'site.yaml',
      withLine(SITE, '- { pot: three-cup', '      - { pot: three-cup, stove: bar-gas }'),
    );
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 10,
      column: 9,
      field: 'sets[0].cards[0]',
      wording: contentWords.cardNeedsPotAndCoffee(),
    });
  });

  it('a card mixing every_coffee_with_every_pot with a pot is refused', async () => {
    await put(
      dir,
      'site.yaml',
      withLine(
        SITE,
        '- { stove: bar-induction',
        '      - { pot: one-cup, stove: bar-induction, every_coffee_with_every_pot: true }',
      ),
    );
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 11,
      field: 'sets[0].cards[1]',
      wording: contentWords.cardMixesForms(),
    });
  });

  it('a card listed twice is refused at the second', async () => {
    await put(
      dir,
      'site.yaml',
      withLine(
        SITE,
        '- { stove: bar-induction',
        '      - { pot: three-cup, coffee: house-blend, stove: bar-gas }',
      ),
    );
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 11,
      field: 'sets[0].cards[1]',
      code: 'repeated',
      wording: contentWords.repeatedCard('three-cup', 'house-blend', 'bar-gas', 10),
    });
  });

  it('a station set with coffees, and an insert set without them, are refused', async () => {
    const text = withoutLine(
      withLine(SITE, 'cards:', '    pots: [three-cup]\n    cards:'),
      'coffees:',
    );
    await put(dir, 'site.yaml', text);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 9,
      column: 5,
      field: 'sets[0].pots',
      code: 'layout',
      wording: contentWords.keyNotForLayout('pots', 'station', 'insert'),
    });
    const insert = expectIssue(issues, {
      file: 'site.yaml',
      line: 13,
      field: 'sets[1]',
      code: 'layout',
    });
    expect(wording(insert.message).problem).toBe(
      contentWords.missingForLayout('coffees', 'insert', '').problem,
    );
  });

  it('unknown ids in an insert set are reported each at its place', async () => {
    await put(dir, 'site.yaml', `${SITE}\n    pots: [three-cup, two-cup]\n    stoves: [bar-gaz]`);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 16,
      column: 23,
      field: 'sets[1].pots[1]',
      code: 'unknown-id',
    });
    const stove = expectIssue(issues, {
      file: 'site.yaml',
      line: 17,
      column: 14,
      field: 'sets[1].stoves[0]',
      code: 'unknown-id',
    });
    expect(wording(stove.message).fix).toBe('Did you mean `bar-gas`?');
  });

  // own rule: `sheet: { paper, up }` on a set; up is 2, 4 or 8 (content/README.md)
  it('reads a set’s sheet with where it is written, and refuses an up of 3 naming the values', async () => {
    await put(dir, 'site.yaml', `${SITE}\n    sheet: { paper: A4, up: 4 }`);
    const { site } = await loadCatalogue(dir);
    expect(site.sets[0]!.sheet).toBeNull();
    expect(site.sets[1]!.sheet).toEqual({
      paper: 'A4',
      up: 4,
      source: { file: 'site.yaml', line: 16, column: 12 },
      field: 'sets[1].sheet',
    });

    await put(dir, 'site.yaml', `${SITE}\n    sheet: { paper: A4, up: 3 }`);
    const issue = expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 16,
      field: 'sets[1].sheet.up',
    });
    const text = issueLine(issue);
    for (const value of ['sets[1].sheet.up', '`2`', '`4`', '`8`', 'got 3'])
      expect(text, text).toContain(value);
  });

  // own rule: a sheet needs both its paper and its up
  it('refuses a sheet without paper, and a sheet paper that is not one of the papers', async () => {
    await put(dir, 'site.yaml', `${SITE}\n    sheet: { up: 2 }`);
    const missing = expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 16,
      field: 'sets[1].sheet.paper',
      code: 'missing-key',
    });
    expect(issueLine(missing)).toContain('sets[1].sheet.paper');
    await put(dir, 'site.yaml', `${SITE}\n    sheet: { paper: B5, up: 2 }`);
    const paper = expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 16,
      field: 'sets[1].sheet.paper',
    });
    expect(issueLine(paper)).toContain('`A4`');
  });
});
