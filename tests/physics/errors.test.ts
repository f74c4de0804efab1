import { describe, expect, it } from 'vitest';
import { OutOfRangeError, requireInRange } from '../../generator/physics/errors.ts';

describe('OutOfRangeError', () => {
  it('names correlation, quantity, value and range in its message and fields', () => {
    const error = new OutOfRangeError(
      'IAPWS-IF97 Region 1',
      'temperature',
      700,
      273.15,
      623.15,
      'K',
    );
    expect(error).toBeInstanceOf(Error);
    expect(error.name).toBe('OutOfRangeError');
    expect(error.message).toBe('IAPWS-IF97 Region 1: temperature 700 K is outside 273.15–623.15 K');
    expect(error).toMatchObject({
      correlation: 'IAPWS-IF97 Region 1',
      quantity: 'temperature',
      value: 700,
      min: 273.15,
      max: 623.15,
      unit: 'K',
    });
  });
  it('says when the lower bound itself is excluded', () => {
    const error = new OutOfRangeError(
      'IAPWS-IF97 Region 2',
      'pressure',
      0,
      0,
      3536.589,
      'Pa',
      true,
    );
    expect(error.message).toBe(
      'IAPWS-IF97 Region 2: pressure 0 Pa is outside 0–3536.589 Pa (0 excluded)',
    );
  });
  it('requireInRange accepts both bounds and rejects NaN', () => {
    expect(() => requireInRange('c', 'x', 1, 1, 2, 'm')).not.toThrow();
    expect(() => requireInRange('c', 'x', 2, 1, 2, 'm')).not.toThrow();
    expect(() => requireInRange('c', 'x', Number.NaN, 1, 2, 'm')).toThrow(OutOfRangeError);
  });
});
