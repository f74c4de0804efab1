/**
 * crossSection(pot, fill): drawn to one scale from the pot's own dimensions (z up from the
 * floor, SVG y down), so every height on the drawing is the entry's height × px per metre.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { potGeometry } from '../../generator/brew/geometry.ts';
import type { PotEntry } from '../../generator/content/types.ts';
import { crossSection } from '../../generator/render/cross-section.ts';
import { demoCatalogue } from './demo.ts';

let pots: PotEntry[];
beforeAll(async () => {
  pots = [...(await demoCatalogue()).pots.values()];
});

const attr = (svg: string, cls: string, name: string): number => {
  const tag = new RegExp(`<[a-z]+ [^>]*class="${cls}"[^>]*>`).exec(svg)?.[0];
  if (!tag) throw new Error(`no element of class ${cls}`);
  return Number(new RegExp(` ${name}="([^"]+)"`).exec(tag)![1]);
};

const TOLERANCE_PX = 0.01; // coordinates are written to 2 decimals

describe('crossSection', () => {
  it('draws the fill line below the valve line (larger SVG y)', () => {
    for (const pot of pots) {
      const fill = pot.model.valveHeightM - 0.004;
      const { svg, layout } = crossSection({
        pot: pot.model,
        potName: pot.name,
        fillHeightM: fill,
        units: 'metric',
      });
      const fillY = attr(svg, 'fill-line', 'y1');
      const valveY = attr(svg, 'valve-line', 'y1');
      expect(fillY, pot.id).toBeGreaterThan(valveY);
      expect(Math.abs(fillY - layout.fillY)).toBeLessThan(TOLERANCE_PX);
      expect(Math.abs(valveY - layout.valveY)).toBeLessThan(TOLERANCE_PX);
    }
  });

  it('places every height at z × scale above the floor', () => {
    for (const pot of pots) {
      const m = pot.model;
      const g = potGeometry(m);
      const fill = m.valveHeightM * 0.8;
      const { layout: l } = crossSection({
        pot: m,
        potName: pot.name,
        fillHeightM: fill,
        units: 'metric',
      });
      const s = l.scalePxPerM;
      const cases: [string, number, number][] = [
        ['fill line', l.fillY, fill],
        ['valve', l.valveY, m.valveHeightM],
        ['tube end', l.tubeEndY, m.tubeGapM],
        ['top of the base', l.baseTopY, g.baseHeightM],
        ['top of the bed', l.bedTopY, g.bedTopM],
        ['spout', l.spoutY, m.spoutHeightM],
      ];
      for (const [what, y, zM] of cases) {
        const expected = l.floorY - zM * s;
        expect(
          Math.abs(y - expected),
          `${pot.id} ${what}: y ${y}, expected ${expected}`,
        ).toBeLessThan(1e-9);
      }
      expect(l.potRightX - l.potLeftX).toBeCloseTo(m.baseInnerDiameterM * s, 9);
    }
  });

  it('keeps x and y on one scale: the drawn base has the pot’s height-to-width ratio', () => {
    const m = pots[0]!.model;
    const { layout: l } = crossSection({
      pot: m,
      potName: 'x',
      fillHeightM: 0.01,
      units: 'metric',
    });
    const drawnRatio = (l.floorY - l.baseTopY) / (l.potRightX - l.potLeftX);
    const g = potGeometry(m);
    expect(drawnRatio).toBeCloseTo(g.baseHeightM / m.baseInnerDiameterM, 9);
  });

  it('labels the fill line with its gap below the valve, in the card’s units', () => {
    const m = pots[0]!.model;
    const fill = m.valveHeightM - 0.00508; // 0.20 in
    const metric = crossSection({ pot: m, potName: 'x', fillHeightM: fill, units: 'metric' }).svg;
    const us = crossSection({ pot: m, potName: 'x', fillHeightM: fill, units: 'us' }).svg;
    expect(metric).toContain('5\u00a0mm below the valve');
    expect(us).toContain('0.20\u00a0in below the valve');
    expect(metric).toContain('>Valve<');
    expect(metric).toContain('>Fill line<');
  });
});
