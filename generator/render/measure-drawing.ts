/**
 * The customer's page: where to measure an own pot. A cut-through pot (base, funnel
 * basket, upper chamber and spout column) with seven dimension lines lettered A–G, the
 * letters the form's labels start with (words/planner.ts). Our own drawing; not to scale.
 */
import { FONT_FAMILY } from './fonts.ts';
import { escapeXml } from './svg.ts';

const INK = '#000000';
const DIM = '#1f4e9c';

function dimension(x1: number, y1: number, x2: number, y2: number, letter: string): string {
  const horizontal = y1 === y2;
  const tx = horizontal ? (x1 + x2) / 2 : x1 + 9;
  const ty = horizontal ? y1 - 4 : (y1 + y2) / 2 + 4;
  return (
    `<line x1="${x1}" y1="${y1}" x2="${x2}" y2="${y2}" stroke="${DIM}" stroke-width="1.2" marker-start="url(#m-arrow)" marker-end="url(#m-arrow)"/>` +
    `<text x="${tx}" y="${ty}" fill="${DIM}" font-size="12" font-weight="bold" text-anchor="middle">${letter}</text>`
  );
}

export function measureDrawingSvg(alt: string): string {
  const parts = [
    '<defs><marker id="m-arrow" viewBox="0 0 10 10" refX="5" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="' +
      DIM +
      '"/></marker></defs>',
    // Base (lower chamber), floor at y = 200.
    `<path d="M60,200 L52,120 L148,120 L140,200 Z" fill="#eef3fa" stroke="${INK}" stroke-width="2"/>`,
    // Safety valve on the base's side.
    `<rect x="146" y="146" width="12" height="8" fill="#ffffff" stroke="${INK}" stroke-width="1.5"/>`,
    // Funnel basket and its tube.
    `<path d="M66,112 L134,112 L130,132 L70,132 Z" fill="#d9c7ad" stroke="${INK}" stroke-width="1.5"/>`,
    `<rect x="96" y="132" width="8" height="58" fill="#ffffff" stroke="${INK}" stroke-width="1.2"/>`,
    // Upper chamber and spout column.
    `<path d="M56,110 L64,30 L136,30 L144,110 Z" fill="#ffffff" stroke="${INK}" stroke-width="2"/>`,
    `<rect x="95" y="40" width="10" height="70" fill="#ffffff" stroke="${INK}" stroke-width="1.2"/>`,
    // Dimension lines.
    dimension(62, 176, 138, 176, 'A'),
    dimension(172, 200, 172, 154, 'B'),
    dimension(196, 200, 196, 40, 'C'),
    dimension(70, 104, 130, 104, 'D'),
    dimension(36, 112, 36, 132, 'E'),
    dimension(82, 160, 96, 160, 'F'),
    dimension(86, 190, 86, 200, 'G'),
    `<line x1="160" y1="154" x2="178" y2="154" stroke="${DIM}" stroke-dasharray="2,2"/>`,
    `<line x1="105" y1="40" x2="202" y2="40" stroke="${DIM}" stroke-dasharray="2,2"/>`,
    `<line x1="40" y1="200" x2="202" y2="200" stroke="${INK}" stroke-width="1"/>`,
  ];
  return `<svg class="measure-drawing" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 220 210" width="220" height="210" role="img" aria-label="${escapeXml(alt)}" font-family="${FONT_FAMILY}">${parts.join('')}</svg>`;
}
