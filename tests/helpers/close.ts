/**
 * Closeness assertions whose failure message carries the input (in the label), the
 * actual and expected values and the tolerance, e.g.
 * "saturationPressurePa(300 K), IF97 Table 35: actual 3536.6, expected 3536.58941,
 *  |difference| 0.0106 exceeds relative tolerance 1e-8 (absolute 3.54e-5)".
 */

function fail(label: string, actual: number, expected: number, tolerance: string): never {
  throw new Error(
    `${label}: actual ${actual}, expected ${expected}, ` +
      `|difference| ${Math.abs(actual - expected)} exceeds ${tolerance}`,
  );
}

/** Passes when |actual − expected| ≤ rtol·|expected|. NaN never passes. */
export function expectRelative(
  actual: number,
  expected: number,
  rtol: number,
  label: string,
): void {
  const atol = rtol * Math.abs(expected);
  if (!(Math.abs(actual - expected) <= atol)) {
    fail(label, actual, expected, `relative tolerance ${rtol} (absolute ${atol})`);
  }
}

/** Passes when |actual − expected| ≤ atol. NaN never passes. */
export function expectAbsolute(
  actual: number,
  expected: number,
  atol: number,
  label: string,
): void {
  if (!(Math.abs(actual - expected) <= atol)) {
    fail(label, actual, expected, `absolute tolerance ${atol}`);
  }
}

/**
 * Half a unit of the last printed digit of a table entry, the tolerance its printed
 * digits allow: '2.3393' → 5e-5, '2406' → 0.5, '0.353658941e-2' → 5e-12.
 */
export function halfUnitOfLastDigit(printed: string): number {
  const match = /^[+-]?\d*(?:\.(\d*))?(?:e([+-]?\d+))?$/i.exec(printed.trim());
  if (!match) throw new Error(`halfUnitOfLastDigit: '${printed}' is not a decimal number`);
  const decimals = match[1]?.length ?? 0;
  const exponent = Number(match[2] ?? 0);
  return 0.5 * 10 ** (exponent - decimals);
}
