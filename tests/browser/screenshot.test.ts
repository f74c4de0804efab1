/**
 * REGRESSION CHECK, NOT VALIDATION: one station card's print layout, screenshotted in
 * Chromium, against a reference picture the project made from its own output
 * (tests/browser/reference/). It says "the layout did not move", never "the layout is
 * right"; the print checks (print.test.ts) say what must hold.
 *
 * The comparison counts the pixels whose colour differs by more than PIXEL_TOLERANCE in
 * any channel and fails above MAX_DIFFERING_SHARE of the picture: anti-aliasing and a
 * changed digit pass, a block that moved or a line that wrapped does not. On a failure the
 * new screenshot and a picture of the difference (differing pixels in red) are written to
 * a temporary folder named in the message.
 *
 * Refresh the reference after an intended change of layout, wording or numbers (look at
 * the new picture first):
 *
 *   STOVECARD_UPDATE_REFERENCE=1 npx vitest run tests/browser/screenshot.test.ts
 */
import { existsSync } from 'node:fs';
import { cp, mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { describeWithBrowser, openFile, openGuardedPage, type GuardedPage } from './chromium.ts';
import { BUILD_ENV, DEMO_CONTENT } from './demo-builds.ts';
import { compareImages, decodePng, encodePng } from './png.ts';

const REFERENCE_DIR = fileURLToPath(new URL('./reference/', import.meta.url));
const CARD = { pot: 'three-cup', coffee: 'house-blend', stove: 'bar-gas' } as const;
const SLUG = `${CARD.pot}--${CARD.coffee}--${CARD.stove}`;
const REFERENCE = path.join(REFERENCE_DIR, `station-card-${SLUG}-A5.png`);
const UPDATE = process.env.STOVECARD_UPDATE_REFERENCE === '1';

/** A colour step anti-aliasing or font hinting may make, of 255. */
const PIXEL_TOLERANCE = 48;
/** 1 % of the card's pixels: about ten big digits, far less than one block moving. */
const MAX_DIFFERING_SHARE = 0.01;
/** A5 at 96 CSS px per inch. */
const A5_VIEWPORT = { width: Math.ceil((148 / 25.4) * 96), height: Math.ceil((210 / 25.4) * 96) };

describeWithBrowser('the station card screenshot (a regression check, not validation)', () => {
  let root: string;
  let guarded: GuardedPage;

  beforeAll(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'stovecard-screenshot-'));
    guarded = await openGuardedPage({ viewport: A5_VIEWPORT });
  });

  afterAll(async () => {
    await guarded?.close();
    if (root) await rm(root, { recursive: true, force: true });
  });

  it('decodePng reads what Chromium encodes: known colours at known places', async () => {
    const file = path.join(root, 'colours.html');
    await writeFile(
      file,
      `<!doctype html><body style="margin:0;background:#fff">
<div style="display:flex"><div style="width:30px;height:20px;background:rgb(255,0,0)"></div>
<div style="width:30px;height:20px;background:rgb(0,128,0)"></div>
<div style="width:30px;height:20px;background:rgb(20,40,250)"></div></div>
<div style="width:90px;height:20px;background:linear-gradient(90deg,#000,#fff)"></div></body>`,
    );
    await openFile(guarded, file);
    const image = decodePng(
      await guarded.page.screenshot({ clip: { x: 0, y: 0, width: 90, height: 40 } }),
    );
    expect([image.width, image.height]).toEqual([90, 40]);
    const at = (x: number, y: number) => [
      ...image.data.subarray((y * 90 + x) * 4, (y * 90 + x) * 4 + 4),
    ];
    expect(at(15, 10)).toEqual([255, 0, 0, 255]);
    expect(at(45, 10)).toEqual([0, 128, 0, 255]);
    expect(at(75, 10)).toEqual([20, 40, 250, 255]);
    // The gradient only grows from left to right (exercises the Sub/Paeth row filters).
    const row = Array.from({ length: 90 }, (_, x) => at(x, 30)[0]!);
    expect(row[0]).toBeLessThan(10);
    expect(row[89]).toBeGreaterThan(245);
    for (let x = 1; x < 90; x++) expect(row[x]!).toBeGreaterThanOrEqual(row[x - 1]!);
    // And what encodePng writes decodes to the same pixels.
    expect(decodePng(encodePng(image)).data).toEqual(image.data);
  });

  it('the comparison passes the reference itself and fails it moved down by 2 px', async () => {
    if (!existsSync(REFERENCE)) return; // the next test says how to make it
    const reference = decodePng(await readFile(REFERENCE));
    expect(compareImages(reference, reference, PIXEL_TOLERANCE).differing).toBe(0);
    const stride = reference.width * 4;
    const moved = new Uint8Array(reference.data.length).fill(255);
    moved.set(reference.data.subarray(0, reference.data.length - 2 * stride), 2 * stride);
    const diff = compareImages(reference, { ...reference, data: moved }, PIXEL_TOLERANCE);
    expect(diff.share).toBeGreaterThan(MAX_DIFFERING_SHARE);
  });

  it(`${SLUG} at A5 looks as it did when the reference was made`, async () => {
    const content = path.join(root, 'content');
    await cp(DEMO_CONTENT, content, { recursive: true });
    const site = path.join(content, 'site.yaml');
    const yaml = (await readFile(site, 'utf8')).replace(/^paper: .*$/m, 'paper: A5');
    const oneCard = `sets:\n  - id: one\n    title: One card\n    layout: station\n    cards:\n      - { pot: ${CARD.pot}, coffee: ${CARD.coffee}, stove: ${CARD.stove} }\n`;
    await writeFile(site, yaml.replace(/^sets:[\s\S]*$/m, oneCard));
    const outDir = path.join(root, 'site');
    const result = await buildSite({
      contentDir: content,
      outDir,
      cacheDir: path.join(root, 'cache'),
      env: BUILD_ENV,
    });
    const card = result.data.stationCards.find((c) => c.paths.pageFile.includes(SLUG));
    expect(card, `no station card ${SLUG}`).toBeDefined();

    await openFile(guarded, path.join(outDir, card!.paths.pageFile));
    const shot = await guarded.page
      .locator('.card')
      .screenshot({ animations: 'disabled', caret: 'hide' });
    guarded.expectNoTrouble(card!.paths.pageFile);

    if (UPDATE) {
      await mkdir(REFERENCE_DIR, { recursive: true });
      await writeFile(REFERENCE, shot);
      console.warn(
        `stovecard: wrote the screenshot reference ${REFERENCE}; look at it before keeping it`,
      );
      return;
    }
    expect(
      existsSync(REFERENCE),
      `no reference picture at ${REFERENCE}; make one with STOVECARD_UPDATE_REFERENCE=1 npx vitest run tests/browser/screenshot.test.ts`,
    ).toBe(true);
    const expected = decodePng(await readFile(REFERENCE));
    const actual = decodePng(shot);
    const sizes = `reference ${expected.width}×${expected.height}, now ${actual.width}×${actual.height}`;
    if (expected.width !== actual.width || expected.height !== actual.height) {
      const kept = await keep(shot, null);
      expect.fail(`the card's size changed (${sizes}); the new screenshot is ${kept.actual}`);
    }
    const diff = compareImages(expected, actual, PIXEL_TOLERANCE);
    if (diff.share > MAX_DIFFERING_SHARE) {
      const kept = await keep(shot, encodePng(diff.picture));
      const box = diff.box!;
      expect.fail(
        `${(diff.share * 100).toFixed(2)} % of the pixels differ (tolerance ${PIXEL_TOLERANCE}/255 per channel; at most ${MAX_DIFFERING_SHARE * 100} % may), within x ${box.x0}–${box.x1}, y ${box.y0}–${box.y1}. New screenshot: ${kept.actual}; differences in red: ${kept.diff}. If the change is intended, refresh with STOVECARD_UPDATE_REFERENCE=1.`,
      );
    }
  });
});

/** Writes the new screenshot (and the difference picture) where a person can look at them. */
async function keep(
  actual: Buffer,
  diff: Buffer | null,
): Promise<{ actual: string; diff: string | null }> {
  const dir = await mkdtemp(path.join(tmpdir(), 'stovecard-screenshot-failure-'));
  const files = {
    actual: path.join(dir, 'actual.png'),
    diff: diff ? path.join(dir, 'diff.png') : null,
  };
  await writeFile(files.actual, actual);
  if (diff && files.diff) await writeFile(files.diff, diff);
  return files;
}
