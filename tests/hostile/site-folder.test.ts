/**
 * The --out folder under faults, through the real command: a folder the tool did not make
 * is refused and untouched; a linked site keeps its link; what killed builds leave is
 * swept; and a build killed at any moment (random SIGKILLs, and a kill at each step of the
 * swap through STOVECARD_FAULT_AT) always leaves the previous or the new site whole.
 */
import { spawn } from 'node:child_process';
import {
  cp,
  lstat,
  mkdir,
  mkdtemp,
  readFile,
  readlink,
  rm,
  symlink,
  writeFile,
} from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { noteLines } from '../../generator/cli/build.ts';
import type { BuildResult } from '../../generator/pipeline/build-site.ts';
import { FAULT_POINTS, SITE_MARKER } from '../../generator/pipeline/swap.ts';
import { faultWords } from '../../generator/words/build-faults.ts';
import { expectCleanFailure, lines, runMainIn, spawnCli } from './cli-run.ts';
import { demoCopy, leftovers, treeHash } from './site-tree.ts';

let root: string;
const EPOCH = { SOURCE_DATE_EPOCH: '1767225600' }; // 2026-01-01: the same bytes every build

/** A small copy of the demo content (two station cards), its business named `name`. */
async function smallContent(dir: string, name: string): Promise<string> {
  await demoCopy(dir);
  const site = await readFile(path.join(dir, 'site.yaml'), 'utf8');
  const head = site
    .slice(0, site.indexOf('sets:'))
    .replace('  name: Brindlemoss Roastery', `  name: ${name}`);
  await writeFile(
    path.join(dir, 'site.yaml'),
    `${head}sets:\n  - id: bar\n    title: Bar\n    layout: station\n    cards:\n` +
      '      - { pot: three-cup, coffee: house-blend, stove: bar-gas }\n' +
      '      - { pot: six-cup, coffee: ember-blend, stove: bar-gas }\n',
  );
  return dir;
}

let contentA: string;
let contentB: string;

async function build(out: string, content = contentA) {
  return runMainIn(root, ['build', '--content', content, '--out', out]);
}

/** A pid that surely belongs to no running process: a child that has exited. */
async function deadPid(): Promise<number> {
  const child = spawn(process.execPath, ['-e', '']);
  await new Promise((resolve) => child.on('close', resolve));
  return child.pid!;
}

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-site-folder-'));
  contentA = await smallContent(path.join(root, 'content-a'), 'Brindlemoss Roastery');
  contentB = await smallContent(path.join(root, 'content-b'), 'Quorvel Bar');
  process.env.SOURCE_DATE_EPOCH = EPOCH.SOURCE_DATE_EPOCH;
}, 60_000);

afterAll(async () => {
  delete process.env.SOURCE_DATE_EPOCH;
  if (root) await rm(root, { recursive: true, force: true });
});

describe('--out that the tool did not make', () => {
  it('a hand-made site folder (index.html, CNAME, about.html, img/) is refused and kept byte for byte', async () => {
    const docs = path.join(root, 'docs');
    await mkdir(path.join(docs, 'img'), { recursive: true });
    await writeFile(path.join(docs, 'index.html'), '<!doctype html><title>Our café</title>');
    await writeFile(path.join(docs, 'CNAME'), 'cards.example.org\n');
    await writeFile(path.join(docs, 'about.html'), '<p>about us</p>');
    await writeFile(path.join(docs, 'img', 'logo.svg'), '<svg/>');
    const before = await treeHash(docs);
    const run = await build(docs);
    expectCleanFailure(run, 'hand-made docs');
    expect(lines(run.stderr)).toEqual([`stovecard: ${faultWords.outNotASite(docs)}`]);
    expect(await treeHash(docs)).toBe(before);
    expect(await leftovers(docs)).toEqual([]);
  });

  it('an empty folder and a site the tool made are replaced; the site carries the marker', async () => {
    const out = path.join(root, 'empty-then-site');
    await mkdir(out);
    const first = await build(out);
    expect(first.code, first.stderr).toBe(0);
    expect((await lstat(path.join(out, SITE_MARKER))).isFile()).toBe(true);
    const second = await build(out, contentB);
    expect(second.code, second.stderr).toBe(0);
    expect(await readFile(path.join(out, 'index.html'), 'utf8')).toContain('Quorvel Bar');
    expect(await leftovers(out)).toEqual([]);
  }, 60_000);
});

describe('a linked --out', () => {
  it('keeps the link and puts the site where it points, build after build', async () => {
    const target = path.join(root, 'www', 'cards');
    await mkdir(path.dirname(target), { recursive: true });
    const out = path.join(root, 'linked-site');
    await symlink(target, out);
    for (const [content, name] of [
      [contentA, 'Brindlemoss Roastery'],
      [contentB, 'Quorvel Bar'],
    ] as const) {
      const run = await build(out, content);
      expect(run.code, run.stderr).toBe(0);
      expect(await readlink(out)).toBe(target);
      expect(await readFile(path.join(target, 'index.html'), 'utf8')).toContain(name);
      expect(await readFile(path.join(out, 'index.html'), 'utf8')).toContain(name);
    }
    expect(await leftovers(target)).toEqual([]);
  }, 60_000);
});

describe('leftovers of killed builds', () => {
  it('are removed by the next build, with a note; folders of others and of running builds stay', async () => {
    const out = path.join(root, 'swept');
    expect((await build(out)).code).toBe(0);
    const dead = await deadPid();
    const ours = [`swept.tmp-${dead}-a1`, `swept.old-${dead}`, `swept.v-${dead}-b2`];
    for (const name of ours) {
      await mkdir(path.join(root, name, 'cards'), { recursive: true });
      await writeFile(path.join(root, name, SITE_MARKER), '');
    }
    await symlink(`swept.v-${dead}-b2`, path.join(root, `swept.link-${dead}-c3`));
    // Not ours: no marker and not empty; and one of a process that runs (this one).
    await mkdir(path.join(root, `swept.tmp-${dead}-notes`));
    await writeFile(path.join(root, `swept.tmp-${dead}-notes`, 'todo.txt'), 'keep');
    await mkdir(path.join(root, `swept.tmp-${process.pid}-live`));
    await writeFile(path.join(root, `swept.tmp-${process.pid}-live`, SITE_MARKER), '');
    const run = await build(out);
    expect(run.code, run.stderr).toBe(0);
    const note = lines(run.stderr).find((line) => line.startsWith('note: removed'));
    expect(note, run.stderr).toContain('4 folders');
    expect((await leftovers(out)).sort()).toEqual(
      [`swept.tmp-${dead}-notes`, `swept.tmp-${process.pid}-live`].sort(),
    );
  }, 60_000);

  it('a plain-folder site moved aside by a build killed mid-swap is put back by the next build, even a failing one', async () => {
    const out = path.join(root, 'plain');
    expect((await build(path.join(root, 'plain-src'))).code).toBe(0);
    await cp(path.join(root, 'plain-src'), out, { recursive: true, dereference: true });
    const before = await treeHash(out);
    const killed = spawnCli(['build', '--content', contentB, '--out', out], {
      cwd: root,
      env: { ...EPOCH, STOVECARD_FAULT_AT: 'swap:moved-old' },
    });
    const result = await killed.done;
    expect(result.signal, result.stderr).toBe('SIGKILL');
    // The one instant without <out>: a plain folder becoming a link (see swap.ts).
    await expect(lstat(out)).rejects.toThrow();
    const broken = await smallContent(path.join(root, 'content-broken'), 'X');
    await writeFile(path.join(broken, 'pots', 'three-cup.yaml'), 'cups: [');
    const failing = await build(out, broken);
    expect(failing.code).toBe(2);
    expect(await treeHash(out)).toBe(before);
  }, 60_000);
});

describe('a previous site that cannot be removed', () => {
  it('is named in a note, after the summary, and the build succeeds (the new site is in place)', () => {
    const result = {
      sweptLeftovers: [],
      damagedCache: {},
      swap: {
        version: '/srv/site.v-1-a',
        previous: '/srv/site.v-0-a',
        notRemoved: { folder: '/srv/site.v-0-a', code: 'EACCES' },
      },
    } as unknown as BuildResult;
    expect(noteLines(result)).toBe(
      `${faultWords.previousNotRemoved('/srv/site.v-0-a', 'EACCES')}\n`,
    );
    expect(noteLines(result)).toMatch(/new site is in place.*could not be removed \(EACCES\)/);
  });

  it.skipIf(process.getuid?.() === 0)(
    'read-only: the build exits 0, the new site is in place, and the note names the old folder',
    async () => {
      const out = path.join(root, 'read-only');
      expect((await build(out)).code).toBe(0);
      const version = path.join(root, await readlink(out));
      await import('node:child_process').then(({ execFileSync }) =>
        execFileSync('chmod', ['-R', 'a-w', version]),
      );
      const run = await build(out, contentB);
      await import('node:child_process').then(({ execFileSync }) =>
        execFileSync('chmod', ['-R', 'u+w', version]),
      );
      expect(run.code, run.stderr).toBe(0);
      expect(run.stderr).toContain('could not be removed');
      expect(await readFile(path.join(out, 'index.html'), 'utf8')).toContain('Quorvel Bar');
    },
    60_000,
  );
});

describe('a build killed at any moment leaves the previous or the new site whole', () => {
  const hashes = new Map<string, string>();
  let childBuildMs = 1500;
  const out = () => path.join(root, 'killed');

  beforeAll(async () => {
    // Reference sites for both contents (and a warm cache, so a build is ~1 s).
    for (const [name, content] of [
      ['a', contentA],
      ['b', contentB],
    ] as const) {
      const ref = path.join(root, `ref-${name}`);
      const run = await build(ref, content);
      expect(run.code, run.stderr).toBe(0);
      hashes.set(content, (await treeHash(ref))!);
    }
    expect(hashes.get(contentA)).not.toBe(hashes.get(contentB));
    // How long a whole build takes as a child process, so the kills spread over all of it.
    const started = performance.now();
    const timed = await spawnCli(['build', '--content', contentA, '--out', out()], {
      cwd: root,
      env: EPOCH,
    }).done;
    expect(timed.code, timed.stderr).toBe(0);
    childBuildMs = performance.now() - started;
  }, 120_000);

  /** Runs a build of `content` killed by `kill`; the site must be the one before or `content`'s. */
  async function killedBuild(
    content: string,
    before: string,
    kill: { atMs: number } | { point: string },
  ): Promise<string> {
    const env = 'point' in kill ? { ...EPOCH, STOVECARD_FAULT_AT: kill.point } : EPOCH;
    const { child, done } = spawnCli(['build', '--content', content, '--out', out()], {
      cwd: root,
      env,
    });
    const timer = 'atMs' in kill ? setTimeout(() => child.kill('SIGKILL'), kill.atMs) : null;
    const result = await done;
    if (timer) clearTimeout(timer);
    const after = await treeHash(out());
    const label = `${JSON.stringify({ ...kill, seed: process.env.STOVECARD_FAULT_SEED ?? 'default' })}: exit ${result.code} ${result.signal}\n${result.stderr}`;
    expect([before, hashes.get(content)], label).toContain(after);
    if (result.code === 0) expect(after, label).toBe(hashes.get(content));
    if ('point' in kill) expect(result.signal, label).toBe('SIGKILL');
    return after!;
  }

  it('at each step of the swap (STOVECARD_FAULT_AT)', async () => {
    let current = hashes.get(contentA)!;
    let next = contentB;
    // swap:moved-old happens only for a plain folder (tested above); here <out> is a link.
    for (const point of FAULT_POINTS.filter((p) => p !== 'swap:moved-old')) {
      current = await killedBuild(next, current, { point });
      next = next === contentA ? contentB : contentA;
    }
  }, 120_000);

  it('at random moments (SIGKILL within the time of a whole build), then a clean build sweeps what they left', async () => {
    let current = (await treeHash(out()))!;
    let next = current === hashes.get(contentA) ? contentB : contentA;
    // A fixed-seed linear congruential generator (Numerical Recipes constants), so a failure
    // can be replayed; the seed is printed in the label of every kill.
    const start = Number(process.env.STOVECARD_FAULT_SEED ?? 20261202);
    let seed = start;
    const random = () => (seed = (seed * 1664525 + 1013904223) >>> 0) / 2 ** 32;
    for (let i = 0; i < 10; i++) {
      current = await killedBuild(next, current, { atMs: Math.round(random() * childBuildMs) });
      next = next === contentA ? contentB : contentA;
    }
    const clean = await build(out(), contentA);
    expect(clean.code, clean.stderr).toBe(0);
    expect(await treeHash(out())).toBe(hashes.get(contentA));
    expect(await leftovers(out())).toEqual([]);
  }, 240_000);
});
