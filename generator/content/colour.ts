/**
 * Colours as site.yaml writes them (#RRGGBB) and WCAG 2.x's contrast ratio (relative
 * luminance, success criterion 1.4.3). Pure: the schema check and the browser use it too.
 */

/** The schema's pattern of brand.colour (site.schema.json). */
export const COLOUR_PATTERN = /^#[0-9A-Fa-f]{6}$/;

/** WCAG 2.x's contrast for normal text (success criterion 1.4.3, level AA). */
export const TEXT_CONTRAST_MIN = 4.5;

/** One sRGB channel (0–255) to linear light, as WCAG 2.x's relative luminance defines it. */
function linear(channel: number): number {
  const c = channel / 255;
  // WCAG 2.x writes the threshold 0.03928 (sRGB's own is 0.04045); no 8-bit value lies between.
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** WCAG 2.x relative luminance of "#rrggbb": 0.2126 R + 0.7152 G + 0.0722 B of linear light. */
export function relativeLuminance(colour: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => Number.parseInt(colour.slice(i, i + 2), 16));
  return 0.2126 * linear(r!) + 0.7152 * linear(g!) + 0.0722 * linear(b!);
}

/** WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05), the lighter colour's luminance over the darker's. */
export function contrastRatio(a: string, b: string): number {
  const [la, lb] = [relativeLuminance(a), relativeLuminance(b)];
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
