/**
 * The bench's stricter floor and its set-size comparison (bench/run.ts):
 *
 *   strict floor   every card's page as a bare page through the same layout
 *                  (templates/_includes/layouts/base.njk: the site's head, fonts and
 *                  navigation, the card's title as its body), by Eleventy, and every
 *                  card's PDF as a bare one-page PDF in the same fonts (render/pdf/bare.ts),
 *                  on a new pool of the build's workers: what the pages and PDFs cost with
 *                  no card on them
 *   set sizes      a set's PDF as the build assembles it (its cards' own PDFs merged)
 *                  against the same cards drawn afresh into one document (card.ts
 *                  addCardPage, one font subset per face for the whole set)
 */
import { cp, mkdir, mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import Eleventy from '@11ty/eleventy';
import type { BuildResult } from '../generator/pipeline/build-site.ts';
import { allSettledOrThrow } from '../generator/pipeline/concurrent.ts';
import { TEMPLATES_DIR } from '../generator/pipeline/eleventy.ts';
import { WorkerPool } from '../generator/pipeline/pool.ts';
import { filters } from '../generator/render/eleventy-setup.ts';
import { addCardPage, type CardView } from '../generator/render/pdf/card.ts';
import { openPdf, pdfDate } from '../generator/render/pdf/document.ts';
import { setCards } from '../generator/render/pdf/site-pdfs.ts';

const BARE_CARD = `---
pagination:
  data: stovecard.bareCards
  size: 1
  alias: card
permalink: "{{ card.paths.pageFile }}"
---
{% extends "layouts/base.njk" %}
{% block lang %}{{ card.lang }}{% endblock %}
{% block title %}{{ card.title }}{% endblock %}
{% block body %}<h1>{{ card.title }}</h1><p>{{ card.subtitle }}</p>{% endblock %}
`;

export interface StrictFloor {
  readonly wallMs: number;
  readonly pagesMs: number;
  readonly pdfsMs: number;
  readonly pages: number;
  readonly pdfs: number;
}

/** Bare pages and bare PDFs of every card of `full`'s site, into a scratch folder. */
export async function strictFloor(
  full: BuildResult,
  root: string,
  workers: number,
  env: NodeJS.ProcessEnv,
): Promise<StrictFloor> {
  const { data } = full;
  const scratch = await mkdtemp(path.join(root, 'strict-'));
  const input = path.join(scratch, 'templates');
  await mkdir(path.join(input, '_includes'), { recursive: true });
  await cp(
    path.join(TEMPLATES_DIR, '_includes', 'layouts'),
    path.join(input, '_includes', 'layouts'),
    {
      recursive: true,
    },
  );
  await writeFile(path.join(input, 'bare.njk'), BARE_CARD);
  const config = path.join(scratch, 'eleventy.config.mjs');
  await writeFile(
    config,
    `export default () => ({ dir: { input: ${JSON.stringify(input)}, includes: '_includes', layouts: '_includes/layouts' }, templateFormats: ['njk'], htmlTemplateEngine: 'njk' });\n`,
  );
  const cards: CardView[] = [...data.stationCards, ...data.insertCards];
  const started = performance.now();
  const site = new Eleventy(input, path.join(scratch, 'site'), {
    configPath: config,
    quietMode: true,
    config(c: {
      addGlobalData(name: string, value: unknown): void;
      addFilter(name: string, f: unknown): void;
    }) {
      c.addGlobalData('stovecard', { ...data, bareCards: cards });
      c.addFilter('rel', filters.rel);
    },
  } as never);
  site.disableLogger();
  await site.write();
  const pagesMs = performance.now() - started;
  const pool = new WorkerPool({ size: Math.max(1, workers) });
  const author = data.site.businessName;
  try {
    await allSettledOrThrow(
      cards.map(async (card) => {
        const { result } = await pool.run({
          kind: 'bare-pdf',
          input: {
            title: card.title,
            subtitle: card.subtitle,
            lang: card.lang,
            widthMm: card.page.widthMm,
            heightMm: card.page.heightMm,
            builtOn: card.footer.builtOn,
            author,
            env,
          },
        });
        const file = path.join(scratch, 'site', card.paths.pdfFile);
        await mkdir(path.dirname(file), { recursive: true });
        await writeFile(file, result.bytes);
      }),
    );
  } finally {
    await pool.close();
  }
  const wallMs = performance.now() - started;
  await rm(scratch, { recursive: true, force: true });
  return { wallMs, pagesMs, pdfsMs: wallMs - pagesMs, pages: cards.length, pdfs: cards.length };
}

export interface SetSize {
  readonly set: string;
  readonly cards: number;
  readonly assembledBytes: number;
  readonly freshBytes: number;
}

/** The sets' PDFs in the site against their cards drawn afresh into one document each. */
export async function setSizes(
  full: BuildResult,
  siteDir: string,
  setIds: readonly string[],
  env: NodeJS.ProcessEnv,
): Promise<SetSize[]> {
  const { data } = full;
  const out: SetSize[] = [];
  for (const id of setIds) {
    const set = data.sets.find((s) => s.id === id);
    if (!set) continue;
    const cards = setCards(set, data);
    const open = openPdf({
      title: set.title,
      author: data.site.businessName,
      lang: set.lang,
      date: pdfDate(data.site.builtOn, env),
      idSeed: JSON.stringify({ set: set.id }),
    });
    for (const card of cards) addCardPage(open, card);
    const fresh = await open.finish();
    const assembled = await stat(path.join(siteDir, set.paths.pdfFile));
    out.push({
      set: id,
      cards: cards.length,
      assembledBytes: assembled.size,
      freshBytes: fresh.length,
    });
  }
  return out;
}
