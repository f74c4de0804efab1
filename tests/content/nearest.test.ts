import { describe, expect, it } from 'vitest';
import { editDistance, nearest } from '../../generator/content/nearest.ts';

describe('editDistance', () => {
  it.each([
    ['kitten', 'sitting', 3], // the textbook Levenshtein example
    ['', 'abc', 3],
    ['abc', 'abc', 0],
    ['hieght', 'height', 1], // one swap of neighbours
    ['aluminum', 'aluminium', 1],
  ])('editDistance(%s, %s) is %i', (a, b, expected) => {
    expect(editDistance(a, b)).toBe(expected);
    expect(editDistance(b, a)).toBe(expected);
  });
});

describe('nearest', () => {
  const keys = [
    'sealed_volume_ml',
    'inner_diameter_mm',
    'valve_height_mm',
    'valve_opening_bar',
    'mass_g',
  ];

  it('nearest(a typo of a key) is that key', () => {
    expect(nearest('valve_hieght_mm', keys)).toBe('valve_height_mm');
    expect(nearest('sealed_volume_l', keys)).toBe('sealed_volume_ml');
    expect(nearest('Mass_G', keys)).toBe('mass_g');
  });

  it('nearest(the start of a word) is the word', () => {
    expect(nearest('med', ['low', 'medium', 'high'])).toBe('medium');
  });

  it('nearest(something unrelated) is undefined', () => {
    expect(nearest('colour', keys)).toBeUndefined();
    expect(nearest('7', ['1', '2', '3'])).toBeUndefined();
  });
});
