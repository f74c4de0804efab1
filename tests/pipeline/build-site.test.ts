/**
 * buildSite on the demo content: the pages it makes, the plan cache, the swap that keeps the
 * last good site when a build fails, escaping of YAML text, and no network references.
 */
import { formatContentErrors } from '../../generator/words/content.ts';
import { createHash } from 'node:crypto';
import { cp, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { expandCards } from '../../generator/pipeline/cards.ts';
import { ContentErrors, loadCatalogue } from '../../generator/content/index.ts';
import type { Catalogue } from '../../generator/content/types.ts';

const EPOCH = { SOURCE_DATE_EPOCH: '1714521600' }; // 2024-05-01

let root: string;
let cacheDir: string;
let catalogue: Catalogue;
let first: BuildResult;
let firstMs: number;

async function files(dir: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...(await files(full)));
    else out.push(full);
  }
  return out.sort();
}

async function treeHash(dir: string): Promise<string> {
  const hash = createHash('sha256');
  for (const file of await files(dir)) {
    hash.update(path.relative(dir, file));
    hash.update(await readFile(file));
  }
  return hash.digest('hex');
}

async function contentCopy(name: string): Promise<string> {
  const dir = path.join(root, name);
  await cp('content', dir, { recursive: true });
  return dir;
}

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-build-'));
  cacheDir = path.join(root, 'cache');
  catalogue = await loadCatalogue('content');
  const started = performance.now();
  first = await buildSite({
    contentDir: 'content',
    outDir: path.join(root, 'site'),
    cacheDir,
    env: EPOCH,
  });
  firstMs = performance.now() - started;
});

afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('buildSite(demo content)', () => {
  it('writes the index, each set, each card, each insert, method and troubleshooting', async () => {
    const site = path.join(root, 'site');
    const written = new Set((await files(site)).map((f) => path.relative(site, f)));
    const jobs = expandCards(catalogue);
    const expected = [
      'index.html',
      'method/index.html',
      'troubleshooting/index.html',
      'assets/card.css',
      'assets/fonts/DejaVuSans.ttf',
      'assets/fonts/DejaVuSans-Bold.ttf',
      ...catalogue.site.sets.map((s) => `sets/${s.id}/index.html`),
      ...jobs.stations.map((s) => `cards/${s.slug}/index.html`),
      ...jobs.inserts.map((i) => `inserts/${i.slug}/index.html`),
      ...[...catalogue.coffees.keys()].map((c) => `brew/${c}/index.html`),
      'assets/planner.js',
    ];
    for (const file of expected) expect(written.has(file), file).toBe(true);
    expect(first.pages).toBe(
      3 +
        catalogue.site.sets.length +
        jobs.stations.length +
        jobs.inserts.length +
        first.data.plannerPages.length,
    );
    expect(first.stationCards).toBe(jobs.stations.length);
    expect(first.planned).toBe(jobs.stations.length);
    expect(first.cached).toBe(0);
  });

  it('a station card’s page carries the plan’s numbers', async () => {
    const card = first.data.stationCards.find((c) => c.recipe !== null)!;
    const html = await readFile(path.join(root, 'site', card.paths.pageFile), 'utf8');
    const r = card.recipe!;
    for (const text of [
      r.water.fillVolume.value,
      r.water.temperature.value,
      r.coffee.dose.value,
      r.timings.firstCoffee.text,
      r.timings.offHeat.text,
      r.heat.level,
    ]) {
      expect(html).toContain(text);
    }
    expect(html).toContain('<svg'); // chart, drawing and QR inline
    expect(html).not.toMatch(/<script/);
  });

  it('a refused card’s page says why, what to change, and the cautions', async () => {
    const card = first.data.stationCards.find((c) => c.refusal !== null)!;
    const html = await readFile(path.join(root, 'site', card.paths.pageFile), 'utf8');
    const escaped = (t: string) =>
      t.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
    expect(html).toContain(escaped(card.refusal!.reason));
    expect(html).toContain(escaped(card.refusal!.suggestion));
    expect(html).toContain(escaped(card.cautions.items[0]!));
    expect(html).not.toContain('class="step step-water"');
  });

  it('the index links every card page and its PDF', async () => {
    const html = await readFile(path.join(root, 'site', 'index.html'), 'utf8');
    for (const card of first.data.stationCards.filter((c) =>
      first.data.sets.some((s) => s.cards.some((l) => l.pageUrl === c.paths.pageUrl)),
    )) {
      expect(html).toContain(`href="${card.paths.pageFile}"`);
      expect(html).toContain(`href="${card.paths.pdfFile}"`);
    }
    for (const insert of first.data.insertCards)
      expect(html).toContain(`href="${insert.paths.pdfFile}"`);
  });

  it('loads nothing from the network: no http(s) in src, href, url() or @import', async () => {
    const site = path.join(root, 'site');
    for (const file of await files(site)) {
      if (!/\.(html|css|svg)$/.test(file)) continue;
      const text = await readFile(file, 'utf8');
      expect(text, file).not.toMatch(/\b(?:src|href|xlink:href)\s*=\s*["']?\s*https?:/i);
      expect(text, file).not.toMatch(/url\(\s*["']?https?:/i);
      expect(text, file).not.toMatch(/@import/i);
      // Only the customer's pages run a script: the site's own, and their data as JSON.
      const scripts = [...text.matchAll(/<script\b[^>]*>/gi)].map((m) => m[0]);
      if (path.relative(site, file).startsWith('brew/')) {
        expect(scripts, file).toEqual([
          '<script type="application/json" id="planner-data">',
          '<script defer src="../../assets/planner.js">',
        ]);
      } else expect(scripts, file).toEqual([]);
    }
    // The script asks for nothing by address either (its data is in the page).
    const script = await readFile(path.join(site, 'assets', 'planner.js'), 'utf8');
    expect(script).not.toMatch(/\bfetch\(|XMLHttpRequest|WebSocket|sendBeacon|importScripts/);
  });
});

describe('the plan cache', () => {
  it('a rebuild with unchanged content plans nothing', async () => {
    const started = performance.now();
    const again = await buildSite({
      contentDir: 'content',
      outDir: path.join(root, 'site'),
      cacheDir,
      env: EPOCH,
    });
    const againMs = performance.now() - started;
    expect(again.planned).toBe(0);
    expect(again.cached).toBe(first.planned);
    console.info(
      `first build ${firstMs.toFixed(0)} ms (${first.planned} plans); rebuild ${againMs.toFixed(0)} ms (0 plans)`,
    );
  });

  it('changing one coffee re-plans only that coffee’s cards', async () => {
    const dir = await contentCopy('content-one-coffee');
    const coffeeId = 'house-blend';
    const file = path.join(dir, 'coffees', `${coffeeId}.yaml`);
    await writeFile(file, `${await readFile(file, 'utf8')}\n# edited\n`);
    const result = await buildSite({
      contentDir: dir,
      outDir: path.join(root, 'site-one-coffee'),
      cacheDir,
      env: EPOCH,
    });
    const mine = expandCards(catalogue).stations.filter(
      (s) => s.request.coffeeId === coffeeId,
    ).length;
    expect(result.planned).toBe(mine);
    expect(result.cached).toBe(first.planned - mine);
  });
});

describe('reproducible output', () => {
  it('same content and SOURCE_DATE_EPOCH give the same bytes', async () => {
    await buildSite({
      contentDir: 'content',
      outDir: path.join(root, 'site-b'),
      cacheDir,
      env: EPOCH,
    });
    expect(await treeHash(path.join(root, 'site-b'))).toBe(await treeHash(path.join(root, 'site')));
    const html = await readFile(path.join(root, 'site-b', 'index.html'), 'utf8');
    expect(html).toContain('2024-05-01');
  });
});

describe('a failed build', () => {
  it('keeps the previous site byte-identical and reports file:line:column', async () => {
    const dir = await contentCopy('content-broken');
    const outDir = path.join(root, 'site-kept');
    await buildSite({ contentDir: dir, outDir, cacheDir, env: EPOCH });
    const before = await treeHash(outDir);
    await writeFile(
      path.join(dir, 'pots', 'three-cup.yaml'),
      'name: Three-cup\ncups: [3\nbase: {\n',
    );
    await writeFile(path.join(dir, 'coffees', 'ember-blend.yaml'), 'name: Ember\nroast: 12\n');
    const error = await buildSite({ contentDir: dir, outDir, cacheDir, env: EPOCH }).catch(
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(ContentErrors);
    const message = formatContentErrors(error as ContentErrors);
    expect(message).toMatch(/pots\/three-cup\.yaml:\d+:\d+/);
    expect(message).toMatch(/coffees\/ember-blend\.yaml:\d+:\d+/); // all issues at once
    expect(await treeHash(outDir)).toBe(before);
    expect((await readdir(root)).filter((name) => name.includes('.tmp-'))).toEqual([]);
  });

  it('a failing extra step also keeps the previous site, and a good one writes into it', async () => {
    const outDir = path.join(root, 'site-steps');
    await buildSite({
      contentDir: 'content',
      outDir,
      cacheDir,
      env: EPOCH,
      extraSteps: [
        async (ctx) =>
          writeFile(path.join(ctx.siteDir, 'extra.txt'), `${ctx.data.stationCards.length}`),
      ],
    });
    expect(await readFile(path.join(outDir, 'extra.txt'), 'utf8')).toBe(String(first.stationCards));
    const before = await treeHash(outDir);
    const failing = buildSite({
      contentDir: 'content',
      outDir,
      cacheDir,
      env: EPOCH,
      extraSteps: [async () => Promise.reject(new Error('pdf step failed'))],
    });
    await expect(failing).rejects.toThrow('pdf step failed');
    expect(await treeHash(outDir)).toBe(before);
  });
});

describe('escaping of YAML text', () => {
  it('a coffee named <script>alert(1)</script> & "x" is printed as text', async () => {
    const dir = await contentCopy('content-hostile');
    const file = path.join(dir, 'coffees', 'house-blend.yaml');
    const yaml = await readFile(file, 'utf8');
    await writeFile(file, yaml.replace(/^name: .*$/m, `name: '<script>alert(1)</script> & "x"'`));
    const outDir = path.join(root, 'site-hostile');
    const result = await buildSite({ contentDir: dir, outDir, cacheDir, env: EPOCH });
    const pages = result.data.stationCards
      .filter((c) => c.coffeeId === 'house-blend')
      .map((c) => c.paths.pageFile);
    expect(pages.length).toBeGreaterThan(0);
    for (const page of [...pages, 'index.html', 'inserts/house-blend/index.html']) {
      const html = await readFile(path.join(outDir, page), 'utf8');
      expect(html, page).not.toContain('<script>alert(1)');
      expect(html, page).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;x&quot;');
    }
  });
});
