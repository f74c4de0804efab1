/**
 * Text fields that look like HTML or script are printed as text: a copy of the demo content
 * whose names, notes, level label, business and set title hold markup is built by the real
 * command (`stovecard build`, as a child process, so the PDF step runs too), and in Chromium
 * every page shows each string literally in one text node, holds no <script>, no on…
 * handler and no javascript: link, opens no dialog (page.on('dialog') never fires) and asks
 * for nothing but its own files. The card PDFs carry the same strings as text (pdfjs-dist;
 * these run without a browser too).
 */
import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runChild } from '../hostile/cli-run.ts';
import { demoCopy } from '../hostile/site-tree.ts';
import { describeWithBrowser, openFile, openGuardedPage, type GuardedPage } from './chromium.ts';
import { BUILD_ENV } from './demo-builds.ts';
import { readPdfPages, squash } from './pdf-pages.ts';

const HOSTILE = {
  coffee: '<script>alert(1)</script> & "quotes" <b>',
  notes: "Notes <img src=x onerror=alert(2)> & 'single'",
  pot: 'Pot </p><script>alert(3)</script><p>',
  stove: 'Stove <b>bold</b> & "gas" <!--',
  level: '<i>gentle&lt;',
  business: 'Roastery <b>&amp;</b> "Co"',
  contact: '<a href="javascript:alert(4)">call</a>',
  setTitle: 'Bar <script>alert(5)</script>',
} as const;

/** A YAML single-quoted scalar: nothing in it is special but the quote, written twice. */
const quoted = (text: string): string => `'${text.replace(/'/g, "''")}'`;

async function setLine(file: string, pattern: RegExp, line: string): Promise<void> {
  const text = await readFile(file, 'utf8');
  if (!pattern.test(text)) throw new Error(`${file}: no line matches ${pattern}`);
  await writeFile(file, text.replace(pattern, line));
}

/** The demo with markup in every text field of one pot × coffee × stove, and two small sets. */
async function hostileContent(dir: string): Promise<void> {
  await demoCopy(dir);
  const at = (file: string) => path.join(dir, file);
  await setLine(at('coffees/house-blend.yaml'), /^name: .*$/m, `name: ${quoted(HOSTILE.coffee)}`);
  await setLine(at('coffees/house-blend.yaml'), /^notes: .*$/m, `notes: ${quoted(HOSTILE.notes)}`);
  await setLine(at('pots/three-cup.yaml'), /^name: .*$/m, `name: ${quoted(HOSTILE.pot)}`);
  await setLine(at('stoves/bar-gas.yaml'), /^name: .*$/m, `name: ${quoted(HOSTILE.stove)}`);
  // On the level the planner chooses for this card (low, since the window became a preference).
  await setLine(at('stoves/bar-gas.yaml'), /label: low/, `label: ${quoted(HOSTILE.level)}`);
  await setLine(at('site.yaml'), /^ {2}name: .*$/m, `  name: ${quoted(HOSTILE.business)}`);
  await setLine(at('site.yaml'), /^ {2}contact: .*$/m, `  contact: ${quoted(HOSTILE.contact)}`);
  await setLine(
    at('site.yaml'),
    /^sets:[\s\S]*$/m,
    [
      'sets:',
      '  - id: bar',
      `    title: ${quoted(HOSTILE.setTitle)}`,
      '    layout: station',
      '    cards:',
      '      - { pot: three-cup, coffee: house-blend, stove: bar-gas }',
      '  - id: bags',
      '    title: Bags',
      '    layout: insert',
      '    coffees: [house-blend]',
      '    pots: [three-cup]',
      '    stoves: [bar-gas]',
      '',
    ].join('\n'),
  );
}

/** Runs in the page: which of `needles` some text node (or the title) holds whole, and what markup got in. */
function inspect(needles: readonly string[]) {
  const texts: string[] = [document.title];
  const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
  for (let node = walker.nextNode(); node; node = walker.nextNode())
    texts.push(node.nodeValue ?? '');
  const handlers: string[] = [];
  const links: string[] = [];
  for (const el of document.querySelectorAll('*')) {
    for (const attr of el.getAttributeNames())
      if (attr.toLowerCase().startsWith('on'))
        handlers.push(`<${el.tagName.toLowerCase()} ${attr}>`);
    const href = el.getAttribute('href') ?? el.getAttribute('xlink:href') ?? '';
    if (/^\s*javascript:/i.test(href)) links.push(href);
  }
  return {
    missing: needles.filter((needle) => !texts.some((text) => text.includes(needle))),
    scripts: document.querySelectorAll('script').length,
    // The roaster's own logo (site.yaml brand:) is the only image a page may carry.
    images: document.querySelectorAll('img:not(.site-logo):not(.brand-logo)').length,
    handlers,
    links,
  };
}

let root: string;
let outDir: string;
let buildLog: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-hostile-text-'));
  const content = path.join(root, 'content');
  await hostileContent(content);
  outDir = path.join(root, 'site');
  const built = await runChild(['build', '--content', content, '--out', outDir], {
    cwd: root,
    env: BUILD_ENV,
    timeoutMs: 110_000,
  });
  buildLog = built.stderr;
  expect(built.code, built.stderr).toBe(0);
}, 120_000);

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

describeWithBrowser('markup in text fields is printed as text, in Chromium', () => {
  let guarded: GuardedPage;

  beforeAll(async () => {
    guarded = await openGuardedPage();
  });

  afterAll(async () => {
    await guarded?.close();
  });

  const pages: [string, (keyof typeof HOSTILE)[]][] = [
    [
      'cards/three-cup--house-blend--bar-gas/index.html',
      ['coffee', 'pot', 'stove', 'level', 'business', 'contact'],
    ],
    ['inserts/house-blend/index.html', ['coffee', 'notes', 'pot', 'level', 'business', 'contact']],
    ['index.html', ['coffee', 'pot', 'stove', 'business', 'contact', 'setTitle']],
    ['sets/bar/index.html', ['coffee', 'pot', 'stove', 'setTitle']],
  ];

  for (const [page, fields] of pages) {
    it(`${page}: ${fields.join(', ')} shown literally, no script ran`, async () => {
      const file = path.join(outDir, page);
      expect(existsSync(file), `${file} was not built`).toBe(true);
      await openFile(guarded, file);
      const seen = await guarded.page.evaluate(
        inspect,
        fields.map((f) => HOSTILE[f]),
      );
      expect(seen.missing, `${page}: not found as literal text`).toEqual([]);
      expect(seen.scripts, `${page}: <script> elements`).toBe(0);
      expect(seen.images, `${page}: <img> elements`).toBe(0);
      expect(seen.handlers, `${page}: event-handler attributes`).toEqual([]);
      expect(seen.links, `${page}: javascript: links`).toEqual([]);
      expect(guarded.trouble.dialogs, `${page}: dialogs opened`).toEqual([]);
      guarded.expectNoTrouble(page);
    });
  }
});

describe('markup in text fields is printed as text, in the PDFs', () => {
  const pdfs: [string, (keyof typeof HOSTILE)[]][] = [
    [
      'cards/three-cup--house-blend--bar-gas.pdf',
      ['coffee', 'pot', 'stove', 'level', 'business', 'contact'],
    ],
    ['inserts/house-blend.pdf', ['coffee', 'notes', 'pot', 'level', 'business', 'contact']],
  ];
  for (const [pdf, fields] of pdfs) {
    it(`${pdf}: ${fields.join(', ')} as text`, async (context) => {
      const file = path.join(outDir, pdf);
      if (!existsSync(file)) {
        context.skip(
          `${pdf} was not written: stovecard build makes no PDFs yet (build log: ${buildLog.trim()})`,
        );
        return;
      }
      const read = await readPdfPages(await readFile(file), true);
      const text = squash(read.text.join(' '));
      const missing = fields.filter((f) => !text.includes(squash(HOSTILE[f])));
      expect(missing, `${pdf}: not found in the PDF's text:\n${read.text.join('\n')}`).toEqual([]);
    });
  }
});
