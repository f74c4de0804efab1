/**
 * PDF object syntax (ISO 32000-1 §7.2–7.3), read and written back, as far as merge.ts
 * needs it. A value is an atom, a reference, an array or a dictionary. An atom (number,
 * name, boolean, null, literal or hex string) keeps its exact source text, so a string is
 * copied byte for byte: a coffee called "Lot (12 0 R)" stays text, and only `N G R` outside
 * strings is ever read as a reference. Text is handled as latin1, one char per byte.
 */

export interface PdfAtom {
  readonly kind: 'atom';
  readonly text: string;
}

export interface PdfRef {
  readonly kind: 'ref';
  readonly num: number;
  readonly gen: number;
}

/**
 * A parent-tree key not numbered yet (merge.ts, a card page's segment): the `index`-th
 * key of its card, written as an integer once the set gives the card its first key.
 */
export interface PdfKey {
  readonly kind: 'key';
  readonly index: number;
}

export type PdfDict = Map<string, PdfValue>;

export type PdfValue = PdfAtom | PdfRef | PdfKey | PdfValue[] | PdfDict;

export const atom = (text: string): PdfAtom => ({ kind: 'atom', text });
export const ref = (num: number, gen = 0): PdfRef => ({ kind: 'ref', num, gen });
export const key = (index: number): PdfKey => ({ kind: 'key', index });

export function isDict(value: PdfValue | undefined): value is PdfDict {
  return value instanceof Map;
}

export function isRef(value: PdfValue | undefined): value is PdfRef {
  return value !== undefined && !Array.isArray(value) && !isDict(value) && value.kind === 'ref';
}

function isAtom(value: PdfValue | undefined): value is PdfAtom {
  return value !== undefined && !Array.isArray(value) && !isDict(value) && value.kind === 'atom';
}

/** The name an atom holds, without its slash ("/Page" → "Page"); null for anything else. */
export function nameOf(value: PdfValue | undefined): string | null {
  return isAtom(value) && value.text.startsWith('/') ? value.text.slice(1) : null;
}

/** The integer an atom holds; null for anything else. */
export function intOf(value: PdfValue | undefined): number | null {
  return isAtom(value) && /^[+-]?\d+$/.test(value.text) ? Number(value.text) : null;
}

/** §7.3.3: integers and reals, no exponents. */
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)$/;

/** The number an atom holds; null for anything else. */
export function numberOf(value: PdfValue | undefined): number | null {
  return isAtom(value) && NUMBER.test(value.text) ? Number(value.text) : null;
}

// §7.2.2: white-space and delimiter characters, as a table by character code.
const SPACE = 1;
const DELIMITER = 2;
const CLASS = new Uint8Array(256);
for (const code of [0x00, 0x09, 0x0a, 0x0c, 0x0d, 0x20]) CLASS[code] = SPACE;
for (const c of '()<>[]{}/%') CLASS[c.charCodeAt(0)] = DELIMITER;

/** A regular character (neither space nor delimiter); false past the end of the text. */
const isRegular = (code: number) => code < 256 && CLASS[code] === 0;

const isInteger = (word: string) => {
  if (word === '') return false;
  for (let i = 0; i < word.length; i++) {
    const code = word.charCodeAt(i);
    if (code < 0x30 || code > 0x39) return false;
  }
  return true;
};

/** Reads values from latin1 text, starting at `pos`; `pos` is left after what was read. */
export class PdfLexer {
  pos: number;

  constructor(
    readonly text: string,
    pos = 0,
  ) {
    this.pos = pos;
  }

  /** Skips white space and comments. */
  skipSpace(): void {
    const t = this.text;
    for (;;) {
      const code = t.charCodeAt(this.pos);
      if (CLASS[code] === SPACE) this.pos += 1;
      else if (code === 0x25 /* % */) {
        while (this.pos < t.length && t[this.pos] !== '\n' && t[this.pos] !== '\r') this.pos += 1;
      } else return;
    }
  }

  /** A run of regular characters: a number or a keyword ("obj", "R", "true"). */
  regular(): string {
    const start = this.pos;
    while (isRegular(this.text.charCodeAt(this.pos))) this.pos += 1;
    return this.text.slice(start, this.pos);
  }

  /** Whether `keyword` comes next (after white space); consumes it when it does. */
  keyword(keyword: string): boolean {
    this.skipSpace();
    const end = this.pos + keyword.length;
    if (this.text.startsWith(keyword, this.pos) && !isRegular(this.text.charCodeAt(end))) {
      this.pos = end;
      return true;
    }
    return false;
  }

  value(): PdfValue {
    this.skipSpace();
    const t = this.text;
    const c = t[this.pos];
    if (c === '<' && t[this.pos + 1] === '<') return this.dict();
    if (c === '<') return atom(this.until('>', 'hex string'));
    if (c === '[') return this.array();
    if (c === '(') return atom(this.literal());
    if (c === '/') {
      const start = this.pos++;
      this.regular();
      return atom(t.slice(start, this.pos));
    }
    const word = this.regular();
    if (word === '') throw this.error(`unexpected "${c ?? 'end of file'}"`);
    if (isInteger(word)) {
      const after = this.pos;
      this.skipSpace();
      const gen = this.regular();
      if (isInteger(gen) && this.keyword('R')) return ref(Number(word), Number(gen));
      this.pos = after;
      return atom(word);
    }
    if (NUMBER.test(word) || word === 'true' || word === 'false' || word === 'null')
      return atom(word);
    throw this.error(`unexpected keyword "${word}"`);
  }

  private dict(): PdfDict {
    this.pos += 2;
    const out: PdfDict = new Map();
    for (;;) {
      this.skipSpace();
      if (this.text.startsWith('>>', this.pos)) {
        this.pos += 2;
        return out;
      }
      const key = this.value();
      const name = nameOf(key);
      if (name === null) throw this.error('a dictionary key that is not a name');
      out.set(name, this.value());
    }
  }

  private array(): PdfValue[] {
    this.pos += 1;
    const out: PdfValue[] = [];
    for (;;) {
      this.skipSpace();
      if (this.text[this.pos] === ']') {
        this.pos += 1;
        return out;
      }
      out.push(this.value());
    }
  }

  /** A literal string, parentheses and all. */
  private literal(): string {
    const start = this.pos;
    this.pos = literalEnd(this.text, start);
    if (this.pos < 0) {
      this.pos = start;
      throw this.error('a literal string without its closing parenthesis');
    }
    return this.text.slice(start, this.pos);
  }

  private until(close: string, what: string): string {
    const end = this.text.indexOf(close, this.pos);
    if (end < 0) throw this.error(`a ${what} without its "${close}"`);
    const start = this.pos;
    this.pos = end + close.length;
    return this.text.slice(start, this.pos);
  }

  error(message: string): Error {
    return new Error(`PDF syntax: ${message} at byte ${this.pos}`);
  }
}

/**
 * Where the literal string opening at `start` ends, or -1 if it does not (§7.3.4.2:
 * balanced parentheses, a backslash escapes the next character).
 */
function literalEnd(text: string, start: number): number {
  let depth = 0;
  for (let i = start; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x5c /* \\ */) i += 1;
    else if (c === 0x28 /* ( */) depth += 1;
    else if (c === 0x29 /* ) */ && --depth === 0) return i + 1;
  }
  return -1;
}

/**
 * Object text with holes: `pieces[0] slot[0] pieces[1] … pieces[n]`. A slot ≥ 1 is a
 * reference (`N 0 R`, N the slot), a slot < 0 the parent-tree key of index −1 − slot
 * (written as an integer). merge.ts keeps a card page's objects in this form (its
 * segment), so a set fills in the numbers without reading the card again.
 */
export interface PdfTemplate {
  readonly pieces: readonly string[];
  readonly slots: readonly number[];
}

/** The template's text with each slot as `fill` writes it. */
export function fillTemplate(template: PdfTemplate, fill: (slot: number) => string): string {
  const { pieces, slots } = template;
  let out = pieces[0]!;
  for (let i = 0; i < slots.length; i++) out += fill(slots[i]!) + pieces[i + 1]!;
  return out;
}

/** A reference slot as `N 0 R`; a key slot is an error (only segments hold keys). */
export const refText = (slot: number): string => {
  if (slot < 1) throw new Error(`PDF: a parent-tree key (slot ${slot}) where a number belongs`);
  return `${slot} 0 R`;
};

/**
 * The value at `pos` copied as text, each reference `N G R` in it replaced by
 * `renumber(N)` (generation 0), all else (strings, names, numbers, spacing) byte for
 * byte; null, with nothing more renumbered, as soon as a name in `stop` appears (the
 * caller then reads the value as a tree). The cheap way to copy the many small objects
 * that only need their references changed (structure elements); `end` is where the value
 * ends.
 */
export function renumberedText(
  text: string,
  pos: number,
  renumber: (num: number) => number,
  stop: ReadonlySet<string>,
): { text: string; end: number } | null {
  const copied = renumberedTemplate(text, pos, renumber, stop);
  return copied && { text: fillTemplate(copied.template, refText), end: copied.end };
}

/** renumberedText as a template: the renumbered references are its slots. */
export function renumberedTemplate(
  text: string,
  pos: number,
  renumber: (num: number) => number,
  stop: ReadonlySet<string>,
): { template: PdfTemplate; end: number } | null {
  const lexer = new PdfLexer(text, pos);
  lexer.skipSpace();
  const start = lexer.pos;
  const pieces: string[] = [];
  const slots: number[] = [];
  let copied = start;
  let depth = 0;
  do {
    lexer.skipSpace();
    const i = lexer.pos;
    const c = text.charCodeAt(i);
    if (c === 0x3c /* < */ && text.charCodeAt(i + 1) === 0x3c) {
      depth += 1;
      lexer.pos += 2;
    } else if (c === 0x3e /* > */ && text.charCodeAt(i + 1) === 0x3e) {
      depth -= 1;
      lexer.pos += 2;
    } else if (c === 0x5b /* [ */) {
      depth += 1;
      lexer.pos += 1;
    } else if (c === 0x5d /* ] */) {
      depth -= 1;
      lexer.pos += 1;
    } else if (c === 0x29 /* ) */ || c === 0x7b /* { */ || c === 0x7d /* } */) {
      return null;
    } else if (c === 0x28 /* ( */) {
      lexer.pos = literalEnd(text, i);
      if (lexer.pos < 0) return null;
    } else if (c === 0x3c) {
      const close = text.indexOf('>', i);
      if (close < 0) return null;
      lexer.pos = close + 1;
    } else if (c === 0x2f /* / */) {
      lexer.pos += 1;
      if (stop.has(lexer.regular())) return null;
    } else {
      const word = lexer.regular();
      if (word === '') return null;
      if (isInteger(word)) {
        const after = lexer.pos;
        lexer.skipSpace();
        if (isInteger(lexer.regular()) && lexer.keyword('R')) {
          pieces.push(text.slice(copied, i));
          slots.push(renumber(Number(word)));
          copied = lexer.pos;
        } else lexer.pos = after;
      }
    }
  } while (depth > 0);
  if (depth < 0) return null;
  pieces.push(text.slice(copied, lexer.pos));
  return { template: { pieces, slots }, end: lexer.pos };
}

/** The value as PDF text (latin1). */
export function writeValue(value: PdfValue): string {
  if (Array.isArray(value)) return `[${value.map(writeValue).join(' ')}]`;
  if (isDict(value)) {
    let out = '<<';
    for (const [key, item] of value) out += `/${key} ${writeValue(item)}\n`;
    return `${out}>>`;
  }
  if (value.kind === 'key') throw new Error('PDF: a parent-tree key not numbered yet');
  return value.kind === 'ref' ? `${value.num} ${value.gen} R` : value.text;
}

/**
 * The value as a template (the same text as writeValue once filled): each reference is a
 * slot (its number; generation 0, as merge.ts writes every object), each PdfKey a key slot.
 */
export function writeTemplate(value: PdfValue): PdfTemplate {
  const pieces: string[] = [];
  const slots: number[] = [];
  let text = '';
  const walk = (v: PdfValue): void => {
    if (Array.isArray(v)) {
      text += '[';
      v.forEach((item, i) => {
        if (i > 0) text += ' ';
        walk(item);
      });
      text += ']';
    } else if (isDict(v)) {
      text += '<<';
      for (const [name, item] of v) {
        text += `/${name} `;
        walk(item);
        text += '\n';
      }
      text += '>>';
    } else if (v.kind === 'atom') text += v.text;
    else {
      if (v.kind === 'ref' && v.gen !== 0)
        throw new Error(`PDF: reference ${v.num} ${v.gen} R is not of generation 0`);
      pieces.push(text);
      slots.push(v.kind === 'ref' ? v.num : -1 - v.index);
      text = '';
    }
  };
  walk(value);
  pieces.push(text);
  return { pieces, slots };
}
