/**
 * The demo's SVG logo (content/brand/logo.svg, our own drawing) on the demo's cards: a tagged
 * Figure with the logo's text alternative on the card's PDF page and an <img> of the SVG in
 * the card's HTML; the demo colour reads as text, so it colours the headings too.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cardPdf } from '../../generator/render/pdf/card.ts';
import { stationCardHtml } from '../../generator/render/card-html.ts';
import { contrastRatio } from '../../generator/content/colour.ts';
import { demoSite, NO_EPOCH, type DemoSite } from './demo-site.ts';
import { readPdf, type StructNode } from './read-pdf.ts';

let demo: DemoSite;
beforeAll(async () => {
  demo = await demoSite();
}, 300_000);
afterAll(async () => demo?.dispose());

function figureAlts(node: StructNode | null): string[] {
  if (!node) return [];
  const own = node.role === 'Figure' && node.alt ? [node.alt] : [];
  return [
    ...own,
    ...(node.children ?? []).flatMap((c) =>
      'children' in c || 'role' in c ? figureAlts(c as StructNode) : [],
    ),
  ];
}

describe('the demo brand (SVG logo)', () => {
  it('is in the demo: an SVG logo and a colour that reads as text (WCAG 2.x 4.5:1)', () => {
    const brand = demo.data.site.brand;
    expect(brand?.logo?.format).toBe('svg');
    // source: WCAG 2.x success criterion 1.4.3
    expect(contrastRatio(brand!.accent!, '#ffffff')).toBeGreaterThanOrEqual(4.5);
    expect(brand?.text).toBe(brand?.accent);
  });

  it('a station card and an insert: one logo Figure on the PDF page, one <img> of the SVG in the HTML', async () => {
    const alt = demo.data.site.brand!.logo!.alt;
    for (const view of [demo.data.stationCards[0]!, demo.data.insertCards[0]!]) {
      const read = await readPdf((await cardPdf(view, { author: 'x', env: NO_EPOCH })).bytes);
      expect(
        figureAlts(read.structure[0]!).filter((a) => a === alt),
        view.id,
      ).toHaveLength(1);
    }
    const html = stationCardHtml(demo.data.stationCards[0]!);
    expect(html).toMatch(/<img class="brand-logo" src="data:image\/svg\+xml;charset=utf-8,%3Csvg/);
  });
});
