/**
 * PdfLexer and writeValue: the PDF object syntax of ISO 32000-1 §7.2–7.3, checked on the
 * standard's own examples. What matters for the merge: a string is one atom whatever it
 * holds, so text that looks like a reference is never read as one.
 */
import { describe, expect, it } from 'vitest';
import {
  PdfLexer,
  intOf,
  renumberedText,
  isDict,
  isRef,
  nameOf,
  numberOf,
  writeValue,
  type PdfValue,
} from '../../generator/render/pdf/pdf-syntax.ts';

const read = (text: string): PdfValue => new PdfLexer(text).value();

/** Every reference in a value, depth first. */
function refs(value: PdfValue): number[] {
  if (Array.isArray(value)) return value.flatMap(refs);
  if (isDict(value)) return [...value.values()].flatMap(refs);
  return isRef(value) ? [value.num] : [];
}

describe('PdfLexer.value() on literal strings (ISO 32000-1 §7.3.4.2)', () => {
  it('reads the standard’s example with balanced parentheses as one string', () => {
    // §7.3.4.2, Example 1.
    const text =
      '(Strings may contain balanced parentheses ( ) and special characters (*!&}^% and so on).)';
    const value = read(text);
    expect(value).toEqual({ kind: 'atom', text });
  });

  it('reads escaped parentheses and backslashes without ending the string early', () => {
    // §7.3.4.2, Table 3: \( \) \\ and octal \ddd escapes.
    const text = String.raw`(a \) b \\ c \( d \053 e)`;
    expect(read(`[${text} 7 0 R]`)).toEqual([
      { kind: 'atom', text },
      { kind: 'ref', num: 7, gen: 0 },
    ]);
  });

  it('never reads "12 0 R" inside a literal or hex string as a reference', () => {
    const value = read(
      String.raw`<< /T (Lot (12 0 R) \) 13 0 R) /H <3132203020 52> /K [14 0 R] >>`,
    );
    expect(refs(value)).toEqual([14]);
  });
});

describe('PdfLexer.value() on the other objects (ISO 32000-1 §7.3.2–7.3.10)', () => {
  it('reads numbers as §7.3.3 writes them: 123 43445 +17 -98 0 34.5 -3.62 +123.6 4. -.002 0.0', () => {
    const value = read('[123 43445 +17 -98 0 34.5 -3.62 +123.6 4. -.002 0.0]');
    expect((value as PdfValue[]).map(numberOf)).toEqual([
      123, 43445, 17, -98, 0, 34.5, -3.62, 123.6, 4, -0.002, 0,
    ]);
  });

  it('reads the §7.3.7 example dictionary, nested dictionary and all', () => {
    const value = read(
      '<< /Type /Example /Subtype /DictionaryExample /Version 0.01 /IntegerItem 12 ' +
        '/StringItem (a string) /Subdictionary << /Item1 0.4 /Item2 true /LastItem (not !) ' +
        '/VeryLastItem (OK) >> >>',
    );
    if (!isDict(value)) throw new Error('not a dictionary');
    expect(nameOf(value.get('Type'))).toBe('Example');
    expect(intOf(value.get('IntegerItem'))).toBe(12);
    const sub = value.get('Subdictionary');
    expect(isDict(sub) && writeValue(sub.get('VeryLastItem')!)).toBe('(OK)');
  });

  it('reads "12 0 R" as a reference (§7.3.10) and "12 0" followed by anything else as numbers', () => {
    expect(read('12 0 R')).toEqual({ kind: 'ref', num: 12, gen: 0 });
    expect(read('[12 0]')).toEqual([
      { kind: 'atom', text: '12' },
      { kind: 'atom', text: '0' },
    ]);
  });

  it('skips comments (§7.2.4) between tokens', () => {
    expect(read('[1 % a comment ] 2 0 R\n 3]')).toEqual([
      { kind: 'atom', text: '1' },
      { kind: 'atom', text: '3' },
    ]);
  });

  it('refuses an unterminated string, naming the byte', () => {
    expect(() => read('(never closed')).toThrow(/literal string.*byte 0/);
  });
});

describe('renumberedText(text, pos, renumber, stop)', () => {
  const plus100 = (num: number) => num + 100;

  it('renumbers the references of a structure element and copies the rest byte for byte', () => {
    const text = String.raw`<<
/S /P
/T (Lot \(12 0 R\) 3 0 R)
/A <3132203020 52>
/K [1 2 0 R 5]
/P 12 0 R
>> endobj`;
    expect(renumberedText(text, 0, plus100, new Set())).toEqual({
      text: text
        .replace('[1 2 0 R 5]', '[1 102 0 R 5]')
        .replace('/P 12 0 R', '/P 112 0 R')
        .replace(' endobj', ''),
      end: text.indexOf(' endobj'),
    });
  });

  it('gives up (null) on a name it is told to stop at, and on text that is not one value', () => {
    expect(renumberedText('<< /Type /Page /Parent 1 0 R >>', 0, plus100, new Set(['Type']))).toBe(
      null,
    );
    expect(renumberedText('(never closed', 0, plus100, new Set())).toBe(null);
    expect(renumberedText('] 1 0 R', 0, plus100, new Set())).toBe(null);
  });

  it('copies a single atom as the whole value', () => {
    expect(renumberedText(' (PDFKit) endobj', 0, plus100, new Set())).toEqual({
      text: '(PDFKit)',
      end: 9,
    });
    expect(renumberedText('7 0 R endobj', 0, plus100, new Set())).toEqual({
      text: '107 0 R',
      end: 5,
    });
  });
});

describe('writeValue(value)', () => {
  it('writes back what it read: atoms byte for byte, references, arrays, dictionaries', () => {
    const text = String.raw`<< /T (Caf\351 \(1 0 R\)) /K [1 0 R 2 <FEFF00E9>] /B true /N null >>`;
    const again = read(writeValue(read(text)));
    expect(again).toEqual(read(text));
    expect(writeValue(again)).toContain(String.raw`(Caf\351 \(1 0 R\))`);
  });
});
