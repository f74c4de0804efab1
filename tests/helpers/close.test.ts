import { describe, expect, it } from 'vitest';
import { expectAbsolute, expectRelative, halfUnitOfLastDigit } from './close.ts';

describe('tests/helpers/close.ts', () => {
  it('expectRelative passes inside the tolerance and reports all four numbers outside it', () => {
    expectRelative(1.0000001, 1, 1e-6, 'inside');
    expect(() => expectRelative(1.1, 1, 1e-6, 'f(2 K)')).toThrow(
      /f\(2 K\): actual 1\.1, expected 1, \|difference\| 0\.1\d* exceeds relative tolerance 0\.000001 \(absolute 0\.000001\)/,
    );
  });
  it('expectAbsolute passes inside the tolerance and fails on NaN', () => {
    expectAbsolute(2.4, 2.5, 0.11, 'inside');
    expect(() => expectAbsolute(Number.NaN, 2.5, 1, 'nan')).toThrow(/actual NaN, expected 2\.5/);
  });
  it("halfUnitOfLastDigit('2.3393') is 5e-5, ('2406') 0.5, ('0.353658941e-2') 5e-12", () => {
    expect(halfUnitOfLastDigit('2.3393')).toBeCloseTo(5e-5, 18);
    expect(halfUnitOfLastDigit('2406')).toBe(0.5);
    expect(halfUnitOfLastDigit('0.353658941e-2')).toBeCloseTo(5e-12, 24);
  });
});
