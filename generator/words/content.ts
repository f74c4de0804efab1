/**
 * User-facing words of the content layer: every problem found in a YAML file and how to fix
 * it, written for the barista, roaster or trainer who edits the file. Each factory returns
 * a problem (no final full stop) and a fix (a whole sentence); `issueLine` joins them as
 * `pots/three-cup.yaml:12:5 base.valve_height_mm — <problem>. <fix>`.
 * Tests assert through these same factories, so the wording can change here alone.
 */

import type {
  ContentKindName,
  ContentMessage,
  ContentMessageArgs,
  ContentMessageKey,
  LogoFound,
  ValueSpec,
} from '../content/messages.ts';

export type { ValueSpec } from '../content/messages.ts';
import { escapeUnsafe, SHOWN_MAX, shown as shownText } from './shown.ts';

export interface Wording {
  readonly problem: string;
  readonly fix: string;
}

/** Where an issue is and what it says (generator/content/issues.ts ContentIssue). */
interface IssueAt {
  readonly file: string;
  readonly line: number;
  readonly column: number;
  readonly field: string;
  readonly message: ContentMessage;
}

type LengthUnit = 'mm' | 'in';

/** A length as the person wrote it: "32 mm", "1.26 in"; `digits` fixes the decimals of a computed one. */
function len(value: number, unit: LengthUnit, digits?: number): string {
  const shown =
    digits === undefined ? String(value) : value.toFixed(unit === 'in' ? digits + 2 : digits);
  return `${shown} ${unit}`;
}

interface UnitWords {
  /** What follows "a number": " of millimetres". */
  readonly ofUnit: string;
  /** The unit after a range in a fix ("between 5 and 200 millimetres"); '' for a share. */
  readonly plural: string;
  /** How people write the unit after a number, lower case, for "32mm" → "write 32". */
  readonly written: readonly string[];
}

function unitWords(plural: string, written: readonly string[]): UnitWords {
  return { ofUnit: ` of ${plural}`, plural, written };
}

const UNITS: Readonly<Record<string, UnitWords>> = {
  mL: unitWords('millilitres', ['ml', 'millilitre', 'millilitres', 'milliliter', 'milliliters']),
  mm: unitWords('millimetres', ['mm', 'millimetre', 'millimetres', 'millimeter', 'millimeters']),
  in: unitWords('inches', ['in', 'inch', 'inches', '"']),
  '°F': unitWords('degrees Fahrenheit', ['f', '°f', 'ºf', 'degf', 'fahrenheit']),
  g: unitWords('grams', ['g', 'gr', 'gram', 'grams']),
  bar: unitWords('bar (gauge)', ['bar', 'bars']),
  'W/K': unitWords('watts per kelvin', ['w/k']),
  'm²': unitWords('square metres', ['m2', 'm²', 'm^2']),
  'g/mL': unitWords('grams per millilitre', ['g/ml', 'g/cc', 'g/cm3', 'g/cm³']),
  'g/g': unitWords('grams of water per gram of coffee', ['g/g']),
  '°C': unitWords('degrees Celsius', ['c', '°c', 'ºc', 'degc', 'celsius']),
  s: unitWords('seconds', ['s', 'sec', 'secs', 'second', 'seconds']),
  W: unitWords('watts', ['w', 'watt', 'watts']),
  m: unitWords('metres', ['m', 'metre', 'metres', 'meter', 'meters']),
  share: { ofUnit: ' (a share: 0.38 means 38 %)', plural: '', written: [] },
};

const CONTENT_KINDS: Record<ContentKindName, { readonly one: string; readonly folder: string }> = {
  pot: { one: 'pot', folder: 'pots' },
  coffee: { one: 'coffee', folder: 'coffees' },
  stove: { one: 'stove', folder: 'stoves' },
  log: { one: 'brew log', folder: 'logs' },
  site: { one: 'site', folder: '' },
};

const code = (text: string): string => `\`${text}\``;

function list(items: readonly string[]): string {
  return items.map(code).join(', ');
}

function kindWord(kindName: ContentKindName): string {
  return CONTENT_KINDS[kindName].one;
}

function inParent(parentField: string): string {
  return parentField === '' ? 'at the top level of the file' : `under ${code(parentField)}`;
}

/** A value as YAML flow text, the way it would be written in a file: `{ pot: three-cup }`. */
function showExample(example: unknown): string {
  if (Array.isArray(example)) return `[${example.map(showExample).join(', ')}]`;
  if (example !== null && typeof example === 'object') {
    const pairs = Object.entries(example).map(([key, value]) => `${key}: ${showExample(value)}`);
    return `{ ${pairs.join(', ')} }`;
  }
  return String(example);
}

function rangeWords(spec: ValueSpec): string {
  const { minimum, maximum } = spec;
  if (minimum !== undefined && maximum !== undefined) return ` between ${minimum} and ${maximum}`;
  if (minimum !== undefined) return ` of at least ${minimum}`;
  if (maximum !== undefined) return ` of at most ${maximum}`;
  return '';
}

/** "a number of millimetres between 5 and 200", "one of `gas`, `radiant`", "true or false". */
export function expected(spec: ValueSpec): string {
  if (spec.allowed) return `one of ${list(spec.allowed)}`;
  switch (spec.type) {
    case 'number':
    case 'integer': {
      const base = spec.type === 'integer' ? 'a whole number' : 'a number';
      const ofUnit = spec.unit ? (UNITS[spec.unit]?.ofUnit ?? ` of ${spec.unit}`) : '';
      return `${base}${ofUnit}${rangeWords(spec)}`;
    }
    case 'string':
      return 'text';
    case 'boolean':
      return 'true or false';
    case 'array':
      if (spec.minItems !== undefined && spec.minItems === spec.maxItems) {
        return spec.minItems === 2
          ? 'a pair of values in square brackets'
          : `a list of ${spec.minItems} values`;
      }
      return spec.minItems
        ? `a list of at least ${spec.minItems} item${spec.minItems === 1 ? '' : 's'}`
        : 'a list';
    case 'object':
      return 'a mapping of keys (`key: value`, indented below it or written as `{ key: value }`)';
    default:
      return 'a value';
  }
}

/** How a wrong value reads in a message: the user's own text where it helps. */
export function shown(value: unknown, sourceText?: string): string {
  if (value === null || value === undefined) return 'nothing';
  if (typeof value === 'string') {
    // At most SHOWN_MAX characters, controls and bidi controls as escapes (words/shown.ts).
    const cut = value.length > SHOWN_MAX ? value.slice(0, SHOWN_MAX) : value;
    const rest = value.length - cut.length;
    return `${escapeUnsafe(JSON.stringify(cut))}${rest > 0 ? `…(+${rest} characters)` : ''}`;
  }
  if (typeof value === 'number')
    return sourceText === undefined ? String(value) : shownText(sourceText);
  if (typeof value === 'boolean') return String(value);
  if (Array.isArray(value)) return value.length === 0 ? 'an empty list' : 'a list';
  return 'a mapping';
}

/** `32mm` → 32 when the written unit is the one the key already names. */
function numberWithUnit(text: string, unit: string | undefined): number | undefined {
  const match = /^\s*([-+]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:e[-+]?\d+)?)\s*(.*?)\s*$/i.exec(text);
  if (!match?.[1]) return undefined;
  const number = Number(match[1].replace(',', '.'));
  const written = (match[2] ?? '').toLowerCase();
  if (!Number.isFinite(number)) return undefined;
  if (written === '') return number;
  if (unit === 'share' && written === '%') return number / 100;
  if (unit && UNITS[unit]?.written.includes(written)) return number;
  return undefined;
}

/** " millimetres" after a number or a range; '' when the value has no unit. */
function unitAfter(spec: ValueSpec): string {
  const plural = spec.unit ? (UNITS[spec.unit]?.plural ?? spec.unit) : '';
  return plural === '' ? '' : ` ${plural}`;
}

function exampleFix(spec: ValueSpec): string {
  if (spec.example === undefined) return '';
  return `, e.g. ${showExample(spec.example)}`;
}

/** One factory per content message key (generator/content/messages.ts): a missing one fails tsc. */
type MessageWords = {
  readonly [K in ContentMessageKey]: (...args: ContentMessageArgs[K]) => Wording;
};

const messageWords = {
  // ── Reading the file ────────────────────────────────────────────────────────────────

  fileTooLarge(sizeBytes: number, limitBytes: number): Wording {
    const mib = (bytes: number): string => `${(bytes / 1024 / 1024).toFixed(1)} MiB`;
    return {
      problem: `the file is ${mib(sizeBytes)}, more than the ${mib(limitBytes)} a content file may be`,
      fix: 'An entry needs a few hundred bytes: check that this is the right file, or split it.',
    };
  },

  notUtf8(): Wording {
    return {
      problem: 'the file is not valid UTF-8 text (an unreadable byte is here)',
      fix: 'Save it again as UTF-8 (most editors: "Save with encoding" → UTF-8) and retype any special characters near this place.',
    };
  },

  /** `reason`: the system's error code (ENOENT, EACCES, …) or its message. */
  unreadable(reason: string): Wording {
    const reasons: Readonly<Record<string, string>> = {
      ENOENT: 'there is no such file',
      EACCES: 'permission denied',
      EISDIR: 'it is a folder',
    };
    return {
      problem: `the file cannot be read (${reasons[reason] ?? reason})`,
      fix: 'Check that the file exists and that you may read it.',
    };
  },

  missingSiteFile(): Wording {
    return {
      problem: 'there is no site.yaml in the content folder',
      fix: 'Create site.yaml (see content/README.md): it names the business, the paper and the card sets.',
    };
  },

  badFileName(stem: string, suggestion: string): Wording {
    return {
      problem: `the file name ${code(stem)} is used as the entry's id, and ids may only hold lower-case letters, digits and hyphens`,
      fix: `Rename the file to ${code(suggestion)} (and write that id wherever it is referenced).`,
    };
  },

  sameIdTwice(id: string, otherFile: string): Wording {
    return {
      problem: `the id ${code(id)} is also the id of ${otherFile}`,
      fix: 'Keep one of the two files, or rename one of them.',
    };
  },

  // ── YAML syntax ─────────────────────────────────────────────────────────────────────

  yamlSyntax(detail: string, yamlCode: string): Wording {
    const fixes: Readonly<Record<string, string>> = {
      TAB_AS_INDENT: 'Indent with spaces, not tabs.',
      MULTIPLE_DOCS:
        'Keep one document per file: remove the second `---` and what follows, or move it to its own file.',
      MISSING_CHAR:
        'Close the quote or bracket that was opened, or add the missing colon after the key.',
    };
    return {
      problem: `the YAML cannot be read: ${detail}`,
      fix:
        fixes[yamlCode] ??
        'Check the indentation, colons, quotes and brackets on this line and the one before.',
    };
  },

  duplicateKey(key: string): Wording {
    return {
      problem: `the key ${code(key)} appears a second time in the same mapping`,
      fix: 'Keep only one of the two lines.',
    };
  },

  tooManyAliases(limit: number): Wording {
    return {
      problem: `the file expands more than ${limit} aliases (*name)`,
      fix: 'Write the values out instead of repeating aliases.',
    };
  },

  /** The YAML nests collections so deeply that reading it would exhaust the stack. */
  nestedTooDeeply(): Wording {
    return {
      problem: 'the YAML nests lists or mappings too deeply to be read',
      fix: 'An entry needs only a few levels: look for a run of `[` or `{` that is never closed, or indentation that keeps growing.',
    };
  },

  emptyFile(kindName: ContentKindName): Wording {
    return {
      problem: 'the file is empty',
      fix: `Describe the ${kindWord(kindName)} with keys such as \`name: …\` (see content/README.md).`,
    };
  },

  // ── Schema ──────────────────────────────────────────────────────────────────────────

  unknownKey(
    key: string,
    parentField: string,
    suggestion: string | undefined,
    allowed: readonly string[],
  ): Wording {
    return {
      problem:
        parentField === ''
          ? `there is no key ${code(key)} at the top level of this file`
          : `${code(parentField)} has no key ${code(key)}`,
      fix:
        suggestion !== undefined
          ? `Did you mean ${code(suggestion)}?`
          : `Remove it, or use one of: ${list(allowed)}.`,
    };
  },

  missingKey(key: string, parentField: string, spec: ValueSpec): Wording {
    const example =
      spec.example !== undefined && typeof spec.example !== 'object'
        ? ` ${showExample(spec.example)}`
        : ' …';
    return {
      problem: `${code(key)} is missing`,
      fix: `Add \`${key}:${example}\` ${inParent(parentField)} (${expected(spec)}).`,
    };
  },

  wrongType(spec: ValueSpec, value: unknown, sourceText?: string): Wording {
    const problem = `expected ${expected(spec)}, got ${shown(value, sourceText)}`;
    if ((spec.type === 'number' || spec.type === 'integer') && typeof value === 'string') {
      const number = numberWithUnit(value, spec.unit);
      if (number !== undefined)
        return { problem, fix: `Write ${number}: the key's name already says the unit.` };
      const inUnit = unitAfter(spec) === '' ? '' : ` in${unitAfter(spec)}`;
      return { problem, fix: `Write the number alone${inUnit}${exampleFix(spec)}.` };
    }
    if (spec.type === 'integer' && typeof value === 'number') {
      return { problem, fix: `Write a whole number${exampleFix(spec)}.` };
    }
    if (value === null)
      return { problem, fix: `Write a value after the colon${exampleFix(spec)}.` };
    if (spec.type === 'string')
      return {
        problem,
        fix: `Write it as text${exampleFix(spec)}; put quotes around it if it looks like a number.`,
      };
    if (spec.type === 'boolean') return { problem, fix: 'Write true or false.' };
    return { problem, fix: `Write ${expected(spec)}${exampleFix(spec)}.` };
  },

  notFinite(spec: ValueSpec, sourceText: string): Wording {
    return {
      problem: `${sourceText} is too large to be a number here (expected ${expected(spec)})`,
      fix: `Write ${expected(spec)}${exampleFix(spec)}.`,
    };
  },

  outOfRange(spec: ValueSpec, value: number, sourceText?: string): Wording {
    const negative = value < 0 && (spec.minimum ?? 0) >= 0 ? ' (it cannot be negative)' : '';
    return {
      problem: `expected ${expected(spec)}, got ${shown(value, sourceText)}${negative}`,
      fix: `Write a value${rangeWords(spec)}${unitAfter(spec)}; check the unit named in the key.`,
    };
  },

  badEnum(value: unknown, allowed: readonly string[], suggestion: string | undefined): Wording {
    return {
      problem: `expected one of ${list(allowed)}, got ${shown(value)}`,
      fix:
        suggestion !== undefined
          ? `Did you mean ${code(suggestion)}?`
          : `Write one of ${list(allowed)}.`,
    };
  },

  listLength(spec: ValueSpec, count: number): Wording {
    return {
      problem: `expected ${expected(spec)}, got ${count === 0 ? 'an empty list' : `${count} item${count === 1 ? '' : 's'}`}`,
      fix:
        spec.example !== undefined
          ? `Write it like ${showExample(spec.example)}.`
          : `Write ${expected(spec)}.`,
    };
  },

  textLength(maxLength: number | undefined, length: number): Wording {
    return maxLength !== undefined && length > maxLength
      ? { problem: `the text has ${length} characters, more than ${maxLength}`, fix: 'Shorten it.' }
      : {
          problem: 'the text is empty',
          fix: 'Write something, or remove the key if it is optional.',
        };
  },

  badId(value: string, suggestion: string): Wording {
    return {
      problem: `${JSON.stringify(value)} is not an id: ids hold only lower-case letters, digits and hyphens`,
      fix: `Write ${code(suggestion)}.`,
    };
  },

  badUrl(value: string): Wording {
    return {
      problem: `${JSON.stringify(value)} is not a web address`,
      fix: 'Write the full address, starting with https://, e.g. https://cards.example/.',
    };
  },

  repeatedItem(value: unknown): Wording {
    return { problem: `${shown(value)} is listed twice`, fix: 'Remove the repeat.' };
  },

  invalidValue(detail: string): Wording {
    return {
      problem: `the value is not accepted (${detail})`,
      fix: 'Check it against content/README.md.',
    };
  },

  // ── Pots ────────────────────────────────────────────────────────────────────────────

  valveAboveBase(valve: number, equivalentHeight: number, unit: LengthUnit): Wording {
    return {
      problem: `the valve sits ${len(valve, unit)} above the floor, but a base of this sealed volume and diameter is only ${len(equivalentHeight, unit, 1)} high`,
      fix: 'Measure the valve height from the floor inside the base, and check the sealed volume and inner diameter.',
    };
  },

  tubeGapAboveValve(gap: number, valve: number, unit: LengthUnit): Wording {
    return {
      problem: `the funnel tube ends ${len(gap, unit)} above the floor, not below the valve at ${len(valve, unit)}`,
      fix: `Measure the gap between the lower end of the funnel tube and the floor of the base (${unit === 'in' ? 'a fraction of an inch' : 'a few millimetres'}).`,
    };
  },

  spoutTooLow(spout: number, lowest: number, unit: LengthUnit): Wording {
    return {
      problem: `the spout is ${len(spout, unit)} above the floor of the base, below the top of the basket at ${len(lowest, unit, 1)}`,
      fix: 'Measure the spout outlet from the floor of the base with the pot assembled.',
    };
  },

  basketWiderThanBase(basket: number, base: number, unit: LengthUnit): Wording {
    return {
      problem: `a basket ${len(basket, unit)} across cannot sit inside a base ${len(base, unit)} across`,
      fix: 'Check both diameters: measure inside the base and inside the basket.',
    };
  },

  tubeWiderThanBasket(tube: number, basket: number, unit: LengthUnit): Wording {
    return {
      problem: `the funnel tube (${len(tube, unit)} inside) is not narrower than the basket (${len(basket, unit)})`,
      fix: `Measure the inside of the tube below the basket, ${unit === 'in' ? 'about a quarter of an inch' : 'a few millimetres'} across.`,
    };
  },

  bothUnits(firstKey: string, secondKey: string): Wording {
    return {
      problem: `${code(firstKey)} and ${code(secondKey)} say the same thing in two units`,
      fix: `Keep one of them, ${code(firstKey)} or ${code(secondKey)}.`,
    };
  },

  lengthMissing(
    mmKey: string,
    inKey: string,
    parentField: string,
    mmSpec: ValueSpec,
    inSpec: ValueSpec,
  ): Wording {
    const example = (key: string, spec: ValueSpec): string =>
      code(spec.example === undefined ? `${key}: …` : `${key}: ${showExample(spec.example)}`);
    return {
      problem: `${inParent(parentField)} there is neither ${code(mmKey)} nor ${code(inKey)}`,
      fix: `Add ${example(mmKey, mmSpec)} ${inParent(parentField)} in millimetres, or ${example(inKey, inSpec)} in inches.`,
    };
  },

  // ── Coffees ─────────────────────────────────────────────────────────────────────────

  reversedRange(low: number, high: number): Wording {
    return {
      problem: `the range [${low}, ${high}] does not go from low to high`,
      fix: `Write the lower value first and make them differ, e.g. [${Math.min(low, high)}, ${Math.max(low, high) === Math.min(low, high) ? high + 1 : Math.max(low, high)}].`,
    };
  },

  // ── Stoves ──────────────────────────────────────────────────────────────────────────

  repeatedLevel(label: string, firstLine: number): Wording {
    return {
      problem: `the level ${code(label)} is already named on line ${firstLine}`,
      fix: 'Give each level its own label, as written on the knob.',
    };
  },

  powerNotIncreasing(powerW: number, previousLabel: string, previousW: number): Wording {
    return {
      problem: `${powerW} W is not more than the level before it (${code(previousLabel)}, ${previousW} W)`,
      fix: 'List the levels gentlest first, each stronger than the one before.',
    };
  },

  // ── Brew logs ───────────────────────────────────────────────────────────────────────

  brewWithoutObservation(): Wording {
    return {
      problem: 'this brew records no observation',
      fix: 'Add at least one of first_coffee_s, sputter_s, off_heat_s, yield_ml, cup_g or water_c.',
    };
  },

  readingsOutOfOrder(tS: number, previousS: number): Wording {
    return {
      problem: `the reading at ${tS} s comes after one at ${previousS} s`,
      fix: 'List readings in time order, each later than the one before.',
    };
  },

  sputterBeforeFirstCoffee(sputterS: number, firstCoffeeS: number): Wording {
    return {
      problem: `the sputter at ${sputterS} s comes before the first coffee at ${firstCoffeeS} s`,
      fix: 'Check the two times: coffee appears first, the sputter ends the brew.',
    };
  },

  // ── References between files ────────────────────────────────────────────────────────

  unknownId(
    kindName: ContentKindName,
    id: string,
    suggestion: string | undefined,
    known: readonly string[],
  ): Wording {
    const folder = CONTENT_KINDS[kindName].folder;
    const problem = `there is no ${kindWord(kindName)} ${code(id)} (no ${folder}/${id}.yaml)`;
    if (suggestion !== undefined) return { problem, fix: `Did you mean ${code(suggestion)}?` };
    return {
      problem,
      fix:
        known.length === 0
          ? `Add ${folder}/${id}.yaml.`
          : `Use one of ${list(known)}, or add ${folder}/${id}.yaml.`,
    };
  },

  unknownLevel(
    level: string,
    stoveId: string,
    suggestion: string | undefined,
    labels: readonly string[],
  ): Wording {
    return {
      problem: `the stove ${code(stoveId)} has no level ${code(level)}`,
      fix:
        suggestion !== undefined
          ? `Did you mean ${code(suggestion)}?`
          : `Use one of ${list(labels)}.`,
    };
  },

  // ── site.yaml ───────────────────────────────────────────────────────────────────────

  repeatedSetId(id: string, firstLine: number): Wording {
    return {
      problem: `the set id ${code(id)} is already used on line ${firstLine}`,
      fix: 'Give each set its own id: it names the page and the PDF.',
    };
  },

  keyNotForLayout(key: string, layout: string, belongsTo: string): Wording {
    return {
      problem: `${code(key)} does not apply to a set with layout ${code(layout)}`,
      fix: `Remove it, or change the layout to ${code(belongsTo)}.`,
    };
  },

  missingForLayout(key: string, layout: string, example: string): Wording {
    return {
      problem: `a set with layout ${code(layout)} needs ${code(key)}`,
      fix: `Add ${example} to the set.`,
    };
  },

  cardNeedsPotAndCoffee(): Wording {
    return {
      problem: 'a card names a stove but not both a pot and a coffee',
      fix: 'Add `pot:` and `coffee:`, or write `every_coffee_with_every_pot: true` to print every coffee with every pot.',
    };
  },

  cardMixesForms(): Wording {
    return {
      problem: '`every_coffee_with_every_pot: true` already chooses the pots and coffees',
      fix: 'Remove `pot:` and `coffee:` from this card, or remove `every_coffee_with_every_pot`.',
    };
  },

  everyFlagFalse(): Wording {
    return {
      problem: '`every_coffee_with_every_pot: false` says nothing',
      fix: 'Remove the key and name a pot and a coffee, or write true.',
    };
  },

  repeatedCard(potId: string, coffeeId: string, stoveId: string, firstLine: number): Wording {
    return {
      problem: `the card ${potId} × ${coffeeId} × ${stoveId} is already in this set (line ${firstLine})`,
      fix: 'Remove one of them.',
    };
  },
  /** A control or bidirectional-control character in a key or text (entry-file.ts). */
  unsafeCharacter(codePoint: number): Wording {
    const hex = codePoint.toString(16).toUpperCase().padStart(4, '0');
    const bidi =
      (codePoint >= 0x202a && codePoint <= 0x202e) || (codePoint >= 0x2066 && codePoint <= 0x2069);
    return {
      problem: bidi
        ? `the text holds U+${hex}, an invisible direction control that would reorder the printed text`
        : `the text holds U+${hex}, an invisible control character`,
      fix: 'Delete it (retype the text if the character cannot be seen in your editor).',
    };
  },

  /** base_url that would not give each card its own working address (site.ts). */
  badBaseUrl(problem: string, maxLength: number): Wording {
    const problems: Record<string, string> = {
      'not-a-url': 'base_url is not a web address',
      scheme: 'base_url must start with https:// or http://',
      query:
        'base_url holds a `?query`: every card’s address would end in it, and every QR code would open the same page',
      fragment:
        'base_url holds a `#fragment`: every card’s address would end in it, and every QR code would open the same page',
      credentials: 'base_url holds a user name or password, which would be printed on every card',
      'too-long': `base_url is longer than ${maxLength} characters, too long for a QR code a phone can read at the printed size`,
    };
    return {
      problem: problems[problem] ?? 'base_url is not usable',
      fix: 'Give the address the site is published at, e.g. `https://cards.roaster.example/` (a folder after the host is fine).',
    };
  },

  /** brand.colour not written #RRGGBB (site.yaml; the schema's pattern). */
  badColour(value: string): Wording {
    return {
      problem: `"${value}" is not a colour written #RRGGBB`,
      fix: 'Write the colour as # and six hexadecimal digits, e.g. `colour: "#1F5C4A"` (quoted: YAML reads # as a comment).',
    };
  },
  /** brand.logo names no file (content/brand.ts). */
  logoMissing(file: string): Wording {
    return {
      problem: `the logo file ${file} does not exist in the content folder`,
      fix: 'Put the SVG or PNG file there, or correct the path (it is relative to the content folder, e.g. `logo: brand/logo.svg`).',
    };
  },
  logoOutside(file: string): Wording {
    return {
      problem: `the logo path ${file} leads outside the content folder`,
      fix: 'Copy the logo into the content folder (e.g. brand/logo.svg) and give the path from there.',
    };
  },
  logoNotAFile(file: string): Wording {
    return {
      problem: `the logo path ${file} is a folder, not a file`,
      fix: 'Give the path of the SVG or PNG file itself, e.g. `logo: brand/logo.svg`.',
    };
  },
  logoTooLarge(file: string, sizeBytes: number, limitBytes: number): Wording {
    return {
      problem: `the logo ${file} is ${sizeBytes} bytes, more than the ${limitBytes} a logo may have`,
      fix: 'Save it smaller: an SVG of simple shapes, or a PNG of some 600 pixels across is plenty for print.',
    };
  },
  logoFormat(file: string, found: LogoFound): Wording {
    const what: Record<LogoFound, string> = {
      jpeg: 'a JPEG picture',
      gif: 'a GIF picture',
      webp: 'a WebP picture',
      pdf: 'a PDF',
      'broken-png': 'a PNG whose header is damaged',
      'not-svg': 'text without an <svg> root element',
      unknown: 'neither a PNG nor an SVG file',
    };
    return {
      problem: `the logo ${file} is ${what[found]}; a logo must be SVG or PNG`,
      fix: 'Export the logo as SVG (preferred: it prints sharp at any size) or PNG, and name that file.',
    };
  },
  logoSvgFeature(file: string, feature: string): Wording {
    return {
      problem: `the SVG logo ${file} uses ${feature}, which stovecard does not draw (it draws shapes, paths and text only)`,
      fix: 'Save the logo as plain SVG with its shapes inline (no scripts, embedded images, links to other files or entity declarations), or export it as PNG.',
    };
  },
  logoSvgSize(file: string): Wording {
    return {
      problem: `the SVG logo ${file} has neither a width and height nor a viewBox, so its proportions are unknown`,
      fix: 'Add a viewBox to its <svg> element, e.g. `viewBox="0 0 120 40"` for a logo three times as wide as high.',
    };
  },

  /** A content file that is a link to a place outside the content folder (catalogue.ts). */
  linkOutside(): Wording {
    return {
      problem:
        'this is a link to a file outside the content folder, which the build does not follow',
      fix: 'Copy the file into the content folder, or link to a file inside it.',
    };
  },

  /** The last issue of a file whose schema problems were cut at the cap. */
  moreProblems(count: number): Wording {
    return {
      problem: `and ${count} more problem${count === 1 ? '' : 's'} of the same kind in this file, not listed`,
      fix: 'Fix the ones listed and build again to see the rest.',
    };
  },
} satisfies MessageWords;

/** The problem and fix of one content message. */
export function wording(message: ContentMessage): Wording {
  const say = messageWords[message.key] as (...args: readonly unknown[]) => Wording;
  return say(...message.args);
}

/** One issue as one line of the error report; every part may carry the user's text, escaped and capped. */
export function issueLine(issue: IssueAt): string {
  const { problem, fix } = wording(issue.message);
  const field = issue.field === '' ? '' : ` ${shownText(issue.field)}`;
  const file = shownText(issue.file, 200);
  return `${file}:${issue.line}:${issue.column}${field} — ${shownText(problem, 400)}. ${shownText(fix, 400)}`;
}

/** The report's last line when it lists only its first issues. */
export function moreInReport(count: number): string {
  return `… and ${count} more problem${count === 1 ? '' : 's'}, not listed: fix the ones above and build again to see them`;
}

export function errorsHeading(issueCount: number, fileCount: number): string {
  const problems = issueCount === 1 ? 'a problem' : `${issueCount} problems`;
  const files = fileCount === 1 ? '1 file' : `${fileCount} files`;
  return `The content has ${problems} in ${files}; nothing was built:`;
}

/** A report lists the first MAX_REPORTED issues, then how many more there are. */
export const MAX_REPORTED = 50;

/** The report a person reads: a heading, then one line per issue (the first MAX_REPORTED). */
export function formatContentErrors(error: { readonly issues: readonly IssueAt[] }): string {
  const files = new Set(error.issues.map((issue) => issue.file)).size;
  const shown = error.issues.slice(0, MAX_REPORTED).map(issueLine);
  const more = error.issues.length - shown.length;
  return [
    errorsHeading(error.issues.length, files),
    ...shown,
    ...(more > 0 ? [moreInReport(more)] : []),
  ].join('\n');
}

export const contentWords = { ...messageWords, wording, issueLine, errorsHeading, moreInReport };
