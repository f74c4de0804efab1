/**
 * The folders of generator/ import one way (DEVELOPERS.md, "The pipeline" table):
 *
 *   physics, numerics ← brew ← content ← planning, calibration ← pipeline → render → words
 *   cli on top; units.ts (SI ↔ trade units) beside physics, for anything above it.
 *
 * Every static `import … from`, `export … from` and dynamic `import('…')` of every .ts file
 * under generator/ is read and resolved to the folder it lands in; an import a folder is not
 * allowed fails here with the file, line and specifier. Model layers (brew, planning,
 * content, calibration) import nothing from words/: they return codes and SI facts. words/
 * imports only types (`import type`), so it holds text and no logic.
 * The table is this project's own rule (common practice, no source).
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve('generator');

type Layer =
  | 'physics'
  | 'numerics'
  | 'units'
  | 'project-root'
  | 'brew'
  | 'content'
  | 'planning'
  | 'calibration'
  | 'pipeline'
  | 'render'
  | 'words'
  | 'browser'
  | 'cli';

/** What each folder may import (besides itself and node: / npm packages). */
const ALLOWED: Record<Layer, readonly Layer[]> = {
  physics: [],
  numerics: [],
  units: ['physics'],
  'project-root': [],
  brew: ['physics', 'numerics'],
  content: ['brew', 'physics', 'units', 'project-root'],
  planning: ['brew', 'physics', 'numerics', 'content', 'units'],
  calibration: ['brew', 'physics', 'numerics', 'content', 'planning', 'units'],
  words: ['brew', 'content', 'planning', 'calibration'],
  render: ['brew', 'content', 'planning', 'words', 'units', 'project-root'],
  pipeline: [
    'brew',
    'content',
    'planning',
    'calibration',
    'render',
    'words',
    'units',
    'project-root',
  ],
  // The customer's page script: the engine, the content checks and the card code, bundled.
  browser: ['brew', 'content', 'planning', 'render', 'words', 'units'],
  cli: [
    'physics',
    'numerics',
    'units',
    'brew',
    'content',
    'planning',
    'calibration',
    'pipeline',
    'render',
    'project-root',
    'words',
  ],
};

/** Layers whose imports of another layer must be type-only. */
const TYPES_ONLY: ReadonlySet<Layer> = new Set(['words']);

function layerOf(file: string): Layer | null {
  const rel = path.relative(ROOT, file);
  if (rel.startsWith('..')) return null;
  const top = rel.split(path.sep)[0]!;
  const name = top.endsWith('.ts') ? top.slice(0, -3) : top;
  return name in ALLOWED ? (name as Layer) : null;
}

function tsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) return tsFiles(full);
    return entry.name.endsWith('.ts') ? [full] : [];
  });
}

interface ImportLine {
  readonly file: string;
  readonly line: number;
  readonly specifier: string;
  readonly typeOnly: boolean;
}

/** Static imports/exports with a `from`, side-effect imports, and dynamic import('…'). */
const IMPORT =
  /(?:^|\n)\s*(import|export)\s+(type\s+)?(?:[^'";]*?\sfrom\s+)?['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;

function importsOf(file: string, text: string): ImportLine[] {
  const found: ImportLine[] = [];
  for (const m of text.matchAll(IMPORT)) {
    const specifier = m[3] ?? m[4]!;
    const at = m.index! + m[0].indexOf(specifier);
    found.push({
      file,
      line: text.slice(0, at).split('\n').length,
      specifier,
      typeOnly: m[2] !== undefined,
    });
  }
  return found;
}

/** Every import that crosses a layer boundary the table does not allow. */
function forbiddenImports(files: readonly string[]): string[] {
  const bad: string[] = [];
  for (const file of files) {
    const from = layerOf(file)!;
    for (const imp of importsOf(file, readFileSync(file, 'utf8'))) {
      if (!imp.specifier.startsWith('.')) continue;
      const to = layerOf(path.resolve(path.dirname(file), imp.specifier));
      const where = `${path.relative('.', file)}:${imp.line} imports ${imp.specifier}`;
      if (to === null) {
        bad.push(`${where} (outside generator/)`);
        continue;
      }
      if (to === from) continue;
      if (!ALLOWED[from].includes(to)) bad.push(`${where}: ${from} may not import ${to}`);
      else if (TYPES_ONLY.has(from) && !imp.typeOnly)
        bad.push(`${where}: ${from} may import only types`);
    }
  }
  return bad;
}

const FILES = tsFiles(ROOT).filter((file) => layerOf(file) !== null);

describe('generator/ import direction', () => {
  it('every .ts file under generator/ belongs to a layer of the table', () => {
    const stray = tsFiles(ROOT).filter((file) => layerOf(file) === null);
    expect(stray).toEqual([]);
    expect(FILES.length).toBeGreaterThan(100);
  });

  it('no folder imports a folder above it (the table in DEVELOPERS.md)', () => {
    expect(forbiddenImports(FILES)).toEqual([]);
  });

  it('brew, planning, content and calibration import nothing from words/', () => {
    const model = FILES.filter((f) =>
      ['brew', 'planning', 'content', 'calibration'].includes(layerOf(f)!),
    );
    const toWords = model.flatMap((file) =>
      importsOf(file, readFileSync(file, 'utf8'))
        .filter((imp) => layerOf(path.resolve(path.dirname(file), imp.specifier)) === 'words')
        .map((imp) => `${path.relative('.', file)}:${imp.line} ${imp.specifier}`),
    );
    expect(toWords).toEqual([]);
  });

  it('the scan finds static, type-only, re-exported and dynamic imports (a check that it can fail)', () => {
    const text = [
      "import { a } from '../words/card.ts';",
      "import type { B } from '../planning/types.ts';",
      "export { c } from './c.ts';",
      'const m = await import("../render/format.ts");',
      "import './side-effect.ts';",
    ].join('\n');
    const found = importsOf(path.join(ROOT, 'brew', 'x.ts'), text);
    expect(found.map((i) => [i.specifier, i.line, i.typeOnly])).toEqual([
      ['../words/card.ts', 1, false],
      ['../planning/types.ts', 2, true],
      ['./c.ts', 3, false],
      ['../render/format.ts', 4, false],
      ['./side-effect.ts', 5, false],
    ]);
    const dir = path.join(ROOT, 'brew');
    const bad = found.filter((i) => {
      const to = layerOf(path.resolve(dir, i.specifier));
      return to !== 'brew' && !ALLOWED.brew.includes(to!);
    });
    expect(bad.map((i) => i.specifier)).toEqual([
      '../words/card.ts',
      '../planning/types.ts',
      '../render/format.ts',
    ]);
  });
});

describe('the plan cache follows the model code only', () => {
  it('PLAN_SOURCES holds no words, render or pipeline rendering code, so a wording edit keeps every plan', async () => {
    const { PLAN_SOURCES } = await import('../../generator/pipeline/code-version.ts');
    expect(PLAN_SOURCES.filter((s) => /generator\/(words|render)/.test(s))).toEqual([]);
    // Everything the planner runs is hashed: its runtime imports stay inside these folders.
    for (const folder of ['brew', 'planning', 'physics', 'numerics']) {
      expect(PLAN_SOURCES).toContain(`generator/${folder}`);
    }
    const runtime = FILES.filter((f) => ['brew', 'planning'].includes(layerOf(f)!)).flatMap(
      (file) =>
        importsOf(file, readFileSync(file, 'utf8'))
          .filter((imp) => imp.specifier.startsWith('.') && !imp.typeOnly)
          .map((imp) => layerOf(path.resolve(path.dirname(file), imp.specifier))),
    );
    expect([...new Set(runtime)].sort()).toEqual(['brew', 'numerics', 'physics', 'planning']);
  });
});

describe('the render cache follows the code a view runs', () => {
  it('every runtime import of render/ and words/ lies in RENDER_SOURCES or PLAN_SOURCES', async () => {
    const { PLAN_SOURCES, RENDER_SOURCES } =
      await import('../../generator/pipeline/code-version.ts');
    const hashed = [...PLAN_SOURCES, ...RENDER_SOURCES].map((s) => path.resolve(s));
    // project-root.ts only finds the project folder; it shapes no output.
    const covered = (file: string): boolean =>
      layerOf(file) === 'project-root' ||
      hashed.some((h) => file === h || file.startsWith(`${h}${path.sep}`));
    const outside = FILES.filter((f) => ['render', 'words'].includes(layerOf(f)!)).flatMap((file) =>
      importsOf(file, readFileSync(file, 'utf8'))
        .filter((imp) => imp.specifier.startsWith('.') && !imp.typeOnly)
        .map((imp) => path.resolve(path.dirname(file), imp.specifier))
        .filter((target) => !covered(target))
        .map((target) => `${path.relative('.', file)} → ${path.relative('.', target)}`),
    );
    expect(outside).toEqual([]);
  });
});
