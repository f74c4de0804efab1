/**
 * site.yaml `brand: { logo, colour }`: the WCAG 2.x contrast ratio against its definition and
 * published values, the logo read by its bytes, and every bad logo or colour refused at
 * site.yaml's line and field with a fix.
 */
import { mkdir, symlink } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { loadCatalogue } from '../../generator/content/index.ts';
import { contrastRatio, relativeLuminance } from '../../generator/content/colour.ts';
import { MAX_LOGO_BYTES } from '../../generator/content/brand.ts';
import { contentWords, wording } from '../../generator/words/content.ts';
import { encodePng } from '../browser/png.ts';
import {
  catalogueIssues,
  contentCopy,
  expectIssue,
  put,
  removeCopy,
  SITE,
  withLine,
} from './helpers.ts';

/** A w × h PNG of one colour (tests/browser/png.ts, PNG spec §11.2.2 IHDR). */
function png(width: number, height: number): Buffer {
  const data = new Uint8Array(width * height * 4);
  for (let i = 0; i < data.length; i += 4) data.set([46, 94, 78, 255], i);
  return encodePng({ width, height, data });
}

const SVG =
  '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 40 20"><rect width="40" height="20" fill="#2e5e4e"/></svg>';

describe('WCAG 2.x contrast ratio (relative luminance, success criterion 1.4.3)', () => {
  it('black on white is 21:1 and a colour on itself 1:1 (closed form: (1 + 0.05) / (0 + 0.05))', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 12);
    expect(contrastRatio('#ffffff', '#000000')).toBeCloseTo(21, 12);
    expect(contrastRatio('#2e5e4e', '#2e5e4e')).toBeCloseTo(1, 12);
  });

  it('relative luminance follows the WCAG definition: 0.2126 R + 0.7152 G + 0.0722 B of linear sRGB (closed form)', () => {
    // closed form: pure primaries give the coefficients themselves; white gives their sum, 1.
    expect(relativeLuminance('#ff0000')).toBeCloseTo(0.2126, 12);
    expect(relativeLuminance('#00ff00')).toBeCloseTo(0.7152, 12);
    expect(relativeLuminance('#0000ff')).toBeCloseTo(0.0722, 12);
    expect(relativeLuminance('#FFFFFF')).toBeCloseTo(1, 12);
    // closed form: 0x0a = 10/255 = 0.0392 is on the linear side of WCAG's 0.03928 threshold.
    expect(relativeLuminance('#0a0a0a')).toBeCloseTo(10 / 255 / 12.92, 12);
    // closed form: 0x80 = 128/255 on the power side, ((c + 0.055) / 1.055)^2.4.
    expect(relativeLuminance('#808080')).toBeCloseTo(((128 / 255 + 0.055) / 1.055) ** 2.4, 12);
  });

  it('published greys either side of 4.5:1 on white: #767676 passes, #777777 does not (from memory: WebAIM contrast checker, 4.54:1 and 4.48:1)', () => {
    // from memory: checked as the side of 4.5 each falls on and to two decimals.
    expect(contrastRatio('#767676', '#ffffff')).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#777777', '#ffffff')).toBeLessThan(4.5);
    expect(contrastRatio('#777777', '#ffffff')).toBeCloseTo(4.48, 2);
  });
});

describe('site.yaml brand:', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await contentCopy();
    await mkdir(join(dir, 'brand'), { recursive: true });
  });
  afterEach(async () => {
    await removeCopy(dir);
  });

  /** SITE with a brand line after paper (line 4). */
  const siteWith = (brand: string) => withLine(SITE, 'paper', `paper: A5\n${brand}`);

  it('reads an SVG logo and a colour: format, aspect, sha256, lower-case colour and its contrast', async () => {
    await put(dir, 'brand/logo.svg', SVG);
    await put(dir, 'site.yaml', siteWith("brand: { logo: brand/logo.svg, colour: '#2E5E4E' }"));
    const { site } = await loadCatalogue(dir);
    expect(site.brand?.logo?.format).toBe('svg');
    // own rule: the SVG's viewBox gives the aspect when it has no width and height
    expect([site.brand?.logo?.width, site.brand?.logo?.height]).toEqual([40, 20]);
    expect(site.brand?.logo?.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(site.brand?.colour).toBe('#2e5e4e');
    expect(site.brand?.contrastOnWhite).toBeCloseTo(contrastRatio('#2e5e4e', '#ffffff'), 12);
  });

  it('reads a PNG logo by its signature and IHDR size, whatever its name (own rule: the test writes a 30 × 10 PNG)', async () => {
    await put(dir, 'brand/mark.img', png(30, 10));
    await put(dir, 'site.yaml', siteWith('brand: { logo: brand/mark.img }'));
    const { site } = await loadCatalogue(dir);
    expect(site.brand?.logo?.format).toBe('png');
    expect([site.brand?.logo?.width, site.brand?.logo?.height]).toEqual([30, 10]);
    expect(site.brand?.colour).toBeNull();
  });

  it('a new logo or colour changes the site entry’s hash (every cached view keyed by it)', async () => {
    await put(dir, 'brand/logo.svg', SVG);
    await put(dir, 'site.yaml', siteWith("brand: { logo: brand/logo.svg, colour: '#2E5E4E' }"));
    const first = (await loadCatalogue(dir)).site.hash;
    await put(dir, 'brand/logo.svg', SVG.replace('#2e5e4e', '#000000'));
    const second = (await loadCatalogue(dir)).site.hash;
    expect(second).not.toBe(first);
  });

  it('a missing logo file is refused at brand.logo on line 4', async () => {
    await put(dir, 'site.yaml', siteWith('brand: { logo: brand/none.svg }'));
    expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 4,
      field: 'brand.logo',
      code: 'missing-file',
      wording: contentWords.logoMissing('brand/none.svg'),
    });
  });

  it('a JPEG, a GIF and a text file are refused by their bytes, not their names', async () => {
    const cases: [string, Uint8Array | string, Parameters<typeof contentWords.logoFormat>[1]][] = [
      ['brand/logo.png', new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46]), 'jpeg'],
      ['brand/logo.svg', Buffer.from('GIF89a\x01\x00\x01\x00', 'latin1'), 'gif'],
      ['brand/logo.svg', 'name: not a picture\n', 'not-svg'],
      [
        'brand/logo.png',
        Buffer.concat([png(2, 2).subarray(0, 12), Buffer.from('XXXX')]),
        'broken-png',
      ],
    ];
    for (const [file, bytes, found] of cases) {
      await put(dir, file, bytes);
      await put(dir, 'site.yaml', siteWith(`brand: { logo: ${file} }`));
      expectIssue(await catalogueIssues(dir), {
        file: 'site.yaml',
        line: 4,
        field: 'brand.logo',
        wording: contentWords.logoFormat(file, found),
      });
    }
  });

  it('an SVG with a script, an embedded image or a link to another file is refused, naming it', async () => {
    const cases: [string, string][] = [
      [SVG.replace('</svg>', '<script>alert(1)</script></svg>'), 'a <script> element'],
      [
        SVG.replace('</svg>', '<image href="photo.jpg" width="4" height="4"/></svg>'),
        'an embedded or linked <image>',
      ],
      [SVG.replace('fill="#2e5e4e"', 'fill="url(other.svg#g)"'), 'a url(…) to another file'],
    ];
    for (const [text, feature] of cases) {
      await put(dir, 'brand/logo.svg', text);
      await put(dir, 'site.yaml', siteWith('brand: { logo: brand/logo.svg }'));
      expectIssue(await catalogueIssues(dir), {
        file: 'site.yaml',
        line: 4,
        field: 'brand.logo',
        wording: contentWords.logoSvgFeature('brand/logo.svg', feature),
      });
    }
  });

  it('an SVG without a viewBox or width and height is refused (its aspect is unknown)', async () => {
    await put(
      dir,
      'brand/logo.svg',
      '<svg xmlns="http://www.w3.org/2000/svg"><rect width="4" height="4"/></svg>',
    );
    await put(dir, 'site.yaml', siteWith('brand: { logo: brand/logo.svg }'));
    expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 4,
      field: 'brand.logo',
      wording: contentWords.logoSvgSize('brand/logo.svg'),
    });
  });

  it('a logo outside the content folder, by ../ or by a link, is refused', async () => {
    await put(dir, 'site.yaml', siteWith('brand: { logo: ../logo.svg }'));
    expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 4,
      field: 'brand.logo',
      wording: contentWords.logoOutside('../logo.svg'),
    });
    const outside = join(dir, '..', `outside-${Date.now()}.svg`);
    await put(dir, '../' + outside.split('/').pop()!, SVG);
    await symlink(outside, join(dir, 'brand', 'link.svg'));
    await put(dir, 'site.yaml', siteWith('brand: { logo: brand/link.svg }'));
    expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 4,
      field: 'brand.logo',
      wording: contentWords.logoOutside('brand/link.svg'),
    });
  });

  it(`a logo over ${MAX_LOGO_BYTES} bytes is refused with its size`, async () => {
    const big = SVG.replace('</svg>', `<!--${'x'.repeat(MAX_LOGO_BYTES)}--></svg>`);
    await put(dir, 'brand/logo.svg', big);
    await put(dir, 'site.yaml', siteWith('brand: { logo: brand/logo.svg }'));
    expectIssue(await catalogueIssues(dir), {
      file: 'site.yaml',
      line: 4,
      field: 'brand.logo',
      wording: contentWords.logoTooLarge('brand/logo.svg', Buffer.byteLength(big), MAX_LOGO_BYTES),
    });
  });

  it('a colour not written #RRGGBB is refused at brand.colour with the colour words', async () => {
    for (const colour of ["'#2E5E4'", 'green', "'2E5E4E'", "'#2E5E4G'"]) {
      await put(dir, 'site.yaml', siteWith(`brand: { colour: ${colour} }`));
      const issue = expectIssue(await catalogueIssues(dir), {
        file: 'site.yaml',
        line: 4,
        field: 'brand.colour',
      });
      expect(wording(issue.message)).toEqual(contentWords.badColour(colour.replace(/'/g, '')));
    }
  });

  it('an unquoted #colour is a YAML comment: brand.colour is then empty and refused', async () => {
    await put(dir, 'site.yaml', siteWith('brand:\n  colour: #2E5E4E'));
    const issues = await catalogueIssues(dir);
    expect(issues.some((i) => i.file === 'site.yaml' && i.field.startsWith('brand'))).toBe(true);
  });
});
