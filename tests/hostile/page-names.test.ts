/**
 * Page names through the real build: ids may hold `--`, the separator of page names, and
 * no two cards may ever share a page (issue 16 found one card silently replacing another).
 */
import { cp, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkPageNames, PageCollisionError } from '../../generator/pipeline/cards.ts';
import { insertSlug, pageName, pagePart, stationPaths } from '../../generator/render/paths.ts';
import { ID_PATTERN } from '../../generator/content/ids.ts';
import { faultWords } from '../../generator/words/build-faults.ts';
import { runMainIn } from './cli-run.ts';
import { demoCopy } from './site-tree.ts';

let root: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-page-names-'));
});
afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

/** Demo content with pots p, p--x, coffees c, x--c, house, house--bags and `sets`. */
async function dashedContent(dir: string, sets: string): Promise<string> {
  await demoCopy(dir);
  await cp(path.join(dir, 'pots', 'three-cup.yaml'), path.join(dir, 'pots', 'p.yaml'));
  await cp(path.join(dir, 'pots', 'six-cup.yaml'), path.join(dir, 'pots', 'p--x.yaml'));
  await cp(path.join(dir, 'coffees', 'house-blend.yaml'), path.join(dir, 'coffees', 'c.yaml'));
  await cp(path.join(dir, 'coffees', 'ember-blend.yaml'), path.join(dir, 'coffees', 'x--c.yaml'));
  await cp(path.join(dir, 'coffees', 'house-blend.yaml'), path.join(dir, 'coffees', 'house.yaml'));
  await cp(
    path.join(dir, 'coffees', 'morning-lantern.yaml'),
    path.join(dir, 'coffees', 'house--bags.yaml'),
  );
  const site = await readFile(path.join(dir, 'site.yaml'), 'utf8');
  await writeFile(
    path.join(dir, 'site.yaml'),
    `${site.slice(0, site.indexOf('sets:'))}sets:\n${sets}`,
  );
  return dir;
}

describe('ids holding the page-name separator', () => {
  it('pot p--x × coffee c and pot p × coffee x--c get a card each, and so do house and house--bags', async () => {
    const content = await dashedContent(
      path.join(root, 'content'),
      [
        '  - id: bar',
        '    title: Bar',
        '    layout: station',
        '    cards:',
        '      - { pot: p--x, coffee: c, stove: bar-gas }',
        '      - { pot: p, coffee: x--c, stove: bar-gas }',
        '  - id: shop',
        '    title: Shop',
        '    layout: insert',
        '    coffees: [house, house--bags]',
        '    pots: [p]',
        '    stoves: [bar-gas]',
        '  - id: bags',
        '    title: Bags',
        '    layout: insert',
        '    coffees: [house]',
        '    pots: [p]',
        '    stoves: [bar-gas]',
        '',
      ].join('\n'),
    );
    const out = path.join(root, 'site');
    const run = await runMainIn(root, ['build', '--content', content, '--out', out]);
    expect(run.code, run.stderr).toBe(0);
    const cards = (await readdir(path.join(out, 'cards'))).filter((n) => !n.endsWith('.pdf'));
    // The two station cards, and the station pages the inserts' rows point to.
    expect(cards.sort()).toEqual(
      [
        'p-_-x--c--bar-gas',
        'p--x-_-c--bar-gas',
        'p--house--bar-gas',
        'p--house-_-bags--bar-gas',
      ].sort(),
    );
    // pot p--x × coffee c, and pot p × coffee x--c
    const cardA = await readFile(
      path.join(out, 'cards', 'p-_-x--c--bar-gas', 'index.html'),
      'utf8',
    );
    const cardB = await readFile(
      path.join(out, 'cards', 'p--x-_-c--bar-gas', 'index.html'),
      'utf8',
    );
    expect(cardA).toContain('Brindlemoss house blend'); // coffee c is a copy of house-blend
    expect(cardB).toContain('Ember blend'); // coffee x--c is a copy of ember-blend
    const inserts = (await readdir(path.join(out, 'inserts'))).filter((n) => n.endsWith('.pdf'));
    // house (shop), house--bags (shop), house again (bags: the set's name is added).
    expect(inserts.sort()).toEqual(['house--bags.pdf', 'house-_-bags.pdf', 'house.pdf'].sort());
    const lantern = await readFile(path.join(out, 'inserts', 'house-_-bags', 'index.html'), 'utf8');
    expect(lantern).toContain('Morning');
  }, 120_000);
});

describe('pageName', () => {
  const id = fc.stringMatching(ID_PATTERN).filter((s) => s.length <= 24);
  // Ids of `a` and dashes only: lists that join alike under plain `--` are common here.
  const dashy = fc.stringMatching(/^a[a-]{0,6}$/);
  it('is one-to-one on lists of ids (10,000 generated pairs of triples), and never changes an id without --', () => {
    fc.assert(
      fc.property(fc.tuple(dashy, dashy, dashy), fc.tuple(dashy, dashy, dashy), (a, b) => {
        expect(a.every((part) => ID_PATTERN.test(part))).toBe(true);
        const same = a.every((part, i) => part === b[i]);
        expect(pageName(...a) === pageName(...b)).toBe(same);
      }),
      { numRuns: 10_000 },
    );
    fc.assert(
      fc.property(id, (one) => {
        if (!one.includes('--')) expect(pagePart(one)).toBe(one);
        expect(pagePart(one)).not.toContain('--');
      }),
      { numRuns: 2_000 },
    );
  });

  it('an insert with its set never takes the name of another coffee', () => {
    expect(insertSlug('house', 'bags')).not.toBe(insertSlug('house--bags', null));
    expect(stationPaths({ potId: 'p--x', coffeeId: 'c', stoveId: 's' }).pageFile).not.toBe(
      stationPaths({ potId: 'p', coffeeId: 'x--c', stoveId: 's' }).pageFile,
    );
  });

  it('a collision (a set named like a station card would be, say) fails naming both entries', () => {
    const jobs = {
      sets: [],
      stations: [
        {
          slug: 'a',
          key: 'a',
          language: 'en',
          request: { potId: 'a', coffeeId: 'b', stoveId: 'c' },
          setIds: [],
        },
        {
          slug: 'b',
          key: 'b',
          language: 'en',
          request: { potId: 'a', coffeeId: 'b', stoveId: 'c' },
          setIds: [],
        },
      ],
      inserts: [
        { setId: 's1', language: 'en', coffeeId: 'k', slug: 'k', rows: [] },
        { setId: 's2', language: 'en', coffeeId: 'k', slug: 'k', rows: [] },
      ],
    };
    let caught: unknown;
    try {
      checkPageNames(jobs);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(PageCollisionError);
    const e = caught as PageCollisionError;
    expect(faultWords.pageCollision(e.page, e.first, e.second)).toBe(
      'two cards would share the page inserts/k/index.html: insert of coffee k in set s1 and insert of coffee k in set s2; rename one of the ids',
    );
  });
});
