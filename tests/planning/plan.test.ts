import { describe, expect, it } from 'vitest';
import {
  firstPrintable,
  planCard,
  startCandidates,
  TIE_SHARE,
} from '../../generator/planning/plan.ts';
import type { BrewResult } from '../../generator/brew/types.ts';
import { maxSafeFill } from '../../generator/planning/fill.ts';
import { simulateBrew } from '../../generator/brew/simulate.ts';
import { brewSetup, roomModel } from '../../generator/planning/setup.ts';
import { saturationTemperatureK } from '../../generator/physics/if97-region4.ts';
import { ambientPressurePa } from '../../generator/physics/atmosphere.ts';
import type { AcceptedPlan, CardPlan } from '../../generator/planning/types.ts';
import { planWords } from '../../generator/words/plan.ts';
import { coffeeEntry, potEntry, seaLevel, stoveEntry } from './entries.ts';

const C = 273.15;
/** A gas ring from a simmer (~100 W reaching the pot) to a strong flame. */
const gasRing = stoveEntry([100, 130, 160, 200, 250, 300, 400]);
const accepted = (plan: CardPlan): AcceptedPlan => {
  if (plan.refused) throw new Error(`expected a recipe, got a refusal: ${plan.refused.reason}`);
  return plan;
};
const typical = accepted(
  planCard({ pot: potEntry(), coffee: coffeeEntry(), stove: gasRing, room: seaLevel }),
);

describe('planCard on a typical three-cup pot with a permeable grind', () => {
  // own rule: the planner's own limits and search, not an outside value
  it('re-simulating the plan’s own choices gives the plan’s numbers', () => {
    const again = simulateBrew(
      brewSetup(potEntry().model, coffeeEntry().bed, roomModel(seaLevel), {
        fillVolumeM3: typical.fillM3,
        startK: typical.startK,
        heatInputW: typical.heatToPotW,
        heatOffAtS: typical.offHeatS.midS,
      }),
    );
    expect(again.firstCoffeeS).toBeCloseTo(typical.firstCoffeeS.midS, 6);
    expect(again.yieldM3).toBeCloseTo(typical.yieldM3, 12);
    expect(again.extraction!.inBandShare).toBeCloseTo(typical.extraction.inBandShare, 9);
    expect(again.extraction!.meanK).toBeCloseTo(typical.extraction.meanK, 6);
  });

  it('chooses a start near 70 °C (hot-water rule of thumb: common practice, no source)', () => {
    expect(typical.startK - C).toBeGreaterThanOrEqual(60);
    expect(typical.startK - C).toBeLessThanOrEqual(80);
  });

  // common practice, no source: a hot start brews far more of the cup in band than a cold one
  it('puts far more of the cup in band than a cold start', () => {
    expect(typical.extraction.inBandShare).toBeGreaterThan(typical.coldStart.inBandShare + 0.25);
    expect(typical.extraction.meanK).toBeGreaterThan(typical.coldStart.meanK + 10);
  });

  // own rule: the planner's own limits and search, not an outside value
  it('keeps the delivery phase inside the coffee’s window and before the sputter', () => {
    const delivery = typical.offHeatS.midS - typical.firstCoffeeS.midS;
    expect(delivery).toBeGreaterThanOrEqual(60 - 1e-6);
    expect(delivery).toBeLessThanOrEqual(150 + 1e-6);
    expect(typical.brew.endReason).toBe('flow-stopped');
  });

  it('gives timing ranges that contain the nominal value', () => {
    for (const r of [typical.firstCoffeeS, typical.offHeatS]) {
      expect(r.lowS).toBeLessThanOrEqual(r.midS);
      expect(r.highS).toBeGreaterThanOrEqual(r.midS);
      expect(r.highS - r.lowS).toBeGreaterThan(1);
    }
  });

  // own rule: the planner's own limits and search, not an outside value
  it('fills below the valve with the stated margin once the water is at its hottest', () => {
    expect(typical.belowValveM).toBeGreaterThan(typical.expansionMarginM);
    expect(typical.peakGaugePa).toBeLessThanOrEqual(0.5 * potEntry().model.valveOpeningGaugePa);
  });
});

describe('planCard at altitude (ISO 2533 pressure, IF97 Region 4 boiling point)', () => {
  const high = planCard({
    pot: potEntry(),
    coffee: coffeeEntry(),
    stove: gasRing,
    room: { ...seaLevel, altitudeM: 2500 },
  });

  it('reports boiling near 92 °C at 2,500 m', () => {
    // ISO 2533: p(2500 m) = 74.68 kPa; IF97 Region 4: T_sat(74.68 kPa) = 91.8 °C.
    expect(ambientPressurePa(2500)).toBeCloseTo(74682, -1);
    expect(high.boilingK - C).toBeGreaterThan(91.3);
    expect(high.boilingK - C).toBeLessThan(92.3);
    expect(high.boilingK).toBeCloseTo(saturationTemperatureK(ambientPressurePa(2500)), 9);
  });

  it('starts hotter or predicts a cooler cup than at sea level', () => {
    const h = accepted(high);
    expect(h.startK > typical.startK || h.extraction.meanK < typical.extraction.meanK).toBe(true);
  });

  it('never starts within 2 K of boiling', () => {
    const starts = startCandidates(
      {
        pot: potEntry(),
        coffee: coffeeEntry(),
        stove: gasRing,
        room: { ...seaLevel, altitudeM: 2500 },
      },
      high.boilingK,
    );
    expect(Math.max(...starts)).toBeLessThanOrEqual(high.boilingK - 2);
  });
});

describe('planCard refusals (a reason and a fix, never a recipe)', () => {
  it('refuses a fill above the valve', () => {
    const limit = maxSafeFill(potEntry().model, seaLevel.ambientK, 101325).maxFillM3;
    const plan = planCard({
      pot: potEntry(),
      coffee: coffeeEntry(),
      stove: gasRing,
      room: seaLevel,
      fillM3: limit * 1.15,
    });
    expect(plan.refused?.code).toBe('fill-above-valve');
    expect(plan.refused?.suggestion).toMatch(/at most \d+ mL/);
  });

  it('refuses a bed so tight the pressure nears the valve, suggesting a coarser grind', () => {
    const plan = planCard({
      pot: potEntry(),
      coffee: { ...coffeeEntry({ permeabilityM2: 1.5e-14 }), grind: 'fine' },
      stove: gasRing,
      room: seaLevel,
    });
    expect(plan.refused?.code).toBe('pressure-near-valve');
    expect(plan.refused?.suggestion).toContain('coarser');
  });

  // common practice, no source: aluminium is not magnetic, so an induction hob does not heat it.
  it('refuses an aluminium pot on induction, and accepts it with an induction plate', () => {
    const induction = stoveEntry([100, 150, 200, 300], 'induction');
    const plan = planCard({
      pot: potEntry(),
      coffee: coffeeEntry(),
      stove: induction,
      room: seaLevel,
    });
    expect(plan.refused).toEqual(planWords.inductionNeedsMagneticBase(potEntry().name));
    const plated = planCard({
      pot: potEntry({}, { inductionReady: true }),
      coffee: coffeeEntry(),
      stove: induction,
      room: seaLevel,
    });
    expect(plated.refused).toBeNull();
  });
});

describe('planCard’s coarse-to-fine start search', () => {
  // The search is checked against the planner's own exhaustive search (every start at
  // every level): a consistency check of the shortcut, not of the physics.
  const pots = [
    potEntry(),
    potEntry({ sealedVolumeM3: 160e-6, baseInnerDiameterM: 0.07, valveHeightM: 0.026 }),
    potEntry({ sealedVolumeM3: 420e-6, baseInnerDiameterM: 0.1, valveHeightM: 0.036 }),
  ];
  const stoves = [gasRing, stoveEntry([150, 300, 500, 800, 1200], 'radiant')];
  const cases = pots.flatMap((pot) =>
    [0.6e-12, 1e-12, 1.8e-12].flatMap((k) =>
      stoves.map((stove) => ({ pot, coffee: coffeeEntry({ permeabilityM2: k }), stove })),
    ),
  );

  // own rule: the planner's own limits and search, not an outside value
  it('never chooses a plan worse than a tie with the exhaustive search’s, and mostly the same', () => {
    let same = 0;
    let accepted = 0;
    for (const c of cases) {
      const request = { ...c, room: seaLevel, kettlePresetsK: [70 + C, 80 + C, 90 + C] };
      const quick = planCard(request);
      const every = planCard(request, { coarseStride: 1 });
      expect(quick.refused?.code ?? null).toBe(every.refused?.code ?? null);
      if (quick.refused || every.refused) continue;
      accepted++;
      expect(quick.extraction.inBandShare).toBeGreaterThanOrEqual(
        every.extraction.inBandShare - TIE_SHARE - 0.005,
      );
      expect(quick.simulations).toBeLessThan(every.simulations);
      if (quick.startK === every.startK && quick.levelIndex === every.levelIndex) same++;
    }
    expect(accepted).toBeGreaterThanOrEqual(12);
    expect(same / accepted).toBeGreaterThanOrEqual(0.9);
  });
});

describe('firstPrintable: the printed run keeps the limits the search saw', () => {
  // Stand-in runs: only the fields firstPrintable reads.
  const runOf = (over: Partial<BrewResult>): BrewResult =>
    ({ peakGaugePa: 1e4, endReason: 'flow-stopped', extraction: {}, ...over }) as BrewResult;
  const byShare = (a: { share: number }, b: { share: number }) => a.share > b.share;
  const limitPa = 5e4;

  // own rule: the planner's own limits and search, not an outside value
  it('takes the heat off 4 s earlier when the best choice’s printed run sputters', () => {
    const tried: number[] = [];
    const result = firstPrintable(
      [{ share: 0.9, offS: 100 }],
      byShare,
      (_c, offS) => {
        tried.push(offS);
        return runOf(offS > 97 ? { endReason: 'sputter' } : {});
      },
      limitPa,
    );
    expect(tried).toEqual([100, 96]);
    expect(result?.chosen.offS).toBe(96);
  });

  // own rule: the planner's own limits and search, not an outside value
  it('moves to the next best choice when retries do not help, and refuses when none passes', () => {
    const choices = [
      { share: 0.5, offS: 80 },
      { share: 0.9, offS: 100 },
    ];
    const result = firstPrintable(
      choices,
      byShare,
      (c) => runOf(c.share > 0.8 ? { peakGaugePa: 6e4 } : {}),
      limitPa,
    );
    expect(result?.chosen).toEqual({ share: 0.5, offS: 80 });
    expect(
      firstPrintable(choices, byShare, () => runOf({ endReason: 'sputter' }), limitPa),
    ).toBeNull();
  });
});
