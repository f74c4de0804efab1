import { describe, expect, it } from 'vitest';
import { schemaIssues, type SchemaName } from '../../generator/content/schema-check.ts';
import { parseYamlSource } from '../../generator/content/yaml-source.ts';
import { contentWords, type ValueSpec, wording } from '../../generator/words/content.ts';
import { COFFEE, expectIssue, LOG, POT, SITE, STOVE, withLine, withoutLine } from './helpers.ts';

const FILE = 'pots/three-cup.yaml';

function issuesOf(schema: SchemaName, text: string) {
  const parsed = parseYamlSource(text, FILE);
  expect(parsed.issues).toEqual([]);
  return schemaIssues(schema, parsed.value, parsed.source);
}

const VALVE_HEIGHT: ValueSpec = {
  type: 'number',
  unit: 'mm',
  minimum: 5,
  maximum: 200,
  example: 32,
};

describe('schemaIssues on the tests’ valid files', () => {
  it.each([
    ['pot', POT],
    ['coffee', COFFEE],
    ['stove', STOVE],
    ['log', LOG],
    ['site', SITE],
  ] as const)('schemaIssues(%s) is empty', (schema, text) => {
    expect(issuesOf(schema, text)).toEqual([]);
  });
});

describe('schemaIssues words each kind of mistake', () => {
  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a number written with its unit ("32mm") asks for the number alone', () => {
    const issues = issuesOf('pot', withLine(POT, 'valve_height_mm', '  valve_height_mm: 32mm'));
    const issue = expectIssue(issues, {
      file: FILE,
      line: 6,
      column: 20,
      field: 'base.valve_height_mm',
      code: 'wrong-type',
      wording: contentWords.wrongType(VALVE_HEIGHT, '32mm'),
    });
    expect(wording(issue.message).problem).toBe(
      'expected a number of millimetres between 5 and 200, got "32mm"',
    );
    expect(wording(issue.message).fix).toMatch(/^Write 32\b/);
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a unit other than the key’s ("3.2cm") is not silently converted', () => {
    const issues = issuesOf('pot', withLine(POT, 'valve_height_mm', '  valve_height_mm: 3.2cm'));
    const issue = expectIssue(issues, { file: FILE, line: 6, field: 'base.valve_height_mm' });
    expect(wording(issue.message).fix).not.toMatch(/Write 3\.2/);
    expect(wording(issue.message).fix).toContain('millimetres');
  });

  it('a wrong type names what was expected and what was written', () => {
    const issues = issuesOf('pot', withLine(POT, 'cups', 'cups: three'));
    expectIssue(issues, {
      file: FILE,
      line: 2,
      column: 7,
      field: 'cups',
      code: 'wrong-type',
      wording: contentWords.wrongType(
        { type: 'integer', minimum: 1, maximum: 18, example: 3 },
        'three',
      ),
    });
  });

  it('a negative size is out of range and says it cannot be negative', () => {
    const issues = issuesOf('pot', withLine(POT, 'basket_depth_mm', '  basket_depth_mm: -15'));
    const spec: ValueSpec = { type: 'number', unit: 'mm', minimum: 3, maximum: 80, example: 15 };
    const issue = expectIssue(issues, {
      file: FILE,
      line: 11,
      column: 20,
      field: 'funnel.basket_depth_mm',
      code: 'out-of-range',
      wording: contentWords.outOfRange(spec, -15, '-15'),
    });
    expect(wording(issue.message).problem).toContain('cannot be negative');
  });

  it('a number too large to store (1e400) is refused, not read as Infinity', () => {
    const issues = issuesOf('pot', withLine(POT, 'sealed_volume_ml', '  sealed_volume_ml: 1e400'));
    const spec: ValueSpec = {
      type: 'number',
      unit: 'mL',
      minimum: 30,
      maximum: 2000,
      example: 260,
    };
    expectIssue(issues, {
      file: FILE,
      line: 4,
      field: 'base.sealed_volume_ml',
      code: 'out-of-range',
      wording: contentWords.notFinite(spec, '1e400'),
    });
  });

  it('a large but finite number is out of range', () => {
    const issues = issuesOf(
      'pot',
      withLine(POT, 'sealed_volume_ml', '  sealed_volume_ml: 99999999999999999999'),
    );
    expectIssue(issues, {
      file: FILE,
      line: 4,
      field: 'base.sealed_volume_ml',
      code: 'out-of-range',
    });
  });

  it('an unknown key with a typo suggests the nearest valid key', () => {
    const issues = issuesOf('pot', withLine(POT, 'valve_height_mm', '  valve_hieght_mm: 32'));
    const allowed = [
      'sealed_volume_ml',
      'inner_diameter_mm',
      'valve_height_mm',
      'valve_opening_bar',
      'material',
      'mass_g',
      'induction_plate',
      'heat_loss_w_per_k',
    ];
    const issue = expectIssue(issues, {
      file: FILE,
      line: 6,
      column: 3,
      field: 'base.valve_hieght_mm',
      code: 'unknown-key',
      wording: contentWords.unknownKey('valve_hieght_mm', 'base', 'valve_height_mm', allowed),
    });
    expect(wording(issue.message).fix).toBe('Did you mean `valve_height_mm`?');
    // …and the real key is then missing, reported at the parent mapping's line.
    expectIssue(issues, {
      file: FILE,
      line: 3,
      column: 1,
      field: 'base.valve_height_mm',
      code: 'missing-key',
    });
  });

  it('a missing required key points at the parent mapping and says what to add', () => {
    const issues = issuesOf('pot', withoutLine(POT, 'tube_gap_mm'));
    const spec: ValueSpec = { type: 'number', unit: 'mm', minimum: 0.5, maximum: 50, example: 4 };
    const inches: ValueSpec = {
      type: 'number',
      unit: 'in',
      minimum: 0.02,
      maximum: 1.97,
      example: 0.16,
    };
    const issue = expectIssue(issues, {
      file: FILE,
      line: 9,
      column: 1,
      field: 'funnel.tube_gap_mm',
      code: 'missing-key',
      wording: contentWords.lengthMissing('tube_gap_mm', 'tube_gap_in', 'funnel', spec, inches),
    });
    expect(wording(issue.message).fix).toContain('`tube_gap_mm: 4` under `funnel`');
    expect(wording(issue.message).fix).toContain('`tube_gap_in: 0.16` in inches');
  });

  it('a missing top-level key points at the document root', () => {
    const issues = issuesOf('pot', withoutLine(POT, 'cups'));
    expectIssue(issues, { file: FILE, line: 1, column: 1, field: 'cups', code: 'missing-key' });
  });

  it('a key with no value reads as "nothing" and points at the key', () => {
    const issues = issuesOf('pot', withLine(POT, 'mass_g', '  mass_g:'));
    expectIssue(issues, {
      file: FILE,
      line: 8,
      column: 3,
      field: 'base.mass_g',
      code: 'wrong-type',
      wording: contentWords.wrongType(
        { type: 'number', unit: 'g', minimum: 20, maximum: 3000, example: 180 },
        null,
      ),
    });
  });

  it('a bad enum lists the allowed values and suggests the nearest', () => {
    const issues = issuesOf('pot', withLine(POT, 'material', '  material: aluminum'));
    const issue = expectIssue(issues, {
      file: FILE,
      line: 7,
      column: 13,
      field: 'base.material',
      code: 'bad-enum',
      wording: contentWords.badEnum('aluminum', ['aluminium', 'stainless-steel'], 'aluminium'),
    });
    expect(wording(issue.message).problem).toContain('`aluminium`, `stainless-steel`');
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('a percentage for a share suggests the fraction', () => {
    const issues = issuesOf('stove', withLine(STOVE, 'kind', 'kind: gas\nefficiency: 38%'));
    const issue = expectIssue(issues, {
      file: FILE,
      line: 3,
      field: 'efficiency',
      code: 'wrong-type',
    });
    expect(wording(issue.message).fix).toMatch(/^Write 0\.38\b/);
  });

  it('a pair with three values is a list-length issue with an example', () => {
    const issues = issuesOf('coffee', `${COFFEE}\ntarget_c: [90, 96, 99]`);
    expectIssue(issues, {
      file: FILE,
      line: 6,
      field: 'target_c',
      code: 'bad-value',
      wording: contentWords.listLength(
        { type: 'array', minItems: 2, maxItems: 2, example: [90, 96] },
        3,
      ),
    });
  });

  it('a reading out of range inside a list of pairs names its index', () => {
    const issues = issuesOf('log', withLine(LOG, 'cup_g', '    cup_g: [[110, 18], [130, -52]]'));
    expectIssue(issues, {
      file: FILE,
      line: 10,
      column: 30,
      field: 'brews[0].cup_g[1][1]',
      code: 'out-of-range',
    });
  });

  it('an id with capitals and spaces is refused with a corrected id', () => {
    const issues = issuesOf('site', withLine(SITE, '- id: bar', '  - id: Bar Station'));
    expectIssue(issues, {
      file: FILE,
      line: 6,
      field: 'sets[0].id',
      code: 'bad-value',
      wording: contentWords.badId('Bar Station', 'bar-station'),
    });
  });

  it('a repeated kettle preset points at the repeat', () => {
    const issues = issuesOf(
      'site',
      withLine(SITE, 'paper', 'paper: A5\nkettle_presets_c: [70, 80, 70]'),
    );
    expectIssue(issues, {
      file: FILE,
      line: 4,
      column: 28,
      field: 'kettle_presets_c[2]',
      code: 'repeated',
    });
  });

  it('a mapping where a number belongs is a wrong type', () => {
    const issues = issuesOf('pot', withLine(POT, 'cups', 'cups: { small: 3 }'));
    expectIssue(issues, { file: FILE, line: 2, field: 'cups', code: 'wrong-type' });
  });

  it('a list where the file should be a mapping is a wrong type at the root', () => {
    const issues = issuesOf('pot', '- name: pot\n- cups: 3\n');
    expectIssue(issues, { file: FILE, line: 1, field: '', code: 'wrong-type' });
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('reports every mistake of a file at once', () => {
    let text = withLine(POT, 'cups', 'cups: three');
    text = withLine(text, 'material', '  material: aluminum');
    text = withLine(text, 'spout_height_mm', '  spout_height_mm: 115mm');
    const issues = issuesOf('pot', text);
    expect(issues.map((issue) => issue.line).sort((a, b) => a - b)).toEqual([2, 7, 15]);
  });
});
