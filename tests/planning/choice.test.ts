/**
 * The planner's choice on pots, coffees and stoves of our own invention (not the demo's):
 * a one-cup pot, a three-cup pot with generous headspace, a nine-cup pot; open, typical and
 * tight beds; weak, medium and strong stoves. Properties of the planner's contract, checked
 * against independent re-simulations of its own choices (the brew model, the fill limit):
 * - never worse than doing nothing: the printed share in band is at least the cold start's;
 * - below a share of 0.3 the plan names what binds (a code with its facts), and only then;
 * - the printed peak is the recipe's own run, inside its corner range, and the corners'
 *   highest keeps the half-valve limit;
 * - the planned fill is a whole millilitre that the fill limit (and so `simulate`) accepts.
 */
import { describe, expect, it } from 'vitest';
import {
  BINDING_SHARE,
  PRESSURE_LIMIT_SHARE_OF_VALVE,
  planCard,
  windowPenalty,
  cupPenalty,
} from '../../generator/planning/plan.ts';
import { maxSafeFill } from '../../generator/planning/fill.ts';
import { simulateBrew } from '../../generator/brew/simulate.ts';
import { brewSetup, roomModel } from '../../generator/planning/setup.ts';
import type { AcceptedPlan, CardPlan } from '../../generator/planning/types.ts';
import type { CoffeeEntry, PotEntry, StoveEntry } from '../../generator/content/types.ts';
import { coffeeEntry, potEntry, seaLevel, stoveEntry } from './entries.ts';
import { stationCardView } from '../../generator/render/card-view.ts';
import { OPTIONS, demoCatalogue } from '../render/demo.ts';
import { expectOneSource } from '../render/one-source.ts';

const C = 273.15;
const presets = [70 + C, 80 + C, 90 + C];
const pots: Record<string, PotEntry> = {
  oneCup: potEntry(
    {
      sealedVolumeM3: 95e-6,
      baseInnerDiameterM: 0.058,
      valveHeightM: 0.024,
      basketDiameterM: 0.038,
      basketDepthM: 0.011,
      tubeInnerDiameterM: 0.005,
      tubeGapM: 0.003,
      spoutHeightM: 0.085,
      upperCapacityM3: 70e-6,
      baseMassKg: 0.09,
    },
    { cups: 1, id: 'one-cup' },
  ),
  // 320 mL sealed over a valve 30 mm up: ~150 mL of air above the fill.
  generous3: potEntry(
    { sealedVolumeM3: 320e-6, valveHeightM: 0.03 },
    { cups: 3, id: 'generous-three' },
  ),
  nineCup: potEntry(
    {
      sealedVolumeM3: 700e-6,
      baseInnerDiameterM: 0.11,
      valveHeightM: 0.055,
      basketDiameterM: 0.08,
      basketDepthM: 0.02,
      tubeInnerDiameterM: 0.009,
      tubeGapM: 0.005,
      spoutHeightM: 0.17,
      upperCapacityM3: 550e-6,
      baseMassKg: 0.35,
    },
    { cups: 9, id: 'nine-cup' },
  ),
};
const beds = {
  open: coffeeEntry({ permeabilityM2: 4e-12 }),
  typical: coffeeEntry(),
  tight: coffeeEntry({ permeabilityM2: 3e-13 }),
};
const stoves = {
  weak: stoveEntry([80, 120, 180]),
  medium: stoveEntry([200, 350, 500]),
  strong: stoveEntry([450, 700, 1000]),
};

interface Case {
  readonly name: string;
  readonly pot: PotEntry;
  readonly coffee: CoffeeEntry;
  readonly plan: CardPlan;
}
const planOf = (name: string, pot: PotEntry, coffee: CoffeeEntry, stove: StoveEntry): Case => ({
  name,
  pot,
  coffee,
  plan: planCard({ pot, coffee, stove, room: seaLevel, kettlePresetsK: presets }),
});

const cases: Case[] = [];
for (const [pn, pot] of Object.entries(pots))
  for (const [bn, coffee] of Object.entries(beds))
    for (const [sn, stove] of Object.entries(stoves))
      cases.push(planOf(`${pn}/${bn}/${sn}`, pot, coffee, stove));

/**
 * A bed that tightens as it brews (generator/brew/bed.ts), at final shares 0.3, 0.6 and
 * 0.9 over 40 mL: the invented pots, the open and tight beds, the weak and strong stoves;
 * a bed between them keeping 30 % over 60 mL on all three stoves; and the open and tight
 * beds at 0.6 with a wide band (70–96 °C) that a cold start partly reaches.
 */
const SHARES = [0.3, 0.6, 0.9] as const;
const tighteningCases: Case[] = [];
for (const [pn, pot] of Object.entries(pots))
  for (const bn of ['open', 'tight'] as const)
    for (const sn of ['weak', 'strong'] as const)
      for (const share of SHARES) {
        const coffee = {
          ...beds[bn],
          bed: { ...beds[bn].bed, tightening: { finalShare: share, overM3: 40e-6 } },
        };
        tighteningCases.push(planOf(`${pn}/${bn}/${sn}/f${share}`, pot, coffee, stoves[sn]));
      }
// A bed between the two keeping 30 %, on all three stoves: the late pressure rises most
// (an invented nine-cup printed 0.806 bar over a 0.75 bar limit before the corners took
// the heat off at the card's off-heat time).
for (const [pn, pot] of Object.entries(pots))
  for (const [sn, stove] of Object.entries(stoves)) {
    const coffee = coffeeEntry({
      permeabilityM2: 0.6e-12,
      tightening: { finalShare: 0.3, overM3: 60e-6 },
    });
    tighteningCases.push(planOf(`${pn}/mid/${sn}/f0.3`, pot, coffee, stove));
  }
// A wide band, 70–96 °C, which a cold start reaches part of (at 90–96 °C every cold start
// above scores 0 and "never below the cold start" would hold trivially).
for (const [pn, pot] of Object.entries(pots))
  for (const bn of ['open', 'tight'] as const)
    for (const sn of ['weak', 'strong'] as const) {
      const coffee = {
        ...beds[bn],
        bed: {
          ...beds[bn].bed,
          targetBandK: [70 + C, 96 + C] as const,
          tightening: { finalShare: 0.6, overM3: 40e-6 },
        },
      };
      tighteningCases.push(planOf(`${pn}/${bn}/${sn}/f0.6/wide`, pot, coffee, stoves[sn]));
    }

const acceptedOf = (list: readonly Case[]) =>
  list.filter((c): c is Case & { plan: AcceptedPlan } => c.plan.refused === null);
const accepted = acceptedOf(cases);
const byName = (name: string) => accepted.find((c) => c.name === name)!.plan;
const limitOf = (pot: PotEntry) => PRESSURE_LIMIT_SHARE_OF_VALVE * pot.model.valveOpeningGaugePa;

/** The planner's contract, checked on a list of cases (the classic bed's and the tightening's). */
function plannerContract(list: readonly Case[]): void {
  const ok = acceptedOf(list);

  it('never prints a share in band below the cold start’s', () => {
    for (const { name, plan } of ok) {
      expect(plan.extraction.inBandShare, name).toBeGreaterThanOrEqual(plan.coldStart.inBandShare);
    }
  });

  it('names a binding cause exactly when the share is below 0.3', () => {
    for (const { name, plan } of ok) {
      expect(plan.bindingCause !== null, name).toBe(plan.extraction.inBandShare < BINDING_SHARE);
      if (plan.bindingCause) {
        expect(plan.bindingCause.facts.share).toBe(plan.extraction.inBandShare);
      }
    }
  });

  it('prints the recipe’s own peak, inside its corner range, with the highest corner under half the valve', () => {
    for (const { name, pot, coffee, plan } of ok) {
      const again = simulateBrew(
        brewSetup(pot.model, coffee.bed, roomModel(seaLevel), {
          fillVolumeM3: plan.fillM3,
          startK: plan.startK,
          heatInputW: plan.heatToPotW,
          heatOffAtS: plan.offHeatS.midS,
        }),
      );
      expect(plan.peakGaugePa, name).toBeCloseTo(again.peakGaugePa, 0);
      expect(plan.peakGaugeRangePa.lowPa).toBeLessThanOrEqual(plan.peakGaugePa);
      expect(plan.peakGaugeRangePa.highPa).toBeGreaterThanOrEqual(plan.peakGaugePa);
      expect(plan.peakGaugeRangePa.highPa, name).toBeLessThanOrEqual(limitOf(pot));
      expect(again.endReason, name).not.toBe('sputter');
    }
  });

  // own rule: the planner's contract (the half-valve limit), not an outside value. The
  // highest corner re-simulated here from the spread alone (tightest bed, most heat and,
  // for a tightening bed, its lowest final share), off the heat at the card's time.
  it('keeps the half-valve limit on the high corner, re-simulated independently', () => {
    for (const { name, pot, coffee, plan } of ok) {
      const k = plan.spread.permeabilityFactor;
      const lowShare = plan.spread.finalShare?.low;
      const tightening = coffee.bed.tightening;
      const bed = {
        ...coffee.bed,
        permeabilityM2: coffee.bed.permeabilityM2 / k,
        ...(tightening && lowShare !== undefined
          ? { tightening: { ...tightening, finalShare: lowShare } }
          : {}),
      };
      const high = simulateBrew(
        brewSetup(pot.model, bed, roomModel(seaLevel), {
          fillVolumeM3: plan.fillM3,
          startK: plan.startK,
          heatInputW: plan.heatToPotW * (1 + plan.spread.heatShare),
          heatOffAtS: plan.offHeatS.midS,
        }),
      );
      // 1 % for the corner runs' search tolerance (1e-5) against this run's 1e-6.
      expect(high.peakGaugePa, name).toBeLessThanOrEqual(limitOf(pot) * 1.01);
      expect(high.peakGaugePa, name).toBeLessThanOrEqual(plan.peakGaugeRangePa.highPa * 1.01);
    }
  });

  // own rule: the planner's contract (its preferences and limits), not an outside value
  it('plans a whole-millilitre fill that the fill limit at its start accepts', () => {
    for (const { name, pot, plan } of ok) {
      const ml = plan.fillM3 * 1e6;
      expect(Math.abs(ml - Math.round(ml)), name).toBeLessThan(1e-6);
      expect(plan.fillM3).toBeLessThanOrEqual(
        maxSafeFill(pot.model, plan.startK, roomModel(seaLevel).ambientPa).maxFillM3,
      );
    }
  });
}

describe('the planner’s choice on invented pots, beds and stoves', () => {
  it('prints a recipe for every one of the 27 cases (only safety refuses)', () => {
    expect(accepted.map((c) => c.name)).toEqual(cases.map((c) => c.name));
  });

  plannerContract(cases);

  // own rule: the planner's contract (its preferences and limits), not an outside value
  it('gets the open-grind one-cup and generous three-cup pots into the band from a hot start', () => {
    // Both used to print a 20 °C start with 0 % in band; a simulation at the gentlest
    // level from 80 °C puts most of the cup in band (the planner's own engine).
    for (const name of ['oneCup/open/weak', 'generous3/open/medium', 'generous3/typical/weak']) {
      const plan = byName(name);
      expect(plan.startK, name).toBeGreaterThan(seaLevel.ambientK + 30);
      expect(plan.extraction.inBandShare, name).toBeGreaterThanOrEqual(0.5);
    }
  });
});

describe('a bed that tightens as it brews, on the invented pots (57 cases)', () => {
  // own rule: only safety refuses (the half-valve limit), and then for a true reason: the
  // gentlest level from a cold start, heat on, already passes half the valve.
  it('refuses only for pressure, and only when the gentlest cold start passes the limit', () => {
    for (const { name, pot, coffee, plan } of tighteningCases) {
      if (plan.refused === null) continue;
      expect(plan.refused.code, name).toBe('pressure-near-valve');
      const stove = stoves[name.split('/')[2] as keyof typeof stoves];
      const cold = simulateBrew(
        brewSetup(pot.model, coffee.bed, roomModel(seaLevel), {
          fillVolumeM3:
            Math.floor(
              maxSafeFill(pot.model, seaLevel.ambientK, roomModel(seaLevel).ambientPa).maxFillM3 *
                1e6,
            ) / 1e6,
          startK: seaLevel.ambientK,
          heatInputW: stove.levels[0]!.heatToPotW,
        }),
      );
      expect(cold.peakGaugePa, name).toBeGreaterThan(limitOf(pot));
    }
  });

  // own rule: the share enters the ranges (its corners), measured or assumed
  it('carries the final share’s corners in the spread, the lower with the tighter bed', () => {
    for (const { name, coffee, plan } of acceptedOf(tighteningCases)) {
      const f = coffee.bed.tightening!.finalShare;
      const spread = plan.spread.finalShare!;
      expect(spread.measured, name).toBe(false);
      expect(spread.low, name).toBeLessThan(f);
      expect(spread.high, name).toBeGreaterThanOrEqual(f);
      expect(spread.high, name).toBeLessThanOrEqual(1);
    }
  });

  // own rule: the property below is not vacuous: some cold starts score
  it('has cold starts with part of the cup in band (the wide band)', () => {
    const scoring = acceptedOf(tighteningCases).filter((c) => c.plan.coldStart.inBandShare > 0.05);
    expect(scoring.length).toBeGreaterThanOrEqual(4);
  });

  it('prints a recipe for most of them', () => {
    // own rule: a tight bed (3e-13 m²) keeping 30 % may honestly be refused on pressure;
    // every open bed gets a recipe.
    const ok = acceptedOf(tighteningCases).map((c) => c.name);
    for (const c of tighteningCases.filter((c) => c.name.includes('/open/')))
      expect(ok, c.name).toContain(c.name);
  });

  plannerContract(tighteningCases);

  // own rule: one number, one source (the checks the demo cards get, render/one-source.ts)
  it('prints each number of the card once, from the plan', async () => {
    const demo = await demoCatalogue();
    for (const { name, pot, coffee, plan } of acceptedOf(tighteningCases)) {
      const stove = stoves[name.split('/')[2] as keyof typeof stoves];
      const catalogue = {
        ...demo,
        pots: new Map([[pot.id, pot]]),
        coffees: new Map([[coffee.id, coffee]]),
        stoves: new Map([[stove.id, stove]]),
      };
      const view = await stationCardView(plan, catalogue, { ...OPTIONS, units: 'metric' });
      expectOneSource(view, plan, name);
      // The share is assumed (no fit wrote it): the card says so.
      expect(view.recipe!.expect.notes.join(' '), name).toMatch(/not yet weighed/);
    }
  }, 120_000);
});

describe('the planner’s preferences', () => {
  // own rule: the planner's contract (its preferences and limits), not an outside value
  it('costs nothing inside the delivery window and grows with the distance outside it', () => {
    expect(windowPenalty(100, [60, 150])).toBe(0);
    expect(windowPenalty(30, [60, 150])).toBeGreaterThan(windowPenalty(45, [60, 150]));
    expect(windowPenalty(200, [60, 150])).toBeGreaterThan(windowPenalty(160, [60, 150]));
  });

  // own rule: the planner's contract (its preferences and limits), not an outside value
  it('costs nothing for a cup at or above the floor and grows as the cup shrinks', () => {
    expect(cupPenalty(80e-6, 75e-6)).toBe(0);
    expect(cupPenalty(30e-6, 75e-6)).toBeGreaterThan(cupPenalty(60e-6, 75e-6));
  });
});
