/**
 * The voice of one output: the language and unit system a card, an insert, a set page or a
 * PDF speaks in, and everything that follows from the pair — the words catalogue, the
 * document language tag (HTML `lang`, PDF `/Lang`, XMP dc:language), the decimal mark and
 * the date form. A build picks one voice per set (content/site.ts resolves its language
 * and the site's units) and hands it down; render modules never import a catalogue.
 *
 * Functions that take a voice also take a bare unit system (the CLI, older callers,
 * tests): that is the English voice of those units (`asVoice`).
 */
import type { UnitSystem } from '../content/types.ts';
import { langTag, wordsFor, type Language, type Messages } from '../words/catalogue.ts';
import type { NumberStyle } from './format.ts';

export interface Voice extends NumberStyle {
  readonly language: Language;
  /** BCP 47 tag of the output's text (words/catalogue.ts langTag). */
  readonly lang: string;
  readonly units: UnitSystem;
  /** Decimal mark of the language ("." or ","). */
  readonly decimal: string;
  readonly words: Messages;
  /** A YYYY-MM-DD date in the language's form. */
  date(iso: string): string;
}

const voices = new Map<string, Voice>();

/** The voice of a language code (the schema's `language` enum) and unit system. */
export function voiceFor(language: string = 'en', units: UnitSystem = 'metric'): Voice {
  const key = `${language}/${units}`;
  let voice = voices.get(key);
  if (!voice) {
    const words = wordsFor(language);
    voice = Object.freeze({
      language: language as Language,
      lang: langTag(language),
      units,
      decimal: words.format.decimal,
      words,
      date: (iso: string): string => words.format.date(iso),
    });
    voices.set(key, voice);
  }
  return voice;
}

/** A voice as given, or the English voice of a bare unit system. */
export function asVoice(voice: Voice | UnitSystem | undefined): Voice {
  if (voice === undefined) return voiceFor('en', 'metric');
  return typeof voice === 'string' ? voiceFor('en', voice) : voice;
}
