#!/usr/bin/env node
// Launcher. Runs the compiled CLI in dist/ (tsc -p tsconfig.build.json, which `npm install`
// runs as `prepare`, or `npm run compile`). In a checkout where a source under generator/ is
// newer than dist/ (or dist/ is missing) and tsx is installed, runs the TypeScript through
// tsx instead, so an edit is never run stale; without tsx it says to compile.
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));
const compiledMain = path.join(root, 'dist', 'generator', 'cli', 'main.js');

function newestSource(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(full));
    else if (entry.name.endsWith('.ts')) newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}

const compiledTime = existsSync(compiledMain) ? statSync(compiledMain).mtimeMs : -1;
const stale = compiledTime < 0 || newestSource(path.join(root, 'generator')) > compiledTime;
let hasTsx = false;
if (stale) {
  try {
    hasTsx = existsSync(fileURLToPath(import.meta.resolve('tsx/esm/api')));
  } catch {
    hasTsx = false;
  }
}

if (stale && hasTsx) {
  const { register } = await import('tsx/esm/api');
  register();
  await import('../generator/cli/main.ts');
} else if (compiledTime < 0) {
  process.stderr.write(
    'stovecard: dist/ is missing; run `npm run compile` (or `npm install`) first\n',
  );
  process.exitCode = 2;
} else {
  if (stale)
    process.stderr.write(
      'stovecard: dist/ is older than generator/; `npm run compile` brings it up to date\n',
    );
  await import(pathToFileURL(compiledMain).href);
}
