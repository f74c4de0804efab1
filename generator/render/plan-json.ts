/**
 * The plan as `stovecard plan --json` prints it: rounded values in the metric units its
 * field names say (°C, mL, g, mm, s, bar). One function, so the command line and the
 * customer's page in the browser (generator/browser/) give the same answer for the same
 * inputs; the page's result elements carry these values in `data-value`.
 */
import type { CardPlan } from '../planning/types.ts';
import { round, toBar, toCelsius, toMl, toMm } from '../units.ts';
import { refusalText, warningText } from './plan-text.ts';

const times = (r: { lowS: number; midS: number; highS: number }) => ({
  low: round(r.lowS),
  mid: round(r.midS),
  high: round(r.highS),
});

export function planJson(plan: CardPlan) {
  const context = {
    pot: plan.potId,
    coffee: plan.coffeeId,
    stove: plan.stoveId,
    boilingC: round(toCelsius(plan.boilingK), 1),
    warnings: plan.warnings.map((w) => warningText(w, 'metric')),
  };
  if (plan.refused) {
    const text = refusalText(plan.refused, 'metric');
    return {
      ...context,
      refused: {
        code: text.code,
        reason: text.reason,
        suggestion: text.suggestion,
        facts: plan.refused.facts,
      },
    };
  }
  return {
    ...context,
    fillMl: round(toMl(plan.fillM3)),
    fillG: round(plan.fillKg * 1000),
    fillHeightMm: round(toMm(plan.fillHeightM), 1),
    belowValveMm: round(toMm(plan.belowValveM), 1),
    doseG: round(plan.doseKg * 1000, 1),
    startC: round(toCelsius(plan.startK)),
    kettlePresetC: plan.kettlePresetK === null ? null : round(toCelsius(plan.kettlePresetK)),
    level: plan.levelLabel,
    firstCoffeeS: times(plan.firstCoffeeS),
    offHeatS: times(plan.offHeatS),
    yieldMl: round(toMl(plan.yieldM3)),
    extraction: {
      meanC: round(toCelsius(plan.extraction.meanK), 1),
      p10C: round(toCelsius(plan.extraction.p10K), 1),
      p90C: round(toCelsius(plan.extraction.p90K), 1),
      inBandShare: round(plan.extraction.inBandShare, 3),
    },
    coldStart: {
      meanC: round(toCelsius(plan.coldStart.meanK), 1),
      inBandShare: round(plan.coldStart.inBandShare, 3),
      firstCoffeeS:
        plan.coldStart.firstCoffeeS === null ? null : round(plan.coldStart.firstCoffeeS),
    },
    peakGaugeBar: round(toBar(plan.peakGaugePa), 3),
    peakGaugeRangeBar: {
      low: round(toBar(plan.peakGaugeRangePa.lowPa), 3),
      high: round(toBar(plan.peakGaugeRangePa.highPa), 3),
    },
    deliveryS: round(plan.deliveryS),
    deliveryWindowS: plan.deliveryWindowS.map((s) => round(s)),
    spread: plan.spread,
    bindingCause: plan.bindingCause,
    simulations: plan.simulations,
    refused: null,
  };
}

/** The --json object of a plan. */
export type PlanJson = ReturnType<typeof planJson>;
