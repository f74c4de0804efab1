/**
 * The top of V8 CPU profiles (`node --cpu-prof --import tsx …` writes one *.cpuprofile
 * per thread, workers included): self time by function and by where the code lives (a
 * generator/ file, a package in node_modules, node internals), as shares of the sampled
 * time, summed over every profile given (files, or folders of them). Idle time is left
 * out of the shares.
 *
 *   npx tsx bench/profile-summary.ts <file.cpuprofile | folder>... [--top N]
 */
import { readdir, readFile, stat } from 'node:fs/promises';
import path from 'node:path';

interface ProfileNode {
  readonly id: number;
  readonly callFrame: {
    readonly functionName: string;
    readonly url: string;
    readonly lineNumber: number;
  };
  readonly children?: readonly number[];
}

interface CpuProfile {
  readonly nodes: readonly ProfileNode[];
  readonly samples: readonly number[];
  readonly timeDeltas: readonly number[];
}

export interface ProfileRow {
  readonly name: string;
  readonly ms: number;
  readonly share: number;
}

/** Where a script lives: "generator/brew/simulate.ts", "node_modules/pdfkit", "node:internal", "(program)". */
export function placeOf(url: string, functionName: string): string {
  if (url === '') return functionName.startsWith('(') ? functionName : '(native)';
  const modules = /node_modules\/((?:@[^/]+\/)?[^/]+)/.exec(url);
  if (modules) return `node_modules/${modules[1]}`;
  const own = /\/((?:generator|bench|tests)\/.+?)(?:\?.*)?$/.exec(url);
  if (own) return own[1]!;
  if (url.startsWith('node:')) return 'node:internal';
  return url;
}

/** Self time per function and per place, largest first, over all the profiles. */
export function summarise(profiles: readonly CpuProfile[]): {
  byFunction: ProfileRow[];
  byPlace: ProfileRow[];
} {
  const byFunction = new Map<string, number>();
  const byPlace = new Map<string, number>();
  let total = 0;
  for (const profile of profiles) {
    const nodes = new Map(profile.nodes.map((node) => [node.id, node]));
    profile.samples.forEach((id, i) => {
      const us = profile.timeDeltas[i] ?? 0;
      const frame = nodes.get(id)!.callFrame;
      if (frame.functionName === '(idle)') return;
      const place = placeOf(frame.url, frame.functionName);
      const name = `${frame.functionName || '(anonymous)'} ${place}:${frame.lineNumber + 1}`;
      byFunction.set(name, (byFunction.get(name) ?? 0) + us);
      byPlace.set(place, (byPlace.get(place) ?? 0) + us);
      total += us;
    });
  }
  const rows = (map: Map<string, number>): ProfileRow[] =>
    [...map.entries()]
      .map(([name, us]) => ({ name, ms: us / 1000, share: total > 0 ? us / total : 0 }))
      .sort((a, b) => b.ms - a.ms);
  return { byFunction: rows(byFunction), byPlace: rows(byPlace) };
}

function table(title: string, rows: readonly ProfileRow[], top: number): string {
  const lines = rows
    .slice(0, top)
    .map(
      (r) =>
        `  ${(r.share * 100).toFixed(1).padStart(5)} %  ${r.ms.toFixed(0).padStart(7)} ms  ${r.name}`,
    );
  return [title, ...lines].join('\n');
}

async function profileFiles(target: string): Promise<string[]> {
  if (!(await stat(target)).isDirectory()) return [target];
  const names = (await readdir(target)).filter((name) => name.endsWith('.cpuprofile'));
  return names.sort().map((name) => path.join(target, name));
}

async function main(argv: readonly string[]): Promise<void> {
  const topAt = argv.indexOf('--top');
  const top = topAt >= 0 ? Number(argv[topAt + 1]) : 25;
  const targets = argv.filter((a, i) => !a.startsWith('--') && (topAt < 0 || i !== topAt + 1));
  if (targets.length === 0) {
    throw new Error('usage: profile-summary <file.cpuprofile | folder>... [--top N]');
  }
  const files = (await Promise.all(targets.map(profileFiles))).flat();
  const profiles = await Promise.all(
    files.map(async (file) => JSON.parse(await readFile(file, 'utf8')) as CpuProfile),
  );
  const { byFunction, byPlace } = summarise(profiles);
  process.stdout.write(`${files.length} profiles\n`);
  process.stdout.write(`${table('self time by place', byPlace, top)}\n\n`);
  process.stdout.write(`${table('self time by function', byFunction, top)}\n`);
}

if (import.meta.url === `file://${process.argv[1]}`) await main(process.argv.slice(2));
