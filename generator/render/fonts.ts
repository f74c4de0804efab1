/**
 * The one typeface of the site, charts and PDFs: DejaVu Sans, from the dejavu-fonts-ttf
 * package (the pages load it from the site's own assets; nothing comes from the network).
 */
import { createRequire } from 'node:module';
import path from 'node:path';

const require = createRequire(import.meta.url);
const ttfDir = path.join(path.dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf');

/** CSS / SVG font-family name the pages declare with @font-face. */
export const FONT_FAMILY = 'DejaVu Sans';

export type FontFace = 'regular' | 'bold' | 'oblique' | 'bold-oblique';

const files: Record<FontFace, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  oblique: 'DejaVuSans-Oblique.ttf',
  'bold-oblique': 'DejaVuSans-BoldOblique.ttf',
};

/** Absolute path of a face's TTF file. */
export function fontPath(face: FontFace): string {
  return path.join(ttfDir, files[face]);
}

/** File name of a face, as copied into the site's assets/fonts/. */
export function fontFileName(face: FontFace): string {
  return files[face];
}

/** The font licence shipped with the package, copied beside the fonts. */
export const FONT_LICENSE_PATH = path.join(path.dirname(ttfDir), 'LICENSE');

export const FONT_FACES: readonly FontFace[] = ['regular', 'bold', 'oblique', 'bold-oblique'];
