/**
 * poppler-utils (pdfinfo, pdftotext, pdftoppm) and qpdf run on PDF files, for tests that
 * check our PDFs with a reader that is not ours and not pdfjs. They are Debian packages, not
 * npm ones: where one is missing its checks are skipped with a notice, except under CI=true,
 * where a missing tool is a failing test (.ci/run installs poppler-utils and qpdf).
 */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

export interface ToolRun {
  readonly stdout: string;
  readonly stderr: string;
  readonly status: number | null;
}

export function runTool(tool: string, args: readonly string[]): ToolRun {
  const run = spawnSync(tool, args, { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (run.error) throw run.error;
  return { stdout: run.stdout, stderr: run.stderr, status: run.status };
}

export function onPath(tool: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${tool}`]).status === 0;
}

const IN_CI = process.env.CI === 'true' || process.env.CI === '1';

/** Why `tools` cannot run here (the missing ones named), or undefined when all are on PATH. */
export function missingTools(tools: readonly string[]): string | undefined {
  const missing = tools.filter((tool) => !onPath(tool));
  if (missing.length === 0) return undefined;
  return `${missing.join(', ')} not on PATH (Debian: poppler-utils for pdfinfo/pdftotext/pdftoppm, qpdf; .ci/run installs them)`;
}

/**
 * describe(name, body) when every tool is on PATH. Without one: a failing test under
 * CI=true, elsewhere a skipped suite whose name says why, and a warning on the console.
 */
export function describeWithTools(tools: readonly string[], name: string, body: () => void): void {
  const missing = missingTools(tools);
  if (missing === undefined) {
    describe(name, body);
  } else if (IN_CI) {
    describe(name, () => {
      it(`has ${tools.join(', ')} to run`, () => {
        expect.fail(missing);
      });
    });
  } else {
    console.warn(`stovecard suite "${name}" skipped: ${missing}`);
    describe.skip(`${name} (skipped: ${missing})`, body);
  }
}

/** pdfinfo's page sizes, pt, of pages 1 … `pages`. */
export function pdfinfoSizes(file: string, pages: number): [number, number][] {
  const out = runTool('pdfinfo', ['-f', '1', '-l', String(pages), file]).stdout;
  return [...out.matchAll(/^Page\s+\d+ size:\s+([\d.]+) x ([\d.]+) pts/gm)].map((m) => [
    Number(m[1]),
    Number(m[2]),
  ]);
}

/** pdftotext's lines of one page (1-based), trimmed, empty ones dropped. */
export function pageLines(file: string, page: number): string[] {
  const out = runTool('pdftotext', ['-f', String(page), '-l', String(page), file, '-']).stdout;
  return out
    .split(/\r?\n|\f/)
    .map((line) => line.trim())
    .filter((line) => line !== '');
}

export interface GrayImage {
  readonly width: number;
  readonly height: number;
  readonly pixels: Uint8Array;
}

/** One page rendered by pdftoppm in 8-bit gray (a binary PGM, netpbm's P5). */
export function renderGray(file: string, page: number, dpi: number, outPrefix: string): GrayImage {
  const args = ['-gray', '-r', String(dpi), '-f', String(page), '-l', String(page)];
  const run = runTool('pdftoppm', [...args, '-singlefile', file, outPrefix]);
  if (run.status !== 0) throw new Error(`pdftoppm ${file}: ${run.stderr}`);
  const bytes = readFileSync(`${outPrefix}.pgm`);
  const header = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(bytes.subarray(0, 40).toString('latin1'));
  if (!header) throw new Error(`pdftoppm ${file}: not an 8-bit PGM`);
  const [width, height] = [Number(header[1]), Number(header[2])];
  return { width, height, pixels: bytes.subarray(header[0].length) };
}
