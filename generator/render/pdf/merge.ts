/**
 * A set's PDF assembled from PDFs already made, at the object level, instead of drawing
 * every card again (a card page costs ~30 ms to draw and well under 1 ms to copy):
 *
 *   shell (pdfkit: metadata, front matter, outline, and per card a placeholder page
 *   carrying only its page number) ─┐
 *   each card's own one-page PDF ───┴─▶ mergeCardPages ─▶ the set's PDF
 *
 * For each placeholder page the card's page and every object reachable from it (content,
 * resources, fonts, annotations) are copied in, renumbered, under the placeholder's
 * object number, so everything that pointed at the placeholder (the outline, the page
 * tree) now points at the card. The placeholder's own drawing (the page number) is kept
 * as a Form XObject painted after the card's content, under a resource name of its own;
 * the card's content is wrapped in q … Q first, since pdfkit leaves its flipped
 * coordinate system set at the end of a page.
 *
 * Tagging stays whole: each card's structure elements (the Art under its Document) move
 * under the shell's Document, in page order, and the card's parent-tree keys (its page's
 * /StructParents, its annotations' /StructParent) are renumbered after the shell's.
 *
 * A card's page is first turned into its segment (pageSegment): its objects as
 * templates, numbered within the card, with holes for what only the set knows (the
 * page's own number, the page tree, the Document element, the stamp, the first
 * parent-tree key); the set fills them in (mergeCardPages). A segment depends on the card
 * PDF's bytes alone, so the build keeps it beside the card PDF in the cache
 * (encodeSegment, decodeSegment) and a set whose cards are known costs a concatenation:
 * a set made from cached segments is byte for byte the set made from the card PDFs.
 *
 * Objects that may be shared (streams, fonts, graphics states) are stored once when
 * identical (pdf-file.ts contentDigest, the same hash in a segment and in the set). Font subsets get a subset tag hashed from their font program: pdfkit tags
 * every document's DejaVu subset alike (BZZZZZ+DejaVuSans), and different subsets under
 * one name in one file are wrong (ISO 32000-1 §9.6.4) and confuse viewers that cache
 * fonts by name. Same inputs, same bytes; the /ID is hashed from the file's content.
 */
import { createHash } from 'node:crypto';
import { contentDigest, PdfFile, PdfWriter, type ObjectSink } from './pdf-file.ts';
import {
  atom,
  fillTemplate,
  intOf,
  isDict,
  isRef,
  key,
  nameOf,
  numberOf,
  ref,
  writeTemplate,
  type PdfDict,
  type PdfRef,
  type PdfTemplate,
  type PdfValue,
} from './pdf-syntax.ts';

/**
 * A placeholder page of the shell (0-based) and the one-page PDF that takes its place,
 * with the PDF's segment when one is known (a cached one; else it is made from `pdf`).
 */
export interface CardGraft {
  readonly page: number;
  readonly pdf: Uint8Array;
  readonly segment?: PageSegment | null;
}

/** Objects whose identity does not matter (pages, structure elements and annotations do). */
const SHAREABLE_TYPES = new Set(['Font', 'FontDescriptor', 'ExtGState']);

/**
 * Names that make an object worth reading as a tree: a type (it may be shared), a font
 * name (to retag), a parent-tree key (to renumber). The rest, structure elements above
 * all, is copied as text with only its references renumbered.
 */
const AS_TREE = new Set(['Type', 'BaseFont', 'FontName', 'StructParent', 'StructParents']);

/** A file being copied: its objects' new numbers, written or only reserved. */
class Source {
  private readonly numbers = new Map<number, number>();
  private readonly written = new Set<number>();
  private readonly visiting = new Set<number>();
  /** Edits of particular objects after their references are renumbered. */
  readonly edits = new Map<number, (value: PdfValue) => PdfValue>();

  constructor(
    readonly file: PdfFile,
    private readonly out: Output,
    /** Old parent-tree keys → what takes their place; null keeps them. */
    private readonly structKeys: Map<number, PdfValue> | null,
  ) {}

  /** Object `num` stands for `target`, an object of the output (never copied itself). */
  alias(num: number, target: number): void {
    this.numbers.set(num, target);
    this.written.add(num);
  }

  /** A new number for object `num`, written when it is first copied. */
  reserve(num: number): number {
    const target = this.out.writer.reserve();
    this.numbers.set(num, target);
    return target;
  }

  /** Copies object `num` and everything it refers to; returns its new number. */
  copy(num: number): number {
    const known = this.numbers.get(num);
    if (this.written.has(num)) return known!;
    if (this.visiting.has(num)) {
      // A cycle (a structure element and its parent): the object needs its number now,
      // and one numbered before its content is known is never shared.
      return known ?? this.reserve(num);
    }
    this.visiting.add(num);
    const edit = this.edits.get(num);
    const template = edit ? null : this.file.renumberedTemplate(num, (n) => this.copy(n), AS_TREE);
    let target: number;
    if (template !== null) {
      this.visiting.delete(num);
      target = this.out.writer.addTemplate(template, this.numbers.get(num));
    } else {
      const object = this.file.object(num);
      let value = this.renumber(object.value);
      if (edit) value = edit(value);
      this.visiting.delete(num);
      target = this.out.add(value, object.stream, this.numbers.get(num));
    }
    this.numbers.set(num, target);
    this.written.add(num);
    return target;
  }

  /** The value with its references renumbered (their objects copied) and its keys mapped. */
  renumber(value: PdfValue): PdfValue {
    if (Array.isArray(value)) return value.map((item) => this.renumber(item));
    if (isDict(value)) {
      const out: PdfDict = new Map();
      for (const [name, item] of value) {
        const structKey = name === 'StructParents' || name === 'StructParent' ? intOf(item) : null;
        out.set(name, structKey === null ? this.renumber(item) : this.key(structKey));
      }
      return this.out.retagged(out);
    }
    return isRef(value) ? ref(this.copy(value.num)) : value;
  }

  private key(old: number): PdfValue {
    if (!this.structKeys) return atom(String(old));
    const mapped = this.structKeys.get(old);
    if (mapped === undefined)
      throw new Error(`PDF merge: parent-tree key ${old} is not in the tree`);
    return mapped;
  }
}

/** The output (a file, or a segment), with the subset tags of the fonts written to it. */
class Output {
  private readonly tags = new Map<number, string>();

  constructor(readonly writer: ObjectSink) {}

  add(value: PdfValue, stream: Uint8Array | null, num?: number): number {
    const type = isDict(value) ? nameOf(value.get('Type')) : null;
    const share = stream !== null || (type !== null && SHAREABLE_TYPES.has(type));
    const target = this.writer.add(value, stream, { ...(num ? { num } : {}), share });
    const tag = isDict(value) ? this.tagOf(value) : null;
    if (tag) this.tags.set(target, tag);
    return target;
  }

  /** A font dictionary's subset name with the tag of its font program; others unchanged. */
  retagged(dict: PdfDict): PdfDict {
    for (const name of ['FontName', 'BaseFont']) {
      const font = nameOf(dict.get(name));
      if (font === null || !SUBSET_NAME.test(font)) continue;
      const tag = this.tagOf(dict);
      if (tag) dict.set(name, atom(`/${tag}${font.slice(6)}`));
    }
    return dict;
  }

  /**
   * The subset tag of a font dictionary: hashed from its font program (a descriptor's
   * /FontFile2), or the tag of its descriptor (a CIDFont), or of its descendant (Type0).
   */
  private tagOf(dict: PdfDict): string | null {
    for (const name of ['FontFile', 'FontFile2', 'FontFile3']) {
      const program = dict.get(name);
      if (isRef(program)) return subsetTag(this.writer.digest(program.num));
    }
    const descriptor = dict.get('FontDescriptor');
    if (isRef(descriptor)) return this.tags.get(descriptor.num) ?? null;
    const descendant = dict.get('DescendantFonts');
    const first = Array.isArray(descendant) ? descendant[0] : undefined;
    return isRef(first) ? (this.tags.get(first.num) ?? null) : null;
  }
}

const SUBSET_NAME = /^[A-Z]{6}\+/;

/** Six capital letters from a hash (§9.6.4 asks only that different subsets differ). */
function subsetTag(digest: string): string {
  const bytes = createHash('sha256').update(digest).digest();
  return [...bytes.subarray(0, 6)].map((b) => String.fromCharCode(65 + (b % 26))).join('');
}

/** What a segment's page refers to that only the set has. */
type Outside = 'pages' | 'document' | 'stamp';

/** One object of a segment: its template (slots: the segment's own numbers), stream, hash. */
export interface SegmentObject {
  readonly template: PdfTemplate;
  readonly stream: Uint8Array | null;
  /** Its content hash when it may be shared (pdf-file.ts contentDigest); else null. */
  readonly digest: string | null;
}

/**
 * A card's page in the set's object form, numbered within itself (1…n): what
 * mergeCardPages fills into a placeholder's place. A pure function of the card PDF.
 */
export interface PageSegment {
  /** By number − 1: an object, or what the set puts there. */
  readonly objects: readonly (SegmentObject | Outside)[];
  /** The number of the page object (it takes its placeholder's number). */
  readonly page: number;
  readonly mediaBox: readonly number[];
  /** The card's Art elements (the kids of its Document), as references. */
  readonly arts: readonly PdfTemplate[];
  /** The parent tree's values, the i-th under the card's i-th key. */
  readonly nums: readonly PdfTemplate[];
}

/** A segment being written: the ObjectSink of a card's Output. */
class SegmentWriter implements ObjectSink {
  readonly objects: (SegmentObject | Outside | null)[] = [];
  private readonly shared = new Map<string, number>();

  reserve(): number {
    this.objects.push(null);
    return this.objects.length;
  }

  outside(what: Outside): number {
    this.objects.push(what);
    return this.objects.length;
  }

  private digestOf = (num: number): string | null => {
    const object = this.objects[num - 1];
    return typeof object === 'object' && object !== null ? object.digest : null;
  };

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
    const digest = share ? contentDigest(template, stream, this.digestOf) : null;
    if (digest !== null) {
      const known = this.shared.get(digest);
      if (known !== undefined) return known;
    }
    const num = options.num ?? this.reserve();
    this.put(num, { template, stream, digest });
    if (digest !== null) this.shared.set(digest, num);
    return num;
  }

  addTemplate(template: PdfTemplate, num?: number): number {
    const target = num ?? this.reserve();
    this.put(target, { template, stream: null, digest: null });
    return target;
  }

  private put(num: number, object: SegmentObject): void {
    if (this.objects[num - 1] !== null) throw new Error(`PDF: object ${num} written twice`);
    this.objects[num - 1] = object;
  }

  digest(num: number): string {
    const digest = this.digestOf(num);
    if (!digest) throw new Error(`PDF: object ${num} is not a shared object written yet`);
    return digest;
  }
}

const Q_OPEN = Buffer.from('q\n', 'latin1');

/**
 * A card's one-page PDF as a segment: its page and everything the page reaches, copied
 * (renumbered within the segment, fonts retagged, identical shared objects once), the
 * page's resources with a name for the set's stamp, its content wrapped in q … Q and
 * followed by the stamp, and its structure (its Document's kids, its parent tree) with
 * holes for the set's numbers.
 */
export function pageSegment(bytes: Uint8Array): PageSegment {
  const file = new PdfFile(bytes);
  const cardPages = file.pages();
  if (cardPages.length !== 1)
    throw new Error(`PDF merge: a card PDF has ${cardPages.length} pages, not one`);
  const cardPage = cardPages[0]!;
  const page = file.dict(cardPage, 'the card’s page');
  const writer = new SegmentWriter();
  const out = new Output(writer);
  const pageNum = writer.reserve();
  const pagesNum = writer.outside('pages');
  const documentNum = writer.outside('document');
  const stampNum = writer.outside('stamp');

  const catalog = file.catalog;
  const tree = file.dict(catalog.get('StructTreeRoot'), 'the card’s structure tree root');
  const document = onlyKid(tree, 'a card');
  const entries = numsOf(tree.get('ParentTree'), (v) => file.resolve(v)!, 'a card');
  const keys = new Map<number, PdfValue>();
  for (let i = 0; i < entries.length; i += 2) keys.set(intOf(entries[i])!, key(i / 2));
  const src = new Source(file, out, keys);
  src.alias(cardPage.num, pageNum);
  src.alias(refIn(catalog, 'Pages', 'a card').num, pagesNum);
  src.alias(document.num, documentNum);

  const resources = file.dict(page.get('Resources'), 'the card page’s resources');
  const xobjects = resources.has('XObject')
    ? file.dict(resources.get('XObject'), 'the card page’s XObjects')
    : new Map<string, PdfValue>();
  const name = freeName(xobjects, 'SetStamp');
  const others: PdfDict = new Map([...resources].filter(([k]) => k !== 'XObject'));
  const newResources = src.renumber(others) as PdfDict;
  newResources.set(
    'XObject',
    new Map([...(src.renumber(xobjects) as PdfDict), [name, ref(stampNum)]]),
  );

  const cardContents = page.get('Contents');
  const contents = [
    ref(out.add(new Map(), Q_OPEN)),
    ...(src.renumber(Array.isArray(cardContents) ? cardContents : [cardContents!]) as PdfValue[]),
    ref(out.add(new Map(), Buffer.from(`\nQ\nq /${name} Do Q\n`, 'latin1'))),
  ];
  const rest: PdfDict = new Map([...page].filter(([k]) => !PAGE_OWN.has(k)));
  const newPage = src.renumber(rest) as PdfDict;
  newPage.set('Parent', ref(pagesNum));
  newPage.set('Contents', contents);
  newPage.set('Resources', ref(out.add(newResources, null)));
  out.add(newPage, null, pageNum);

  const kids = file.dict(document, 'a card’s Document element').get('K');
  const arts = src.renumber(Array.isArray(kids) ? kids : kids ? [kids] : []) as PdfValue[];
  const nums: PdfTemplate[] = [];
  for (let i = 0; i < entries.length; i += 2)
    nums.push(writeTemplate(src.renumber(entries[i + 1]!)));
  const objects = writer.objects.map((object, i) => {
    if (object === null) throw new Error(`PDF merge: segment object ${i + 1} never written`);
    return object;
  });
  return {
    objects,
    page: pageNum,
    mediaBox: mediaBox(file, page),
    arts: arts.map(writeTemplate),
    nums,
  };
}

/** The shell with each graft's placeholder page replaced by the graft's page, stamped. */
export function mergeCardPages(shell: Uint8Array, grafts: readonly CardGraft[]): Buffer {
  const out = new Output(new PdfWriter());
  const writer = out.writer as PdfWriter;
  const src = new Source(new PdfFile(shell), out, null);
  const { file } = src;
  const catalog = file.catalog;
  const pagesRoot = refIn(catalog, 'Pages', 'the shell');
  const treeRoot = refIn(catalog, 'StructTreeRoot', 'the shell');
  const tree = file.dict(treeRoot, 'the shell’s structure tree root');
  const document = onlyKid(tree, 'the shell');
  const pages = file.pages();
  const shellKeys = intOf(tree.get('ParentTreeNextKey')) ?? 0;

  const target = {
    pages: src.reserve(pagesRoot.num),
    document: src.reserve(document.num),
    nextKey: shellKeys,
  };
  const placeholders = grafts.map((graft) => {
    const page = pages[graft.page];
    if (!page) throw new Error(`PDF merge: the shell has no page ${graft.page + 1}`);
    const num = writer.reserve();
    src.alias(page.num, num);
    return { graft, page, num };
  });
  const arts: PdfValue[] = [];
  const nums: PdfValue[] = [];
  for (const { graft, page, num } of placeholders) {
    const segment = graft.segment ?? pageSegment(graft.pdf);
    const stamp = stampOf(out, src, page, segment);
    const card = fillSegment(writer, segment, { ...target, page: num, stamp });
    target.nextKey += segment.nums.length;
    arts.push(...card.arts);
    nums.push(...card.nums);
  }

  src.edits.set(document.num, (value) => {
    const dict = value as PdfDict;
    const kids = dict.get('K');
    dict.set('K', [...(Array.isArray(kids) ? kids : kids ? [kids] : []), ...arts]);
    return dict;
  });
  src.edits.set(treeRoot.num, (value) => {
    const dict = value as PdfDict;
    const own = numsOf(dict.get('ParentTree'), (v) => v, 'the shell');
    dict.set('ParentTree', new Map([['Nums', [...own, ...nums]]]));
    dict.set('ParentTreeNextKey', atom(String(target.nextKey)));
    return dict;
  });
  const root = src.copy(refIn(file.trailer, 'Root', 'the shell’s trailer').num);
  const info = src.copy(refIn(file.trailer, 'Info', 'the shell’s trailer').num);
  return writer.finish(file.version, root, info);
}

/** The placeholder's drawing as a form (painted over the card), after the size check. */
function stampOf(out: Output, shell: Source, placeholder: PdfRef, segment: PageSegment): number {
  const spot = shell.file.dict(placeholder, 'a placeholder page');
  if (spot.has('StructParents'))
    throw new Error(
      'PDF merge: a placeholder page has tagged content; it may carry artifacts only',
    );
  const box = mediaBox(shell.file, spot);
  const cardBox = segment.mediaBox;
  if (box.some((v, i) => Math.abs(v - cardBox[i]!) > 0.005))
    throw new Error(
      `PDF merge: a card page is ${cardBox[2]}×${cardBox[3]} pt, its place in the set ${box[2]}×${box[3]} pt`,
    );
  const content = shell.file.object(refIn(spot, 'Contents', 'a placeholder page').num);
  const form: PdfDict = new Map<string, PdfValue>([
    ['Type', atom('/XObject')],
    ['Subtype', atom('/Form')],
    ['BBox', shell.renumber(spot.get('MediaBox')!)],
    ['Resources', shell.renumber(spot.get('Resources')!)],
  ]);
  for (const name of ['Filter', 'DecodeParms']) {
    const value = (content.value as PdfDict).get(name);
    if (value) form.set(name, shell.renumber(value));
  }
  return out.add(form, content.stream);
}

/**
 * Writes a segment's objects into the set: shared objects the set has already are not
 * written again; the others get numbers in the segment's order. Returns the card's Art
 * references and parent-tree entries, numbered.
 */
function fillSegment(
  writer: PdfWriter,
  segment: PageSegment,
  at: {
    readonly pages: number;
    readonly document: number;
    readonly stamp: number;
    readonly page: number;
    readonly nextKey: number;
  },
): { arts: PdfValue[]; nums: PdfValue[] } {
  const numbers = new Array<number>(segment.objects.length + 1);
  const write: number[] = [];
  segment.objects.forEach((object, i) => {
    const num = i + 1;
    if (typeof object === 'string') numbers[num] = at[object];
    else if (num === segment.page) {
      numbers[num] = at.page;
      write.push(num);
    } else {
      const known = object.digest === null ? undefined : writer.sharedNumber(object.digest);
      if (known !== undefined) numbers[num] = known;
      else {
        numbers[num] = writer.reserve();
        write.push(num);
      }
    }
  });
  const fill = (slot: number): string => {
    if (slot < 0) return String(at.nextKey - 1 - slot);
    const num = numbers[slot];
    if (num === undefined)
      throw new Error(`PDF merge: a segment refers to its object ${slot}, which it has not`);
    return `${num} 0 R`;
  };
  for (const num of write) {
    const object = segment.objects[num - 1] as SegmentObject;
    writer.put(numbers[num]!, fillTemplate(object.template, fill), object.stream, object.digest);
  }
  return {
    arts: segment.arts.map((t) => atom(fillTemplate(t, fill))),
    nums: segment.nums.flatMap((t, i) => [
      atom(String(at.nextKey + i)),
      atom(fillTemplate(t, fill)),
    ]),
  };
}

/** Segment text format; bumped when PageSegment or its encoding changes. */
const SEGMENT_FORMAT = 1;

interface EncodedObject {
  readonly p: readonly string[];
  readonly s: readonly number[];
  readonly d: string | null;
  /** The stream: [offset, length] in the card PDF, or its bytes as latin1 text. */
  readonly b?: readonly [number, number] | string;
}

/**
 * A segment as text, for the cache beside its card PDF: the streams it took from the
 * card PDF by their place in it (the card PDF is read anyway), the others as text.
 */
export function encodeSegment(segment: PageSegment, pdf: Uint8Array): string {
  const base = pdf.byteOffset;
  const objects = segment.objects.map((object): EncodedObject | Outside => {
    if (typeof object === 'string') return object;
    const { template, stream, digest } = object;
    const encoded = { p: template.pieces, s: template.slots, d: digest };
    if (!stream) return encoded;
    const inside =
      stream.buffer === pdf.buffer &&
      stream.byteOffset >= base &&
      stream.byteOffset + stream.byteLength <= base + pdf.byteLength;
    return {
      ...encoded,
      b: inside
        ? [stream.byteOffset - base, stream.byteLength]
        : Buffer.from(stream.buffer, stream.byteOffset, stream.byteLength).toString('latin1'),
    };
  });
  return JSON.stringify({
    format: SEGMENT_FORMAT,
    pdfBytes: pdf.byteLength,
    pdfTail: tailOf(pdf),
    page: segment.page,
    mediaBox: segment.mediaBox,
    arts: segment.arts.map((t) => [t.pieces, t.slots]),
    nums: segment.nums.map((t) => [t.pieces, t.slots]),
    objects,
  });
}

/**
 * The last bytes of a PDF: its trailer, with the file identifier (pdfkit hashes a card's
 * from its whole view, document.ts) and the cross-reference table's offset.
 */
const tailOf = (pdf: Uint8Array): string =>
  Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength).toString(
    'latin1',
    Math.max(0, pdf.byteLength - TAIL_BYTES),
  );

const TAIL_BYTES = 160;

const isStreamStart = (text: string) => text.endsWith('stream\n') || text.endsWith('stream\r\n');

/**
 * The segment `text` holds, for the card PDF `pdf`; null when it is not one (another
 * format, damaged, or for another file: the PDF must have the length and trailer it
 * says, and its streams must sit where it says, between `stream` and `endstream`), so
 * the caller makes the segment again from the PDF.
 */
export function decodeSegment(text: string, pdf: Uint8Array): PageSegment | null {
  try {
    const raw = JSON.parse(text) as {
      format: number;
      pdfBytes: number;
      pdfTail: string;
      page: number;
      mediaBox: number[];
      arts: [string[], number[]][];
      nums: [string[], number[]][];
      objects: (EncodedObject | Outside)[];
    };
    if (raw.format !== SEGMENT_FORMAT || raw.pdfBytes !== pdf.byteLength) return null;
    if (raw.pdfTail !== tailOf(pdf)) return null;
    const view = Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength);
    const template = ([pieces, slots]: [string[], number[]]): PdfTemplate => {
      if (!Array.isArray(pieces) || !Array.isArray(slots) || pieces.length !== slots.length + 1)
        throw new Error('not a template');
      return { pieces, slots };
    };
    const count = raw.objects.length;
    const objects = raw.objects.map((object): SegmentObject | Outside => {
      if (object === 'pages' || object === 'document' || object === 'stamp') return object;
      const t = template([object.p as string[], object.s as number[]]);
      if (t.slots.some((slot) => slot > count || slot === 0)) throw new Error('a slot outside');
      let stream: Uint8Array | null = null;
      if (typeof object.b === 'string') stream = Buffer.from(object.b, 'latin1');
      else if (Array.isArray(object.b)) {
        const [offset, length] = object.b;
        if (offset < 0 || offset + length > view.length) throw new Error('a stream outside');
        const before = view.toString('latin1', Math.max(0, offset - 8), offset);
        const after = view.toString('latin1', offset + length, offset + length + 11);
        if (!isStreamStart(before) || !/^\r?\n?endstream/.test(after))
          throw new Error('a stream not where the segment says');
        stream = view.subarray(offset, offset + length);
      }
      return { template: t, stream, digest: typeof object.d === 'string' ? object.d : null };
    });
    const page = objects[raw.page - 1];
    if (!page || typeof page === 'string' || raw.mediaBox.length !== 4) return null;
    return {
      objects,
      page: raw.page,
      mediaBox: raw.mediaBox,
      arts: raw.arts.map(template),
      nums: raw.nums.map(template),
    };
  } catch {
    return null;
  }
}

/** Page entries the merge sets itself. */
const PAGE_OWN = new Set(['Parent', 'Contents', 'Resources']);

function refIn(dict: PdfDict, name: string, what: string): PdfRef {
  const value = dict.get(name);
  if (!isRef(value)) throw new Error(`PDF merge: ${what} has no /${name} reference`);
  return value;
}

/** The one element under a structure tree root (pdfkit's Document). */
function onlyKid(tree: PdfDict, what: string): PdfRef {
  const kids = tree.get('K');
  const only = Array.isArray(kids) && kids.length === 1 ? kids[0] : kids;
  if (!isRef(only)) throw new Error(`PDF merge: ${what} has no single Document structure element`);
  return only;
}

/** The key, value pairs of a flat number tree (as pdfkit writes the parent tree). */
function numsOf(
  tree: PdfValue | undefined,
  resolve: (value: PdfValue) => PdfValue,
  what: string,
): PdfValue[] {
  const dict = tree && resolve(tree);
  if (!isDict(dict) || dict.has('Kids'))
    throw new Error(`PDF merge: ${what} has no flat parent tree (/Nums)`);
  const nums = dict.get('Nums') ?? [];
  if (!Array.isArray(nums)) throw new Error(`PDF merge: ${what}’s /Nums is not an array`);
  return nums;
}

function mediaBox(file: PdfFile, page: PdfDict): number[] {
  const box = file.resolve(page.get('MediaBox'));
  const numbers = Array.isArray(box) ? box.map((v) => numberOf(file.resolve(v))) : [];
  if (numbers.length !== 4 || numbers.some((n) => n === null))
    throw new Error('PDF merge: a page without a MediaBox of four numbers');
  return numbers as number[];
}

/** `base`, or `base` with the first number that makes it a name `dict` does not have. */
function freeName(dict: PdfDict, base: string): string {
  let name = base;
  for (let i = 1; dict.has(name); i++) name = `${base}${i}`;
  return name;
}
