/**
 * Building beside the output and swapping it in, so that `<out>` names a whole site at
 * every instant: the last good build or the new one, never half of each, never nothing.
 *
 *   <out>                    a symbolic link to the current version: `<base>.v-<pid>-<n>`
 *   <base>.v-<pid>-<n>/      a whole site (holds SITE_MARKER, written first)
 *   <base>.tmp-<pid>-<n>/    the build writing; renamed to a version when it is done
 *   <base>.link-<pid>-<n>    the next link, renamed over <out> (one atomic rename(2))
 *   <base>.old-<pid>/        a plain-folder site being replaced by the first link
 *
 * rename(2) of a folder over a non-empty folder fails, and Node has no exchange, so the
 * only atomic flip of a whole tree is a link renamed over a link. A plain `<out>` folder
 * an earlier build made (it holds the marker) becomes a link once: it is renamed to
 * `<base>.old-<pid>` and the link renamed in; a kill between those two renames (the only
 * instant without `<out>`) is undone by the next build, which renames the old folder back
 * before anything else (recoverLeftovers).
 *
 * `<out>` that is a link someone else made (to anywhere but one of our versions) is kept:
 * the build replaces what it points to, under the target's name.
 *
 * What a build leaves when it is killed (`.tmp-`, `.link-`, `.old-` and unused `.v-` names
 * of a process that no longer runs, holding the marker or empty) is removed by the next.
 *
 * Faults for the tests: STOVECARD_FAULT_AT=<point> kills the process (SIGKILL) at one of
 * FAULT_POINTS, so a test can stop the build between any two steps of the swap.
 */
import {
  lstat,
  mkdir,
  readdir,
  readlink,
  rename,
  rm,
  rmdir,
  stat,
  symlink,
  writeFile,
} from 'node:fs/promises';
import path from 'node:path';

/** The file every site the build makes holds at its root: its presence marks our folder. */
export const SITE_MARKER = '.stovecard-site';
export const SITE_MARKER_TEXT =
  'This folder is a site made by `stovecard build`; the next build replaces it whole.\n';

export const FAULT_POINTS = [
  'swap:start',
  'swap:versioned',
  'swap:linked',
  'swap:moved-old',
  'swap:flipped',
  'swap:cleaned',
] as const;
export type FaultPoint = (typeof FAULT_POINTS)[number];

export function faultPoint(point: FaultPoint): void {
  if (process.env.STOVECARD_FAULT_AT === point) process.kill(process.pid, 'SIGKILL');
}

/** Why `<out>` may not be replaced (the words are cli's: buildWords). */
export class OutFolderError extends Error {
  override readonly name = 'OutFolderError';
  constructor(
    readonly code: 'not-a-folder' | 'not-a-site' | 'link-loop',
    readonly folder: string,
  ) {
    super(`${code}: ${folder}`);
  }
}

let sequence = 0;
const next = () => `${process.pid}-${Date.now().toString(36)}${(sequence++).toString(36)}`;

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** `<base>.<kind>-<pid>…` names of our own folders and links beside `<out>`. */
function ownName(base: string): RegExp {
  return new RegExp(`^${escapeRegExp(base)}\\.(tmp|v|link|old)-(\\d+)(?:-[0-9a-z]+)?$`);
}

function isOurVersionLink(out: string, target: string): boolean {
  const match = ownName(path.basename(out)).exec(target);
  return match !== null && match[1] === 'v';
}

async function lstatOrNull(p: string) {
  try {
    return await lstat(p);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
}

/**
 * The path the build manages for `outDir`: itself, unless it is a link someone else made,
 * whose target (followed, at most 16 deep) is managed instead.
 */
export async function resolveOut(outDir: string): Promise<string> {
  let out = path.resolve(outDir);
  for (let depth = 0; depth < 16; depth++) {
    const info = await lstatOrNull(out);
    if (!info?.isSymbolicLink()) return out;
    const target = await readlink(out);
    if (isOurVersionLink(out, target)) return out;
    out = path.resolve(path.dirname(out), target);
  }
  throw new OutFolderError('link-loop', outDir);
}

async function holdsMarker(dir: string): Promise<boolean> {
  try {
    return (await stat(path.join(dir, SITE_MARKER))).isFile();
  } catch {
    return false;
  }
}

/** Throws OutFolderError unless `out` (resolved) is absent, empty, ours, or our link. */
export async function checkReplaceable(out: string): Promise<void> {
  const info = await lstatOrNull(out);
  if (info === null) return;
  if (info.isSymbolicLink()) return; // resolveOut returned it: it is our version link
  if (!info.isDirectory()) throw new OutFolderError('not-a-folder', out);
  if (await holdsMarker(out)) return;
  if ((await readdir(out)).length === 0) return;
  throw new OutFolderError('not-a-site', out);
}

function processRuns(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

async function currentVersion(out: string): Promise<string | null> {
  try {
    return await readlink(out);
  } catch {
    return null;
  }
}

/**
 * Puts back a plain-folder site a killed build had moved aside, and removes what killed
 * builds left beside `<out>`. Returns the names removed. Failures to remove are ignored
 * (they cost disk space, never the site).
 */
export async function recoverLeftovers(out: string): Promise<string[]> {
  const dir = path.dirname(out);
  const pattern = ownName(path.basename(out));
  let names: string[];
  try {
    names = await readdir(dir);
  } catch {
    return [];
  }
  // A version of this process that is not current is an orphan too: its swap removes the
  // previous version right after the flip, and a build killed after another's flip did not.
  const dead = names
    .map((name) => ({ name, match: pattern.exec(name) }))
    .filter(
      ({ match }) =>
        match !== null &&
        (!processRuns(Number(match[2])) || (match[1] === 'v' && Number(match[2]) === process.pid)),
    );
  if ((await lstatOrNull(out)) === null) {
    // Killed between the two renames of a folder-to-link change: the old site goes back.
    const old = dead.find(({ match }) => match![1] === 'old');
    if (old && (await holdsMarker(path.join(dir, old.name)))) {
      await rename(path.join(dir, old.name), out);
      old.match = null;
    }
  }
  const current = await currentVersion(out);
  const removed: string[] = [];
  for (const { name, match } of dead) {
    if (match === null || name === current) continue;
    const full = path.join(dir, name);
    try {
      const info = await lstat(full);
      if (info.isSymbolicLink()) await rm(full);
      else if (info.isDirectory()) {
        if (!(await holdsMarker(full)) && (await readdir(full)).length > 0) continue;
        await rm(full, { recursive: true, force: true });
      } else continue;
      removed.push(name);
    } catch {
      // Read-only or gone: left for a person, or already removed by another build.
    }
  }
  return removed;
}

/** A fresh folder beside `out` (resolved) for the build to write into, marker first. */
export async function freshTempDir(out: string): Promise<string> {
  const tmp = path.join(path.dirname(out), `${path.basename(out)}.tmp-${next()}`);
  await mkdir(tmp, { recursive: true });
  await writeFile(path.join(tmp, SITE_MARKER), SITE_MARKER_TEXT);
  return tmp;
}

/** What the swap did, for the build's report. */
export interface SwapReport {
  /** The version folder `<out>` now links to. */
  readonly version: string;
  /** The previous site (a version folder or a plain folder), or null when there was none. */
  readonly previous: string | null;
  /** The previous site when it could not be removed (the new one is in place regardless). */
  readonly notRemoved: { readonly folder: string; readonly code: string } | null;
}

/**
 * Puts `tmpDir` in place of `out` (resolved by resolveOut): renames it to a version, links
 * `<out>` to it with one rename, then removes the previous site. When the previous site
 * cannot be removed (read-only), the new site is in place all the same and the report
 * says which folder was left.
 */
export async function swapIn(tmpDir: string, out: string): Promise<SwapReport> {
  faultPoint('swap:start');
  const dir = path.dirname(out);
  const base = path.basename(out);
  const id = next();
  const versionName = `${base}.v-${id}`;
  await rename(tmpDir, path.join(dir, versionName));
  faultPoint('swap:versioned');
  const link = path.join(dir, `${base}.link-${id}`);
  await symlink(versionName, link);
  faultPoint('swap:linked');
  const info = await lstatOrNull(out);
  let previous: string | null = null;
  try {
    if (info?.isSymbolicLink()) {
      const target = await readlink(out);
      previous = path.resolve(dir, target);
      await rename(link, out);
    } else if (info?.isDirectory()) {
      // A plain folder (ours or empty: checkReplaceable): moved aside, the link put in.
      previous = path.join(dir, `${base}.old-${process.pid}`);
      await rm(previous, { recursive: true, force: true });
      await rename(out, previous);
      faultPoint('swap:moved-old');
      try {
        await rename(link, out);
      } catch (error) {
        await rename(previous, out);
        throw error;
      }
    } else {
      await rename(link, out);
    }
  } catch (error) {
    await rm(link, { force: true });
    await rm(path.join(dir, versionName), { recursive: true, force: true });
    throw error;
  }
  faultPoint('swap:flipped');
  let notRemoved: SwapReport['notRemoved'] = null;
  if (previous !== null) {
    try {
      if ((await readdir(previous)).length === 0) await rmdir(previous);
      else await rm(previous, { recursive: true });
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code ?? 'EIO';
      if (code !== 'ENOENT') notRemoved = { folder: previous, code };
    }
  }
  faultPoint('swap:cleaned');
  return { version: path.join(dir, versionName), previous, notRemoved };
}

export async function discard(tmpDir: string): Promise<void> {
  await rm(tmpDir, { recursive: true, force: true });
}
