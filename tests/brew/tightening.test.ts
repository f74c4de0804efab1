/**
 * A bed that tightens as it brews (generator/brew/bed.ts): off by default, exact at
 * final share 1, and slower delivery as the share falls.
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { simulateBrew } from '../../generator/brew/simulate.ts';
import { tighteningShare } from '../../generator/brew/bed.ts';
import { integrate } from '../../generator/numerics/dormand-prince.ts';
import { C, permeableBed, referenceSetup } from './fixtures.ts';

const digest = (value: unknown): string =>
  createHash('sha256').update(JSON.stringify(value)).digest('hex');

describe('tightening off', () => {
  // regression snapshot: the classic engine's full results at main d745829, before the tightening existed
  it('gives the classic results bit for bit', () => {
    expect(digest(simulateBrew(referenceSetup()))).toBe(
      '8f77200b272446a87f3efba3253ef547ed823615debe8e662a96992797198426',
    );
    expect(digest(simulateBrew(referenceSetup({ heatInputW: 600, startK: 70 + C })))).toBe(
      '61feb6774c05157ba669c6694d4a881ab3115177ed772cc2fc84cd2ede34c91d',
    );
  });

  // closed form: s(V) = f + (1 − f)·exp(−V/V_c) is exactly 1 at f = 1
  it('final share 1 is the same as off', () => {
    const on = simulateBrew(
      referenceSetup({ bed: { ...permeableBed, tightening: { finalShare: 1, overM3: 40e-6 } } }),
    );
    expect(digest(on)).toBe(digest(simulateBrew(referenceSetup())));
  });
});

describe('tightening on', () => {
  // own rule: a bed that lets less through delivers more slowly (Darcy: Q ∝ k)
  it('delivery (first coffee to sputter) gets slower as the final share falls', () => {
    const delivery = [1, 0.8, 0.6, 0.4, 0.2].map((f) => {
      const r = simulateBrew(
        referenceSetup({ bed: { ...permeableBed, tightening: { finalShare: f, overM3: 40e-6 } } }),
      );
      return r.sputterS! - r.firstCoffeeS!;
    });
    for (let i = 1; i < delivery.length; i++) {
      expect(delivery[i]!).toBeGreaterThan(delivery[i - 1]!);
    }
  });
});

describe('the share s(V) in a flow of constant driving pressure', () => {
  // closed form: Darcy at constant pressure gives dV/dt = a·s(V) with a the flow through
  // the fresh bed; with s(V) = f + (1 − f)·e^(−V/V_c) and V(0) = 0,
  // V(t) = V_c·ln((e^(a·f·t/V_c) − (1 − f))/f). Integrating the share with the engine's
  // integrator must land on it; late on, the flow tends to the classic bed at k0·f.
  it.each([0.2, 0.6, 0.9])('f = %s: the integrated volume follows V(t) of the closed form', (f) => {
    const tightening = { finalShare: f, overM3: 40e-6 };
    const a = 1.5e-6; // m³/s through the fresh bed
    const exact = (t: number) =>
      tightening.overM3 * Math.log((Math.exp((a * f * t) / tightening.overM3) - (1 - f)) / f);
    for (const tEnd of [10, 40, 120]) {
      const out = integrate(
        (_t, y, dydt) => {
          dydt[0] = a * tighteningShare(tightening, y[0]!);
        },
        0,
        new Float64Array([0]),
        tEnd,
        { rtol: 1e-9, atol: 1e-15 },
      );
      expect(out.kind).toBe('finished');
      expect(Math.abs(out.y[0]! - exact(tEnd)) / exact(tEnd)).toBeLessThan(1e-7);
    }
    // The slope far past V_c: the classic bed's flow at k0·f.
    const late = 40 * tightening.overM3;
    expect(a * tighteningShare(tightening, late)).toBeCloseTo(a * f, 12);
  });
});
