import { describe, expect, it } from 'vitest';
import { deliveryWindowS, THREE_CUP_DELIVERY_WINDOW_S } from '../../generator/planning/delivery.ts';
import { planCard } from '../../generator/planning/plan.ts';
import type { AcceptedPlan, CardPlan } from '../../generator/planning/types.ts';
import { coffeeEntry, potEntry, seaLevel, stoveEntry } from './entries.ts';

const C = 273.15;
const accepted = (plan: CardPlan): AcceptedPlan => {
  if (plan.refused) throw new Error(`expected a recipe, got a refusal: ${plan.refused.reason}`);
  return plan;
};

describe('the default delivery window', () => {
  it('is 60–150 s from three cups up (common practice, no source) and scales below', () => {
    const byDefault = { deliveryWindowS: null };
    expect(deliveryWindowS(byDefault, { cups: 3 })).toEqual(THREE_CUP_DELIVERY_WINDOW_S);
    expect(deliveryWindowS(byDefault, { cups: 9 })).toEqual([60, 150]);
    expect(deliveryWindowS(byDefault, { cups: 1 })).toEqual([20, 50]);
    expect(deliveryWindowS(byDefault, { cups: 2 })).toEqual([40, 100]);
  });

  // own rule: the delivery window scales with the cups (our choice), not an outside value
  it('scales the coffee’s own window the same way', () => {
    expect(deliveryWindowS({ deliveryWindowS: [70, 160] }, { cups: 4 })).toEqual([70, 160]);
    expect(deliveryWindowS({ deliveryWindowS: [72, 159] }, { cups: 1 })).toEqual([24, 53]);
  });

  // own rule: the delivery window scales with the cups (our choice), not an outside value
  it('lets a one-cup pot start hot (with the three-cup window it could only start cold)', () => {
    // A one-cup base: 100 mL sealed, 60 mm across, valve 24 mm up (the demo's measurements).
    const oneCup = potEntry(
      {
        sealedVolumeM3: 100e-6,
        baseInnerDiameterM: 0.06,
        valveHeightM: 0.024,
        baseMassKg: 0.09,
        basketDiameterM: 0.04,
        basketDepthM: 0.011,
        tubeInnerDiameterM: 0.005,
        tubeGapM: 0.003,
        spoutHeightM: 0.085,
        upperCapacityM3: 70e-6,
      },
      { cups: 1 },
    );
    const stove = stoveEntry([90, 150, 250, 400]);
    const request = {
      pot: oneCup,
      stove,
      room: seaLevel,
      kettlePresetsK: [70 + C, 80 + C, 90 + C],
    };
    const scaled = accepted(
      planCard({ ...request, coffee: { ...coffeeEntry(), deliveryWindowS: null } }),
    );
    // The window a three-cup pot gets, imposed on the one-cup pot: 3 × [20, 50] s.
    const threeCup = accepted(
      planCard({ ...request, coffee: { ...coffeeEntry(), deliveryWindowS: [180, 450] } }),
    );
    expect(threeCup.startK).toBeCloseTo(seaLevel.ambientK, 9);
    expect(scaled.startK).toBeGreaterThanOrEqual(60 + C);
    expect(scaled.extraction.inBandShare).toBeGreaterThan(threeCup.extraction.inBandShare + 0.2);
  });
});
