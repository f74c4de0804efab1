/**
 * A training binder's exercises (render/exercises.ts): practical tasks on the binder's own
 * cards, in its PDF between the troubleshooting pages and the brew-log sheet and on its set
 * page. Built by the site build itself (buildSite with the PDF step) from the demo content
 * with three sets: a station set (whose first card the troubleshooting table is computed
 * for), an English binder holding that card and a Spanish binder that does not.
 *
 * Checked: the part's place in the PDF (its outline entry and its text) and the contents
 * line's page number; every number an exercise prints is printed by the card it names (its
 * own PDF) or, for the grind exercise, by the troubleshooting table; the Spanish binder's
 * exercises are Spanish; no text on those pages under 7 pt (the project's floor,
 * render/pdf/style.ts PDF_TEXT_FLOOR_PT, own rule); the set page's HTML shows the same text
 * as the PDF pages (tagged text, artifacts and list marks left out).
 */
import { cp, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { exercisesView } from '../../generator/render/exercises.ts';
import type { SetView } from '../../generator/render/site-view.ts';
import { voiceFor } from '../../generator/render/voice.ts';
import { wordsFor } from '../../generator/words/catalogue.ts';
import { openPdf, readPdf, smallestText, squash, type ReadPdf } from '../pdf/read-pdf.ts';

const SITE = `business: { name: Test Roasters, contact: t@test.example }
units: metric
paper: A5
kettle_presets_c: [70, 80, 90]
room: { ambient_c: 20, altitude_m: 0 }
sets:
  - id: bar
    title: Bar
    layout: station
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
  - id: training
    title: Training
    layout: binder
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
      - { pot: one-cup, coffee: morning-lantern, stove: home-radiant }
      - { pot: four-cup-steel, coffee: ember-blend, stove: bar-induction }
  - id: formacion
    title: Formación
    layout: binder
    language: es
    cards:
      - { pot: three-cup, coffee: house-blend, stove: home-radiant }
      - { pot: six-cup, coffee: slow-river-decaf, stove: bar-gas }
`;

let root: string;
let out: string;
let result: BuildResult;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-exercises-'));
  const content = path.join(root, 'content');
  await cp('content', content, { recursive: true });
  await rm(path.join(content, 'logs'), { recursive: true, force: true });
  await writeFile(path.join(content, 'site.yaml'), SITE);
  out = path.join(root, 'site');
  result = await buildSite({
    contentDir: content,
    outDir: out,
    cacheDir: path.join(root, 'cache'),
    env: { SOURCE_DATE_EPOCH: '1767225600' },
    extraSteps: [sitePdfStep],
  });
}, 600_000);

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

const setOf = (id: string): SetView => result.data.sets.find((s) => s.id === id)!;

interface Binder {
  readonly set: SetView;
  readonly bytes: Buffer;
  readonly read: ReadPdf;
  /** 0-based pages of the exercises part, first to last. */
  readonly pages: readonly number[];
}

const binders = new Map<string, Binder>();
async function binder(id: string): Promise<Binder> {
  const known = binders.get(id);
  if (known) return known;
  const set = setOf(id);
  const bytes = await readFile(path.join(out, set.paths.pdfFile));
  const read = await readPdf(bytes);
  const title = set.exercises!.title;
  const first = read.outline.find((o) => o.title === title)!.page!;
  const next = read.outline[read.outline.findIndex((o) => o.title === title) + 1]!.page!;
  const made = {
    set,
    bytes,
    read,
    pages: Array.from({ length: next - first }, (_, i) => first + i),
  };
  binders.set(id, made);
  return made;
}

/** Numbers as the cards print them: times, ranges, and values with a unit. */
const NUMBER =
  /\d+:\d\d(?:–\d+:\d\d)?|\d+(?:[.,]\d+)?(?:–\d+(?:[.,]\d+)?)?\s?(?:°C|mL|mm|g|bar|%)|(?<=\b(?:setting|posición) )\S+?(?=[),.;]|\s)/g;
const numbersIn = (text: string): string[] =>
  [...text.replace(/[\u00a0\u202f]/g, ' ').matchAll(NUMBER)].map((m) => m[0]);

/** Tagged text of the pages, in drawing order: no artifacts (running foot, page numbers), no list marks. */
async function taggedText(bytes: Uint8Array, pages: readonly number[]): Promise<string> {
  const doc = await openPdf(bytes);
  try {
    const parts: string[] = [];
    for (const n of pages) {
      const content = await (
        await doc.getPage(n + 1)
      ).getTextContent({ includeMarkedContent: true });
      const stack: string[] = [];
      for (const item of content.items as { type?: string; tag?: string; str?: string }[]) {
        if (item.type === 'beginMarkedContent' || item.type === 'beginMarkedContentProps')
          stack.push(item.tag ?? '');
        else if (item.type === 'endMarkedContent') stack.pop();
        else if (item.str !== undefined && !stack.includes('Artifact') && !stack.includes('Lbl'))
          parts.push(item.str);
      }
    }
    return parts.join(' ');
  } finally {
    await doc.destroy();
  }
}

const ENTITIES: Record<string, string> = {
  '&amp;': '&',
  '&lt;': '<',
  '&gt;': '>',
  '&quot;': '"',
  '&#39;': "'",
  '&nbsp;': ' ',
};

/** The visible text of the set page's exercises section. */
function htmlSection(html: string): string {
  const section = /<section class="exercises"[\s\S]*?<\/section>/.exec(html)?.[0] ?? '';
  return section
    .replace(/<[^>]+>/g, ' ')
    .replace(/&[a-z]+;|&#\d+;/g, (e) => ENTITIES[e] ?? ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

describe('a training binder’s exercises', () => {
  it('come after the troubleshooting pages and before the brew-log sheet, in the outline and the text', async () => {
    for (const id of ['training', 'formacion']) {
      const { set, read, pages } = await binder(id);
      const words = wordsFor(set.language);
      const titles = read.outline.map((o) => o.title);
      const at = (title: string) => titles.indexOf(title);
      expect(at(words.troubleshooting.title), id).toBeGreaterThan(0);
      expect(at(set.exercises!.title), id).toBe(at(words.troubleshooting.title) + 1);
      expect(at(words.binder.logSheet.title), id).toBe(at(set.exercises!.title) + 1);
      expect(pages.length, id).toBeGreaterThan(0);
      // The part's first page holds its title and intro; the log sheet follows its last page.
      expect(squash(read.text[pages[0]!]!), id).toContain(
        squash(`${set.exercises!.title} ${set.exercises!.intro}`),
      );
      expect(squash(read.text[pages.at(-1)! + 1]!), id).toContain(
        squash(words.binder.logSheet.intro),
      );
      expect(squash(read.text[pages[0]! - 1]!), id).not.toContain(squash(set.exercises!.intro));
    }
  });

  it('have a contents line with the page they start on', async () => {
    for (const id of ['training', 'formacion']) {
      const { set, read, pages } = await binder(id);
      // Page 2 is the contents (page 1 the cover); the line is the title, leaders, the number.
      const contents = squash(read.text[1]!);
      expect(contents, id).toContain(squash(`${set.exercises!.title} ${pages[0]! + 1}`));
      expect(squash(read.text[pages[0]!]!), id).toContain(
        squash(wordsFor(set.language).pdf.pageNumber(pages[0]! + 1, read.pages)),
      );
    }
  });

  it('quote only numbers the card they name prints (or, for the grind, the troubleshooting table)', async () => {
    for (const id of ['training', 'formacion']) {
      const { set, read } = await binder(id);
      const words = wordsFor(set.language);
      const trouble = read.outline.find((o) => o.title === words.troubleshooting.title)!.page!;
      const troubleText = read.text
        .slice(trouble, read.outline.find((o) => o.title === set.exercises!.title)!.page!)
        .join(' ');
      const views = result.data.stationCards.filter((c) => c.language === set.language);
      const x = set.exercises!;
      expect(x.exercises.length, id).toBe(4);
      for (const [i, ex] of x.exercises.entries()) {
        const card = views.find((c) => words.pdf.contents.station(c.title, c.subtitle) === ex.card);
        expect(card, `${id} exercise ${i + 1}: ${ex.card}`).toBeDefined();
        expect(set.cards.map((c) => c.pdfFile)).toContain(card!.paths.pdfFile);
        const cardText = (await readPdf(await readFile(path.join(out, card!.paths.pdfFile))))
          .text[0]!;
        const printed = squash(cardText + (i === 1 ? ` ${troubleText}` : ''));
        const quoted = numbersIn(
          [...ex.steps, ...ex.record, ex.goal, ex.good, ex.safety].join(' '),
        );
        expect(quoted.length, `${id} exercise ${i + 1}`).toBeGreaterThan(0);
        for (const n of quoted)
          expect(printed, `${id} exercise ${i + 1}: ${n}`).toContain(squash(n));
        // The recipe's own numbers reach the exercise as the card prints them.
        const r = card!.recipe!;
        const all = squash([...ex.steps, ex.goal, ex.good].join(' '));
        expect(all).toContain(squash(r.water.fillVolume.text));
        if (i !== 2) {
          expect(all).toContain(squash(r.water.temperature.text));
          expect(all).toContain(squash(r.coffee.dose.text));
        } else {
          expect(all).toContain(squash(r.water.fillLineText));
        }
      }
    }
  });

  it('grind exercise: the table’s own card in the English binder, another card named in the Spanish', () => {
    const table = result.data.troubleshooting.moves!;
    const en = setOf('training').exercises!.exercises[1]!;
    expect(en.card).toContain(table.card.pot);
    expect(en.good).not.toContain(table.card.stove);
    const es = setOf('formacion').exercises!.exercises[1]!;
    expect(es.good).toContain(
      wordsFor('es').binder.exercises.tableCard(
        table.card.coffee,
        table.card.pot,
        table.card.stove,
      ),
    );
    for (const row of table.rows.filter((r) => r.code === 'baseline' || r.code === 'finer'))
      for (const text of [row.change, row.firstCoffee]) expect(en.good).toContain(text);
  });

  it('are Spanish in a Spanish binder, with a decimal comma', async () => {
    const { read, pages } = await binder('formacion');
    const text = squash(pages.map((p) => read.text[p]).join(' '));
    const es = wordsFor('es').binder.exercises;
    const en = wordsFor('en').binder.exercises;
    expect(text).toContain(squash(es.title));
    for (const label of [es.goalLabel, es.stepsLabel, es.recordLabel, es.goodLabel, es.safetyLabel])
      expect(text).toContain(squash(label));
    for (const label of [en.goalLabel, en.stepsLabel, en.recordLabel, en.goodLabel])
      expect(text).not.toContain(squash(label));
    expect(text).toMatch(/\d,\dg/);
    expect(text).not.toMatch(/\d\.\d+(?:g|bar)/);
  });

  it('set no text under 7 pt on their pages', async () => {
    for (const id of ['training', 'formacion']) {
      const { bytes, pages } = await binder(id);
      const { sizes } = await smallestText(bytes);
      for (const p of pages)
        expect(sizes[p]!, `${id} page ${p + 1}`).toBeGreaterThanOrEqual(7 - 1e-6);
    }
  });

  it('show the same text on the set page as in the PDF', async () => {
    for (const id of ['training', 'formacion']) {
      const { set, bytes, pages } = await binder(id);
      const html = htmlSection(await readFile(path.join(out, set.paths.pageFile), 'utf8'));
      expect(html, id).not.toBe('');
      expect(squash(html), id).toBe(squash(await taggedText(bytes, pages)));
      for (const ex of set.exercises!.exercises) expect(html).toContain(ex.safety);
    }
  });

  it('are only on a binder: a station set has none, on its page or in its PDF', async () => {
    const bar = setOf('bar');
    expect(bar.exercises).toBeNull();
    const html = await readFile(path.join(out, bar.paths.pageFile), 'utf8');
    expect(html).not.toContain('class="exercises"');
  });
});

describe('exercisesView', () => {
  it('says there is nothing to practise on when no card of the binder has a recipe', () => {
    for (const language of ['en', 'es']) {
      const view = exercisesView([], null, voiceFor(language));
      expect(view.exercises).toEqual([]);
      expect(view.intro).toBe(wordsFor(language).binder.exercises.none);
    }
  });
});
