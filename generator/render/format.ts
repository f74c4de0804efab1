/**
 * SI → the numbers a card prints, in the site's unit system, with the rounding each
 * quantity is printed at. The conversions are generator/units.ts (NIST SP 811, Appendix B);
 * the two that module lacks are defined here from the same source:
 * 1 psi = 6894.757293168 Pa, 1 ft = 0.3048 m (both exact by definition).
 *
 * Rounding (what "correct to the rounding shown" means on a card):
 *   temperature    metric 1 °C            us 1 °F
 *   water volume   metric 1 mL            us 0.1 fl oz
 *   water mass     metric 1 g             us 0.1 oz
 *   dose           metric 0.1 g           us 0.01 oz
 *   length         metric 1 mm            us 0.01 in
 *   pressure       metric 0.01 bar        us 0.1 psi
 *   assumed valve  2 significant figures (pressureRough: nobody measured it)
 *   altitude       metric 1 m             us 1 ft
 *   share          1 %
 *   time ranges    5 s, the low end rounded down and the high end up (never narrower
 *                  than the model's spread)
 */
import type { UnitSystem } from '../content/types.ts';
import {
  round,
  toBar,
  toCelsius,
  toFahrenheit,
  toFahrenheitDelta,
  toFlOz,
  toGrams,
  toInches,
  toMl,
  toMm,
  toOunces,
  toPsi,
  toFeet,
} from '../units.ts';

/** Time ranges are printed to this step, s. */
export const TIME_STEP_S = 5;

/** A number and its unit, formatted; `text` is the two joined with a narrow no-break space. */
export interface Quantity {
  /** The digits, e.g. "62" or "2.1". */
  readonly value: string;
  /** The unit symbol, e.g. "°C", "fl oz". */
  readonly unit: string;
  /** "62 °C": value and unit joined by U+00A0 (never split over two lines). */
  readonly text: string;
}

/** A time range as printed: "1:50–2:20". */
export interface TimeRangeText {
  /** Low end, m:ss (rounded down to TIME_STEP_S). */
  readonly low: string;
  /** High end, m:ss (rounded up to TIME_STEP_S). */
  readonly high: string;
  /** "1:50–2:20" (en dash), or one time when both ends round to the same step. */
  readonly text: string;
  /** The printed ends in seconds, for checks. */
  readonly lowS: number;
  readonly highS: number;
}

const NBSP = '\u00a0';

/** A unit system and the decimal mark to write numbers with (render/voice.ts Voice is one). */
export interface NumberStyle {
  readonly units: UnitSystem;
  /** "." (English) or "," (Spanish). */
  readonly decimal: string;
}

/** A bare unit system (decimal point) or a number style: every function below takes either. */
export type Units = UnitSystem | NumberStyle;

function systemOf(units: Units): UnitSystem {
  return typeof units === 'string' ? units : units.units;
}

/** The decimal mark of a style; a bare unit system or none writes a point. */
function markOf(units: Units | undefined): string {
  return units === undefined || typeof units === 'string' ? '.' : units.decimal;
}

/** A number and its unit, written with the style's decimal mark (default "."). */
export function quantity(value: number, digits: number, unit: string, style?: Units): Quantity {
  const v = fixed(value, digits, style);
  return { value: v, unit, text: `${v}${NBSP}${unit}` };
}

/** Fixed decimals without "-0", with the style's decimal mark (default "."). */
export function fixed(value: number, digits: number, style?: Units): string {
  const text = round(value, digits).toFixed(digits);
  const mark = markOf(style);
  return mark === '.' ? text : text.replace('.', mark);
}

export function temperature(k: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toFahrenheit(k), 0, '°F', units)
    : quantity(toCelsius(k), 0, '°C', units);
}

/** A temperature difference (K) as °C or °F degrees. */
export function temperatureDelta(dk: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toFahrenheitDelta(dk), 0, '°F', units)
    : quantity(dk, 0, '°C', units);
}

/** A temperature band "90–96 °C". */
export function temperatureBand(band: readonly [number, number], units: Units): string {
  const lo = temperature(band[0], units);
  const hi = temperature(band[1], units);
  return `${lo.value}–${hi.value}${NBSP}${hi.unit}`;
}

export function waterVolume(m3: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toFlOz(m3), 1, 'fl oz', units)
    : quantity(toMl(m3), 0, 'mL', units);
}

/**
 * The fill, rounded DOWN at the shown precision: the planned fill is the most water that
 * stays below the valve, so a card must never print a larger number.
 */
export function fillVolume(m3: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(floorShown(toFlOz(m3) * 10) / 10, 1, 'fl oz', units)
    : quantity(floorShown(toMl(m3)), 0, 'mL', units);
}

/**
 * Rounded down, except that float noise below a whole number does not drop it: the planner
 * plans whole millilitres (planning/plan.ts fillFor), and 150 mL must print 150, not 149.
 */
function floorShown(x: number): number {
  return Math.floor(x + 1e-9);
}

/** The fill's mass, rounded down like `fillVolume`. */
export function fillMass(kg: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(Math.floor(toOunces(kg) * 10) / 10, 1, 'oz', units)
    : quantity(Math.floor(toGrams(kg)), 0, 'g', units);
}

/** A height that must not be overstated (the fill line, its distance below the valve): rounded down. */
export function lengthDown(m: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(Math.floor(toInches(m) * 100) / 100, 2, 'in', units)
    : quantity(Math.floor(toMm(m)), 0, 'mm', units);
}

export function waterMass(kg: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toOunces(kg), 1, 'oz', units)
    : quantity(toGrams(kg), 0, 'g', units);
}

export function dose(kg: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toOunces(kg), 2, 'oz', units)
    : quantity(toGrams(kg), 1, 'g', units);
}

export function length(m: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toInches(m), 2, 'in', units)
    : quantity(toMm(m), 0, 'mm', units);
}

export function pressure(pa: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toPsi(pa), 1, 'psi', units)
    : quantity(toBar(pa), 2, 'bar', units);
}

/**
 * A pressure nobody measured (the valve's assumed opening pressure): two significant
 * figures, so it never reads as more precise than it is ("1.5 bar", "22 psi").
 */
export function pressureRough(pa: number, units: Units): Quantity {
  const value = systemOf(units) === 'us' ? toPsi(pa) : toBar(pa);
  const digits = Math.max(0, 1 - Math.floor(Math.log10(Math.abs(value) || 1)));
  return quantity(
    Number(value.toPrecision(2)),
    digits,
    systemOf(units) === 'us' ? 'psi' : 'bar',
    units,
  );
}

export function altitude(m: number, units: Units): Quantity {
  return systemOf(units) === 'us'
    ? quantity(toFeet(m), 0, 'ft', units)
    : quantity(m, 0, 'm', units);
}

/** A share 0–1 as "78 %". */
export function share(value: number, units?: Units): Quantity {
  return quantity(value * 100, 0, '%', units);
}

/** Seconds as m:ss ("2:05"); negative input is a bug upstream and prints as 0:00. */
export function clock(s: number): string {
  const whole = Math.max(0, Math.round(s));
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

/** A range printed outward to TIME_STEP_S, so the printed range always contains the model's. */
export function timeRange(lowS: number, highS: number): TimeRangeText {
  const lo = Math.floor(Math.min(lowS, highS) / TIME_STEP_S + 1e-9) * TIME_STEP_S;
  const hi = Math.ceil(Math.max(lowS, highS) / TIME_STEP_S - 1e-9) * TIME_STEP_S;
  const low = clock(lo);
  const high = clock(hi);
  return { low, high, text: lo === hi ? low : `${low}–${high}`, lowS: lo, highS: hi };
}

/** Axis units of the cup chart in this unit system. */
export function chartUnits(units: Units): {
  volume: (m3: number) => number;
  temperature: (k: number) => number;
  volumeUnit: string;
  temperatureUnit: string;
} {
  return systemOf(units) === 'us'
    ? { volume: toFlOz, temperature: toFahrenheit, volumeUnit: 'fl oz', temperatureUnit: '°F' }
    : { volume: toMl, temperature: toCelsius, volumeUnit: 'mL', temperatureUnit: '°C' };
}
