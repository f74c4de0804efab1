/**
 * Running `stovecard` the two ways a person does, for the hostile-input tests: in-process
 * through main([...]) with stdout and stderr captured, or as a child process
 * (`tsx generator/cli/main.ts …`), and checking that a failure reads as a person's error,
 * not a program's.
 */
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { expect, vi } from 'vitest';
import { main } from '../../generator/cli/main.ts';

export const PROJECT_ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const DEMO_CONTENT = path.join(PROJECT_ROOT, 'content');
const TSX = path.join(PROJECT_ROOT, 'node_modules', '.bin', 'tsx');
const MAIN = path.join(PROJECT_ROOT, 'generator', 'cli', 'main.ts');

export interface CliRun {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

/** main(argv) in this process, with process.stdout and process.stderr captured. */
export async function runMain(argv: readonly string[]): Promise<CliRun> {
  let stdout = '';
  let stderr = '';
  const out = vi
    .spyOn(process.stdout, 'write')
    .mockImplementation((chunk) => ((stdout += String(chunk)), true));
  const err = vi
    .spyOn(process.stderr, 'write')
    .mockImplementation((chunk) => ((stderr += String(chunk)), true));
  try {
    const code = await main([...argv]);
    return { code, stdout, stderr };
  } finally {
    out.mockRestore();
    err.mockRestore();
  }
}

/**
 * main(argv) with the working folder set to `cwd` for the call (relative --content and --out
 * are taken from there; the cache goes beside the content folder). Needs
 * vitest's default `forks` pool: worker threads cannot change the working folder.
 */
export async function runMainIn(cwd: string, argv: readonly string[]): Promise<CliRun> {
  const before = process.cwd();
  process.chdir(cwd);
  try {
    return await runMain(argv);
  } finally {
    process.chdir(before);
  }
}

/**
 * `npx tsx generator/cli/main.ts …` as a child process. `cwd` defaults to the checkout;
 * elsewhere tsx and main.ts are named by absolute path (npx would not find tsx there).
 */
export function runChild(
  argv: readonly string[],
  options: { cwd?: string; env?: NodeJS.ProcessEnv; timeoutMs?: number } = {},
): Promise<CliRun> {
  const cwd = options.cwd ?? PROJECT_ROOT;
  const [file, args] =
    cwd === PROJECT_ROOT
      ? ['npx', ['tsx', 'generator/cli/main.ts', ...argv]]
      : [TSX, [MAIN, ...argv]];
  if (!existsSync(TSX)) throw new Error(`tsx is not installed at ${TSX} (npm ci)`);
  return new Promise((resolve) => {
    execFile(
      file,
      args,
      {
        cwd,
        env: { ...process.env, STOVECARD_DEBUG: '', ...options.env },
        timeout: options.timeoutMs ?? 60_000,
        maxBuffer: 16 * 1024 * 1024,
      },
      (error, stdout, stderr) => {
        const code = error ? (typeof error.code === 'number' ? error.code : -1) : 0;
        resolve({ code, stdout, stderr });
      },
    );
  });
}

/** Lines of a stack trace, and the `SomeError:` prefix Node prints for an uncaught error. */
const STACK_LINE = /^\s+at /m;
const NODE_ERROR_PREFIX = /^(?:\w*Error|Uncaught \w+)(?: \[\w+\])?:/m;

/** A failure a person can act on: exit 2, no stack trace, no Node error prefix, no internal error. */
export function expectCleanFailure(run: CliRun, label: string): void {
  const shown = `${label}\n--- stderr ---\n${run.stderr}\n--- stdout ---\n${run.stdout}`;
  expect(run.code, shown).toBe(2);
  expect(run.stderr, shown).not.toMatch(STACK_LINE);
  expect(run.stderr, shown).not.toMatch(NODE_ERROR_PREFIX);
  expect(run.stderr, shown).not.toContain('internal error');
  expect(run.stdout, shown).not.toMatch(STACK_LINE);
}

/** Non-empty stderr lines. */
export function lines(text: string): string[] {
  return text.split('\n').filter((line) => line.trim() !== '');
}

const TSX_LOADER = path.join(PROJECT_ROOT, 'node_modules', 'tsx', 'dist', 'loader.mjs');

/**
 * `node --import tsx generator/cli/main.ts …` as ONE process (npx and the tsx launcher
 * start a second one), so a test can kill the command itself at any moment.
 */
export function spawnCli(
  argv: readonly string[],
  options: { cwd: string; env?: NodeJS.ProcessEnv },
): { child: ChildProcess; done: Promise<CliRun & { signal: NodeJS.Signals | null }> } {
  const child = spawn(process.execPath, ['--import', TSX_LOADER, MAIN, ...argv], {
    cwd: options.cwd,
    env: { ...process.env, STOVECARD_DEBUG: '', ...options.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let stdout = '';
  let stderr = '';
  child.stdout?.on('data', (chunk) => (stdout += String(chunk)));
  child.stderr?.on('data', (chunk) => (stderr += String(chunk)));
  const done = new Promise<CliRun & { signal: NodeJS.Signals | null }>((resolve) => {
    child.on('close', (code, signal) => resolve({ code: code ?? -1, signal, stdout, stderr }));
  });
  return { child, done };
}
