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
 * Objects that may be shared (streams, fonts, graphics states) are stored once when
 * identical. Font subsets get a subset tag hashed from their font program: pdfkit tags
 * every document's DejaVu subset alike (BZZZZZ+DejaVuSans), and different subsets under
 * one name in one file are wrong (ISO 32000-1 §9.6.4) and confuse viewers that cache
 * fonts by name. Same inputs, same bytes; the /ID is hashed from the file's content.
 */
import { createHash } from 'node:crypto';
import { PdfFile, PdfWriter } from './pdf-file.ts';
import {
  atom,
  intOf,
  isDict,
  isRef,
  nameOf,
  numberOf,
  ref,
  type PdfDict,
  type PdfRef,
  type PdfValue,
} from './pdf-syntax.ts';

/** A placeholder page of the shell (0-based) and the one-page PDF that takes its place. */
export interface CardGraft {
  readonly page: number;
  readonly pdf: Uint8Array;
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
    /** Old → new parent-tree keys; null keeps them. */
    private readonly structKeys: Map<number, number> | null,
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
    const text = edit ? null : this.file.renumberedText(num, (n) => this.copy(n), AS_TREE);
    let target: number;
    if (text !== null) {
      this.visiting.delete(num);
      target = this.out.writer.addText(text, this.numbers.get(num));
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
      for (const [key, item] of value) {
        const structKey = key === 'StructParents' || key === 'StructParent' ? intOf(item) : null;
        out.set(key, structKey === null ? this.renumber(item) : atom(String(this.key(structKey))));
      }
      return this.out.retagged(out);
    }
    return isRef(value) ? ref(this.copy(value.num)) : value;
  }

  private key(old: number): number {
    if (!this.structKeys) return old;
    const key = this.structKeys.get(old);
    if (key === undefined) throw new Error(`PDF merge: parent-tree key ${old} is not in the tree`);
    return key;
  }
}

/** The output file, with the subset tags of the fonts written to it. */
class Output {
  readonly writer = new PdfWriter();
  private readonly tags = new Map<number, string>();

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
    for (const key of ['FontName', 'BaseFont']) {
      const name = nameOf(dict.get(key));
      if (name === null || !SUBSET_NAME.test(name)) continue;
      const tag = this.tagOf(dict);
      if (tag) dict.set(key, atom(`/${tag}${name.slice(6)}`));
    }
    return dict;
  }

  /**
   * The subset tag of a font dictionary: hashed from its font program (a descriptor's
   * /FontFile2), or the tag of its descriptor (a CIDFont), or of its descendant (Type0).
   */
  private tagOf(dict: PdfDict): string | null {
    for (const key of ['FontFile', 'FontFile2', 'FontFile3']) {
      const program = dict.get(key);
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

const Q_OPEN = Buffer.from('q\n', 'latin1');

/** The shell with each graft's placeholder page replaced by the graft's page, stamped. */
export function mergeCardPages(shell: Uint8Array, grafts: readonly CardGraft[]): Buffer {
  const out = new Output();
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
    const num = out.writer.reserve();
    src.alias(page.num, num);
    return { graft, page, num };
  });
  const arts: PdfValue[] = [];
  const nums: PdfValue[] = [];
  for (const { graft, page, num } of placeholders) {
    const card = graftCard(out, src, page, num, graft.pdf, target);
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
  return out.writer.finish(file.version, root, info);
}

/** Copies one card's page over a placeholder; returns its structure and parent-tree entries. */
function graftCard(
  out: Output,
  shell: Source,
  placeholder: PdfRef,
  num: number,
  bytes: Uint8Array,
  target: { readonly pages: number; readonly document: number; nextKey: number },
): { arts: PdfValue[]; nums: PdfValue[] } {
  const file = new PdfFile(bytes);
  const cardPages = file.pages();
  if (cardPages.length !== 1)
    throw new Error(`PDF merge: a card PDF has ${cardPages.length} pages, not one`);
  const cardPage = cardPages[0]!;
  const page = file.dict(cardPage, 'the card’s page');
  const spot = shell.file.dict(placeholder, 'a placeholder page');
  if (spot.has('StructParents'))
    throw new Error(
      'PDF merge: a placeholder page has tagged content; it may carry artifacts only',
    );
  const box = mediaBox(shell.file, spot);
  const cardBox = mediaBox(file, page);
  if (box.some((v, i) => Math.abs(v - cardBox[i]!) > 0.005))
    throw new Error(
      `PDF merge: a card page is ${cardBox[2]}×${cardBox[3]} pt, its place in the set ${box[2]}×${box[3]} pt`,
    );

  const catalog = file.catalog;
  const tree = file.dict(catalog.get('StructTreeRoot'), 'the card’s structure tree root');
  const document = onlyKid(tree, 'a card');
  const entries = numsOf(tree.get('ParentTree'), (v) => file.resolve(v)!, 'a card');
  const keys = new Map<number, number>();
  for (let i = 0; i < entries.length; i += 2) keys.set(intOf(entries[i])!, target.nextKey++);
  const src = new Source(file, out, keys);
  src.alias(cardPage.num, num);
  src.alias(refIn(catalog, 'Pages', 'a card').num, target.pages);
  src.alias(document.num, target.document);

  // The placeholder's drawing as a form, painted over the card.
  const content = shell.file.object(refIn(spot, 'Contents', 'a placeholder page').num);
  const form: PdfDict = new Map<string, PdfValue>([
    ['Type', atom('/XObject')],
    ['Subtype', atom('/Form')],
    ['BBox', shell.renumber(spot.get('MediaBox')!)],
    ['Resources', shell.renumber(spot.get('Resources')!)],
  ]);
  for (const key of ['Filter', 'DecodeParms']) {
    const value = (content.value as PdfDict).get(key);
    if (value) form.set(key, shell.renumber(value));
  }
  const stamp = out.add(form, content.stream);

  const resources = file.dict(page.get('Resources'), 'the card page’s resources');
  const xobjects = resources.has('XObject')
    ? file.dict(resources.get('XObject'), 'the card page’s XObjects')
    : new Map<string, PdfValue>();
  const name = freeName(xobjects, 'SetStamp');
  const others: PdfDict = new Map([...resources].filter(([key]) => key !== 'XObject'));
  const newResources = src.renumber(others) as PdfDict;
  newResources.set(
    'XObject',
    new Map([...(src.renumber(xobjects) as PdfDict), [name, ref(stamp)]]),
  );

  const cardContents = page.get('Contents');
  const contents = [
    ref(out.add(new Map(), Q_OPEN)),
    ...(src.renumber(Array.isArray(cardContents) ? cardContents : [cardContents!]) as PdfValue[]),
    ref(out.add(new Map(), Buffer.from(`\nQ\nq /${name} Do Q\n`, 'latin1'))),
  ];
  const rest: PdfDict = new Map([...page].filter(([key]) => !PAGE_OWN.has(key)));
  const newPage = src.renumber(rest) as PdfDict;
  newPage.set('Parent', ref(target.pages));
  newPage.set('Contents', contents);
  newPage.set('Resources', ref(out.add(newResources, null)));
  out.add(newPage, null, num);

  const kids = file.dict(document, 'a card’s Document element').get('K');
  const arts = src.renumber(Array.isArray(kids) ? kids : kids ? [kids] : []) as PdfValue[];
  const nums: PdfValue[] = [];
  for (let i = 0; i < entries.length; i += 2)
    nums.push(atom(String(keys.get(intOf(entries[i])!))), src.renumber(entries[i + 1]!));
  return { arts, nums };
}

/** Page entries the merge sets itself. */
const PAGE_OWN = new Set(['Parent', 'Contents', 'Resources']);

function refIn(dict: PdfDict, key: string, what: string): PdfRef {
  const value = dict.get(key);
  if (!isRef(value)) throw new Error(`PDF merge: ${what} has no /${key} reference`);
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
