/**
 * writeSitePdfs(siteDir, data): every card's and every set's PDF at the path the pages
 * link, reported through the build's progress events, and byte-identical when the site
 * is built again from the same content.
 */
import { mkdtemp, readFile, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { writeSitePdfs, type PdfReport } from '../../generator/render/pdf/site-pdfs.ts';
import { NO_EPOCH, demoSite, type DemoSite } from './demo-site.ts';
import { readPdf } from './read-pdf.ts';

let demo: DemoSite;
let root: string;
let report: PdfReport;
const events: { phase: string; done: number; total: number }[] = [];

async function files(dir: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile()) out.push(path.relative(dir, path.join(entry.parentPath, entry.name)));
  }
  return out.sort();
}

beforeAll(async () => {
  demo = await demoSite();
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-pdf-site-'));
  report = await writeSitePdfs(path.join(root, 'one'), demo.data, (e) => events.push(e), NO_EPOCH);
});

afterAll(async () => {
  await demo?.dispose();
  if (root) await rm(root, { recursive: true, force: true });
});

describe('writeSitePdfs(siteDir, data)', () => {
  it('writes each card’s PDF at its paths.pdfFile, beside its page folder', async () => {
    const written = await files(path.join(root, 'one'));
    for (const card of [...demo.data.stationCards, ...demo.data.insertCards]) {
      expect(written).toContain(card.paths.pdfFile);
      expect(card.paths.pdfFile).toBe(card.paths.pageUrl.replace(/\/$/, '.pdf'));
    }
  });

  it('writes each set’s PDF at the set’s paths.pdfFile, its sheet’s, and every PDF the set pages link', async () => {
    const written = await files(path.join(root, 'one'));
    for (const set of demo.data.sets) {
      expect(written).toContain(set.paths.pdfFile);
      if (set.sheet) expect(written).toContain(set.sheet.pdfFile);
      for (const link of set.cards) expect(written).toContain(link.pdfFile);
    }
    const sheets = demo.data.sets.filter((set) => set.sheet !== null).length;
    expect(sheets).toBeGreaterThan(0);
    expect(written).toHaveLength(
      demo.data.stationCards.length + demo.data.insertCards.length + demo.data.sets.length + sheets,
    );
  });

  it('reports progress from 0 to all the PDFs, one event per file', () => {
    const total = report.files.length;
    expect(events[0]).toEqual({ phase: 'steps', done: 0, total });
    expect(events.at(-1)).toEqual({ phase: 'steps', done: total, total });
    expect(events.map((e) => e.done)).toEqual([...Array(total + 1).keys()]);
  });

  it('reports the pages of each file as the PDFs have them', async () => {
    for (const file of report.files.filter((f) => f.file.startsWith('sets/'))) {
      const read = await readPdf(await readFile(path.join(root, 'one', file.file)));
      expect(read.pages, file.file).toBe(file.pages);
    }
  });

  it('writes the same bytes when the site is built again from the same content', async () => {
    // A rebuild as `stovecard build` does it: plans from the cache, views and PDFs anew.
    const again = await demoSite(demo.cacheDir);
    try {
      await writeSitePdfs(path.join(root, 'two'), again.data, () => {}, NO_EPOCH);
    } finally {
      await again.dispose();
    }
    const one = await files(path.join(root, 'one'));
    expect(await files(path.join(root, 'two'))).toEqual(one);
    for (const file of one) {
      const a = await readFile(path.join(root, 'one', file));
      const b = await readFile(path.join(root, 'two', file));
      expect(a.equals(b), file).toBe(true);
    }
  });

  it('dates the PDFs from SOURCE_DATE_EPOCH when it is set', async () => {
    const card = demo.data.insertCards[0]!;
    const dir = path.join(root, 'epoch');
    await writeSitePdfs(
      dir,
      { ...demo.data, stationCards: [], insertCards: [card], sets: [] },
      () => {},
      {
        SOURCE_DATE_EPOCH: '1700000000',
      },
    );
    const read = await readPdf(await readFile(path.join(dir, card.paths.pdfFile)));
    expect(read.info.CreationDate).toBe('D:20231114221320Z');
    expect(read.xmp).toContain('<xmp:CreateDate>2023-11-14T22:13:20Z</xmp:CreateDate>');
  });
});
