/**
 * The one error the property functions raise: an input outside the range the published
 * correlation was fitted and validated over. The functions never clamp.
 */

/** Shortest decimal that shows a bound or an input to 7 significant digits. */
function formatNumber(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(7))) : String(x);
}

/** An input lies outside a correlation's published range of validity. */
export class OutOfRangeError extends Error {
  override readonly name = 'OutOfRangeError';

  constructor(
    /** The correlation, e.g. 'IAPWS-IF97 Region 1'. */
    readonly correlation: string,
    /** The input that is out of range, e.g. 'temperature'. */
    readonly quantity: string,
    readonly value: number,
    readonly min: number,
    readonly max: number,
    /** Unit of value, min and max, e.g. 'K'. */
    readonly unit: string,
    /** True when min itself is excluded (0 < p for a gas pressure). */
    readonly minExclusive: boolean = false,
  ) {
    super(
      `${correlation}: ${quantity} ${formatNumber(value)} ${unit} is outside ` +
        `${formatNumber(min)}–${formatNumber(max)} ${unit}` +
        (minExclusive ? ` (${formatNumber(min)} excluded)` : ''),
    );
  }
}

/**
 * Throws OutOfRangeError unless min ≤ value ≤ max. NaN is out of every range.
 */
export function requireInRange(
  correlation: string,
  quantity: string,
  value: number,
  min: number,
  max: number,
  unit: string,
): void {
  if (!(value >= min && value <= max)) {
    throw new OutOfRangeError(correlation, quantity, value, min, max, unit);
  }
}
