/**
 * Whole PDF files at the object level, for merge.ts: reading the files pdfkit writes
 * (one classic cross-reference table, `N G obj … endobj`, streams with a direct or
 * indirect /Length) and writing a new one. Anything else (a cross-reference stream, an
 * incremental update) is refused with an error rather than guessed at. An object is read
 * as a tree of values, or copied as text with its references renumbered (the cheap way
 * for the many that need nothing else changed).
 *
 * The writer numbers objects as they are added and stores an object it already has
 * (same dictionary text, same stream bytes) once, when the caller says it may be shared:
 * the same font subset, ICC profile or graphics state in many cards is written once.
 */
import { createHash } from 'node:crypto';
import { fileId } from './document.ts';
import {
  atom,
  fillTemplate,
  intOf,
  isDict,
  isRef,
  nameOf,
  PdfLexer,
  ref,
  refText,
  renumberedTemplate,
  writeTemplate,
  writeValue,
  type PdfDict,
  type PdfRef,
  type PdfTemplate,
  type PdfValue,
} from './pdf-syntax.ts';

export interface PdfObject {
  readonly value: PdfValue;
  /** The stream's bytes as stored (still encoded), for a stream object. */
  readonly stream: Uint8Array | null;
}

/** A PDF file read for its objects; each object is parsed when first asked for. */
export class PdfFile {
  readonly version: string;
  readonly trailer: PdfDict;
  private readonly text: string;
  private readonly offsets = new Map<number, number>();
  private readonly parsed = new Map<number, PdfObject>();

  constructor(private readonly bytes: Uint8Array) {
    this.text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1');
    const header = /^%PDF-(\d\.\d)/.exec(this.text);
    if (!header) throw new Error('PDF: the file does not start with a %PDF header');
    this.version = header[1]!;
    const start = /startxref\s+(\d+)\s+%%EOF\s*$/.exec(this.text.slice(-64));
    if (!start) throw new Error('PDF: no startxref at the end of the file');
    const lexer = new PdfLexer(this.text, Number(start[1]));
    if (!lexer.keyword('xref'))
      throw new Error('PDF: only a classic cross-reference table is read (as pdfkit writes)');
    while (!lexer.keyword('trailer')) this.readSubsection(lexer);
    const trailer = lexer.value();
    if (!isDict(trailer)) throw lexer.error('a trailer that is not a dictionary');
    if (trailer.has('Prev') || trailer.has('Encrypt'))
      throw new Error('PDF: incremental updates and encryption are not read');
    this.trailer = trailer;
  }

  /** One subsection: its first number and count, then entries of exactly 20 bytes (§7.5.4). */
  private readSubsection(lexer: PdfLexer): void {
    lexer.skipSpace();
    const first = Number(lexer.regular());
    lexer.skipSpace();
    const count = Number(lexer.regular());
    lexer.skipSpace();
    if (!Number.isInteger(first) || !Number.isInteger(count))
      throw lexer.error('a cross-reference subsection without its first number and count');
    const t = this.text;
    for (let i = 0; i < count; i++, lexer.pos += 20) {
      const type = t[lexer.pos + 17];
      if (t[lexer.pos + 10] !== ' ' || (type !== 'n' && type !== 'f'))
        throw lexer.error('a malformed cross-reference entry');
      if (type === 'n') this.offsets.set(first + i, Number(t.slice(lexer.pos, lexer.pos + 10)));
    }
  }

  /** A lexer just after object `num`'s `N G obj`; an error when the file has no such object. */
  private body(num: number): PdfLexer {
    const offset = this.offsets.get(num);
    if (offset === undefined) throw new Error(`PDF: no object ${num} in the file`);
    const lexer = new PdfLexer(this.text, offset);
    lexer.skipSpace();
    const header = /(\d+) (\d+) obj/y;
    header.lastIndex = lexer.pos;
    const match = header.exec(this.text);
    if (!match || Number(match[1]) !== num) throw lexer.error(`object ${num} is not at its offset`);
    lexer.pos = header.lastIndex;
    return lexer;
  }

  /**
   * Object `num` as a template of its text with its references renumbered (pdf-syntax.ts
   * renumberedTemplate), when it is not a stream and holds none of the names in `stop`;
   * null otherwise.
   */
  renumberedTemplate(
    num: number,
    renumber: (num: number) => number,
    stop: ReadonlySet<string>,
  ): PdfTemplate | null {
    const lexer = this.body(num);
    const copied = renumberedTemplate(this.text, lexer.pos, renumber, stop);
    if (!copied) return null;
    lexer.pos = copied.end;
    return lexer.keyword('endobj') ? copied.template : null;
  }

  /** Where `stream` (an object's stream, as `object` gives it) starts in the file's bytes. */
  offsetOf(stream: Uint8Array): number | null {
    return stream.buffer === this.bytes.buffer ? stream.byteOffset - this.bytes.byteOffset : null;
  }

  /** Object `num`; an error when the file has none. */
  object(num: number): PdfObject {
    const known = this.parsed.get(num);
    if (known) return known;
    const lexer = this.body(num);
    const value = lexer.value();
    let stream: Uint8Array | null = null;
    if (lexer.keyword('stream')) {
      if (!isDict(value)) throw lexer.error('a stream without a dictionary');
      // §7.3.8.1: the keyword is followed by CR LF or LF, then the data.
      if (this.text[lexer.pos] === '\r') lexer.pos += 1;
      if (this.text[lexer.pos] === '\n') lexer.pos += 1;
      const length = intOf(this.resolve(value.get('Length')));
      if (length === null) throw lexer.error(`stream ${num} without a /Length`);
      stream = this.bytes.subarray(lexer.pos, lexer.pos + length);
      lexer.pos += length;
      if (!lexer.keyword('endstream')) throw lexer.error(`stream ${num} is not ${length} bytes`);
    }
    if (!lexer.keyword('endobj')) throw lexer.error(`object ${num} without endobj`);
    const object = { value, stream };
    this.parsed.set(num, object);
    return object;
  }

  /** The value a reference points to; any other value as it is. */
  resolve(value: PdfValue | undefined): PdfValue | undefined {
    return isRef(value) ? this.object(value.num).value : value;
  }

  /** The dictionary `value` is or points to; an error naming `what` otherwise. */
  dict(value: PdfValue | undefined, what: string): PdfDict {
    const resolved = this.resolve(value);
    if (!isDict(resolved)) throw new Error(`PDF: ${what} is not a dictionary`);
    return resolved;
  }

  get catalog(): PdfDict {
    return this.dict(this.trailer.get('Root'), 'the catalog (/Root)');
  }

  /** The pages in order, walking the page tree from the catalog's /Pages. */
  pages(): PdfRef[] {
    const out: PdfRef[] = [];
    const walk = (node: PdfValue | undefined) => {
      if (!isRef(node)) throw new Error('PDF: a page tree node that is not a reference');
      const dict = this.dict(node, `page tree node ${node.num}`);
      if (nameOf(dict.get('Type')) === 'Page') out.push(node);
      else {
        const kids = dict.get('Kids');
        if (!Array.isArray(kids)) throw new Error(`PDF: page tree node ${node.num} has no /Kids`);
        kids.forEach(walk);
      }
    };
    walk(this.catalog.get('Pages'));
    return out;
  }
}

/** What the writer holds of one object: its text between `obj` and `endobj`. */
interface Written {
  readonly head: string;
  readonly stream: Uint8Array | null;
  /** Content hash, of shared objects only (hashing them all would cost more than the copy). */
  readonly digest: string | null;
}

/**
 * The content hash of a shareable object: its text with each reference replaced by the
 * hash of the object it points to, and its stream's bytes; null when it refers to anything
 * not shareable (that object's identity matters, so this one's does too) or to a key. The
 * same object has the same hash whatever its references' numbers, in whichever file it
 * was numbered (a set, or a card page's segment in merge.ts): shared objects dedupe
 * across both.
 */
export function contentDigest(
  template: PdfTemplate,
  stream: Uint8Array | null,
  digestOf: (slot: number) => string | null,
): string | null {
  const hash = createHash('sha256');
  const { pieces, slots } = template;
  hash.update(pieces[0]!, 'latin1');
  for (let i = 0; i < slots.length; i++) {
    const child = slots[i]! < 1 ? null : digestOf(slots[i]!);
    if (child === null) return null;
    hash.update(`{${child}}`, 'latin1').update(pieces[i + 1]!, 'latin1');
  }
  if (stream) hash.update(stream);
  return hash.digest('hex');
}

/** Where an object's copy goes: a file (PdfWriter) or a card page's segment (merge.ts). */
export interface ObjectSink {
  /** A number for an object added later with `add(…, num)`. */
  reserve(): number;
  add(
    value: PdfValue,
    stream: Uint8Array | null,
    options?: { num?: number; share?: boolean },
  ): number;
  /** Adds an object whose text is a template already (never shared). */
  addTemplate(template: PdfTemplate, num?: number): number;
  /** The content hash of shared object `num`. */
  digest(num: number): string;
}

/** A new PDF file, object by object; `finish` writes the cross-reference table and trailer. */
export class PdfWriter implements ObjectSink {
  private readonly objects: (Written | null)[] = [];
  private readonly shared = new Map<string, number>();

  /** A number for an object added later with `add(…, num)`. */
  reserve(): number {
    this.objects.push(null);
    return this.objects.length;
  }

  /**
   * Adds an object (its /Length set from the stream) at `num`, or at a new number, or,
   * when `share` is true, returns the number of an identical shared object already added.
   */
  add(
    value: PdfValue,
    stream: Uint8Array | null,
    options: { num?: number; share?: boolean } = {},
  ): number {
    if (stream) {
      if (!isDict(value)) throw new Error('PDF: a stream needs a dictionary');
      value.set('Length', atom(String(stream.length)));
    }
    const template = writeTemplate(value);
    const share = options.share === true && options.num === undefined;
    const digest = share
      ? contentDigest(template, stream, (n) => this.objects[n - 1]?.digest ?? null)
      : null;
    if (digest !== null) {
      const known = this.shared.get(digest);
      if (known !== undefined) return known;
    }
    const num = options.num ?? this.reserve();
    this.put(num, fillTemplate(template, refText), stream, digest);
    return num;
  }

  /** Adds an object written as text already (never shared), at `num` or a new number. */
  addText(head: string, num?: number): number {
    const target = num ?? this.reserve();
    this.put(target, head, null, null);
    return target;
  }

  addTemplate(template: PdfTemplate, num?: number): number {
    return this.addText(fillTemplate(template, refText), num);
  }

  /** The number of the shared object of this content hash, if one was added. */
  sharedNumber(digest: string): number | undefined {
    return this.shared.get(digest);
  }

  /**
   * Writes object `num` (reserved) as it is: its text, stream (its /Length in the text
   * already) and content hash when it may be shared (merge.ts, filling a segment in).
   */
  put(num: number, head: string, stream: Uint8Array | null, digest: string | null): void {
    if (this.objects[num - 1] !== null) throw new Error(`PDF: object ${num} written twice`);
    this.objects[num - 1] = { head, stream, digest };
    if (digest !== null && !this.shared.has(digest)) this.shared.set(digest, num);
  }

  /** The content hash of shared object `num` (its text and stream bytes). */
  digest(num: number): string {
    const digest = this.objects[num - 1]?.digest;
    if (!digest) throw new Error(`PDF: object ${num} is not a shared object written yet`);
    return digest;
  }

  /**
   * The file: header, objects in number order, cross-reference table, trailer. The file
   * identifier is hashed from everything before the trailer, so the same objects give the
   * same bytes and any change gives another /ID.
   */
  finish(version: string, root: number, info: number): Buffer {
    // Text is gathered into one string between streams: a Buffer per small piece would
    // cost more than the copying itself.
    const chunks: Uint8Array[] = [];
    let length = 0;
    let text = '';
    const flush = () => {
      const bytes = Buffer.from(text, 'latin1');
      chunks.push(bytes);
      length += bytes.length;
      text = '';
    };
    text += `%PDF-${version}\n%\xff\xff\xff\xff\n`;
    const offsets: number[] = [];
    this.objects.forEach((object, i) => {
      if (!object) throw new Error(`PDF: object ${i + 1} was reserved and never written`);
      offsets.push(length + text.length);
      text += `${i + 1} 0 obj\n${object.head}\n`;
      if (object.stream) {
        text += 'stream\n';
        flush();
        chunks.push(object.stream);
        length += object.stream.length;
        text += '\nendstream\n';
      }
      text += 'endobj\n';
    });
    const size = this.objects.length + 1;
    const xref = length + text.length;
    text += `xref\n0 ${size}\n0000000000 65535 f \n`;
    for (const offset of offsets) text += `${String(offset).padStart(10, '0')} 00000 n \n`;
    flush();
    const body = Buffer.concat(chunks, length);
    const seed = createHash('sha256').update(body).update(`${root} ${info}`).digest('hex');
    const id = Buffer.from(fileId(seed)).toString('hex');
    const trailer = new Map<string, PdfValue>([
      ['Size', atom(String(size))],
      ['Root', ref(root)],
      ['Info', ref(info)],
      ['ID', [atom(`<${id}>`), atom(`<${id}>`)]],
    ]);
    const tail = `trailer\n${writeValue(trailer)}\nstartxref\n${xref}\n%%EOF\n`;
    return Buffer.concat([body, Buffer.from(tail, 'latin1')]);
  }
}
