/**
 * The insert's step pictograms: small line drawings of our own, one per step of the
 * stranger's method (insert-steps.ts). No text inside, so they serve every language; the
 * step's words stand beside each. 40 × 40 user units, black ink, water in a light blue.
 * HTML inlines the SVG (aria-hidden: the step text says it all); the PDF draws it as an
 * artifact (pen.decoration).
 */

/** The steps of an insert, in the order a person works. */
export type InsertStepCode = 'kettle' | 'fill' | 'basket' | 'seal' | 'heat' | 'time' | 'cool';

export const INSERT_STEP_ORDER: readonly InsertStepCode[] = [
  'kettle',
  'fill',
  'basket',
  'seal',
  'heat',
  'time',
  'cool',
];

const INK = '#000000';
const WATER = '#9cc3e6';
const SOFT = '#777777';

const open = (body: string): string =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="40" height="40" viewBox="0 0 40 40">` +
  `<g fill="none" stroke="${INK}" stroke-width="2" stroke-linejoin="round" stroke-linecap="round">${body}</g></svg>`;

/** The lower chamber of the pot, with its valve on the right side: shared by three drawings. */
const BASE = `<path d="M11 18 L29 18 L31 34 L9 34 Z"/><circle cx="30" cy="22" r="1.6" fill="${INK}"/>`;

const DRAWINGS: Record<InsertStepCode, string> = {
  // A kettle with steam above its spout.
  kettle: open(
    `<path d="M9 34 L12 18 L26 18 L29 34 Z"/>` +
      `<path d="M12 22 L6 16"/>` +
      `<path d="M15 18 Q19 11 23 18"/>` +
      `<path d="M5 11 Q3 8 5 5" stroke="${SOFT}" stroke-width="1.5"/>` +
      `<path d="M9 11 Q7 8 9 5" stroke="${SOFT}" stroke-width="1.5"/>`,
  ),
  // The base filled with water up to a dashed line under the valve.
  fill: open(
    `<path d="M10.4 25 L29.6 25 L31 34 L9 34 Z" fill="${WATER}" stroke="none"/>` +
      BASE +
      `<path d="M6 25 L34 25" stroke-width="1.3" stroke-dasharray="2.5 1.5"/>` +
      `<path d="M20 4 L20 14 M16 10 L20 14 L24 10"/>`,
  ),
  // The basket filled level with the rim, a straight edge across it, a tamper struck out.
  basket: open(
    `<path d="M8 12 L24 12 L22 24 L10 24 Z"/>` +
      `<path d="M8.6 14 L23.4 14 L22 24 L10 24 Z" fill="${SOFT}" stroke="none"/>` +
      `<path d="M4 12 L28 12" stroke-width="1.5"/>` +
      `<path d="M14.5 24 L14.5 34 L17.5 34 L17.5 24"/>` +
      `<path d="M31 20 L31 28 M28 28 L34 28 L34 31 L28 31 Z" stroke-width="1.5"/>` +
      `<path d="M26 18 L37 35" stroke-width="2.2"/>`,
  ),
  // The top screwed onto the base, a cloth wrapped round the hot base, a turning arrow.
  seal: open(
    `<path d="M12 4 L28 4 L26 17 L14 17 Z"/>` +
      `<path d="M12 19 L28 19 L30 35 L10 35 Z"/>` +
      `<path d="M6 24 Q12 21 18 24 T30 24 L34 31 Q28 28 22 31 T8 31 Z" fill="${SOFT}" stroke-width="1.3"/>` +
      `<path d="M31 9 Q36 12 32 16 M32 16 L31 12.5 M32 16 L35 15" stroke-width="1.5"/>`,
  ),
  // The base on a burner whose flame stays inside the base's width (guide lines down).
  heat: open(
    `<path d="M11 6 L29 6 L31 22 L9 22 Z"/>` +
      `<path d="M9 22 L9 36 M31 22 L31 36" stroke="${SOFT}" stroke-width="1" stroke-dasharray="1.5 1.5"/>` +
      `<path d="M14 34 Q12 29 15 25 Q16 29 17 30 Q17 26 20 24 Q23 28 22 31 Q24 29 25 26 Q28 30 26 34 Z" stroke-width="1.5"/>` +
      `<path d="M6 36 L34 36"/>`,
  ),
  // A clock face, and an arrow lifting the pot off the heat.
  time: open(
    `<circle cx="17" cy="22" r="12"/>` +
      `<path d="M17 22 L17 14 M17 22 L23 25"/>` +
      `<path d="M34 30 L34 8 M30 12 L34 8 L38 12"/>`,
  ),
  // The base under a running cold tap.
  cool: open(
    `<path d="M4 4 L20 4 L20 8"/>` +
      `<path d="M20 11 L20 14 M18 17 L18 19 M22 17 L22 19" stroke="${WATER}" stroke-width="2.2"/>` +
      BASE.replace('M11 18 L29 18 L31 34 L9 34 Z', 'M11 22 L29 22 L31 36 L9 36 Z').replace(
        'cy="22"',
        'cy="26"',
      ) +
      `<path d="M9 36 L4 38" stroke-width="1.5"/>`,
  ),
};

/** The pictogram of one step, as an SVG string. */
export function pictogramSvg(code: InsertStepCode): string {
  return DRAWINGS[code];
}
