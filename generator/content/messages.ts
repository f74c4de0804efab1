/**
 * Problems in content files as a message key and its facts, no words: generator/words/
 * content.ts says each one (`contentWords[key](...args)`), in the CLI and the build log.
 * The key names the words' factory; the tuple is its arguments, values as the person wrote
 * them (numbers in the unit of their key, ids, the source text of a value).
 */

/** What a schema expects of one value, as far as the words need it. */
export interface ValueSpec {
  /** JSON-Schema type: number, integer, string, boolean, array, object. */
  readonly type?: string;
  /** The schema's `x-unit`: mL, mm, g, bar, W/K, m², g/mL, g/g, °C, s, W, m, share. */
  readonly unit?: string;
  readonly minimum?: number;
  readonly maximum?: number;
  readonly allowed?: readonly string[];
  readonly minItems?: number;
  readonly maxItems?: number;
  /** The schema's first example, to show in a fix. */
  readonly example?: unknown;
}

/** What a logo file's bytes turned out to be when they are neither PNG nor SVG (brand.ts). */
export type LogoFound = 'jpeg' | 'gif' | 'webp' | 'pdf' | 'broken-png' | 'not-svg' | 'unknown';

/** The kinds of content file, for messages that name one. */
export type ContentKindName = 'pot' | 'coffee' | 'stove' | 'log' | 'site';

/** Every content message: its key and the facts its words take. */
export interface ContentMessageArgs {
  readonly fileTooLarge: readonly [sizeBytes: number, limitBytes: number];
  readonly unsafeCharacter: readonly [codePoint: number];
  readonly badBaseUrl: readonly [problem: string, maxLength: number];
  readonly linkOutside: readonly [];
  readonly moreProblems: readonly [count: number];
  readonly notUtf8: readonly [];
  readonly unreadable: readonly [reason: string];
  readonly missingSiteFile: readonly [];
  readonly badFileName: readonly [stem: string, suggestion: string];
  readonly sameIdTwice: readonly [id: string, otherFile: string];
  readonly yamlSyntax: readonly [detail: string, yamlCode: string];
  readonly duplicateKey: readonly [key: string];
  readonly tooManyAliases: readonly [limit: number];
  readonly nestedTooDeeply: readonly [];
  readonly emptyFile: readonly [kindName: ContentKindName];
  readonly unknownKey: readonly [
    key: string,
    parentField: string,
    suggestion: string | undefined,
    allowed: readonly string[],
  ];
  readonly missingKey: readonly [key: string, parentField: string, spec: ValueSpec];
  readonly wrongType: readonly [spec: ValueSpec, value: unknown, sourceText?: string];
  readonly notFinite: readonly [spec: ValueSpec, sourceText: string];
  readonly outOfRange: readonly [spec: ValueSpec, value: number, sourceText?: string];
  readonly badEnum: readonly [
    value: unknown,
    allowed: readonly string[],
    suggestion: string | undefined,
  ];
  readonly listLength: readonly [spec: ValueSpec, count: number];
  readonly textLength: readonly [maxLength: number | undefined, length: number];
  readonly badId: readonly [value: string, suggestion: string];
  readonly badUrl: readonly [value: string];
  readonly badColour: readonly [value: string];
  readonly logoMissing: readonly [file: string];
  readonly logoOutside: readonly [file: string];
  readonly logoNotAFile: readonly [file: string];
  readonly logoTooLarge: readonly [file: string, sizeBytes: number, limitBytes: number];
  readonly logoFormat: readonly [file: string, found: LogoFound];
  readonly logoSvgFeature: readonly [file: string, feature: string];
  readonly logoSvgSize: readonly [file: string];
  readonly repeatedItem: readonly [value: unknown];
  readonly invalidValue: readonly [detail: string];
  readonly valveAboveBase: readonly [valve: number, equivalentHeight: number, unit: 'mm' | 'in'];
  readonly tubeGapAboveValve: readonly [gap: number, valve: number, unit: 'mm' | 'in'];
  readonly spoutTooLow: readonly [spout: number, lowest: number, unit: 'mm' | 'in'];
  readonly basketWiderThanBase: readonly [basket: number, base: number, unit: 'mm' | 'in'];
  readonly tubeWiderThanBasket: readonly [tube: number, basket: number, unit: 'mm' | 'in'];
  readonly bothUnits: readonly [firstKey: string, secondKey: string];
  readonly lengthMissing: readonly [
    mmKey: string,
    inKey: string,
    parentField: string,
    mmSpec: ValueSpec,
    inSpec: ValueSpec,
  ];
  readonly reversedRange: readonly [low: number, high: number];
  readonly repeatedLevel: readonly [label: string, firstLine: number];
  readonly powerNotIncreasing: readonly [powerW: number, previousLabel: string, previousW: number];
  readonly brewWithoutObservation: readonly [];
  readonly readingsOutOfOrder: readonly [tS: number, previousS: number];
  readonly sputterBeforeFirstCoffee: readonly [sputterS: number, firstCoffeeS: number];
  readonly unknownId: readonly [
    kindName: ContentKindName,
    id: string,
    suggestion: string | undefined,
    known: readonly string[],
  ];
  readonly unknownLevel: readonly [
    level: string,
    stoveId: string,
    suggestion: string | undefined,
    labels: readonly string[],
  ];
  readonly repeatedSetId: readonly [id: string, firstLine: number];
  readonly keyNotForLayout: readonly [key: string, layout: string, belongsTo: string];
  readonly missingForLayout: readonly [key: string, layout: string, example: string];
  readonly cardNeedsPotAndCoffee: readonly [];
  readonly cardMixesForms: readonly [];
  readonly everyFlagFalse: readonly [];
  readonly repeatedCard: readonly [
    potId: string,
    coffeeId: string,
    stoveId: string,
    firstLine: number,
  ];
}

export type ContentMessageKey = keyof ContentMessageArgs;

export type ContentMessage = {
  readonly [K in ContentMessageKey]: { readonly key: K; readonly args: ContentMessageArgs[K] };
}[ContentMessageKey];

/** `message('unknownKey', key, parent, suggestion, allowed)`: a message with its facts. */
export function message<K extends ContentMessageKey>(
  key: K,
  ...args: ContentMessageArgs[K]
): ContentMessage {
  return { key, args } as ContentMessage;
}
