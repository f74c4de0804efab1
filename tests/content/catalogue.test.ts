import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { ContentErrors, loadCatalogue, type Catalogue } from '../../generator/content/index.ts';
import { MAX_CONTENT_FILE_BYTES } from '../../generator/content/file-bytes.ts';
import { MAX_ALIAS_COUNT } from '../../generator/content/yaml-source.ts';
import { contentWords, wording, formatContentErrors } from '../../generator/words/content.ts';
import {
  catalogueIssues,
  COFFEE,
  contentCopy,
  DEMO_CONTENT,
  expectIssue,
  LOG,
  POT,
  put,
  removeCopy,
  SITE,
  STOVE,
  withLine,
} from './helpers.ts';

describe('loadCatalogue(content/), the demo', () => {
  let catalogue: Catalogue;
  beforeEach(async () => {
    catalogue = await loadCatalogue(DEMO_CONTENT);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('reads every demo file', () => {
    expect([...catalogue.pots.keys()]).toEqual([
      'four-cup-steel',
      'one-cup',
      'six-cup',
      'three-cup',
    ]);
    expect(catalogue.coffees.size).toBe(4);
    expect([...catalogue.stoves.keys()]).toEqual(['bar-gas', 'bar-induction', 'home-radiant']);
    expect([...catalogue.logs.keys()]).toEqual(['first-morning']);
    expect(catalogue.site.sets.map((set) => [set.id, set.layout])).toEqual([
      ['quorvel-bar', 'station'],
      ['barista-training', 'station'],
      ['shipping-inserts', 'insert'],
      ['counter-inserts', 'insert'],
      ['quorvel-barra', 'station'],
      ['fichas-bolsa', 'insert'],
    ]);
  });

  // own rule: `layout: binder` is a station set whose PDF has the binder's front matter
  it('reads layout: binder as a station set marked binder (the demo’s training set)', () => {
    expect(catalogue.site.sets.map((set) => [set.id, set.binder])).toEqual([
      ['quorvel-bar', false],
      ['barista-training', true],
      ['shipping-inserts', false],
      ['counter-inserts', false],
      ['quorvel-barra', false],
      ['fichas-bolsa', false],
    ]);
  });

  // own rule: a set's `sheet: { paper, up }` is read as written, with where it is written
  it('reads the demo’s sheets: paper, up and the line of each `sheet:`', () => {
    const sheets = catalogue.site.sets.map((set) => [
      set.id,
      set.sheet && { paper: set.sheet.paper, up: set.sheet.up, field: set.sheet.field },
    ]);
    expect(sheets).toEqual([
      ['quorvel-bar', null],
      ['barista-training', null],
      ['shipping-inserts', { paper: 'letter', up: 2, field: 'sets[2].sheet' }],
      ['counter-inserts', { paper: 'A4', up: 4, field: 'sets[3].sheet' }],
      ['quorvel-barra', { paper: 'A4', up: 2, field: 'sets[4].sheet' }],
      ['fichas-bolsa', null],
    ]);
    for (const set of catalogue.site.sets) {
      if (!set.sheet) continue;
      expect(set.sheet.source.file).toBe('site.yaml');
      expect(set.sheet.source.line, set.id).toBeGreaterThan(set.source.line);
    }
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('keeps the station cards between 20 and 40', () => {
    const station = catalogue.site.sets.filter((set) => set.layout === 'station');
    const cards = station.reduce((sum, set) => sum + set.cards.length, 0);
    expect(cards).toBeGreaterThanOrEqual(20);
    expect(cards).toBeLessThanOrEqual(40);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('expands the bar set: four gas cards, then every coffee with every pot on induction', () => {
    const bar = catalogue.site.sets[0]!;
    expect(bar.cards).toHaveLength(4 + catalogue.pots.size * catalogue.coffees.size);
    expect(bar.cards.slice(4).every((card) => card.stoveId === 'bar-induction')).toBe(true);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('plans the inserts over all coffees × pots × stoves', () => {
    const inserts = catalogue.site.sets[2]!;
    expect(inserts.coffeeIds).toHaveLength(4);
    expect(inserts.cards).toHaveLength(4 * 4 * 3);
  });

  it('has a coffee left to its grind default and a pot that is ready for induction', () => {
    expect(
      [...catalogue.coffees.values()].filter((coffee) => coffee.permeabilityAssumed),
    ).toHaveLength(1);
    expect(
      [...catalogue.pots.values()].filter((pot) => pot.inductionReady).map((pot) => pot.id),
    ).toEqual(['four-cup-steel', 'six-cup']);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('names each entry’s source relative to the content folder, with the file’s sha256', () => {
    const pot = catalogue.pots.get('three-cup')!;
    expect(pot.source.file).toBe('pots/three-cup.yaml');
    expect(pot.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(catalogue.site.source.file).toBe('site.yaml');
  });

  it('starts every demo file with its schema line', async () => {
    const folders = { pots: 'pot', coffees: 'coffee', stoves: 'stove', logs: 'log' };
    for (const [folder, schema] of Object.entries(folders)) {
      for (const name of await readdir(join(DEMO_CONTENT, folder))) {
        const text = await readFile(join(DEMO_CONTENT, folder, name), 'utf8');
        const expected = `# yaml-language-server: $schema=../../generator/content/schemas/${schema}.schema.json`;
        expect(text.split('\n')[0], `${folder}/${name}`).toBe(expected);
      }
    }
    const site = await readFile(join(DEMO_CONTENT, 'site.yaml'), 'utf8');
    expect(site.split('\n')[0]).toBe(
      '# yaml-language-server: $schema=../generator/content/schemas/site.schema.json',
    );
  });
});

describe('loadCatalogue(a broken copy of the content)', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await contentCopy();
  });
  afterEach(async () => {
    await removeCopy(dir);
  });

  it('reads the unbroken copy', async () => {
    const catalogue = await loadCatalogue(dir);
    expect(catalogue.site.sets.map((set) => set.id)).toEqual(['bar', 'inserts']);
  });

  it('a truncated file is a YAML error at the place it stops', async () => {
    const cut = POT.slice(0, POT.indexOf('tube_gap_mm') + 'tube_g'.length);
    await put(dir, 'pots/three-cup.yaml', cut);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'pots/three-cup.yaml',
      line: 13,
      column: 3,
      field: '',
      code: 'yaml-syntax',
    });
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a truncated flow mapping is a YAML error too', async () => {
    await put(
      dir,
      'stoves/bar-gas.yaml',
      STOVE.slice(0, STOVE.indexOf('power_w: 1500') + 'power_w: 15'.length),
    );
    const issues = await catalogueIssues(dir);
    expectIssue(issues, { file: 'stoves/bar-gas.yaml', line: 6, field: '', code: 'yaml-syntax' });
  });

  it('a duplicate key names the key at its second place', async () => {
    await put(dir, 'pots/three-cup.yaml', withLine(POT, 'mass_g', '  mass_g: 180\n  mass_g: 190'));
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'pots/three-cup.yaml',
      line: 9,
      column: 3,
      field: 'base.mass_g',
      code: 'duplicate-key',
      wording: contentWords.duplicateKey('mass_g'),
    });
  });

  it('a duplicate key does not hide the file’s other mistakes', async () => {
    const text = withLine(
      withLine(POT, 'mass_g', '  mass_g: 180\n  mass_g: 190'),
      'cups',
      'cups: three',
    );
    await put(dir, 'pots/three-cup.yaml', text);
    const issues = await catalogueIssues(dir);
    expect(issues.map((issue) => issue.code).sort()).toEqual(['duplicate-key', 'wrong-type']);
  });

  it('an unknown id in site.yaml suggests the nearest existing id, at its line', async () => {
    await put(
      dir,
      'site.yaml',
      withLine(
        SITE,
        '- { pot: three-cup',
        '      - { pot: thre-cup, coffee: house-blend, stove: bar-gas }',
      ),
    );
    const issues = await catalogueIssues(dir);
    const pots = ['four-cup-steel', 'one-cup', 'six-cup', 'three-cup'];
    const issue = expectIssue(issues, {
      file: 'site.yaml',
      line: 10,
      column: 16,
      field: 'sets[0].cards[0].pot',
      code: 'unknown-id',
      wording: contentWords.unknownId('pot', 'thre-cup', 'three-cup', pots),
    });
    expect(wording(issue.message).fix).toBe('Did you mean `three-cup`?');
  });

  it('an unknown id with nothing near lists the ids there are', async () => {
    await put(dir, 'site.yaml', withLine(SITE, 'coffees:', '    coffees: [espresso-roast]'));
    const issues = await catalogueIssues(dir);
    const issue = expectIssue(issues, {
      file: 'site.yaml',
      line: 15,
      column: 15,
      field: 'sets[1].coffees[0]',
    });
    expect(wording(issue.message).fix).toContain('`house-blend`');
  });

  it('a log naming a level its stove lacks suggests the nearest level', async () => {
    await put(dir, 'logs/first-morning.yaml', withLine(LOG, '- level:', '  - level: meduim'));
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'logs/first-morning.yaml',
      line: 5,
      column: 12,
      field: 'brews[0].level',
      code: 'unknown-level',
      wording: contentWords.unknownLevel('meduim', 'bar-gas', 'medium', ['low', 'medium', 'high']),
    });
  });

  it('a log naming an unknown stove is reported, and its levels are not guessed at', async () => {
    await put(dir, 'logs/first-morning.yaml', withLine(LOG, 'stove:', 'stove: bar-gaz'));
    const issues = await catalogueIssues(dir);
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: 'logs/first-morning.yaml',
      line: 3,
      column: 8,
      field: 'stove',
      code: 'unknown-id',
    });
  });

  it('non-UTF-8 bytes are refused at the first bad byte', async () => {
    const latin1 = Buffer.concat([
      Buffer.from('name: Caf'),
      Buffer.from([0xe9]),
      Buffer.from(` blend\n${COFFEE.split('\n').slice(1).join('\n')}`),
    ]);
    await put(dir, 'coffees/house-blend.yaml', latin1);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'coffees/house-blend.yaml',
      line: 1,
      column: 10,
      field: '',
      code: 'not-utf8',
      wording: contentWords.notUtf8(),
    });
  });

  it('a non-UTF-8 byte on a later line is placed on that line', async () => {
    const bytes = Buffer.concat([
      Buffer.from('name: House blend\nroast: m'),
      Buffer.from([0xff]),
      Buffer.from('edium\n'),
    ]);
    await put(dir, 'coffees/house-blend.yaml', bytes);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'coffees/house-blend.yaml',
      line: 2,
      column: 9,
      field: '',
      code: 'not-utf8',
    });
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a 2 MiB file is refused without being parsed', async () => {
    const huge = `${POT}\n${'# padding padding padding padding\n'.repeat(62_000)}`;
    expect(huge.length).toBeGreaterThan(2 * 1024 * 1024);
    await put(dir, 'pots/three-cup.yaml', huge);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'pots/three-cup.yaml',
      line: 1,
      column: 1,
      field: '',
      code: 'file-too-large',
      wording: contentWords.fileTooLarge(Buffer.byteLength(huge), MAX_CONTENT_FILE_BYTES),
    });
  });

  it('aliases are allowed, but their expansion is capped', async () => {
    await put(dir, 'stoves/bar-gas.yaml', STOVE.replace('levels:', 'levels: &levels').concat('\n'));
    await loadCatalogue(dir);
    const bomb = [
      'a: &a [x, x, x, x, x, x, x, x, x, x]',
      'b: &b [*a, *a, *a, *a, *a, *a, *a, *a, *a, *a]',
    ];
    bomb.push(
      'c: &c [*b, *b, *b, *b, *b, *b, *b, *b, *b, *b]',
      'd: [*c, *c, *c, *c, *c, *c, *c, *c, *c, *c]',
    );
    await put(dir, 'logs/bomb.yaml', bomb.join('\n'));
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'logs/bomb.yaml',
      line: 1,
      field: '',
      code: 'too-many-aliases',
      wording: contentWords.tooManyAliases(MAX_ALIAS_COUNT),
    });
  });

  it('an empty file says so', async () => {
    await put(dir, 'stoves/spare.yaml', '# to be written\n');
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'stoves/spare.yaml',
      line: 1,
      field: '',
      code: 'empty-file',
      wording: contentWords.emptyFile('stove'),
    });
  });

  it('a file name that is not an id is refused with a corrected name', async () => {
    await put(dir, 'pots/Big Pot.yaml', POT);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'pots/Big Pot.yaml',
      line: 1,
      field: '',
      code: 'bad-file-name',
      wording: contentWords.badFileName('Big Pot', 'big-pot'),
    });
  });

  it('two files with one id are refused', async () => {
    await put(dir, 'pots/three-cup.yml', POT);
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'pots/three-cup.yml',
      line: 1,
      field: '',
      code: 'same-id-twice',
      wording: contentWords.sameIdTwice('three-cup', 'pots/three-cup.yaml'),
    });
  });

  it('other files in the folders are ignored', async () => {
    await put(dir, 'pots/notes.txt', 'not an entry');
    await put(dir, 'pots/.DS_Store', '\u0000');
    await expect(loadCatalogue(dir)).resolves.toBeDefined();
  });

  it('reports every problem of every file at once, sorted by file and line', async () => {
    await put(
      dir,
      'pots/three-cup.yaml',
      withLine(withLine(POT, 'cups', 'cups: three'), 'valve_height_mm', '  valve_hieght_mm: 32'),
    );
    await put(dir, 'coffees/house-blend.yaml', withLine(COFFEE, 'roast', 'roast: darkish'));
    await put(
      dir,
      'stoves/bar-gas.yaml',
      withLine(STOVE, '- { label: high', '  - { label: high, power_w: 900 }'),
    );
    await put(dir, 'site.yaml', withLine(SITE, 'paper', 'paper: A3'));
    const error = await loadCatalogue(dir).catch((thrown: unknown) => thrown);
    expect(error).toBeInstanceOf(ContentErrors);
    const issues = (error as ContentErrors).issues;
    expect(issues.map((issue) => `${issue.file}:${issue.line} ${issue.field}`)).toEqual([
      'coffees/house-blend.yaml:2 roast',
      'pots/three-cup.yaml:2 cups',
      'pots/three-cup.yaml:3 base.valve_height_mm',
      'pots/three-cup.yaml:6 base.valve_hieght_mm',
      'site.yaml:3 paper',
      'stoves/bar-gas.yaml:6 levels[2].power_w',
    ]);
    // The error's own message is for developers: codes and places, no words.
    expect((error as ContentErrors).message).toContain('pots/three-cup.yaml:6:');
    expect((error as ContentErrors).message).not.toContain('Did you mean');
  });

  it('a missing site.yaml is one clear issue', async () => {
    await removeCopy(join(dir, 'site.yaml'));
    const issues = await catalogueIssues(dir);
    expectIssue(issues, {
      file: 'site.yaml',
      line: 1,
      field: '',
      code: 'missing-file',
      wording: contentWords.missingSiteFile(),
    });
  });
});

describe('formatContentErrors', () => {
  it('lists each issue as file:line:column field — problem. fix', async () => {
    const dir = await contentCopy();
    try {
      await put(
        dir,
        'pots/three-cup.yaml',
        withLine(POT, 'valve_height_mm', '  valve_height_mm: 32mm'),
      );
      const error = await loadCatalogue(dir).catch((thrown: unknown) => thrown as ContentErrors);
      const lines = formatContentErrors(error as ContentErrors).split('\n');
      expect(lines[0]).toBe(contentWords.errorsHeading(1, 1));
      expect(lines[1]).toBe(
        'pots/three-cup.yaml:6:20 base.valve_height_mm — expected a number of millimetres between 5 and 200, got "32mm". ' +
          "Write 32: the key's name already says the unit.",
      );
    } finally {
      await removeCopy(dir);
    }
  });
});
