/**
 * pdfBuildStep in the real site build (buildSite's extraSteps): the PDFs land in the new
 * site beside the HTML, every PDF the pages link exists, and progress covers them.
 */
import { mkdtemp, readFile, readdir, rm, stat } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import type { ProgressEvent } from '../../generator/pipeline/progress.ts';
import { relativeHref } from '../../generator/render/paths.ts';
import { pdfBuildStep } from '../../generator/render/pdf/site-pdfs.ts';

let root: string;
let result: BuildResult;
const events: ProgressEvent[] = [];

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-pdf-build-'));
  result = await buildSite({
    contentDir: 'content',
    outDir: path.join(root, 'site'),
    cacheDir: path.join(root, 'cache'),
    env: { SOURCE_DATE_EPOCH: '1714521600' },
    extraSteps: [pdfBuildStep],
    onProgress: (event) => events.push(event),
  });
});

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

async function htmlFiles(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true });
  return entries
    .filter((e) => e.isFile() && e.name.endsWith('.html'))
    .map((e) => path.join(e.parentPath, e.name));
}

describe('buildSite({ extraSteps: [pdfBuildStep] })', () => {
  it('writes each card’s PDF beside its HTML page in the swapped-in site', async () => {
    const site = path.join(root, 'site');
    for (const card of [...result.data.stationCards, ...result.data.insertCards]) {
      await expect(stat(path.join(site, card.paths.pageFile))).resolves.toBeTruthy();
      const pdf = await readFile(path.join(site, card.paths.pdfFile));
      expect(pdf.subarray(0, 8).toString('latin1'), card.paths.pdfFile).toBe('%PDF-1.7');
    }
  });

  it('leaves no PDF link of any page dangling', async () => {
    const site = path.join(root, 'site');
    let links = 0;
    for (const file of await htmlFiles(site)) {
      const html = await readFile(file, 'utf8');
      for (const match of html.matchAll(/href="([^"]+\.pdf)"/g)) {
        links += 1;
        await expect(
          stat(path.resolve(path.dirname(file), match[1]!)),
          `${file} → ${match[1]}`,
        ).resolves.toBeTruthy();
      }
    }
    expect(links).toBeGreaterThan(0);
    // The set PDFs and their sheets are where the set pages would link them.
    for (const set of result.data.sets) {
      await expect(
        stat(path.join(site, relativeHref('', set.paths.pdfFile))),
      ).resolves.toBeTruthy();
      if (set.sheet)
        await expect(
          stat(path.join(site, relativeHref('', set.sheet.pdfFile))),
        ).resolves.toBeTruthy();
    }
  });

  it('reports the PDFs as the build’s extra-step progress, up to all of them', () => {
    const steps = events.filter((e) => e.phase === 'steps' && e.total > 0);
    const { stationCards, insertCards, sets } = result.data;
    // Cards, sets and the sets' sheets (`sheet:`).
    const sheets = sets.filter((set) => set.sheet !== null).length;
    const total = stationCards.length + insertCards.length + sets.length + sheets;
    expect(steps.at(-1)).toEqual({ phase: 'steps', done: total, total });
  });
});
