/**
 * Plans cached on disk, one JSON file per pot × coffee × stove × room × code version:
 * `<cacheDir>/plans/<key>.json`. The key is sha256 over the three entries (their file
 * hashes and the SI models the loader made of them, so a change of loader defaults also
 * re-plans), the site's room and kettle presets, and the plan code version
 * (code-version.ts). Plans are plain data; non-finite numbers (NaN when a cold start
 * delivers nothing) are written as tagged objects so they come back as numbers.
 */
import { createHash } from 'node:crypto';
import path from 'node:path';
import type { CoffeeEntry, PotEntry, SiteEntry, StoveEntry } from '../content/types.ts';
import type { CardPlan } from '../planning/types.ts';
import { FileCache } from './file-cache.ts';

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

/** JSON of plain data, with non-finite numbers as tagged objects (JSON has none). */
export function toTaggedJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    typeof v === 'number' && !Number.isFinite(v) ? { [NON_FINITE]: String(v) } : v,
  );
}

/** The inverse of toTaggedJson (text without a tagged number parses without a reviver). */
export function fromTaggedJson<T>(text: string): T {
  if (!text.includes(NON_FINITE)) return JSON.parse(text) as T;
  return JSON.parse(text, (_key, v: unknown) => {
    if (v && typeof v === 'object' && NON_FINITE in v && Object.keys(v).length === 1) {
      return Number((v as Record<string, string>)[NON_FINITE]);
    }
    return v;
  }) as T;
}

export function planToJson(plan: CardPlan): string {
  return toTaggedJson(plan);
}

export function planFromJson(text: string): CardPlan {
  return fromTaggedJson<CardPlan>(text);
}

export class PlanCache {
  readonly dir: string;
  private readonly files: FileCache;

  constructor(cacheDir: string) {
    this.dir = path.join(cacheDir, 'plans');
    this.files = new FileCache(this.dir, '.json');
  }

  /** The cached plan, or null when absent or unreadable (a damaged file is re-planned). */
  async get(key: string): Promise<CardPlan | null> {
    const text = await this.files.getText(key);
    if (text === null) return null;
    try {
      return planFromJson(text);
    } catch {
      return null;
    }
  }

  async has(key: string): Promise<boolean> {
    return this.files.has(key);
  }

  /** The cached planToJson text, unparsed (null when absent). */
  getText(key: string): Promise<string | null> {
    return this.files.getText(key);
  }

  getTextSync(key: string): string | null {
    return this.files.getTextSync(key);
  }

  async put(key: string, plan: CardPlan): Promise<void> {
    await this.putJson(key, planToJson(plan));
  }

  /** A plan already as planToJson text (as the worker pool returns it). */
  async putJson(key: string, json: string): Promise<void> {
    await this.files.put(key, json);
  }
}
