/**
 * The usual cautions and the deferral to the maker's instructions and local rules, on
 * every page a customer, barista or trainee reads: every HTML page and every page of every
 * PDF of the demo site (built at A5, the demo's paper, and at A6, where the compact form
 * is used), and the output of `stovecard plan` for a recipe and for a refusal.
 *
 * A page passes when it carries every line of one form (cardWords.cautions.full or
 * .compact, parallel lists) and the deferral. The rule itself (which cautions a stovetop
 * pressure pot needs) is common practice, no source: makers' leaflets and kitchen-safety
 * guidance carry the same points in their own words.
 */
import { cp, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cardWords } from '../../generator/words/card.ts';
import { LANGUAGES, wordsFor } from '../../generator/words/catalogue.ts';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { BUILD_ENV } from '../browser/demo-builds.ts';
import { runMain, DEMO_CONTENT } from '../hostile/cli-run.ts';
import { describeWithTools, runTool } from '../pdf/poppler.ts';

const words = cardWords.cautions;
const squash = (text: string): string => text.replace(/[\s\u00a0\u202f\u00ad]+/g, '');
const escapeHtml = (text: string): string =>
  text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');

/** The lines of `lines` that `text` does not hold (after `norm`). */
function missing(text: string, lines: readonly string[], norm: (s: string) => string): string[] {
  return lines.filter((line) => !text.includes(norm(line)));
}

/**
 * Which form a text carries completely, in one of the languages (a Spanish set's pages
 * carry the Spanish cautions), or what it lacks of the nearer one.
 */
function cautionCheck(text: string, norm: (s: string) => string): string[] {
  let nearest: string[] | null = null;
  for (const language of LANGUAGES) {
    const own = wordsFor(language).card.cautions;
    const full = missing(text, [...own.full, own.deferral], norm);
    const compact = missing(text, [...own.compact, own.deferral], norm);
    if (full.length === 0 || compact.length === 0) return [];
    const near = full.length <= compact.length ? full : compact;
    if (nearest === null || near.length < nearest.length) nearest = near;
  }
  return nearest ?? [];
}

async function filesUnder(dir: string, ext: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile() && entry.name.endsWith(ext))
      out.push(path.join(entry.parentPath, entry.name));
  }
  return out.sort();
}

function pdfPages(file: string): number {
  const info = runTool('pdfinfo', [file]).stdout;
  return Number(/^Pages:\s+(\d+)/m.exec(info)?.[1] ?? 0);
}

let root: string;
const sites: { paper: 'A5' | 'A6'; dir: string }[] = [];

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-cautions-'));
  const cache = path.join(root, 'cache');
  for (const paper of ['A5', 'A6'] as const) {
    // As `stovecard build` does: the HTML pages, then the PDF step.
    const content = path.join(root, `content-${paper}`);
    await cp(DEMO_CONTENT, content, { recursive: true });
    const site = path.join(content, 'site.yaml');
    let yaml = (await readFile(site, 'utf8')).replace(/^paper: .*$/m, `paper: ${paper}`);
    // A twelve-row insert does not fit A6 with its text at 7 pt (paper-floor.test.ts): on
    // A6 the insert sets (the English and the Spanish one) cover one pot on one stove.
    if (paper === 'A6')
      yaml = yaml
        .replace(
          '    # pots and stoves left out: every pot and every stove',
          '    pots: [one-cup]\n    stoves: [bar-gas]',
        )
        .replace(
          /^( {4}language: es\n {4}coffees: \[.*\]\n)/m,
          '$1    pots: [one-cup]\n    stoves: [bar-gas]\n',
        );
    await writeFile(site, yaml);
    const outDir = path.join(root, `site-${paper}`);
    await buildSite({
      contentDir: content,
      outDir,
      cacheDir: cache,
      env: BUILD_ENV,
      extraSteps: [sitePdfStep],
    });
    sites.push({ paper, dir: outDir });
  }
}, 600_000);

afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('the cautions lists', () => {
  it('full and compact name the same cautions, one line each, and the deferral is apart', () => {
    expect(words.compact.length).toBe(words.full.length);
    expect(words.full.length).toBeGreaterThanOrEqual(10);
    for (const line of [...words.full, ...words.compact])
      expect(line.includes(words.deferral), line).toBe(false);
  });
});

describe('every HTML page of the demo site', () => {
  it('carries a cautions section with every caution of one form and the deferral', async () => {
    let pages = 0;
    const failures: string[] = [];
    for (const site of sites) {
      for (const file of await filesUnder(site.dir, '.html')) {
        pages += 1;
        const html = await readFile(file, 'utf8');
        const sections = [...html.matchAll(/<section class="cautions[^"]*">([\s\S]*?)<\/section>/g)]
          .map((m) => m[1]!)
          .join('\n');
        const lacks = cautionCheck(sections, escapeHtml);
        if (lacks.length > 0)
          failures.push(
            `${site.paper} ${path.relative(site.dir, file)}: lacks ${lacks.join(' | ')}`,
          );
      }
    }
    // The index, method, troubleshooting, three set pages and the cards, at each paper.
    expect(pages).toBeGreaterThan(2 * 6);
    expect(failures).toEqual([]);
  });

  it('uses the compact form on A6 cards and the full one on A5 and on the text pages', async () => {
    const a6 = sites.find((s) => s.paper === 'A6')!;
    const card = (await filesUnder(path.join(a6.dir, 'cards'), '.html')).find(
      (file) => !file.includes(`${path.sep}es${path.sep}`),
    )!;
    expect(await readFile(card, 'utf8')).toContain(escapeHtml(words.compact[1]!));
    const index = await readFile(path.join(a6.dir, 'index.html'), 'utf8');
    expect(index).toContain(escapeHtml(words.full[1]!));
  });
});

describeWithTools(['pdftotext'], 'every page of every PDF of the demo site', () => {
  it('carries every caution of one form and the deferral (pdftotext, page by page)', async () => {
    let pages = 0;
    const failures: string[] = [];
    for (const site of sites) {
      for (const file of await filesUnder(site.dir, '.pdf')) {
        const count = pdfPages(file);
        expect(count, file).toBeGreaterThan(0);
        for (let page = 1; page <= count; page++) {
          pages += 1;
          const text = runTool('pdftotext', [
            '-raw',
            '-f',
            String(page),
            '-l',
            String(page),
            file,
            '-',
          ]);
          const lacks = cautionCheck(squash(text.stdout), squash);
          if (lacks.length > 0)
            failures.push(
              `${site.paper} ${path.relative(site.dir, file)} page ${page}: lacks ${lacks.join(' | ')}`,
            );
        }
      }
    }
    expect(pages).toBeGreaterThan(2 * 10);
    expect(failures).toEqual([]);
  });
});

describe('stovecard plan', () => {
  const entry = (folder: string, id: string) => path.join(DEMO_CONTENT, folder, `${id}.yaml`);

  it('prints the cautions and the deferral after a recipe', async () => {
    const run = await runMain([
      'plan',
      ...['--pot', entry('pots', 'three-cup')],
      ...['--coffee', entry('coffees', 'house-blend')],
      ...['--stove', entry('stoves', 'bar-gas')],
    ]);
    expect(run.code).toBe(0);
    expect(cautionCheck(squash(run.stdout), squash)).toEqual([]);
  });

  it('prints them after a refusal too', async () => {
    // An aluminium pot on induction is refused (no magnetic base).
    const run = await runMain([
      'plan',
      ...['--pot', entry('pots', 'three-cup')],
      ...['--coffee', entry('coffees', 'house-blend')],
      ...['--stove', entry('stoves', 'bar-induction')],
    ]);
    expect(run.code).toBe(3);
    expect(run.stdout).toContain('REFUSED');
    expect(cautionCheck(squash(run.stdout), squash)).toEqual([]);
  });
});
