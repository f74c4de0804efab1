import { describe, expect, it } from 'vitest';
import { isScalar } from 'yaml';
import {
  fieldName,
  nodeAt,
  parseYamlSource,
  pathAtOffset,
  positionAt,
  rangeAt,
} from '../../generator/content/yaml-source.ts';

const TEXT = [
  '# a comment', //                          1
  'name: Bar gas # the small ring', //      2
  'levels:', //                              3
  '  - { label: low, power_w: 600 }', //     4
  '  - label: high', //                      5
  '    power_w: 1500', //                    6
  'spare:', //                               7
  'shared: &plate { power_w: 90 }', //       8
  'copy: *plate', //                         9
].join('\n');

const { source, value, issues } = parseYamlSource(TEXT, 'stoves/bar-gas.yaml');

describe('parseYamlSource', () => {
  it('gives the data and no issues for valid YAML', () => {
    expect(issues).toEqual([]);
    expect(value).toMatchObject({ name: 'Bar gas', levels: [{ label: 'low' }, { label: 'high' }] });
  });
});

describe('positionAt', () => {
  it.each([
    [['name'], 'value', 2, 7],
    [['name'], 'key', 2, 1],
    [['levels', 0, 'power_w'], 'value', 4, 28],
    [['levels', 1, 'power_w'], 'value', 6, 14],
    [['levels', 1], 'value', 5, 5],
    [['spare'], 'value', 7, 1], // no value: the key
    [['levels', 1, 'colour'], 'value', 5, 5], // not there: its deepest part that is
    [['copy', 'power_w'], 'value', 8, 27], // through an alias to its anchor
    [[], 'value', 2, 1], // the document root, after the leading comment
  ] as const)('positionAt(%j, %s) is %i:%i', (path, on, line, column) => {
    expect(positionAt(source, path, on)).toEqual({ line, column });
  });
});

describe('nodeAt and rangeAt', () => {
  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('nodeAt finds the scalar; rangeAt its text', () => {
    const node = nodeAt(source, ['levels', 1, 'power_w']);
    expect(isScalar(node) && node.value).toBe(1500);
    const [start, end] = rangeAt(source, ['levels', 1, 'power_w'])!;
    expect(TEXT.slice(start, end)).toBe('1500');
  });

  // own rule: stovecard's handling of its own YAML input, not an outside value
  it('nodeAt(a path not in the file) is undefined', () => {
    expect(nodeAt(source, ['levels', 7])).toBeUndefined();
  });

  it('a value can be rewritten through the document, keeping the comments', () => {
    const copy = parseYamlSource(TEXT, 'copy.yaml').source;
    copy.doc.setIn(['levels', 1, 'heat_to_pot_w'], 560);
    const rewritten = copy.doc.toString();
    expect(rewritten).toContain('# the small ring');
    expect(rewritten).toContain('heat_to_pot_w: 560');
  });
});

describe('fieldName and pathAtOffset', () => {
  it('fieldName joins keys with dots and indices in brackets', () => {
    expect(fieldName(['levels', 2, 'power_w'])).toBe('levels[2].power_w');
    expect(fieldName(['cup_g', 0, 1])).toBe('cup_g[0][1]');
    expect(fieldName([])).toBe('');
  });

  it('pathAtOffset is the innermost key or item at an offset', () => {
    expect(pathAtOffset(source, TEXT.indexOf('1500'))).toEqual(['levels', 1, 'power_w']);
    expect(pathAtOffset(source, TEXT.indexOf('label: low'))).toEqual(['levels', 0, 'label']);
  });
});
