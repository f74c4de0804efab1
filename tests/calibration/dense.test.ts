import { describe, expect, it } from 'vitest';
import { inverseSpd, normalMatrix, pivotedColumns } from '../../generator/calibration/dense.ts';

describe('inverseSpd', () => {
  it('inverts [[4, 2], [2, 3]] to [[0.375, −0.25], [−0.25, 0.5]] (closed form: adj/det, det 8)', () => {
    const inverse = inverseSpd([
      [4, 2],
      [2, 3],
    ])!;
    const expected = [
      [0.375, -0.25],
      [-0.25, 0.5],
    ];
    inverse.forEach((row, i) => row.forEach((v, j) => expect(v).toBeCloseTo(expected[i]![j]!, 14)));
  });

  it('inverseSpd(singular or indefinite) is null', () => {
    expect(
      inverseSpd([
        [1, 1],
        [1, 1],
      ]),
    ).toBeNull();
    expect(
      inverseSpd([
        [1, 2],
        [2, 1],
      ]),
    ).toBeNull();
  });

  // closed form: A·A⁻¹ = I
  it('A·A⁻¹ = I for a 4 × 4 normal matrix', () => {
    const a = normalMatrix([
      [1, 2, 0, 1, 3],
      [0, 1, 1, 2, 1],
      [2, 0, 1, 1, 0],
      [1, 1, 1, 0, 2],
    ]);
    const inverse = inverseSpd(a)!;
    for (let i = 0; i < 4; i++) {
      for (let j = 0; j < 4; j++) {
        const product = a[i]!.reduce((sum, v, k) => sum + v * inverse[k]![j]!, 0);
        expect(product).toBeCloseTo(i === j ? 1 : 0, 12);
      }
    }
  });
});

describe('pivotedColumns', () => {
  it('takes [0, 2] then [1, 0]; [1, 1e-9] has nothing left after them', () => {
    const taken = pivotedColumns(
      [
        [1, 0],
        [1, 1e-9],
        [0, 2],
      ],
      3,
      1e-6,
    );
    expect(taken.map((t) => t.index)).toEqual([2, 0]);
    expect(taken.map((t) => t.leftNorm)).toEqual([2, 1]);
  });

  it('stops at the limit', () => {
    expect(
      pivotedColumns(
        [
          [3, 0, 0],
          [0, 2, 0],
          [0, 0, 1],
        ],
        2,
        0,
      ).map((t) => t.index),
    ).toEqual([0, 1]);
  });
});
