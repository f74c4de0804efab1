/**
 * Plans cached on disk, one JSON file per pot × coffee × stove × room × code version:
 * `<cacheDir>/plans/<key>.json`. The key is sha256 over the three entries (their file
 * hashes and the SI models the loader made of them, so a change of loader defaults also
 * re-plans), the site's room and kettle presets, and the plan code version
 * (code-version.ts). Plans are plain data; non-finite numbers (NaN when a cold start
 * delivers nothing) are written as tagged objects so they come back as numbers.
 */
import { createHash } from 'node:crypto';
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { CoffeeEntry, PotEntry, SiteEntry, StoveEntry } from '../content/types.ts';
import type { CardPlan } from '../planning/types.ts';

/** Bumped when the cache file layout changes. */
const CACHE_FORMAT = 1;

/** JSON with object keys sorted, so equal data hashes equally whatever the key order. */
export function stableJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) => {
    if (v && typeof v === 'object' && !Array.isArray(v)) {
      return Object.fromEntries(
        Object.entries(v as Record<string, unknown>).sort(([a], [b]) =>
          a < b ? -1 : a > b ? 1 : 0,
        ),
      );
    }
    return v;
  });
}

export interface PlanKeyInput {
  readonly pot: PotEntry;
  readonly coffee: CoffeeEntry;
  readonly stove: StoveEntry;
  readonly site: Pick<SiteEntry, 'room' | 'kettlePresetsK'>;
  readonly codeVersion: string;
}

/** What identifies an entry for planning: its file hash and its SI content (not its place). */
function entryIdentity(entry: PotEntry | CoffeeEntry | StoveEntry): unknown {
  const { source: _source, ...rest } = entry;
  return rest;
}

export function planKey(input: PlanKeyInput): string {
  return createHash('sha256')
    .update(
      stableJson({
        format: CACHE_FORMAT,
        pot: entryIdentity(input.pot),
        coffee: entryIdentity(input.coffee),
        stove: entryIdentity(input.stove),
        room: input.site.room,
        kettlePresetsK: input.site.kettlePresetsK,
        code: input.codeVersion,
      }),
    )
    .digest('hex');
}

const NON_FINITE = '$nonFinite';

export function planToJson(plan: CardPlan): string {
  return JSON.stringify(plan, (_key, v: unknown) =>
    typeof v === 'number' && !Number.isFinite(v) ? { [NON_FINITE]: String(v) } : v,
  );
}

export function planFromJson(text: string): CardPlan {
  return JSON.parse(text, (_key, v: unknown) => {
    if (v && typeof v === 'object' && NON_FINITE in v && Object.keys(v).length === 1) {
      return Number((v as Record<string, string>)[NON_FINITE]);
    }
    return v;
  }) as CardPlan;
}

export class PlanCache {
  readonly dir: string;

  constructor(cacheDir: string) {
    this.dir = path.join(cacheDir, 'plans');
  }

  private file(key: string): string {
    return path.join(this.dir, `${key}.json`);
  }

  /** The cached plan, or null when absent or unreadable (a damaged file is re-planned). */
  async get(key: string): Promise<CardPlan | null> {
    try {
      return planFromJson(await readFile(this.file(key), 'utf8'));
    } catch {
      return null;
    }
  }

  /** Written to a temporary name and renamed, so a crash never leaves half a file. */
  async put(key: string, plan: CardPlan): Promise<void> {
    await mkdir(this.dir, { recursive: true });
    const tmp = `${this.file(key)}.tmp-${process.pid}`;
    await writeFile(tmp, planToJson(plan));
    await rename(tmp, this.file(key));
  }
}
