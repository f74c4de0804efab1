import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { loadPotFile } from '../../generator/content/index.ts';
import {
  ASSUMED_VALVE_OPENING_BAR,
  defaultHeatLossWPerK,
  ROOM_AIR_CONVECTION_W_PER_M2K,
} from '../../generator/content/pot-defaults.ts';
import { contentWords, wording } from '../../generator/words/content.ts';
import { expectIssue, POT, rejection, tempFile, withLine } from './helpers.ts';

async function potIssues(text: string) {
  const path = await tempFile('three-cup.yaml', text);
  return { path, issues: (await rejection(loadPotFile(path))).issues };
}

describe('loadPotFile converts to SI', () => {
  // source: NIST SP 811, Appendix B (mm, mL, g, bar to SI)
  it('loadPotFile(three-cup) gives the model in m, m³, kg and Pa', async () => {
    const pot = await loadPotFile(await tempFile('three-cup.yaml', POT));
    expect(pot).toMatchObject({
      kind: 'pot',
      id: 'three-cup',
      name: 'Three-cup aluminium pot',
      cups: 3,
    });
    // Volumes through ×1e-6: equal to the last bit or one rounding away (relative 1e-15).
    expect(Math.abs(pot.model.sealedVolumeM3 / 2.6e-4 - 1)).toBeLessThan(1e-15);
    expect(Math.abs(pot.model.upperCapacityM3 / 2e-4 - 1)).toBeLessThan(1e-15);
    expect(pot.model).toMatchObject({
      baseInnerDiameterM: 0.084,
      valveHeightM: 0.032,
      baseMaterial: 'aluminium',
      baseMassKg: 0.18,
      basketDiameterM: 0.056,
      basketDepthM: 0.015,
      tubeInnerDiameterM: 0.007,
      tubeGapM: 0.004,
      spoutHeightM: 0.115,
    });
    expect(pot.source).toMatchObject({ line: 1, column: 1 });
  });

  it('hash is the sha256 of the file’s bytes', async () => {
    const pot = await loadPotFile(await tempFile('three-cup.yaml', POT));
    expect(pot.hash).toBe(createHash('sha256').update(POT).digest('hex'));
  });

  // own rule: an assumed valve pressure (no source publishes one), flagged on the card
  it('without valve_opening_bar assumes 1.5 bar and flags it', async () => {
    const pot = await loadPotFile(await tempFile('three-cup.yaml', POT));
    expect(ASSUMED_VALVE_OPENING_BAR).toBe(1.5);
    expect(pot.model.valveOpeningGaugePa).toBe(150_000);
    expect(pot.valveOpeningAssumed).toBe(true);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('with valve_opening_bar uses it and does not flag it', async () => {
    const text = withLine(
      POT,
      'valve_height_mm',
      '  valve_height_mm: 32\n  valve_opening_bar: 1.2',
    );
    const pot = await loadPotFile(await tempFile('three-cup.yaml', text));
    expect(pot.model.valveOpeningGaugePa).toBeCloseTo(120_000, 6);
    expect(pot.valveOpeningAssumed).toBe(false);
  });

  // source: Incropera & DeWitt, Table 1.1: free convection to gases 2–25 W/(m²·K); 10 lies inside it
  it('without heat_loss_w_per_k uses 10 W/(m²·K) × the side area π·d·H', async () => {
    const pot = await loadPotFile(await tempFile('three-cup.yaml', POT));
    // h × π·d·H with H = V/(π d²/4): 10 × π × 0.084 × 0.046915 = 0.123810 W/K.
    const heightM = 2.6e-4 / ((Math.PI * 0.084 ** 2) / 4);
    const closedForm = ROOM_AIR_CONVECTION_W_PER_M2K * Math.PI * 0.084 * heightM;
    expect(Math.abs(pot.model.heatLossWPerK - closedForm) / closedForm).toBeLessThan(1e-12);
    expect(pot.model.heatLossWPerK).toBeCloseTo(0.12381, 5);
    // Incropera & DeWitt, Table 1.1: free convection to gases, 2–25 W/(m²·K).
    expect(ROOM_AIR_CONVECTION_W_PER_M2K).toBeGreaterThanOrEqual(2);
    expect(ROOM_AIR_CONVECTION_W_PER_M2K).toBeLessThanOrEqual(25);
    expect(defaultHeatLossWPerK(2.6e-4, 0.084)).toBe(pot.model.heatLossWPerK);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('with heat_loss_w_per_k (written by calibration) uses it', async () => {
    const text = withLine(POT, 'mass_g', '  mass_g: 180\n  heat_loss_w_per_k: 0.15');
    const pot = await loadPotFile(await tempFile('three-cup.yaml', text));
    expect(pot.model.heatLossWPerK).toBe(0.15);
  });

  it.each([
    ['aluminium', '', false],
    ['aluminium', '\n  induction_plate: true', true],
    ['stainless-steel', '', true],
  ])('a %s base%s is induction-ready: %s', async (material, plate, ready) => {
    const text = withLine(POT, 'material', `  material: ${material}${plate}`);
    const pot = await loadPotFile(await tempFile('three-cup.yaml', text));
    expect(pot.inductionReady).toBe(ready);
  });
});

describe('loadPotFile checks the geometry', () => {
  // The base as a cylinder: H = V / (π d²/4) = 260 mL / (π · 42² mm²) = 46.9 mm.
  const heightMm = 260e3 / (Math.PI * 42 * 42);

  it('a valve above the base’s height', async () => {
    const { path, issues } = await potIssues(
      withLine(POT, 'valve_height_mm', '  valve_height_mm: 50'),
    );
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: path,
      line: 6,
      column: 20,
      field: 'base.valve_height_mm',
      code: 'geometry',
      wording: contentWords.valveAboveBase(50, heightMm, 'mm'),
    });
  });

  it('a tube ending above the valve', async () => {
    const { path, issues } = await potIssues(withLine(POT, 'tube_gap_mm', '  tube_gap_mm: 40'));
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: path,
      line: 13,
      field: 'funnel.tube_gap_mm',
      wording: contentWords.tubeGapAboveValve(40, 32, 'mm'),
    });
  });

  it('a spout below the top of the basket', async () => {
    const { path, issues } = await potIssues(
      withLine(POT, 'spout_height_mm', '  spout_height_mm: 60'),
    );
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: path,
      line: 15,
      field: 'upper.spout_height_mm',
      wording: contentWords.spoutTooLow(60, heightMm + 15, 'mm'),
    });
  });

  it('a basket wider than the base', async () => {
    const { path, issues } = await potIssues(
      withLine(POT, 'basket_diameter_mm', '  basket_diameter_mm: 90'),
    );
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: path,
      line: 10,
      field: 'funnel.basket_diameter_mm',
      wording: contentWords.basketWiderThanBase(90, 84, 'mm'),
    });
  });

  it('a tube as wide as the basket', async () => {
    let text = withLine(POT, 'basket_diameter_mm', '  basket_diameter_mm: 28');
    text = withLine(text, 'tube_inner_diameter_mm', '  tube_inner_diameter_mm: 28');
    const { path, issues } = await potIssues(text);
    expect(issues).toHaveLength(1);
    expectIssue(issues, {
      file: path,
      line: 12,
      field: 'funnel.tube_inner_diameter_mm',
      wording: contentWords.tubeWiderThanBasket(28, 28, 'mm'),
    });
  });

  it('several broken rules are all reported', async () => {
    let text = withLine(POT, 'valve_height_mm', '  valve_height_mm: 50');
    text = withLine(text, 'spout_height_mm', '  spout_height_mm: 60');
    const { issues } = await potIssues(text);
    expect(issues.map((issue) => issue.field)).toEqual([
      'base.valve_height_mm',
      'upper.spout_height_mm',
    ]);
  });
});

describe('loadPotFile names the file as given', () => {
  it('errors carry the path as given', async () => {
    const { path, issues } = await potIssues(withLine(POT, 'cups', 'cups: 0'));
    expect(issues[0]!.file).toBe(path);
  });

  it('a missing file is one issue', async () => {
    const error = await rejection(loadPotFile('no/such/pot.yaml'));
    expectIssue(error.issues, {
      file: 'no/such/pot.yaml',
      line: 1,
      field: '',
      code: 'unreadable',
      wording: contentWords.unreadable('ENOENT'),
    });
  });
});

describe('pot lengths in inches (`_in` instead of `_mm`)', () => {
  /** The test pot with every length in inches: 1 in = 25.4 mm exactly (NIST SP 811, B.8). */
  const inches = (text: string): string =>
    text.replace(
      /^(\s*)(\w+)_mm: ([\d.]+)/gm,
      (_, indent, key, mm) => `${indent}${key}_in: ${Number(mm) / 25.4}`,
    );

  it('gives the same model as the same pot in millimetres (to 1e-12 relative)', async () => {
    const metric = await loadPotFile(await tempFile('three-cup.yaml', POT));
    const us = await loadPotFile(await tempFile('three-cup.yaml', inches(POT)));
    expect(inches(POT)).toContain('valve_height_in:');
    expect(inches(POT)).not.toContain('_mm:');
    for (const [key, value] of Object.entries(metric.model)) {
      const other = (us.model as unknown as Record<string, unknown>)[key];
      if (typeof value === 'number')
        expect(Math.abs((other as number) / value - 1), key).toBeLessThan(1e-12);
      else expect(other, key).toEqual(value);
    }
  });

  it('a length written both ways is refused at the `_in` key', async () => {
    const both = POT.replace(/^(\s*)valve_height_mm: .*$/m, '$&\n$1valve_height_in: 1.26');
    const { issues } = await potIssues(both);
    expect(issues.map((i) => [i.field, i.code])).toEqual([['base.valve_height_in', 'repeated']]);
    expect(wording(issues[0]!.message)).toEqual(
      contentWords.bothUnits('valve_height_mm', 'valve_height_in'),
    );
  });

  it('a length written neither way is refused at its part, naming both keys', async () => {
    const { issues } = await potIssues(withoutKey(POT, 'tube_gap_mm'));
    expect(issues.map((i) => [i.field, i.code])).toEqual([['funnel.tube_gap_mm', 'missing-key']]);
    expect(wording(issues[0]!.message).fix).toContain('`tube_gap_in: 0.16`');
  });

  it('a geometry problem in an inch pot is told in inches', async () => {
    const { issues } = await potIssues(
      inches(POT).replace(/valve_height_in: [\d.]+/, 'valve_height_in: 2'),
    );
    expect(issues.map((i) => i.field)).toEqual(['base.valve_height_in']);
    const text = wording(issues[0]!.message).problem;
    // base height 260 mL / (π · 42² mm²) = 46.92 mm = 1.847 in
    expect(text).toContain('2 in above the floor');
    expect(text).toContain('1.847 in high');
    expect(text).not.toContain('mm');
  });
});

function withoutKey(text: string, key: string): string {
  return text.replace(new RegExp(`^\\s*${key}: .*\\n`, 'm'), '');
}
