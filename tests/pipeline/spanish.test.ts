/**
 * A Spanish build speaks Spanish on every line a customer reads: a small invented site
 * (`language: es`, 1200 m up so the boiling point is printed; a station set with a refused
 * card, a training binder and an insert set; entry names, roasts and notes written in
 * Spanish) gives `lang="es-ES"` pages and `/Lang (es-ES)` PDFs, the Spanish headings and
 * cautions, numbers with a decimal comma, and none of the English card headings. A card
 * also in an English set is built twice, at two addresses, each set linking its own.
 *
 * Sources: the decimal comma is Spain's usage (RAE, Ortografía de la lengua española 2010,
 * on the decimal sign, from memory; ISO 80000-1 allows comma or point); BCP 47 (RFC 5646)
 * for the tag. The Spanish headings are the catalogue's own (generator/words/es.ts, own rule).
 */
import { cp, mkdtemp, readFile, readdir, rm, writeFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { wordsFor } from '../../generator/words/catalogue.ts';
import { describeWithTools, runTool } from '../pdf/poppler.ts';

const es = wordsFor('es');
const en = wordsFor('en');

/** English headings a card, insert or set page prints (none of them is a name in the test content). */
const ENGLISH_HEADINGS = [
  en.card.water.heading, // Water
  en.card.water.heated, // Heat the water to
  en.card.timings.heading, // Times
  en.card.timings.watchHeading, // Watch and listen
  en.card.expect.heading, // What to expect
  en.card.chart.heading, // Temperature of each sip
  en.card.cautions.heading, // Safety
  en.card.cautions.deferral, // Follow the maker’s instructions…
  en.card.crossSection.fillLine, // Fill line
  en.card.refusal.heading, // No recipe on this card
  en.card.insert.heading, // How to brew it in a stovetop pot
  en.card.nav.home, // All cards
];

function pageText(html: string): string {
  const body = html.replace(/<(script|style)\b[^>]*>[\s\S]*?<\/\1>/g, ' ');
  const attrs = [...body.matchAll(/\b(?:alt|aria-label|title)="([^"]*)"/g)].map((m) => m[1]);
  return [body.replace(/<[^>]+>/g, ' '), ...attrs]
    .join(' ')
    .replace(/&nbsp;|&#160;/g, '\u00a0')
    .replace(/&amp;/g, '&')
    .replace(/&#39;/g, "'")
    .replace(/&quot;|&#34;/g, '"')
    .replace(/\s+/g, ' ');
}

/** Whole words/phrases only: "Times" must not match inside another word. */
function englishHits(text: string): string[] {
  return ENGLISH_HEADINGS.filter((h) =>
    new RegExp(`(^|[^\\p{L}])${h.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}([^\\p{L}]|$)`, 'u').test(
      text,
    ),
  );
}

/** A number written with a decimal point before a unit ("14.0 g"): English form. */
const POINT_NUMBER = /\d\.\d+[\u00a0 ](?:g|bar|mL|°C|mm|m²|W|s)\b/;

/** The English set's pages: its set page, its cards (cards/en/…) and the customer's page (brew/<coffee>--en/). */
const englishPage = (rel: string): boolean =>
  rel.startsWith(`cards${path.sep}en${path.sep}`) ||
  rel.includes('english-bar') ||
  rel.includes(`--en${path.sep}`);

async function filesUnder(dir: string, ext: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true });
  return entries
    .filter((e) => e.isFile() && e.name.endsWith(ext))
    .map((e) => path.join(e.parentPath, e.name))
    .sort();
}

let root: string;
let outDir: string;
let built: BuildResult;
const setData = (id: string) => built.data.sets.find((s) => s.id === id)!;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-es-'));
  const content = path.join(root, 'content');
  await cp('content', content, { recursive: true });
  await rm(path.join(content, 'logs'), { recursive: true, force: true });
  const names: Record<string, string> = {
    'pots/three-cup.yaml': 'Cafetera de tres tazas',
    'pots/six-cup.yaml': 'Cafetera de seis tazas con placa',
    'pots/one-cup.yaml': 'Cafetera de una taza',
    'pots/four-cup-steel.yaml': 'Cafetera de acero de cuatro tazas',
    'stoves/bar-gas.yaml': 'Quemador de gas de la barra',
    'stoves/bar-induction.yaml': 'Placa de inducción de la barra',
    'stoves/home-radiant.yaml': 'Vitrocerámica de casa',
    'coffees/house-blend.yaml': 'Mezcla de la casa',
    'coffees/ember-blend.yaml': 'Mezcla Brasa',
    'coffees/morning-lantern.yaml': 'Farol de la mañana',
    'coffees/slow-river-decaf.yaml': 'Río lento descafeinado',
  };
  for (const [file, name] of Object.entries(names)) {
    const at = path.join(content, file);
    const yaml = (await readFile(at, 'utf8'))
      .replace(/^name: .*$/m, `name: ${name}`)
      .replace(/^notes: .*$/m, 'notes: Cacao y avellana tostada');
    await writeFile(at, yaml);
  }
  // Invented: a bed so tight that the pressure nears the valve, refused on every stove.
  const house = await readFile(path.join(content, 'coffees', 'house-blend.yaml'), 'utf8');
  await writeFile(
    path.join(content, 'coffees', 'polvo.yaml'),
    house
      .replace(/^name: .*$/m, 'name: Molienda polvo')
      .replace(/^permeability_m2: .*$/m, 'permeability_m2: 1.5e-14')
      .replace(/^grind: .*$/m, 'grind: fine'),
  );
  await writeFile(
    path.join(content, 'site.yaml'),
    `business:
  name: Tostadero Brindlemoss
  contact: 'fichas@brindlemoss.example'
units: metric
paper: A5
language: es
kettle_presets_c: [70, 80, 90]
room: { ambient_c: 20, altitude_m: 1200 }
base_url: https://fichas.brindlemoss.example/
sets:
  - id: barra
    title: Barra
    layout: station
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
      - { pot: one-cup, coffee: polvo, stove: bar-gas }
      - { pot: four-cup-steel, coffee: ember-blend, stove: bar-induction }
  - id: barista-training
    title: Formación
    layout: binder
    cards:
      - { pot: three-cup, coffee: house-blend, stove: home-radiant }
  - id: bolsa
    title: Bolsa
    layout: insert
    coffees: [house-blend]
  - id: english-bar
    title: English bar
    layout: station
    language: en
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
`,
  );
  outDir = path.join(root, 'site');
  built = await buildSite({
    contentDir: content,
    outDir,
    cacheDir: path.join(root, 'cache'),
    env: { SOURCE_DATE_EPOCH: '1767225600' },
    extraSteps: [sitePdfStep],
  });
}, 600_000);

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

const SPANISH_CARD = 'cards/three-cup--house-blend--bar-gas';
const ENGLISH_CARD = 'cards/en/three-cup--house-blend--bar-gas';

describe('a Spanish build', () => {
  it('every page but the English set’s is lang="es-ES"; the English set’s cards are lang="en-GB"', async () => {
    const wrong: string[] = [];
    for (const file of await filesUnder(outDir, '.html')) {
      const rel = path.relative(outDir, file);
      const lang = /<html lang="([^"]*)"/.exec(await readFile(file, 'utf8'))?.[1];
      const english = englishPage(rel);
      if (lang !== (english ? 'en-GB' : 'es-ES')) wrong.push(`${rel}: ${lang}`);
    }
    expect(wrong).toEqual([]);
  });

  it('a card in a Spanish and an English set exists twice, each set linking its own', async () => {
    expect(existsSync(path.join(outDir, SPANISH_CARD, 'index.html'))).toBe(true);
    expect(existsSync(path.join(outDir, ENGLISH_CARD, 'index.html'))).toBe(true);
    expect(existsSync(path.join(outDir, `${SPANISH_CARD}.pdf`))).toBe(true);
    expect(existsSync(path.join(outDir, `${ENGLISH_CARD}.pdf`))).toBe(true);
    const barra = await readFile(path.join(outDir, 'sets/barra/index.html'), 'utf8');
    const english = await readFile(path.join(outDir, 'sets/english-bar/index.html'), 'utf8');
    expect(barra).toContain(`${SPANISH_CARD}/index.html`);
    expect(barra).not.toContain(ENGLISH_CARD);
    expect(english).toContain(`${ENGLISH_CARD}/index.html`);
    const englishCard = pageText(
      await readFile(path.join(outDir, ENGLISH_CARD, 'index.html'), 'utf8'),
    );
    expect(englishCard).toContain(en.card.water.heading);
    expect(englishCard).toContain(en.card.cautions.deferral);
    // The scanner can fail: the English twin shows most English headings.
    expect(englishHits(englishCard).length).toBeGreaterThan(ENGLISH_HEADINGS.length / 2);
  });

  it('a set page says its PDF holds the set’s cards (not “this card”), in the set’s language', async () => {
    const barra = pageText(await readFile(path.join(outDir, 'sets/barra/index.html'), 'utf8'));
    const english = pageText(
      await readFile(path.join(outDir, 'sets/english-bar/index.html'), 'utf8'),
    );
    expect(barra).toContain(es.print.setPdf(false));
    expect(english).toContain(en.print.setPdf(false));
    for (const page of [barra, english]) {
      expect(page).not.toContain(es.card.nav.print);
      expect(page).not.toContain(en.card.nav.print);
    }
  });

  it('a station card has the Spanish headings, cautions and a decimal comma, and no English heading', async () => {
    const text = pageText(await readFile(path.join(outDir, SPANISH_CARD, 'index.html'), 'utf8'));
    for (const heading of [
      es.card.water.heading,
      es.card.coffee.heading,
      es.card.heat.heading,
      es.card.timings.heading,
      es.card.expect.heading,
      es.card.chart.heading,
      es.card.cautions.heading,
      es.card.expect.boiling,
      es.card.crossSection.fillLine,
    ])
      expect(text, heading).toContain(heading);
    for (const caution of [...es.card.cautions.full, es.card.cautions.deferral])
      expect(text, caution).toContain(caution);
    // The dose is printed to 0.1 g: "14,0 g" in Spanish.
    expect(text).toMatch(/\d,\d[\u00a0 ]g\b/);
    expect(text).not.toMatch(POINT_NUMBER);
    expect(englishHits(text)).toEqual([]);
  });

  it('the refused card says why in Spanish', async () => {
    const text = pageText(
      await readFile(path.join(outDir, 'cards/one-cup--polvo--bar-gas/index.html'), 'utf8'),
    );
    expect(text).toContain(es.card.refusal.heading);
    expect(text).toContain(es.card.refusal.why);
    expect(text).toMatch(/la presión llegaría a \d+,\d\d[\u00a0 ]bar/);
    expect(englishHits(text)).toEqual([]);
  });

  it('no Spanish page keeps an English heading or a decimal point', async () => {
    const bad: string[] = [];
    for (const file of await filesUnder(outDir, '.html')) {
      const rel = path.relative(outDir, file);
      if (englishPage(rel)) continue;
      const text = pageText(await readFile(file, 'utf8'));
      const hits = englishHits(text);
      if (hits.length > 0) bad.push(`${rel}: ${hits.join(', ')}`);
      const point = POINT_NUMBER.exec(text);
      if (point) bad.push(`${rel}: ${point[0]}`);
    }
    expect(bad).toEqual([]);
  });

  it('every PDF of a Spanish card or set has /Lang (es-ES); the English ones (en-GB)', async () => {
    const wrong: string[] = [];
    for (const file of await filesUnder(outDir, '.pdf')) {
      const rel = path.relative(outDir, file);
      const english = englishPage(rel);
      const lang = /\/Lang \(([^)]*)\)/.exec((await readFile(file)).toString('latin1'))?.[1];
      if (lang !== (english ? 'en-GB' : 'es-ES')) wrong.push(`${rel}: ${lang}`);
    }
    expect(wrong).toEqual([]);
  });
});

describeWithTools(['pdftotext'], 'the Spanish PDFs, as pdftotext reads them', () => {
  const text = (file: string): string =>
    runTool('pdftotext', ['-enc', 'UTF-8', path.join(outDir, file), '-']).stdout.replace(
      /\s+/g,
      ' ',
    );

  it('a station card’s PDF has the Spanish headings, a decimal comma and no English heading', () => {
    const t = text(`${SPANISH_CARD}.pdf`);
    for (const heading of [
      es.card.water.heading,
      es.card.timings.heading,
      es.card.cautions.heading,
    ])
      expect(t).toContain(heading);
    expect(t).toMatch(/\d,\d g\b/);
    expect(t).not.toMatch(/\d\.\d+ (?:g|bar)\b/);
    expect(englishHits(t)).toEqual([]);
  });

  it('the training binder’s contents, method and troubleshooting pages are Spanish', () => {
    const t = text('sets/barista-training.pdf');
    expect(t).toContain(es.pdf.contents.frontMatter);
    expect(t).not.toContain(en.pdf.contents.frontMatter);
    expect(t).toContain(es.method.title);
    expect(t).toContain(es.troubleshooting.title);
    expect(t).not.toContain(en.method.title);
    // The binder's own pages (cover, steps, cleaning, glossary, log sheet, sign-off).
    for (const heading of [
      es.binder.cover.kind,
      es.binder.steps.title,
      es.binder.cleaning.title,
      es.binder.glossary.title,
      es.binder.exercises.title,
      es.binder.logSheet.title,
      es.binder.signOff.title,
    ])
      expect(t).toContain(heading);
    expect(t).not.toContain(en.binder.steps.title);
    // The exercises, on the binder's own card: Spanish headings and labels.
    for (const ex of setData('barista-training').exercises!.exercises)
      expect(t).toContain(ex.heading);
    expect(t).toContain(es.binder.exercises.safetyLabel);
    expect(t).not.toContain(en.binder.exercises.goodLabel);
    expect(englishHits(t)).toEqual([]);
  });

  it('the insert’s PDF has the Spanish steps and table headings', () => {
    const t = text('inserts/house-blend.pdf');
    expect(t).toContain(es.card.insert.heading);
    expect(t).toContain(es.card.insert.steps.heading);
    expect(t).toContain(es.card.insert.columns.firstCoffee);
    expect(englishHits(t)).toEqual([]);
  });
});
