/**
 * Reading PDFs back in tests with pdfjs-dist's legacy build (runs in Node without a
 * canvas or poppler): page count and sizes, text per page, the XMP packet, MarkInfo, the
 * structure tree, link annotations and the outline.
 */
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

export interface StructNode {
  readonly role?: string;
  readonly alt?: string;
  readonly children?: readonly (StructNode | { readonly type: string })[];
}

export interface ReadPdf {
  readonly pages: number;
  /** [width, height] of each page, pt. */
  readonly sizes: readonly (readonly [number, number])[];
  /** Text of each page, items joined with spaces (line ends as spaces). */
  readonly text: readonly string[];
  /** The raw XMP packet. */
  readonly xmp: string;
  readonly info: Record<string, unknown>;
  readonly marked: boolean;
  /** Structure tree of each page (pdfjs's view of it). */
  readonly structure: readonly (StructNode | null)[];
  /** The URIs of each page's link annotations. */
  readonly links: readonly (readonly string[])[];
  /** The outline, depth first: each entry's title and the page (0-based) it opens. */
  readonly outline: readonly { readonly title: string; readonly page: number | null }[];
}

interface OutlineItem {
  readonly title: string;
  readonly dest: string | unknown[] | null;
  readonly items: readonly OutlineItem[];
}

/** pdfjs on the file's bytes alone: no eval, no system fonts, no console output. */
export function openPdf(bytes: Uint8Array) {
  return getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    useSystemFonts: false,
    verbosity: 0,
  }).promise;
}

export async function readPdf(bytes: Uint8Array): Promise<ReadPdf> {
  const doc = await openPdf(bytes);
  try {
    const sizes: [number, number][] = [];
    const text: string[] = [];
    const structure: (StructNode | null)[] = [];
    const links: string[][] = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const page = await doc.getPage(i);
      const [x0, y0, x1, y1] = page.view as [number, number, number, number];
      sizes.push([x1 - x0, y1 - y0]);
      const content = await page.getTextContent();
      text.push(
        content.items
          .map((item) => ('str' in item ? item.str + (item.hasEOL ? ' ' : '') : ''))
          .join(' '),
      );
      structure.push((await page.getStructTree()) as StructNode | null);
      const annotations = (await page.getAnnotations()) as { subtype: string; url?: string }[];
      links.push(annotations.filter((a) => a.subtype === 'Link').map((a) => a.url ?? ''));
    }
    const outline: { title: string; page: number | null }[] = [];
    const walk = async (items: readonly OutlineItem[]) => {
      for (const item of items) {
        const dest =
          typeof item.dest === 'string' ? await doc.getDestination(item.dest) : item.dest;
        const target = dest?.[0] as { num: number; gen: number } | undefined;
        outline.push({ title: item.title, page: target ? await doc.getPageIndex(target) : null });
        await walk(item.items);
      }
    };
    await walk(((await doc.getOutline()) ?? []) as OutlineItem[]);
    const meta = await doc.getMetadata();
    const markInfo = (await doc.getMarkInfo()) as { Marked?: boolean } | null;
    return {
      pages: doc.numPages,
      sizes,
      text,
      xmp: meta.metadata?.getRaw() ?? '',
      info: meta.info as Record<string, unknown>,
      marked: markInfo?.Marked === true,
      structure,
      links,
      outline,
    };
  } finally {
    await doc.destroy();
  }
}

/** Text with every run of white space (spaces, no-break spaces, line ends) removed. */
export function squash(text: string): string {
  return text.replace(/[\s\u00a0\u202f]+/g, '');
}

/** Every node of a structure tree, depth first (the reading order). */
export function structNodes(node: StructNode | null): StructNode[] {
  if (!node) return [];
  const out: StructNode[] = [node];
  for (const child of node.children ?? [])
    if ('role' in child || 'children' in child) out.push(...structNodes(child as StructNode));
  return out;
}

/**
 * Smallest size of any non-blank text item on each page, pt (the vertical scale of its text
 * matrix, pdfjs: the scaling of drawings, the chart and a sheet's cells included), and each
 * page's size.
 */
export async function smallestText(
  bytes: Uint8Array,
): Promise<{ sizes: number[]; pages: number[][] }> {
  const doc = await openPdf(bytes);
  try {
    const sizes: number[] = [];
    const pages: number[][] = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const page = await doc.getPage(i);
      const [x0, y0, x1, y1] = page.view as [number, number, number, number];
      pages.push([x1 - x0, y1 - y0]);
      let min = Number.POSITIVE_INFINITY;
      for (const item of (await page.getTextContent()).items) {
        if (!('str' in item) || item.str.trim() === '') continue;
        const [, , c, d] = item.transform as number[];
        min = Math.min(min, Math.hypot(c!, d!));
      }
      sizes.push(min);
    }
    return { sizes, pages };
  } finally {
    await doc.destroy();
  }
}
