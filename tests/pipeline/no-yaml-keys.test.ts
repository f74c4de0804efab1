/**
 * No card, insert, page or PDF shows a reader a YAML key: the people who read them (a
 * customer, a barista, a trainee) never edit the content files, so a sentence such as
 * "add induction_plate: true to its base" means nothing to them. Common practice, no
 * source: instructions for the public are written in the reader's words, not in a file
 * format's.
 *
 * The demo site is built as `stovecard build` builds it (HTML pages, then the PDF step),
 * and every page's visible text and every PDF page's text (pdftotext) is scanned for a
 * YAML-key-like token (`word_word:`) and for every key of the content schemas that has an
 * underscore (`induction_plate`, `every_coffee_with_every_pot`, …) as a whole word.
 */
import { cp, mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { BUILD_ENV } from '../browser/demo-builds.ts';
import { DEMO_CONTENT } from '../hostile/cli-run.ts';
import { describeWithTools, runTool } from '../pdf/poppler.ts';

const SCHEMAS = path.resolve('generator/content/schemas');

/** Every property name of every content schema, at any depth. */
function schemaKeys(): string[] {
  const keys = new Set<string>();
  const walk = (node: unknown): void => {
    if (Array.isArray(node)) return node.forEach(walk);
    if (node === null || typeof node !== 'object') return;
    for (const [k, v] of Object.entries(node)) {
      if (k === 'properties' && v && typeof v === 'object')
        for (const name of Object.keys(v)) keys.add(name);
      walk(v);
    }
  };
  for (const file of readdirSync(SCHEMAS).filter((f) => f.endsWith('.json')))
    walk(JSON.parse(readFileSync(path.join(SCHEMAS, file), 'utf8')));
  return [...keys].sort();
}

const KEY_LIKE = /\b[a-z]+_[a-z_]+:/g;
const UNDERSCORED = schemaKeys().filter((k) => k.includes('_'));
const KNOWN = new RegExp(`\\b(?:${UNDERSCORED.join('|')})\\b`, 'g');

/** The YAML-key-like tokens and the known keys a text shows. */
function yamlKeysIn(text: string): string[] {
  return [...(text.match(KEY_LIKE) ?? []), ...(text.match(KNOWN) ?? [])];
}

/** What a browser shows of an HTML page: no scripts, styles or tags; entities decoded. */
function visibleText(html: string): string {
  return html
    .replace(/<(script|style)\b[\s\S]*?<\/\1>/g, ' ')
    .replace(/<[^>]*>/g, ' ')
    .replace(/&nbsp;|&#160;/g, ' ')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&');
}

async function filesUnder(dir: string, ext: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true }))
    if (entry.isFile() && entry.name.endsWith(ext))
      out.push(path.join(entry.parentPath, entry.name));
  return out.sort();
}

let root: string;
let site: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-yaml-keys-'));
  const content = path.join(root, 'content');
  await cp(DEMO_CONTENT, content, { recursive: true });
  site = path.join(root, 'site');
  await buildSite({
    contentDir: content,
    outDir: site,
    cacheDir: path.join(root, 'cache'),
    env: BUILD_ENV,
    extraSteps: [sitePdfStep],
  });
}, 600_000);

afterAll(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('the scan itself', () => {
  it('finds the sentence the cards used to print, and knows the schemas’ keys', () => {
    expect(yamlKeysIn('add induction_plate: true to its base')).toEqual([
      'induction_plate:',
      'induction_plate',
    ]);
    expect(UNDERSCORED).toContain('induction_plate');
    expect(UNDERSCORED).toContain('every_coffee_with_every_pot');
    expect(yamlKeysIn('Never fill above the valve: 155 mL, 85 °C.')).toEqual([]);
  });
});

describe('every HTML page of the demo site', () => {
  it('shows no YAML key', async () => {
    const found: string[] = [];
    const files = await filesUnder(site, '.html');
    for (const file of files) {
      const keys = yamlKeysIn(visibleText(await readFile(file, 'utf8')));
      if (keys.length > 0) found.push(`${path.relative(site, file)}: ${keys.join(', ')}`);
    }
    expect(files.length).toBeGreaterThan(10);
    expect(found).toEqual([]);
  });
});

describeWithTools(['pdftotext'], 'every PDF of the demo site', () => {
  it('shows no YAML key on any page (pdftotext)', async () => {
    const found: string[] = [];
    const files = await filesUnder(site, '.pdf');
    for (const file of files) {
      const keys = yamlKeysIn(runTool('pdftotext', [file, '-']).stdout);
      if (keys.length > 0) found.push(`${path.relative(site, file)}: ${keys.join(', ')}`);
    }
    expect(files.length).toBeGreaterThan(10);
    expect(found).toEqual([]);
  });
});
