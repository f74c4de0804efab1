/**
 * content/site.yaml → SiteEntry: the business, print settings and room, and the card sets
 * expanded into the pot × coffee × stove cards the planner plans. Needs the ids of the
 * catalogue's files to check references and to expand "every coffee with every pot".
 */
import { createHash } from 'node:crypto';
import type { Brand, BrandYaml } from './brand.ts';
import { message } from './messages.ts';
import type { Checked, ValidFile } from './entry-file.ts';
import type { ContentIssue } from './issues.ts';
import { unknownIdIssues, type KnownIds, type ReferencedKind } from './references.ts';
import type { CardRequest, CardSet, PaperSize, SheetUp, SiteEntry, UnitSystem } from './types.ts';
import { celsiusToK, fahrenheitToK } from './units.ts';
import {
  fieldName,
  issueAt,
  positionAt,
  refAt,
  type YamlPath,
  type YamlSource,
} from './yaml-source.ts';

interface CardYaml {
  readonly pot?: string;
  readonly coffee?: string;
  readonly stove: string;
  readonly every_coffee_with_every_pot?: boolean;
}

interface SetYaml {
  readonly id: string;
  readonly title: string;
  readonly layout: 'station' | 'insert' | 'binder';
  readonly language?: string;
  readonly include_refused?: boolean;
  readonly paper?: PaperSize;
  readonly sheet?: { readonly paper: PaperSize; readonly up: SheetUp };
  readonly cards?: readonly CardYaml[];
  readonly coffees?: readonly string[];
  readonly pots?: readonly string[];
  readonly stoves?: readonly string[];
}

/** site.yaml as written, once it matches schemas/site.schema.json. */
export interface SiteYaml {
  readonly business: { readonly name: string; readonly contact: string };
  readonly language?: string;
  readonly units: UnitSystem;
  readonly paper: PaperSize;
  readonly kettle_presets_c?: readonly number[];
  readonly kettle_presets_f?: readonly number[];
  readonly room: { readonly ambient_c: number; readonly altitude_m?: number };
  readonly base_url?: string;
  readonly brand?: BrandYaml;
  readonly sets: readonly SetYaml[];
}

/** Cards of one set, with the issues found while reading them. */
interface Expanded {
  readonly cards: readonly CardRequest[];
  /** Cards from `every_coffee_with_every_pot`, left out when refused (unless include_refused). */
  readonly expanded: readonly CardRequest[];
  readonly coffeeIds: readonly string[];
  readonly issues: readonly ContentIssue[];
}

function referenceIssues(
  source: YamlSource,
  path: YamlPath,
  kind: ReferencedKind,
  ids: readonly string[],
  known: KnownIds,
): ContentIssue[] {
  return ids.flatMap((id, index) => unknownIdIssues(source, [...path, index], kind, id, known));
}

function keysNotFor(
  source: YamlSource,
  path: YamlPath,
  set: SetYaml,
  keys: readonly (keyof SetYaml)[],
): ContentIssue[] {
  const belongsTo = set.layout === 'insert' ? 'station' : 'insert';
  return keys
    .filter((key) => set[key] !== undefined)
    .map((key) =>
      issueAt(
        source,
        [...path, key],
        'layout',
        message('keyNotForLayout', key, set.layout, belongsTo),
        'key',
      ),
    );
}

/** Every coffee with every pot on one stove, sorted by pot then coffee (known ids are sorted). */
function everyCoffeeWithEveryPot(stoveId: string, known: KnownIds): CardRequest[] {
  return known.pot.flatMap((potId) =>
    known.coffee.map((coffeeId) => ({ potId, coffeeId, stoveId })),
  );
}

function stationCards(source: YamlSource, path: YamlPath, set: SetYaml, known: KnownIds): Expanded {
  const issues = keysNotFor(source, path, set, ['coffees', 'pots', 'stoves']);
  if (set.cards === undefined) {
    const example = '`cards:` with `- { pot: …, coffee: …, stove: … }` lines';
    return {
      cards: [],
      expanded: [],
      coffeeIds: [],
      issues: [
        ...issues,
        issueAt(source, path, 'layout', message('missingForLayout', 'cards', set.layout, example)),
      ],
    };
  }
  const cards: CardRequest[] = [];
  const expanded: CardRequest[] = [];
  const firstLineOf = new Map<string, number>();
  set.cards.forEach((card, index) => {
    const at = [...path, 'cards', index];
    issues.push(...unknownIdIssues(source, [...at, 'stove'], 'stove', card.stove, known));
    let requests: CardRequest[] = [];
    if (card.every_coffee_with_every_pot === true) {
      if (card.pot !== undefined || card.coffee !== undefined) {
        issues.push(issueAt(source, at, 'layout', message('cardMixesForms')));
      }
      requests = everyCoffeeWithEveryPot(card.stove, known);
    } else if (card.every_coffee_with_every_pot === false) {
      issues.push(
        issueAt(
          source,
          [...at, 'every_coffee_with_every_pot'],
          'bad-value',
          message('everyFlagFalse'),
        ),
      );
    } else if (card.pot === undefined || card.coffee === undefined) {
      issues.push(issueAt(source, at, 'missing-key', message('cardNeedsPotAndCoffee')));
    } else {
      issues.push(...unknownIdIssues(source, [...at, 'pot'], 'pot', card.pot, known));
      issues.push(...unknownIdIssues(source, [...at, 'coffee'], 'coffee', card.coffee, known));
      requests = [{ potId: card.pot, coffeeId: card.coffee, stoveId: card.stove }];
    }
    const line = positionAt(source, at).line;
    for (const request of requests) {
      const key = `${request.potId}|${request.coffeeId}|${request.stoveId}`;
      const firstLine = firstLineOf.get(key);
      if (firstLine === undefined) {
        firstLineOf.set(key, line);
        cards.push(request);
        if (card.every_coffee_with_every_pot === true) expanded.push(request);
      } else {
        const wording = message(
          'repeatedCard',
          request.potId,
          request.coffeeId,
          request.stoveId,
          firstLine,
        );
        issues.push(issueAt(source, at, 'repeated', wording));
      }
    }
  });
  const coffeeIds = [...new Set(cards.map((card) => card.coffeeId))];
  return { cards, expanded, coffeeIds, issues };
}

function insertCards(source: YamlSource, path: YamlPath, set: SetYaml, known: KnownIds): Expanded {
  const issues = keysNotFor(source, path, set, ['cards', 'include_refused']);
  if (set.coffees === undefined) {
    const example = '`coffees: [house-blend, …]`';
    issues.push(
      issueAt(source, path, 'layout', message('missingForLayout', 'coffees', 'insert', example)),
    );
  }
  const coffeeIds = set.coffees ?? [];
  const potIds = set.pots ?? known.pot;
  const stoveIds = set.stoves ?? known.stove;
  issues.push(
    ...referenceIssues(source, [...path, 'coffees'], 'coffee', coffeeIds, known),
    ...referenceIssues(source, [...path, 'pots'], 'pot', set.pots ?? [], known),
    ...referenceIssues(source, [...path, 'stoves'], 'stove', set.stoves ?? [], known),
  );
  const cards = coffeeIds.flatMap((coffeeId) =>
    potIds.flatMap((potId) => stoveIds.map((stoveId) => ({ potId, coffeeId, stoveId }))),
  );
  return { cards, expanded: [], coffeeIds, issues };
}

/** The kettle presets in K, ascending, from °C or °F (the schema allows one of the two). */
function kettlePresetsK(data: SiteYaml): number[] {
  const fromF = (data.kettle_presets_f ?? []).map(fahrenheitToK);
  return [...(data.kettle_presets_c ?? []).map(celsiusToK), ...fromF].sort((a, b) => a - b);
}

/** The language of a site or set that names none. */
export const DEFAULT_LANGUAGE = 'en';

export function buildSite(file: ValidFile<SiteYaml>, known: KnownIds): Checked<SiteEntry> {
  const { data, source } = file;
  const issues: ContentIssue[] = [];
  const firstLineOf = new Map<string, number>();
  const sets: CardSet[] = data.sets.map((set, index) => {
    const path = ['sets', index];
    const firstLine = firstLineOf.get(set.id);
    if (firstLine === undefined) firstLineOf.set(set.id, positionAt(source, [...path, 'id']).line);
    else
      issues.push(
        issueAt(source, [...path, 'id'], 'repeated', message('repeatedSetId', set.id, firstLine)),
      );
    const expanded = (set.layout === 'insert' ? insertCards : stationCards)(
      source,
      path,
      set,
      known,
    );
    issues.push(...expanded.issues);
    return {
      id: set.id,
      title: set.title,
      // A binder is a station set with the training front matter in its PDF.
      layout: set.layout === 'insert' ? 'insert' : 'station',
      binder: set.layout === 'binder',
      paper: set.paper ?? data.paper,
      sheet:
        set.sheet === undefined
          ? null
          : {
              paper: set.sheet.paper,
              up: set.sheet.up,
              source: refAt(source, [...path, 'sheet']),
              field: fieldName([...path, 'sheet']),
            },
      language: set.language ?? data.language ?? DEFAULT_LANGUAGE,
      cards: expanded.cards,
      leaveOutIfRefused: set.include_refused === true ? [] : expanded.expanded,
      coffeeIds: expanded.coffeeIds,
      source: refAt(source, path),
    };
  });
  if (data.base_url !== undefined) {
    const problem = baseUrlProblem(data.base_url);
    if (problem !== null)
      issues.push(
        issueAt(source, ['base_url'], 'bad-value', message('badBaseUrl', problem, MAX_BASE_URL)),
      );
  }
  if (issues.length > 0) return { issues };
  const baseUrl =
    data.base_url === undefined || data.base_url.endsWith('/')
      ? data.base_url
      : `${data.base_url}/`;
  const entry: SiteEntry = {
    kind: 'site',
    source: refAt(source, []),
    hash: file.hash,
    business: { name: data.business.name, contact: data.business.contact },
    language: data.language ?? DEFAULT_LANGUAGE,
    units: data.units,
    paper: data.paper,
    kettlePresetsK: kettlePresetsK(data),
    room: { ambientK: celsiusToK(data.room.ambient_c), altitudeM: data.room.altitude_m ?? 0 },
    baseUrl,
    sets,
  };
  return { value: entry, issues: [] };
}

/**
 * The site with its brand. The entry's hash then covers the logo's bytes too, so every cache
 * keyed by the site (views, pages, PDFs) notices a new logo, not only a new site.yaml.
 */
export function withBrand(site: SiteEntry, brand: Brand): SiteEntry {
  const hash = createHash('sha256')
    .update(`${site.hash}|${brand.logo?.sha256 ?? ''}|${brand.colour ?? ''}`)
    .digest('hex');
  return { ...site, hash, brand };
}

/**
 * At most this many characters: a card's address adds `cards/<pot>--<coffee>--<stove>/`,
 * and the QR code of a longer address needs more, smaller modules on the same 13 mm.
 */
export const MAX_BASE_URL = 100;

export type BaseUrlProblem =
  'not-a-url' | 'scheme' | 'query' | 'fragment' | 'credentials' | 'too-long';

/**
 * What is wrong with a base address, or null. A `?query` or `#fragment` would follow every
 * card's path (so every QR code would open the same page); user:password would be printed.
 */
export function baseUrlProblem(raw: string): BaseUrlProblem | null {
  if (raw.length > MAX_BASE_URL) return 'too-long';
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    return 'not-a-url';
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') return 'scheme';
  if (raw.includes('?')) return 'query';
  if (raw.includes('#')) return 'fragment';
  if (url.username !== '' || url.password !== '') return 'credentials';
  return null;
}
