/**
 * cardPdf(view): the one-page PDF twin of each demo card, read back with pdfjs. The
 * numbers are compared with the card view's own strings (what the HTML prints), white
 * space aside (the PDF sets a value and its unit as two runs).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Catalogue, PaperSize, UnitSystem } from '../../generator/content/types.ts';
import {
  cautions,
  insertCardView,
  stationCardView,
  type InsertCardView,
  type StationCardView,
} from '../../generator/render/card-view.ts';
import { cardPdf, type CardView } from '../../generator/render/pdf/card.ts';
import { pageSizePt } from '../../generator/render/pdf/document.ts';
import { stationSlug } from '../../generator/render/paths.ts';
import { BUILT_ON, NO_EPOCH, demoSite, type DemoSite } from './demo-site.ts';
import { readPdf, squash, structNodes, type ReadPdf } from './read-pdf.ts';

const AUTHOR = 'Brindlemoss Roastery';
const CLOCK = /\d+:[0-5]\d/;

let demo: DemoSite;
const pdfs = new Map<
  string,
  {
    view: CardView;
    bytes: Buffer;
    read: ReadPdf;
    fit: {
      fits: boolean;
      usedHeightPt: number;
      availableHeightPt: number;
      dropped?: readonly string[];
    };
    warnings: readonly string[];
  }
>();

beforeAll(async () => {
  demo = await demoSite();
  for (const view of [...demo.data.stationCards, ...demo.data.insertCards]) {
    const pdf = await cardPdf(view, { author: AUTHOR, env: NO_EPOCH });
    pdfs.set(view.paths.pdfFile, {
      view,
      bytes: pdf.bytes,
      read: await readPdf(pdf.bytes),
      fit: pdf.fit,
      warnings: pdf.warnings,
    });
  }
});

afterAll(() => demo?.dispose());

const stations = () => demo.data.stationCards;
const accepted = () => stations().filter((v) => v.recipe !== null);
const refused = () => stations().filter((v) => v.refusal !== null);

describe('cardPdf(every demo card)', () => {
  it('has exactly one page, of the card’s paper size', () => {
    expect(pdfs.size).toBe(demo.data.stationCards.length + demo.data.insertCards.length);
    for (const [file, { view, read }] of pdfs) {
      expect(read.pages, file).toBe(1);
      expect(read.sizes[0], file).toEqual(pageSizePt(view.page.widthMm, view.page.heightMm));
    }
  });

  it('fits its page: the layout reports the height it used and that it fit', () => {
    for (const [file, { fit }] of pdfs) {
      expect(fit.fits, `${file}: ${fit.usedHeightPt} pt of ${fit.availableHeightPt} pt`).toBe(true);
      expect(fit.usedHeightPt, file).toBeLessThanOrEqual(fit.availableHeightPt);
    }
  });

  it('draws the cross-section, chart and QR code without svg-to-pdfkit complaints', () => {
    for (const [file, { warnings }] of pdfs) expect(warnings, file).toEqual([]);
  });

  it('embeds every font as a DejaVu Sans subset (no standard 14 font, as PDF/A wants)', () => {
    for (const [file, { bytes }] of pdfs) {
      const names = [...bytes.toString('latin1').matchAll(/\/BaseFont \/([^\s/]+)/g)].map(
        (m) => m[1]!,
      );
      expect(names.length, file).toBeGreaterThan(0);
      for (const name of names) expect(name, file).toMatch(/^[A-Z]{6}\+DejaVuSans/);
      expect(bytes.toString('latin1'), file).toContain('/FontFile2');
    }
  });

  it('declares PDF/A-2b in its XMP and is tagged (MarkInfo Marked, a structure tree)', () => {
    for (const [file, { bytes, read }] of pdfs) {
      expect(read.xmp, file).toMatch(
        /<pdfaid:part>2<\/pdfaid:part>\s*<pdfaid:conformance>B<\/pdfaid:conformance>/,
      );
      expect(read.marked, file).toBe(true);
      expect(bytes.toString('latin1'), file).toContain('/StructTreeRoot');
    }
  });

  it('prints the footer and every caution the view has (in their short form when the card set them so to fit)', () => {
    for (const [file, { view, read, fit }] of pdfs) {
      const text = squash(read.text[0]!);
      expect(text, file).toContain(squash(view.footer.printedBy));
      expect(text, file).toContain(squash(view.footer.built));
      const dropped = fit.dropped ?? [];
      if (view.footer.webUrl && !dropped.includes('web-line') && view.kind === 'station')
        expect(text, file).toContain(squash(view.footer.webUrl));
      const items = dropped.includes('long-cautions')
        ? cautions('compact').items
        : view.cautions.items;
      expect(items.length).toBe(view.cautions.items.length); // the same cautions, none fewer
      for (const caution of items) expect(text, file).toContain(squash(caution));
      expect(text, file).toContain(squash(view.cautions.deferral));
      for (const warning of view.warnings?.items ?? [])
        expect(text, file).toContain(squash(warning));
    }
  });
});

describe('cardPdf(station card with a recipe)', () => {
  it('prints the fill, start temperature, dose, level and timings exactly as the view', () => {
    expect(accepted().length).toBeGreaterThan(0);
    for (const view of accepted()) {
      const r = view.recipe!;
      const text = squash(pdfs.get(view.paths.pdfFile)!.read.text[0]!);
      for (const shown of [
        r.water.fillVolume.text,
        r.water.fillMassText,
        r.water.temperature.text,
        r.water.fillLineText,
        r.coffee.dose.text,
        r.heat.level,
        r.timings.firstCoffee.text,
        r.timings.offHeat.text,
        ...r.expect.rows.flatMap((row) => [row.label, row.value]),
      ]) {
        expect(text, `${view.id}: "${shown}"`).toContain(squash(shown));
      }
    }
  });

  it('tags headings, lists and the two drawings as Figures with the views’ text alternatives, in reading order', () => {
    for (const view of accepted()) {
      const nodes = structNodes(pdfs.get(view.paths.pdfFile)!.read.structure[0]!);
      const roles = nodes.map((n) => n.role);
      expect(roles.indexOf('H1'), view.id).toBeGreaterThan(-1);
      expect(roles.indexOf('H1'), view.id).toBeLessThan(roles.indexOf('H2'));
      expect(roles.filter((r) => r === 'H2').length, view.id).toBeGreaterThanOrEqual(6);
      expect(roles, view.id).toContain('L');
      expect(roles, view.id).toContain('LI');
      const figures = nodes.filter((n) => n.role === 'Figure').map((n) => n.alt);
      const dropped = pdfs.get(view.paths.pdfFile)!.fit.dropped ?? [];
      // A chart left out to keep the text at 7 pt (card.ts OPTIONAL_ORDER) is no Figure.
      if (dropped.includes('chart')) expect(figures, view.id).not.toContain(view.recipe!.chart.alt);
      else expect(figures, view.id).toContain(view.recipe!.chart.alt);
      expect(
        figures.some((alt) => alt?.includes(view.recipe!.water.fillLineText)),
        view.id,
      ).toBe(!dropped.includes('cross-section'));
    }
  });
});

describe('cardPdf(refused station card)', () => {
  it('prints the refusal reason and what to change, and no timings', () => {
    expect(refused().length).toBeGreaterThan(0);
    for (const view of refused()) {
      const raw = pdfs.get(view.paths.pdfFile)!.read.text[0]!;
      const text = squash(raw);
      expect(text, view.id).toContain(squash(view.refusal!.heading));
      expect(text, view.id).toContain(squash(view.refusal!.reason));
      expect(text, view.id).toContain(squash(view.refusal!.suggestion));
      expect(raw, view.id).not.toMatch(CLOCK);
      expect(raw, view.id).not.toContain('°C');
    }
  });
});

describe('cardPdf(insert card)', () => {
  it('prints every row’s fill, dose, start, level and timings, or why the row has none', () => {
    for (const view of demo.data.insertCards) {
      const text = squash(pdfs.get(view.paths.pdfFile)!.read.text[0]!);
      for (const row of view.rows) {
        if (row.refused) {
          expect(text, view.id).toContain(squash(row.refused.reason));
          continue;
        }
        for (const shown of [
          row.fill!.text,
          row.dose!.text,
          row.start!,
          row.level!,
          row.firstCoffee!.text,
          row.offHeat!.text,
        ]) {
          expect(text, `${view.id} ${row.potId} ${row.stoveId}: "${shown}"`).toContain(
            squash(shown),
          );
        }
      }
    }
  });

  it('tags the rows as a table with row and column headers', () => {
    const view = demo.data.insertCards[0]!;
    const roles = structNodes(pdfs.get(view.paths.pdfFile)!.read.structure[0]!).map((n) => n.role);
    expect(roles).toContain('Table');
    // The table holds the rows with a recipe; the refused ones are sentences under it.
    const shown = view.rows.filter((row) => row.refused === null).length;
    expect(roles.filter((r) => r === 'TR')).toHaveLength(shown + 1);
    expect(roles.filter((r) => r === 'TH').length).toBe(8 + shown);
  });
});

describe('cardPdf(view) twice', () => {
  it('gives the same bytes', async () => {
    for (const view of [accepted()[0]!, refused()[0]!, demo.data.insertCards[0]!]) {
      const again = await cardPdf(view, { author: AUTHOR, env: NO_EPOCH });
      expect(again.bytes.equals(pdfs.get(view.paths.pdfFile)!.bytes), view.id).toBe(true);
    }
  });
});

/** The demo's training cards and inserts, remade for another paper (and units). */
async function viewsFor(paper: PaperSize, units: UnitSystem): Promise<CardView[]> {
  const options = { builtOn: BUILT_ON, fingerprint: 'abcdef12', paper, units };
  const training = demo.jobs.sets.find((s) => s.id === 'barista-training')!;
  const out: CardView[] = [];
  for (const slug of training.cardSlugs)
    out.push(await stationCardView(demo.plans.get(slug)!.plan, demo.catalogue, options));
  for (const job of demo.jobs.inserts) {
    const rows = job.rows.map((r) => ({
      potId: r.potId,
      stoveId: r.stoveId,
      plan: demo.plans.get(stationSlug(r))!.plan,
    }));
    out.push(
      await insertCardView(
        { setId: job.setId, coffeeId: job.coffeeId, slug: job.slug, rows },
        demo.catalogue,
        options,
      ),
    );
  }
  return out;
}

describe.each([
  ['A4', 'metric'],
  ['A6', 'metric'],
  ['letter', 'us'],
  ['half-letter', 'us'],
] as const)('cardPdf(card on %s, %s units)', (paper, units) => {
  it('lays every training card and insert out on one page of that size', async () => {
    for (const view of await viewsFor(paper, units)) {
      if (paper === 'A6' && view.kind === 'insert' && view.rows.length > 4) {
        // Twelve rows, seven steps and the cautions at 7 pt or more need more than an A6
        // page: refused with the fix, never shrunk below the floor (paper-floor.test.ts).
        await expect(cardPdf(view, { author: AUTHOR, env: NO_EPOCH })).rejects.toThrow(
          /7 pt or more[\s\S]*fewer pots or stoves/,
        );
        continue;
      }
      const pdf = await cardPdf(view, { author: AUTHOR, env: NO_EPOCH });
      expect(
        pdf.fit.fits,
        `${view.id}: ${pdf.fit.usedHeightPt} of ${pdf.fit.availableHeightPt} pt`,
      ).toBe(true);
      const read = await readPdf(pdf.bytes);
      expect(read.pages, view.id).toBe(1);
      expect(read.sizes[0], view.id).toEqual(pageSizePt(view.page.widthMm, view.page.heightMm));
      if (view.kind === 'station' && view.recipe) {
        expect(squash(read.text[0]!), view.id).toContain(squash(view.recipe.water.fillVolume.text));
      }
    }
  });
});

describe('cardPdf(card whose YAML text holds HTML and script)', () => {
  const NAME = '<script>alert("x")</script> & <b>Bold</b> roast';
  const NOTES = '<img src=x onerror=alert(1)> cocoa & nuts';

  function withMarkup(catalogue: Catalogue, coffeeId: string): Catalogue {
    const coffees = new Map(catalogue.coffees);
    coffees.set(coffeeId, { ...coffees.get(coffeeId)!, name: NAME, notes: NOTES });
    return { ...catalogue, coffees };
  }

  it('prints the markup as text, in the page and in the metadata', async () => {
    const view = accepted()[0]! as StationCardView;
    const catalogue = withMarkup(demo.catalogue, view.coffeeId);
    const options = { builtOn: BUILT_ON, fingerprint: 'abcdef12' };
    const station = await stationCardView(demo.plans.get(view.id)!.plan, catalogue, options);
    const job = demo.jobs.inserts.find((j) => j.coffeeId === view.coffeeId)!;
    const rows = job.rows.map((r) => ({
      potId: r.potId,
      stoveId: r.stoveId,
      plan: demo.plans.get(stationSlug(r))!.plan,
    }));
    const insert: InsertCardView = await insertCardView(
      { setId: job.setId, coffeeId: job.coffeeId, rows },
      catalogue,
      options,
    );
    for (const card of [station, insert] as CardView[]) {
      const read = await readPdf((await cardPdf(card, { author: AUTHOR, env: NO_EPOCH })).bytes);
      expect(squash(read.text[0]!), card.id).toContain(squash(NAME));
      if (card.kind === 'insert') expect(squash(read.text[0]!)).toContain(squash(NOTES));
      expect(String(read.info.Title)).toContain(NAME);
      expect(read.xmp).toContain(
        '&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &lt;b&gt;Bold&lt;/b&gt; roast',
      );
      expect(read.xmp).not.toContain('<script>');
    }
  });
});
