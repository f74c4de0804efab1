/**
 * site.yaml `brand: { logo, colour }`: the roaster's logo file (SVG or PNG, relative to the
 * content folder) read and checked by its bytes, and the colour with its contrast on white.
 *
 * A logo is judged by what its bytes are, not by its name: a PNG by its signature and IHDR
 * chunk (PNG, ISO/IEC 15948, §5.2 and §11.2.2), an SVG by an `<svg` root element. An SVG is
 * refused when it holds what the PDF renderer does not draw or what could reach outside the
 * file (scripts, embedded or linked images, foreign objects, entity declarations, links
 * to other files). The contrast ratio is WCAG 2.x's (relative luminance, success criterion
 * 1.4.3): the colour is used for headings only at 4.5:1 or more on white.
 */
import { createHash } from 'node:crypto';
import { open, realpath, stat } from 'node:fs/promises';
import { isAbsolute, join, relative } from 'node:path';
import type { ValidFile } from './entry-file.ts';
import { ContentIssue } from './issues.ts';
import { message, type LogoFound } from './messages.ts';
import { issueAt, type YamlSource } from './yaml-source.ts';
import { contrastRatio } from './colour.ts';

export { COLOUR_PATTERN, TEXT_CONTRAST_MIN, contrastRatio, relativeLuminance } from './colour.ts';

/** A logo may have this many bytes: a print logo is some kilobytes; more is the wrong file. */
export const MAX_LOGO_BYTES = 1024 * 1024;

export interface BrandLogo {
  /** As written in site.yaml, relative to the content folder. */
  readonly file: string;
  readonly format: 'svg' | 'png';
  /** The SVG's text, or the PNG's bytes in base64 (JSON-safe, for the views and the cache). */
  readonly data: string;
  /** sha256 of the file's bytes (hex): a changed logo changes every view that shows it. */
  readonly sha256: string;
  /** Intrinsic width and height (PNG pixels; SVG width/height or viewBox): only their ratio is used. */
  readonly width: number;
  readonly height: number;
}

export interface Brand {
  readonly logo: BrandLogo | null;
  /** "#rrggbb", lower case, or null. */
  readonly colour: string | null;
  /** The colour's WCAG 2.x contrast ratio against white (1 to 21), null without a colour. */
  readonly contrastOnWhite: number | null;
}

export interface BrandYaml {
  readonly logo?: string;
  readonly colour?: string;
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

const startsWith = (bytes: Uint8Array, prefix: readonly number[]) =>
  prefix.every((byte, i) => bytes[i] === byte);

/** What a file that is not a usable logo is, by its first bytes. */
function otherFormat(bytes: Uint8Array): LogoFound {
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return 'jpeg';
  if (startsWith(bytes, [0x47, 0x49, 0x46, 0x38])) return 'gif';
  if (
    startsWith(bytes, [0x52, 0x49, 0x46, 0x46]) &&
    startsWith(bytes.subarray(8), [0x57, 0x45, 0x42, 0x50])
  )
    return 'webp';
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46])) return 'pdf';
  return 'unknown';
}

/** A PNG's width and height from its IHDR chunk (the first, right after the signature), or null. */
function pngSize(bytes: Uint8Array): { width: number; height: number } | null {
  if (bytes.length < 33) return null;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const chunkType = String.fromCharCode(...bytes.subarray(12, 16));
  if (view.getUint32(8) !== 13 || chunkType !== 'IHDR') return null;
  const width = view.getUint32(16);
  const height = view.getUint32(20);
  return width > 0 && height > 0 ? { width, height } : null;
}

/** What an SVG logo may not hold, and how the message names it. */
const SVG_REFUSED: readonly [RegExp, string][] = [
  [/<script\b/i, 'a <script> element'],
  [/<foreignObject\b/i, 'a <foreignObject> element'],
  [/<image\b/i, 'an embedded or linked <image>'],
  [/<!ENTITY\b/i, 'an entity declaration'],
  [/\son[a-z]+\s*=/i, 'an event attribute (onload=…)'],
  [/(?:xlink:)?href\s*=\s*["'](?!#)/i, 'a link to another file (href not starting with #)'],
  [/url\(\s*["']?(?!#)/i, 'a url(…) to another file'],
  [/<style\b/i, 'a <style> sheet (give the colours as attributes)'],
];

/** The root <svg> element's start tag, when the text is an SVG document. */
function svgRoot(text: string): string | null {
  // Before the root only a BOM, an XML declaration, comments, a doctype and white space.
  const prolog =
    /^\uFEFF?\s*(?:<\?xml[^>]*\?>\s*)?(?:(?:<!--[\s\S]*?-->|<!DOCTYPE[^>[]*(?:\[[\s\S]*?\])?\s*>)\s*)*/i;
  const rest = text.slice(prolog.exec(text)?.[0].length ?? 0);
  return /^<svg\b[^>]*>/.exec(rest)?.[0] ?? null;
}

/** The SVG's width and height (plain numbers or px/pt/mm/cm/in, same unit), else its viewBox. */
function svgSize(root: string): { width: number; height: number } | null {
  const attr = (name: string) => new RegExp(`\\s${name}\\s*=\\s*["']([^"']*)["']`).exec(root)?.[1];
  const length = /^\s*([0-9]*\.?[0-9]+)\s*(px|pt|mm|cm|in)?\s*$/;
  const w = length.exec(attr('width') ?? '');
  const h = length.exec(attr('height') ?? '');
  if (w && h && (w[2] ?? '') === (h[2] ?? '') && Number(w[1]) > 0 && Number(h[1]) > 0)
    return { width: Number(w[1]), height: Number(h[1]) };
  const box = (attr('viewBox') ?? '')
    .trim()
    .split(/[\s,]+/)
    .map(Number);
  if (box.length === 4 && box.every(Number.isFinite) && box[2]! > 0 && box[3]! > 0)
    return { width: box[2]!, height: box[3]! };
  return null;
}

type Read = { readonly logo: BrandLogo } | { readonly issue: ContentIssue };

async function readLogo(source: YamlSource, contentDir: string, file: string): Promise<Read> {
  const at = (wording: ReturnType<typeof message>) => ({
    issue: issueAt(source, ['brand', 'logo'], 'bad-value', wording),
  });
  if (isAbsolute(file) || file.split(/[\\/]/).includes('..'))
    return at(message('logoOutside', file));
  const full = join(contentDir, file);
  let info;
  try {
    info = await stat(full);
  } catch {
    return {
      issue: issueAt(source, ['brand', 'logo'], 'missing-file', message('logoMissing', file)),
    };
  }
  if (!info.isFile()) return at(message('logoNotAFile', file));
  // A link inside the content folder to a file outside it is not followed (as for entries).
  const [folder, real] = await Promise.all([realpath(contentDir), realpath(full)]);
  const rel = relative(folder, real);
  if (rel === '' || rel.startsWith('..') || isAbsolute(rel))
    return at(message('logoOutside', file));
  if (info.size > MAX_LOGO_BYTES)
    return at(message('logoTooLarge', file, info.size, MAX_LOGO_BYTES));
  const handle = await open(full, 'r');
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(await handle.readFile());
  } finally {
    await handle.close();
  }
  if (bytes.length > MAX_LOGO_BYTES)
    return at(message('logoTooLarge', file, bytes.length, MAX_LOGO_BYTES));
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  if (startsWith(bytes, PNG_SIGNATURE)) {
    const size = pngSize(bytes);
    if (!size) return at(message('logoFormat', file, 'broken-png'));
    const data = Buffer.from(bytes).toString('base64');
    return { logo: { file, format: 'png', data, sha256, ...size } };
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return at(message('logoFormat', file, otherFormat(bytes)));
  }
  const root = svgRoot(text);
  if (root === null)
    return at(
      message(
        'logoFormat',
        file,
        otherFormat(bytes) === 'unknown' ? 'not-svg' : otherFormat(bytes),
      ),
    );
  for (const [pattern, feature] of SVG_REFUSED)
    if (pattern.test(text)) return at(message('logoSvgFeature', file, feature));
  const size = svgSize(root);
  if (!size) return at(message('logoSvgSize', file));
  return { logo: { file, format: 'svg', data: text.replace(/^\uFEFF/, ''), sha256, ...size } };
}

/**
 * The site's brand, or undefined when site.yaml has no `brand:`. The colour's form is the
 * schema's to check (it has passed by now); the logo is read from `contentDir`.
 */
export async function loadBrand(
  file: ValidFile<{ readonly brand?: BrandYaml }>,
  contentDir: string,
): Promise<{ readonly brand?: Brand; readonly issues: readonly ContentIssue[] }> {
  const yaml = file.data.brand;
  if (yaml === undefined) return { issues: [] };
  let logo: BrandLogo | null = null;
  if (yaml.logo !== undefined) {
    const read = await readLogo(file.source, contentDir, yaml.logo);
    if ('issue' in read) return { issues: [read.issue] };
    logo = read.logo;
  }
  const colour = yaml.colour === undefined ? null : yaml.colour.toLowerCase();
  const contrastOnWhite = colour === null ? null : contrastRatio(colour, '#ffffff');
  return { brand: { logo, colour, contrastOnWhite }, issues: [] };
}
