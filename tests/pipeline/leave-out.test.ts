/**
 * Sets that skip what cannot brew: a station set's `every_coffee_with_every_pot` line
 * leaves out the combinations that get no recipe, unless the set says
 * `include_refused: true`; its page says how many were left out and why.
 *
 * The test site is invented here: one aluminium pot without an induction plate and one
 * stainless-steel pot, one coffee, one induction hob. An aluminium base without a
 * magnetic plate does not heat on induction (induction needs a ferromagnetic base: common
 * practice, no source), so the planner refuses that pair and accepts the steel one.
 */
import { mkdir, mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { ContentErrors, loadCatalogue } from '../../generator/content/index.ts';

const EPOCH = { SOURCE_DATE_EPOCH: '1714521600' };

const POTS: Record<string, string> = {
  'pocket-alu': `name: Pocket aluminium pot
cups: 1
base: { sealed_volume_ml: 100, inner_diameter_mm: 60, valve_height_mm: 24, material: aluminium, mass_g: 90 }
funnel: { basket_diameter_mm: 40, basket_depth_mm: 11, tube_inner_diameter_mm: 5, tube_gap_mm: 3 }
upper: { spout_height_mm: 85, capacity_ml: 70 }
`,
  'tall-steel': `name: Tall steel pot
cups: 4
base: { sealed_volume_ml: 330, inner_diameter_mm: 90, valve_height_mm: 36, material: stainless-steel, mass_g: 420 }
funnel: { basket_diameter_mm: 60, basket_depth_mm: 16, tube_inner_diameter_mm: 7, tube_gap_mm: 4 }
upper: { spout_height_mm: 125, capacity_ml: 250 }
`,
};

const COFFEE = `name: Test Harbour blend
roast: medium
grind: medium-fine
bulk_density_g_ml: 0.38
retention_g_per_g: 1.2
`;

const STOVE = `name: Test induction hob
kind: induction
levels:
  - { label: 2, power_w: 300 }
  - { label: 5, power_w: 900 }
  - { label: 8, power_w: 1600 }
`;

function siteYaml(extra: string): string {
  return `business: { name: Test Kiosk, contact: kiosk@test.example }
units: metric
paper: A5
room: { ambient_c: 20 }
sets:
  - id: hob
    title: Hob station
    layout: station
${extra}    cards:
      - { stove: hob, every_coffee_with_every_pot: true }
`;
}

let root: string;

async function contentWith(name: string, site: string): Promise<string> {
  const dir = path.join(root, name);
  for (const sub of ['pots', 'coffees', 'stoves', 'logs'])
    await mkdir(path.join(dir, sub), { recursive: true });
  for (const [id, text] of Object.entries(POTS))
    await writeFile(path.join(dir, 'pots', `${id}.yaml`), text);
  await writeFile(path.join(dir, 'coffees', 'harbour.yaml'), COFFEE);
  await writeFile(path.join(dir, 'stoves', 'hob.yaml'), STOVE);
  await writeFile(path.join(dir, 'site.yaml'), site);
  return dir;
}

async function build(name: string, site: string): Promise<{ result: BuildResult; out: string }> {
  const content = await contentWith(name, site);
  const out = path.join(root, `${name}-site`);
  const result = await buildSite({
    contentDir: content,
    outDir: out,
    cacheDir: path.join(root, 'cache'),
    env: EPOCH,
    workers: 0,
  });
  return { result, out };
}

const REFUSED_SLUG = 'pocket-alu--harbour--hob';
const ACCEPTED_SLUG = 'tall-steel--harbour--hob';

let byDefault: { result: BuildResult; out: string };
let withFlag: { result: BuildResult; out: string };

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-leave-out-'));
  byDefault = await build('default', siteYaml(''));
  withFlag = await build('flag', siteYaml('    include_refused: true\n'));
}, 240_000);

afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('every_coffee_with_every_pot leaves out what gets no recipe', () => {
  it('by default the refused combination is absent from the set, its page and its PDF list', async () => {
    const set = byDefault.result.data.sets.find((s) => s.id === 'hob')!;
    expect(set.cards.map((c) => c.pageUrl)).toEqual([`cards/${ACCEPTED_SLUG}/`]);
    expect(byDefault.result.data.stationCards.map((c) => c.paths.pageUrl)).toEqual([
      `cards/${ACCEPTED_SLUG}/`,
    ]);
    const cards = await readdir(path.join(byDefault.out, 'cards'));
    expect(cards).toEqual([ACCEPTED_SLUG]);
    const page = await readFile(path.join(byDefault.out, 'sets', 'hob', 'index.html'), 'utf8');
    expect(page).not.toContain('Pocket aluminium pot');
    // How many and why, in the insert rows' words for this refusal.
    expect(set.leftOut).toBe(
      'Left out of this set: one combination of pot and coffee that would get no recipe (1 × base does not work on induction).',
    );
    expect(page).toContain('Left out of this set: one combination');
  });

  it('with include_refused: true the refused combination is a card saying why', async () => {
    const set = withFlag.result.data.sets.find((s) => s.id === 'hob')!;
    expect(set.cards.map((c) => c.pageUrl)).toEqual([
      `cards/${REFUSED_SLUG}/`,
      `cards/${ACCEPTED_SLUG}/`,
    ]);
    expect(set.cards[0]!.refused).toBe(true);
    expect(set.leftOut).toBeNull();
    const refused = withFlag.result.data.stationCards.find((c) => c.refusal !== null)!;
    expect(refused.paths.pageUrl).toBe(`cards/${REFUSED_SLUG}/`);
    const page = await readFile(path.join(withFlag.out, 'sets', 'hob', 'index.html'), 'utf8');
    expect(page).toContain('Pocket aluminium pot');
    expect(page).not.toContain('Left out of this set');
  });

  it('a card listed by name is kept even when refused', async () => {
    const site = siteYaml('').replace(
      '    cards:\n',
      '    cards:\n      - { pot: pocket-alu, coffee: harbour, stove: hob }\n',
    );
    // The named card comes first; the every-line repeats it, which is a content error.
    const content = await contentWith('named', site);
    await expect(loadCatalogue(content)).rejects.toBeInstanceOf(ContentErrors);
    const only = siteYaml('').replace(
      '      - { stove: hob, every_coffee_with_every_pot: true }\n',
      '      - { pot: pocket-alu, coffee: harbour, stove: hob }\n',
    );
    const { result } = await build('named-only', only);
    const set = result.data.sets.find((s) => s.id === 'hob')!;
    expect(set.cards.map((c) => c.refused)).toEqual([true]);
    expect(set.leftOut).toBeNull();
  });

  it('include_refused on an insert set is a content error naming the key', async () => {
    const site = `business: { name: Test Kiosk, contact: kiosk@test.example }
units: metric
paper: A5
room: { ambient_c: 20 }
sets:
  - id: bags
    title: Bags
    layout: insert
    include_refused: true
    coffees: [harbour]
`;
    const content = await contentWith('insert-flag', site);
    const error = await loadCatalogue(content).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ContentErrors);
    expect(
      String((error as Error).message) + JSON.stringify((error as ContentErrors).issues),
    ).toContain('include_refused');
  });
});

describe('layout: binder, not the set id, makes a binder', () => {
  it('a station set whose id says training is a plain station set; layout: binder is a binder', async () => {
    const station = siteYaml('').replace('id: hob', 'id: hob-training');
    const plain = await build('training-id', station);
    expect(plain.result.data.sets[0]!.binder).toBe(false);
    const binder = siteYaml('').replace('layout: station', 'layout: binder');
    const made = await build('binder', binder);
    const set = made.result.data.sets[0]!;
    expect(set.binder).toBe(true);
    expect(set.layoutLabel).toBe('Training binder');
    // A binder is a station set: refused combinations are left out the same way.
    expect(set.cards).toHaveLength(1);
    expect(set.leftOut).not.toBeNull();
  });
});
