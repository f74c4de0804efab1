/**
 * The customer's page (brew/<coffee>/) in Chromium: for the same inputs it shows what
 * `stovecard plan --json` prints (the command line run as a child process on the same
 * entries, the customer's own pot and stove saved as the YAML the page builds), refuses
 * what the command line refuses, speaks the site's units, asks nothing of the network,
 * passes axe-core's WCAG A/AA rules, and its brew timer's log entry is read by
 * `stovecard fit`. The cases go beyond the demo: a 9-cup pot of our own with a tight
 * headspace at 2,400 m on a gentle glass-top ring, a 1-cup pot on a strong gas burner.
 */
import { cp, mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { ownPotYaml, ownStoveYaml } from '../../generator/content/own-entries.ts';
import { ANSWER_FIELDS } from '../../generator/render/planner-view.ts';
import { runChild, runMain } from '../hostile/cli-run.ts';
import { describeWithBrowser, openGuardedPage, type GuardedPage } from './chromium.ts';
import { buildDemoAt, DEMO_CONTENT, type DemoBuild } from './demo-builds.ts';

const require = createRequire(import.meta.url);

interface Case {
  readonly name: string;
  /** The page's address query. */
  readonly query: Record<string, string>;
  /** The same inputs as `stovecard plan` flags (entry files relative to the content). */
  readonly cli: { pot: string; stove: string; flags: string[] };
  readonly refused?: boolean;
}

/** An invented 9-cup aluminium pot with little room between the fill and the valve. */
const NINE_CUP = {
  own_cups: '9',
  sealed_volume_ml: '640',
  inner_diameter_mm: '112',
  valve_height_mm: '52',
  material: 'aluminium',
  mass_g: '420',
  basket_diameter_mm: '84',
  basket_depth_mm: '24',
  tube_inner_diameter_mm: '9',
  tube_gap_mm: '5',
  spout_height_mm: '165',
  capacity_ml: '560',
};

const CASES: readonly Case[] = [
  {
    name: 'a site pot on a site stove (3-cup, bar gas)',
    query: { cups: '3', stove: 'bar-gas', kettle_presets_c: '70, 80, 90', altitude_m: '0' },
    cli: {
      pot: 'pots/three-cup.yaml',
      stove: 'stoves/bar-gas.yaml',
      flags: ['--presets-c', '70,80,90', '--altitude-m', '0'],
    },
  },
  {
    name: 'a 1-cup pot on a strong gas burner of the customer’s, kettle that only boils',
    query: {
      cups: '1',
      stove: 'own',
      stove_kind: 'gas',
      stove_power: 'strong',
      kettle_presets_c: '',
      altitude_m: '0',
    },
    cli: { pot: 'pots/one-cup.yaml', stove: 'OWN', flags: ['--altitude-m', '0'] },
  },
  {
    name: 'the customer’s own 9-cup pot, tight headspace, 2,400 m, gentle glass-top ring',
    query: {
      cups: 'own',
      ...NINE_CUP,
      stove: 'own',
      stove_kind: 'radiant',
      stove_power: 'gentle',
      kettle_presets_c: '75, 85, 95',
      altitude_m: '2400',
    },
    cli: {
      pot: 'OWN',
      stove: 'OWN',
      flags: ['--presets-c', '75,85,95', '--altitude-m', '2400'],
    },
  },
  {
    name: 'a refusal: an aluminium pot on induction',
    query: { cups: '3', stove: 'bar-induction', kettle_presets_c: '70, 80, 90', altitude_m: '0' },
    cli: {
      pot: 'pots/three-cup.yaml',
      stove: 'stoves/bar-induction.yaml',
      flags: ['--presets-c', '70,80,90', '--altitude-m', '0'],
    },
    refused: true,
  },
];

let root: string;
let metric: DemoBuild;
let us: DemoBuild;
let guarded: GuardedPage;

function pageUrl(build: DemoBuild, query: Record<string, string>, coffee = 'house-blend'): string {
  const file = path.join(build.outDir, 'brew', coffee, 'index.html');
  return `${pathToFileURL(file).href}?${new URLSearchParams(query).toString()}`;
}

/** Opens the page and waits for its answer (planned, refused or invalid). */
async function openPlanner(url: string): Promise<Record<string, unknown>> {
  guarded.reset();
  await guarded.page.goto(url, { waitUntil: 'load' });
  await guarded.page.waitForFunction(
    () => {
      const state = document.getElementById('planner-answer')?.dataset.state;
      return (
        state === 'planned' || state === 'refused' || state === 'invalid' || state === 'failed'
      );
    },
    undefined,
    { timeout: 30_000 },
  );
  return guarded.page.evaluate(() => {
    const out: Record<string, unknown> = {
      state: document.getElementById('planner-answer')!.dataset.state,
    };
    for (const el of document.querySelectorAll<HTMLElement>('#planner-answer [data-field]'))
      out[el.dataset.field!] =
        el.dataset.value === undefined ? undefined : JSON.parse(el.dataset.value);
    return out;
  });
}

describeWithBrowser('the customer’s page in Chromium', () => {
  beforeAll(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'stovecard-planner-'));
    const cache = path.join(root, 'cache');
    metric = await buildDemoAt(root, 'A5', cache);
    us = await buildDemoAt(root, 'letter', cache);
    guarded = await openGuardedPage({ media: 'screen', viewport: { width: 1000, height: 1400 } });
  }, 600_000);

  afterAll(async () => {
    await guarded?.close();
    if (root) await rm(root, { recursive: true, force: true });
  });

  it('is built for every coffee, and every insert’s QR code and station card page leads to it', async () => {
    const pages = metric.result.data.plannerPages.map((p) => p.paths.pageUrl).sort();
    const coffees = [...new Set(metric.result.data.stationCards.map((c) => c.coffeeId))];
    expect(pages).toEqual(coffees.map((c) => `brew/${c}/`).sort());
    for (const insert of metric.result.data.insertCards) {
      expect(insert.footer.webUrl).toBe(
        `https://cards.brindlemoss.example/brew/${insert.coffeeId}/`,
      );
    }
    const card = metric.result.data.stationCards[0]!;
    const html = await readFile(path.join(metric.outDir, card.paths.pageFile), 'utf8');
    expect(html).toContain(`href="../../brew/${card.coffeeId}/index.html"`);
  });

  for (const c of CASES) {
    it(`shows what stovecard plan --json prints: ${c.name}`, async () => {
      const answer = await openPlanner(pageUrl(metric, c.query));
      guarded.expectNoTrouble(c.name);
      // The same inputs through the command line: own entries saved as the page builds them.
      const dir = path.join(root, 'own');
      await mkdir(dir, { recursive: true });
      let pot = path.join(DEMO_CONTENT, c.cli.pot);
      let stove = path.join(DEMO_CONTENT, c.cli.stove);
      if (c.cli.pot === 'OWN') {
        pot = path.join(dir, 'your-pot.yaml');
        const { own_cups, ...values } = NINE_CUP;
        await writeFile(pot, ownPotYaml('Your pot', own_cups, values, 'metric'));
      }
      if (c.cli.stove === 'OWN') {
        stove = path.join(dir, 'your-stove.yaml');
        await writeFile(
          stove,
          ownStoveYaml(
            'Your stove',
            c.query.stove_kind as 'gas' | 'radiant',
            c.query.stove_power as 'strong' | 'gentle',
          ),
        );
      }
      const cli = await runChild([
        'plan',
        '--pot',
        pot,
        '--coffee',
        path.join(DEMO_CONTENT, 'coffees/house-blend.yaml'),
        '--stove',
        stove,
        ...c.cli.flags,
        '--json',
      ]);
      expect(cli.code, cli.stderr).toBe(c.refused ? 3 : 0);
      const json = JSON.parse(cli.stdout) as Record<string, unknown>;
      expect(answer.state).toBe(c.refused ? 'refused' : 'planned');
      for (const field of ANSWER_FIELDS) expect(answer[field], field).toEqual(json[field] ?? null);
      // The card below the answer is the station card: a recipe, or the refusal's words.
      const card = await guarded.page.locator('#planner-card article.card.station').innerText();
      if (c.refused) expect(card).toContain((json.refused as { reason: string }).reason);
      else expect(card).toContain(`${json.fillMl as number}`);
    }, 120_000);
  }

  it('puts the choices in the address, so a shared link gives the same recipe', async () => {
    await openPlanner(pageUrl(metric, { cups: '3', stove: 'bar-gas' }));
    await guarded.page.selectOption('select[name="cups"]', '6');
    await guarded.page.waitForFunction(() => location.search.includes('cups=6'));
    const shared = guarded.page.url();
    const first = await guarded.page.evaluate(
      () => document.querySelector<HTMLElement>('[data-field="fillMl"]')!.dataset.value,
    );
    const again = await openPlanner(shared);
    expect(JSON.stringify(again.fillMl)).toBe(first);
  });

  it('gives a wrong measure the content layer’s message, at its field, and no recipe', async () => {
    const answer = await openPlanner(
      pageUrl(metric, { cups: 'own', ...NINE_CUP, sealed_volume_ml: '25000', stove: 'bar-gas' }),
    );
    expect(answer.state).toBe('invalid');
    const note = await guarded.page.locator('#problem-sealed_volume_ml').innerText();
    expect(note).toMatch(/between 30 and 2000/);
    expect(await guarded.page.locator('#planner-card article').count()).toBe(0);
  });

  it('speaks °F, inches and fl oz on a US site, with the plan’s metric values in data-value', async () => {
    const answer = await openPlanner(pageUrl(us, { cups: '3', stove: 'bar-gas' }));
    expect(answer.state).toBe('planned');
    const names = await guarded.page.evaluate(() =>
      [...document.querySelectorAll<HTMLInputElement>('[name]')].map((e) => e.name),
    );
    expect(names).toEqual(
      expect.arrayContaining(['kettle_presets_f', 'inner_diameter_in', 'start_f']),
    );
    expect(names).not.toContain('kettle_presets_c');
    const text = await guarded.page.locator('main').innerText();
    expect(text).toMatch(/°F/);
    // A number with a metric unit (the stove is named “… bar, …”: a word, not a unit).
    expect(text).not.toMatch(/\d\s?(°C|mm|bar|mL)\b|°C/);
    const metricAnswer = await openPlanner(
      pageUrl(metric, { cups: '3', stove: 'bar-gas', kettle_presets_c: '70, 80, 90' }),
    );
    expect(answer.fillMl).toBe(metricAnswer.fillMl);
  });

  it('passes axe-core’s WCAG 2 A and AA rules, with the form open for an own pot', async () => {
    await openPlanner(
      pageUrl(metric, { cups: 'own', ...NINE_CUP, stove: 'own', stove_kind: 'gas' }),
    );
    await guarded.page.addScriptTag({ path: require.resolve('axe-core/axe.min.js') });
    const result = await guarded.page.evaluate(async () => {
      const axe = (
        window as unknown as {
          axe: {
            run: (
              ctx: unknown,
              o: unknown,
            ) => Promise<{ violations: { id: string; nodes: unknown[] }[] }>;
          };
        }
      ).axe;
      const r = await axe.run(document, { runOnly: ['wcag2a', 'wcag2aa'] });
      return r.violations.map((v) => `${v.id} (${v.nodes.length})`);
    });
    expect(result).toEqual([]);
  });

  it('times a brew into a log entry that stovecard fit reads', async () => {
    await guarded.page.clock.install({ time: new Date('2026-12-03T08:00:00Z') });
    await openPlanner(pageUrl(metric, { cups: '3', stove: 'bar-gas' }));
    const press = (name: string) => guarded.page.click(`button[data-press="${name}"]`);
    await press('heat_on');
    await guarded.page.clock.fastForward(66_000);
    await press('first_coffee');
    await guarded.page.clock.fastForward(54_000);
    await press('off_heat');
    await guarded.page.selectOption('select[name="level"]', 'medium');
    await guarded.page.fill('input[name="fill_ml"]', '150');
    await guarded.page.fill('input[name="start_c"]', '20');
    await guarded.page.fill('input[name="room_c"]', '21');
    await guarded.page.fill('input[name="cup_g"]', '81');
    const yaml = await guarded.page.locator('#timer-output').inputValue();
    expect(yaml).toMatch(/first_coffee_s: 66\n/);
    expect(yaml).toMatch(/off_heat_s: 120\n/);
    // Into a copy of the demo content's logs/, then fit it as a manager would.
    const content = path.join(root, 'fit-content');
    await cp(DEMO_CONTENT, content, { recursive: true });
    const log = path.join(content, 'logs', 'timed-on-the-page.yaml');
    await writeFile(log, yaml);
    const fit = await runMain(['fit', log, '--json']);
    expect(fit.code, fit.stderr).toBe(0);
    const report = JSON.parse(fit.stdout) as {
      pot: string;
      stove: string;
      brews: number;
      observations: number;
    };
    expect(report).toMatchObject({ pot: 'three-cup', stove: 'bar-gas', brews: 1 });
    // The first coffee and the yield are observations (the off-heat time is a control).
    expect(report.observations).toBeGreaterThanOrEqual(2);
  }, 120_000);
});
