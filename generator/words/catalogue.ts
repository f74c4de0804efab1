/**
 * The words catalogues, one per language, and the one place that picks a catalogue and the
 * document language tag for an output.
 *
 * Structure: `en.ts` is the reference catalogue. `Messages` is its shape with every string
 * widened to `string` (functions keep their parameters and declared results), so a second catalogue typed
 * `Messages` fails tsc on a missing or misspelt key or a function with other parameters.
 * tests/words/catalogues.test.ts holds every catalogue complete at run time too (no empty
 * strings, the same keys and list lengths as English) and the schema's `language` enum
 * equal to the catalogues here.
 *
 * Adding a language: copy en.ts to <code>.ts, translate every value (keep the keys and the
 * parameters), add it to CATALOGUES below, and add <code> to both `language` enums of
 * generator/content/schemas/site.schema.json. DEVELOPERS.md, "Words and languages".
 */
import { en } from './en.ts';
import { es } from './es.ts';

type Widen<T> = T extends string
  ? string
  : T extends (...args: infer A) => infer R
    ? (...args: A) => R
    : T extends readonly (infer U)[]
      ? readonly Widen<U>[]
      : T extends object
        ? { readonly [K in keyof T]: Widen<T[K]> }
        : T;

/** Everything a language must say: the shape of the English catalogue. */
export type Messages = Widen<typeof en>;

const CATALOGUES = { en, es } satisfies Record<string, Messages>;

export type Language = keyof typeof CATALOGUES;

/** The language codes there are catalogues for (the schema's `language` enum). */
export const LANGUAGES = Object.keys(CATALOGUES) as Language[];

export function isLanguage(code: string): code is Language {
  return Object.hasOwn(CATALOGUES, code);
}

/** The catalogue of a language code the schema accepted; an unknown code is a bug upstream. */
export function wordsFor(language: string): Messages {
  if (!isLanguage(language))
    throw new Error(`no words catalogue for language ${JSON.stringify(language)}`);
  return CATALOGUES[language];
}

/** The document language tag (HTML `lang`, PDF `/Lang`, XMP dc:language) of a language code. */
export function langTag(language: string): string {
  return wordsFor(language).langTag;
}
