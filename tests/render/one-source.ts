/**
 * One number, one source: what a station card prints against the plan it formats. Shared
 * by the demo cards' test (card-view.test.ts) and the invented pots' (planning/choice.test.ts,
 * the tightening bed's cases), so both check the same properties:
 * - the gap below the valve is the same text in the sentence and in the drawing (it was
 *   3 mm in one and 4 mm in the other, two computations), and is the plan's, rounded down;
 * - the peak is the plan's own run, and the range around it the plan's corners;
 * - the timings print the plan's ranges (rounded outwards to the clock, at most 5 s).
 */
import { expect } from 'vitest';
import type { AcceptedPlan } from '../../generator/planning/types.ts';
import type { StationCardView } from '../../generator/render/card-view.ts';
import { cardWords } from '../../generator/words/card.ts';

const NBSP = '\u00a0';

/** Checks a metric English station card's numbers against its plan; `name` labels failures. */
export function expectOneSource(view: StationCardView, plan: AcceptedPlan, name: string): void {
  const r = view.recipe!;
  expect(r, name).not.toBeNull();
  expect(r.water.belowValve.text, name).toBe(`${Math.floor(plan.belowValveM * 1e3)}${NBSP}mm`);
  expect(r.water.fillLineText, name).toContain(r.water.belowValve.text);
  expect(r.water.crossSectionSvg, name).toContain(
    cardWords.crossSection.margin(r.water.belowValve.text).replace(/"/g, '&quot;'),
  );
  const peak = r.expect.rows.find((x) => x.label === cardWords.expect.peakPressure)!;
  expect(peak.value.startsWith(`${(plan.peakGaugePa / 1e5).toFixed(2)}${NBSP}bar`), name).toBe(
    true,
  );
  expect(plan.peakGaugeRangePa.lowPa, name).toBeLessThanOrEqual(plan.peakGaugePa);
  expect(plan.peakGaugeRangePa.highPa, name).toBeGreaterThanOrEqual(plan.peakGaugePa);
  for (const [printed, range] of [
    [r.timings.firstCoffee, plan.firstCoffeeS],
    [r.timings.offHeat, plan.offHeatS],
  ] as const) {
    expect(printed.lowS, name).toBeLessThanOrEqual(range.lowS);
    expect(printed.highS, name).toBeGreaterThanOrEqual(range.highS);
    expect(range.lowS - printed.lowS, name).toBeLessThan(5);
    expect(printed.highS - range.highS, name).toBeLessThan(5);
  }
}
