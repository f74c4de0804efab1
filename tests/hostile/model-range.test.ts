/**
 * Inputs outside what the model was checked for (generator/planning/model-range.ts) still
 * get a card, and say so twice: in the card's "Check" box and in the build log. Built by
 * the real command, main(['build', …]), from a copy of the demo content with a very open
 * grind, a very hot plate and a café high in the mountains.
 */
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CHECKED } from '../../generator/planning/model-range.ts';
import { buildWords } from '../../generator/words/card.ts';
import { planNotices } from '../../generator/planning/notices.ts';
import { warningText } from '../../generator/render/plan-text.ts';
import { lines, runMainIn, type CliRun } from './cli-run.ts';
import { demoCopy } from './site-tree.ts';

/** Permeability above the checked 5e-12 m² (a very coarse, open bed). */
const OPEN_BED_M2 = 6e-12;
/** Heat reaching the pot above the checked 1200 W. */
const HOT_PLATE_W = 1300;
/** Above the checked 3000 m. */
const ALTITUDE_M = 3200;

const CARDS = {
  openBed: { pot: 'three-cup', coffee: 'open-grind', stove: 'bar-gas' },
  hotPlate: { pot: 'six-cup', coffee: 'quick-window', stove: 'hot-plate' },
} as const;

const slug = (c: { pot: string; coffee: string; stove: string }) =>
  `${c.pot}--${c.coffee}--${c.stove}`;

const expected = {
  permeability: warningText(
    planNotices.outsideCheckedRange('permeabilityM2', OPEN_BED_M2, ...CHECKED.permeabilityM2),
    'metric',
  ),
  power: warningText(
    planNotices.outsideCheckedRange('heatToPotW', HOT_PLATE_W, ...CHECKED.heatToPotW),
    'metric',
  ),
  altitude: warningText(
    planNotices.outsideCheckedRange('altitudeM', ALTITUDE_M, ...CHECKED.altitudeM),
    'metric',
  ),
};

let root: string;
/** Two builds: the café in the mountains with the open grind; the hot plate at sea level. */
const builds: Record<'mountain' | 'hotPlate', { outDir: string; run: CliRun }> = {} as never;

async function buildWith(
  name: keyof typeof builds,
  altitudeM: number,
  card: { pot: string; coffee: string; stove: string },
): Promise<void> {
  const content = await demoCopy(path.join(root, `content-${name}`));
  const house = await readFile(path.join(content, 'coffees', 'house-blend.yaml'), 'utf8');
  await writeFile(
    path.join(content, 'coffees', 'open-grind.yaml'),
    house.replace(/^permeability_m2: .*$/m, `permeability_m2: ${OPEN_BED_M2}`),
  );
  // The default delivery window [60, 150] s refuses a plate this hot; a wider one accepts it.
  await writeFile(
    path.join(content, 'coffees', 'quick-window.yaml'),
    house.replace(/^notes: /m, 'delivery_window_s: [20, 300]\nnotes: '),
  );
  await writeFile(
    path.join(content, 'stoves', 'hot-plate.yaml'),
    [
      'name: Test plate, hotter than the model was checked for',
      'kind: induction',
      'levels:',
      `  - { label: max, power_w: 1500, heat_to_pot_w: ${HOT_PLATE_W} }`,
      '',
    ].join('\n'),
  );
  const site = path.join(content, 'site.yaml');
  const yaml = (await readFile(site, 'utf8'))
    .replace(/altitude_m: 0/, `altitude_m: ${altitudeM}`)
    .replace(
      /^sets:[\s\S]*$/m,
      [
        'sets:',
        '  - id: outside',
        '    title: Outside the checked ranges',
        '    layout: station',
        '    cards:',
        `      - { pot: ${card.pot}, coffee: ${card.coffee}, stove: ${card.stove} }`,
        '',
      ].join('\n'),
    );
  await writeFile(site, yaml);
  const outDir = path.join(root, `site-${name}`);
  builds[name] = {
    outDir,
    run: await runMainIn(root, ['build', '--content', content, '--out', outDir]),
  };
}

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-model-range-'));
  // One after the other: each changes the working folder and captures stderr while it runs.
  await buildWith('mountain', ALTITUDE_M, CARDS.openBed);
  await buildWith('hotPlate', 0, CARDS.hotPlate);
}, 120_000);

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

describe('stovecard build with inputs outside the checked ranges', () => {
  it('builds (exit 0): a warning is not a refusal', () => {
    for (const { run } of Object.values(builds)) expect(run.code, run.stderr).toBe(0);
  });

  const cases = [
    {
      name: 'a bed permeability and an altitude above the checked ranges',
      build: 'mountain' as const,
      card: CARDS.openBed,
      warnings: [expected.permeability, expected.altitude],
    },
    {
      name: 'heat reaching the pot above the checked range',
      build: 'hotPlate' as const,
      card: CARDS.hotPlate,
      warnings: [expected.power],
    },
  ];

  for (const c of cases) {
    it(`${c.name}: the card's Check box says so`, async () => {
      const file = path.join(builds[c.build].outDir, 'cards', slug(c.card), 'index.html');
      const html = await readFile(file, 'utf8');
      const box = /<section class="warnings"[\s\S]*?<\/section>/.exec(html)?.[0];
      expect(box, `${slug(c.card)} has no warnings section`).toBeDefined();
      expect(html, `${slug(c.card)} was refused`).not.toContain('class="refusal"');
      for (const warning of c.warnings) expect(box, slug(c.card)).toContain(warning);
    });

    it(`${c.name}: the build log says so, naming the card`, () => {
      const { stderr } = builds[c.build].run;
      for (const warning of c.warnings)
        expect(lines(stderr), stderr).toContain(
          buildWords.cardWarning(c.card.pot, c.card.coffee, c.card.stove, warning),
        );
    });
  }

  it('the build log has the warnings before the one-line summary', () => {
    for (const { run } of Object.values(builds)) {
      const log = lines(run.stderr);
      expect(log.at(-1), run.stderr).toMatch(/^built /);
      expect(
        log.slice(0, -1).every((line) => line.startsWith('warning: ')),
        run.stderr,
      ).toBe(true);
    }
  });
});
