/**
 * render/fonts.ts for the browser bundle: the same family and faces; the page loads the
 * TTF files from the site's assets through @font-face, so no file path is needed here.
 */
export const FONT_FAMILY = 'DejaVu Sans';

export type FontFace = 'regular' | 'bold' | 'oblique' | 'bold-oblique';

export const FONT_FACES: readonly FontFace[] = ['regular', 'bold', 'oblique', 'bold-oblique'];

const files: Record<FontFace, string> = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  oblique: 'DejaVuSans-Oblique.ttf',
  'bold-oblique': 'DejaVuSans-BoldOblique.ttf',
};

export function fontFileName(face: FontFace): string {
  return files[face];
}
