/**
 * The top of a V8 CPU profile (`node --cpu-prof --import tsx …` writes *.cpuprofile):
 * self time by function and by where the code lives (generator/<folder>, a package in
 * node_modules, node internals), as shares of the sampled time.
 *
 *   npx tsx bench/profile-summary.ts <file.cpuprofile> [--top N]
 */
import { readFile } from 'node:fs/promises';

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

/** Self time per function and per place, largest first. */
export function summarise(profile: CpuProfile): { byFunction: ProfileRow[]; byPlace: ProfileRow[] } {
  const nodes = new Map(profile.nodes.map((node) => [node.id, node]));
  const selfUs = new Map<number, number>();
  profile.samples.forEach((id, i) => {
    selfUs.set(id, (selfUs.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0));
  });
  const total = [...selfUs.values()].reduce((a, b) => a + b, 0);
  const byFunction = new Map<string, number>();
  const byPlace = new Map<string, number>();
  for (const [id, us] of selfUs) {
    const frame = nodes.get(id)!.callFrame;
    const place = placeOf(frame.url, frame.functionName);
    const name = `${frame.functionName || '(anonymous)'} ${place}:${frame.lineNumber + 1}`;
    byFunction.set(name, (byFunction.get(name) ?? 0) + us);
    byPlace.set(place, (byPlace.get(place) ?? 0) + us);
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
    .map((r) => `  ${(r.share * 100).toFixed(1).padStart(5)} %  ${r.ms.toFixed(0).padStart(7)} ms  ${r.name}`);
  return [title, ...lines].join('\n');
}

async function main(argv: readonly string[]): Promise<void> {
  const file = argv.find((a) => !a.startsWith('--'));
  if (!file) throw new Error('usage: profile-summary <file.cpuprofile> [--top N]');
  const topAt = argv.indexOf('--top');
  const top = topAt >= 0 ? Number(argv[topAt + 1]) : 25;
  const profile = JSON.parse(await readFile(file, 'utf8')) as CpuProfile;
  const { byFunction, byPlace } = summarise(profile);
  process.stdout.write(`${table('self time by place', byPlace, top)}\n\n`);
  process.stdout.write(`${table('self time by function', byFunction, top)}\n`);
}

if (import.meta.url === `file://${process.argv[1]}`) await main(process.argv.slice(2));
