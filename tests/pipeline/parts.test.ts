/** The build's small parts: build date, plan cache, swap, progress, paths and the CLI flags. */
import { mkdtemp, mkdir, readFile, readdir, readlink, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildDate } from '../../generator/pipeline/build-date.ts';
import { planFromJson, planToJson, stableJson } from '../../generator/pipeline/plan-cache.ts';
import { terminalProgress } from '../../generator/pipeline/progress.ts';
import { freshTempDir, SITE_MARKER, swapIn } from '../../generator/pipeline/swap.ts';
import { run } from '../../generator/cli/build.ts';
import { UsageError } from '../../generator/cli/errors.ts';
import type { CardPlan } from '../../generator/planning/types.ts';
import { relativeHref, stationPaths, webUrl } from '../../generator/render/paths.ts';

let root: string;
beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-parts-'));
});
afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('buildDate', () => {
  it('buildDate({SOURCE_DATE_EPOCH: 1714521600}) is 2024-05-01 (UTC)', () => {
    expect(buildDate({ SOURCE_DATE_EPOCH: '1714521600' })).toBe('2024-05-01');
  });
  it('buildDate({}) is today in UTC', () => {
    expect(buildDate({}, new Date('2030-01-02T23:59:00Z'))).toBe('2030-01-02');
  });
  it('buildDate(bad SOURCE_DATE_EPOCH) says what it expects', () => {
    expect(() => buildDate({ SOURCE_DATE_EPOCH: 'soon' })).toThrow(/whole number of seconds/);
  });
});

describe('plan cache files', () => {
  it('planFromJson(planToJson(plan)) keeps NaN and Infinity as numbers', () => {
    const plan = {
      coldStart: { meanK: NaN, inBandShare: 0 },
      peak: Infinity,
      series: [1, 2],
    } as unknown as CardPlan;
    const back = planFromJson(planToJson(plan)) as unknown as typeof plan & {
      coldStart: { meanK: number };
      peak: number;
    };
    expect(back.coldStart.meanK).toBeNaN();
    expect(back.peak).toBe(Infinity);
  });
  it('stableJson sorts keys, so key order does not change the cache key', () => {
    expect(stableJson({ b: 1, a: { d: 2, c: 3 } })).toBe(stableJson({ a: { c: 3, d: 2 }, b: 1 }));
  });
});

describe('swapIn', () => {
  it('puts the new folder in place of the old one (a link to it) and removes the old', async () => {
    const out = path.join(root, 'site');
    await mkdir(out);
    await writeFile(path.join(out, SITE_MARKER), '');
    await writeFile(path.join(out, 'old.txt'), 'old');
    const tmp = await freshTempDir(out);
    await writeFile(path.join(tmp, 'new.txt'), 'new');
    const report = await swapIn(tmp, out);
    expect((await readdir(out)).sort()).toEqual([SITE_MARKER, 'new.txt']);
    expect(await readlink(out)).toBe(path.basename(report.version));
    expect((await readdir(root)).sort()).toEqual(['site', path.basename(report.version)]);
    // The second swap flips the link and removes the first version.
    const again = await freshTempDir(out);
    await writeFile(path.join(again, 'newer.txt'), 'newer');
    const second = await swapIn(again, out);
    expect(second.previous).toBe(report.version);
    expect((await readdir(root)).sort()).toEqual(['site', path.basename(second.version)]);
  });
});

describe('terminalProgress', () => {
  it('redraws one line on a terminal and writes nothing elsewhere', () => {
    const tty: string[] = [];
    const pipe: string[] = [];
    const onTty = terminalProgress({ isTTY: true, write: (t: string) => tty.push(t) });
    const onPipe = terminalProgress({ isTTY: false, write: (t: string) => pipe.push(t) });
    for (const p of [onTty, onPipe]) {
      p({ phase: 'plan', done: 12, total: 30 });
      p.finish();
    }
    expect(tty.join('')).toContain('planned 12/30 cards');
    expect(pipe).toEqual([]);
  });
});

describe('paths', () => {
  it('stationPaths puts the PDF beside the page folder', () => {
    const p = stationPaths({ potId: 'a', coffeeId: 'b', stoveId: 'c' }, 'https://x.example/');
    expect(p).toEqual({
      pageFile: 'cards/a--b--c/index.html',
      pageUrl: 'cards/a--b--c/',
      pdfFile: 'cards/a--b--c.pdf',
      webUrl: 'https://x.example/cards/a--b--c/',
    });
  });
  it('relativeHref links work from disk (explicit index.html, ../ per level)', () => {
    expect(relativeHref('/cards/a--b--c/', 'assets/card.css')).toBe('../../assets/card.css');
    expect(relativeHref('/', 'method/')).toBe('method/index.html');
    expect(relativeHref('/sets/x/', '')).toBe('../../index.html');
  });
  it('webUrl joins with one slash', () => {
    expect(webUrl('https://x.example', '/cards/')).toBe('https://x.example/cards/');
  });
});

describe('stovecard build flags', () => {
  it('run(["--help"]) prints the usage and exits 0', async () => {
    const out: string[] = [];
    const write = process.stdout.write;
    process.stdout.write = ((t: string) =>
      out.push(t) > 0) as unknown as typeof process.stdout.write;
    try {
      expect(await run(['--help'])).toBe(0);
    } finally {
      process.stdout.write = write;
    }
    expect(out.join('')).toContain('--content DIR');
  });
  it('run(["--bogus"]) is a usage error', async () => {
    await expect(run(['--bogus'])).rejects.toBeInstanceOf(UsageError);
  });
  it('run(["--port", "x"]) says what --port takes', async () => {
    await expect(run(['--port', 'x'])).rejects.toThrow(/--port expects a whole number/);
  });
});

it('the font licence travels with the fonts', async () => {
  const { FONT_LICENSE_PATH } = await import('../../generator/render/fonts.ts');
  expect(await readFile(FONT_LICENSE_PATH, 'utf8')).toMatch(/Bitstream|DejaVu/);
});
