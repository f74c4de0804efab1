/**
 * Every language's words catalogue is complete: the same keys as the English one (tsc
 * checks that through the `Messages` type; this checks the values at run time), no empty
 * text, lists of the same length, functions taking the same number of facts and returning
 * text for sample facts; and the content schema accepts exactly the languages there are
 * catalogues for. BCP 47 tag form from RFC 5646 §2.1 (language, optional region).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { LANGUAGES, langTag, wordsFor } from '../../generator/words/catalogue.ts';

/** Every leaf of a catalogue by its dotted path: a string, a list length, or a function's arity. */
function leaves(value: unknown, at = ''): Map<string, string> {
  const out = new Map<string, string>();
  if (typeof value === 'string') out.set(at, 'string');
  else if (typeof value === 'function') out.set(at, `function/${value.length}`);
  else if (Array.isArray(value)) {
    out.set(at, `list/${value.length}`);
    value.forEach((item, i) => leaves(item, `${at}[${i}]`).forEach((v, k) => out.set(k, v)));
  } else if (value !== null && typeof value === 'object') {
    for (const [key, child] of Object.entries(value))
      leaves(child, at === '' ? key : `${at}.${key}`).forEach((v, k) => out.set(k, v));
  } else out.set(at, typeof value);
  return out;
}

function emptyTexts(value: unknown, at = ''): string[] {
  if (typeof value === 'string') return value.trim() === '' ? [at] : [];
  if (Array.isArray(value)) return value.flatMap((v, i) => emptyTexts(v, `${at}[${i}]`));
  if (value !== null && typeof value === 'object')
    return Object.entries(value).flatMap(([k, v]) => emptyTexts(v, at === '' ? k : `${at}.${k}`));
  return [];
}

describe('words catalogues', () => {
  it('English is there, and every catalogue has every key of it with the same shape', () => {
    expect(LANGUAGES).toContain('en');
    const reference = leaves(wordsFor('en'));
    expect(reference.size).toBeGreaterThan(100);
    for (const language of LANGUAGES) {
      const own = leaves(wordsFor(language));
      const missing = [...reference.keys()].filter((k) => !own.has(k));
      const extra = [...own.keys()].filter((k) => !reference.has(k));
      const differ = [...reference]
        .filter(([k, v]) => own.has(k) && own.get(k) !== v)
        .map(([k]) => k);
      expect({ language, missing, extra, differ }).toEqual({
        language,
        missing: [],
        extra: [],
        differ: [],
      });
    }
  });

  it('no catalogue has an empty text', () => {
    for (const language of LANGUAGES) expect(emptyTexts(wordsFor(language)), language).toEqual([]);
  });

  it('each catalogue names its document language with a BCP 47 tag of its own language', () => {
    for (const language of LANGUAGES) {
      expect(langTag(language)).toMatch(/^[a-z]{2,3}(-[A-Z]{2}|-\d{3})?$/);
      expect(langTag(language).split('-')[0]).toBe(language);
    }
  });

  it('an unknown language code is an error, not English', () => {
    expect(() => wordsFor('xx')).toThrow(/no words catalogue/);
  });

  it('site.yaml accepts exactly the languages there are catalogues for, at the site and on a set', () => {
    const schema = JSON.parse(readFileSync('generator/content/schemas/site.schema.json', 'utf8'));
    const site = schema.properties.language.enum as string[];
    const set = schema.properties.sets.items.properties.language.enum as string[];
    expect([...site].sort()).toEqual([...LANGUAGES].sort());
    expect([...set].sort()).toEqual([...LANGUAGES].sort());
  });
});
