/**
 * The planner's refusals and warnings as codes and SI facts (no words: render/plan-text.ts
 * and generator/words/ say them in the output's language and units). One factory per code,
 * so the planner reads `refuse(planNotices.fillAboveValve(...))`.
 */
import type { GrindClass } from '../content/types.ts';
import type { CheckedQuantity, PlanWarning, Refusal } from './types.ts';

export const planNotices = {
  inductionNeedsMagneticBase: (potName: string): Refusal => ({
    code: 'induction-needs-magnetic-base',
    facts: { potName },
  }),
  fillAboveValve: (askedM3: number, limitM3: number, marginM: number): Refusal => ({
    code: 'fill-above-valve',
    facts: { askedM3, limitM3, marginM },
  }),
  pressureNearValve: (peakPa: number, valvePa: number, grind: GrindClass): Refusal => ({
    code: 'pressure-near-valve',
    facts: { peakPa, valvePa, grind },
  }),
  noDelivery: (): Refusal => ({ code: 'no-delivery', facts: {} }),
  noPlanFits: (lowS: number, highS: number, tooFast: boolean): Refusal => ({
    code: 'no-plan-fits',
    facts: { lowS, highS, tooFast },
  }),
  outsideCheckedRange: (
    quantity: CheckedQuantity,
    value: number,
    low: number,
    high: number,
  ): PlanWarning => ({
    code: 'outside-checked-range',
    facts: { quantity, value, low, high },
  }),
  coolCup: (inBandShare: number): PlanWarning => ({ code: 'cool-cup', facts: { inBandShare } }),
  smallFill: (): PlanWarning => ({ code: 'small-fill', facts: {} }),
};

/** Each warning once (the same code with the same facts), in first-seen order. */
export function distinctWarnings(warnings: readonly PlanWarning[]): PlanWarning[] {
  const seen = new Map<string, PlanWarning>();
  for (const w of warnings) {
    const key = JSON.stringify(w);
    if (!seen.has(key)) seen.set(key, w);
  }
  return [...seen.values()];
}
