/**
 * Property-based checks of the brew model (fast-check): random valid pots, beds, heats and
 * starts always finish, never give NaN or Infinity, and keep the model's invariants
 * (closed form: conservation of mass and energy, event order).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { simulateBrew, simulateHeatOn } from '../../generator/brew/simulate.ts';
import { potGeometry } from '../../generator/brew/geometry.ts';
import { maxSafeFill } from '../../generator/planning/fill.ts';
import { ambientPressurePa } from '../../generator/physics/atmosphere.ts';
import { saturationTemperatureK } from '../../generator/physics/if97-region4.ts';
import type { BrewResult, BrewSetup, PotModel } from '../../generator/brew/types.ts';

const C = 273.15;

const potArb = fc
  .record({
    diameterMm: fc.double({ min: 50, max: 110, noNaN: true }),
    heightMm: fc.double({ min: 30, max: 70, noNaN: true }),
    valveShare: fc.double({ min: 0.6, max: 0.8, noNaN: true }),
    gapMm: fc.double({ min: 2, max: 6, noNaN: true }),
    basketShare: fc.double({ min: 0.6, max: 0.75, noNaN: true }),
    basketDepthMm: fc.double({ min: 10, max: 22, noNaN: true }),
    tubeMm: fc.double({ min: 4, max: 9, noNaN: true }),
    columnMm: fc.double({ min: 30, max: 80, noNaN: true }),
    steel: fc.boolean(),
    massG: fc.double({ min: 60, max: 700, noNaN: true }),
    valveBar: fc.double({ min: 1, max: 2.5, noNaN: true }),
  })
  .map((p): PotModel => ({
    sealedVolumeM3: (Math.PI * (p.diameterMm / 1000) ** 2 * (p.heightMm / 1000)) / 4,
    baseInnerDiameterM: p.diameterMm / 1000,
    valveHeightM: (p.valveShare * p.heightMm) / 1000,
    valveOpeningGaugePa: p.valveBar * 1e5,
    baseMaterial: p.steel ? 'stainless-steel' : 'aluminium',
    baseMassKg: p.massG / 1000,
    basketDiameterM: (p.basketShare * p.diameterMm) / 1000,
    basketDepthM: p.basketDepthMm / 1000,
    tubeInnerDiameterM: p.tubeMm / 1000,
    tubeGapM: p.gapMm / 1000,
    spoutHeightM: (p.heightMm + p.basketDepthMm + p.columnMm) / 1000,
    upperCapacityM3: 500e-6,
    heatLossWPerK: 0.05 + (p.diameterMm / 1000) * 2,
  }));

const setupArb = fc
  .record({
    pot: potArb,
    permeabilityM2: fc
      .double({ min: Math.log(2e-14), max: Math.log(1e-11), noNaN: true })
      .map(Math.exp),
    bulkDensity: fc.double({ min: 300, max: 450, noNaN: true }),
    retention: fc.double({ min: 0.8, max: 2, noNaN: true }),
    heatW: fc.double({ min: 40, max: 1500, noNaN: true }),
    fillShare: fc.double({ min: 0.3, max: 1, noNaN: true }),
    startShare: fc.double({ min: 0, max: 1, noNaN: true }),
    ambientC: fc.double({ min: 10, max: 35, noNaN: true }),
    altitudeM: fc.double({ min: 0, max: 3000, noNaN: true }),
    heatOffShare: fc.option(fc.double({ min: 0.1, max: 1.5, noNaN: true }), { nil: undefined }),
  })
  .map((r): BrewSetup => {
    const ambientPa = ambientPressurePa(r.altitudeM);
    const ambientK = r.ambientC + C;
    const hottestStart = Math.min(90 + C, saturationTemperatureK(ambientPa) - 2);
    const startK = ambientK + r.startShare * Math.max(0, hottestStart - ambientK);
    const g = potGeometry(r.pot);
    const safe = maxSafeFill(r.pot, startK, ambientPa).maxFillM3;
    const least = 1.5 * g.volumeAtTubeEndM3;
    return {
      pot: r.pot,
      bed: {
        permeabilityM2: r.permeabilityM2,
        bulkDensityKgM3: r.bulkDensity,
        retentionKgPerKg: r.retention,
        targetBandK: [90 + C, 96 + C],
      },
      room: { ambientK, ambientPa },
      heatInputW: r.heatW,
      fillVolumeM3: least + r.fillShare * Math.max(0, safe - least),
      startK,
      ...(r.heatOffShare !== undefined ? { heatOffAtS: 60 + r.heatOffShare * 200 } : {}),
      collectSeries: true,
      timeLimitS: 1800,
    };
  });

function allFinite(r: BrewResult): boolean {
  const numbers = [
    r.endS,
    r.yieldM3,
    r.leftInBaseM3,
    r.retainedM3,
    r.peakGaugePa,
    ...Object.values(r.balance),
    ...r.series.flatMap((p) => Object.values(p)),
  ];
  return numbers.every(Number.isFinite);
}

describe('simulateBrew over random valid setups (fast-check, seeded)', () => {
  // closed form: conservation of mass and energy, event order, yield bound
  it('always finishes with finite numbers and keeps mass, energy, order and yield bounds', () => {
    fc.assert(
      fc.property(setupArb, (setup) => {
        const r = simulateBrew(setup);
        expect(allFinite(r)).toBe(true);
        expect(['sputter', 'flow-stopped', 'valve-opens', 'time-limit']).toContain(r.endReason);
        const b = r.balance;
        const before = b.initialWaterKg + b.initialVapourKg;
        const after = b.finalBaseLiquidKg + b.finalVapourKg + b.heldUpKg + b.cupKg;
        expect(Math.abs(after - before) / before).toBeLessThan(1e-6);
        if (b.heatInJ > 0) {
          const residual = b.heatInJ - b.heatLostJ - b.storedEnergyChangeJ - b.enthalpyOutJ;
          expect(Math.abs(residual) / b.heatInJ).toBeLessThan(0.005);
        }
        const t = (kind: string) => r.events.find((e) => e.kind === kind)?.tS;
        const flow = t('flow-start'),
          first = t('first-coffee'),
          sputter = t('sputter');
        if (first !== undefined) expect(flow).toBeLessThanOrEqual(first);
        if (first !== undefined && sputter !== undefined)
          expect(first).toBeLessThanOrEqual(sputter);
        for (let i = 1; i < r.series.length; i++) {
          // Integration noise of 1e-10 m³ (1e-4 mL) is allowed: the error norm is an RMS over
          // the state, so one component may exceed its atol (1e-12 m³).
          expect(r.series[i]!.cupM3).toBeGreaterThanOrEqual(r.series[i - 1]!.cupM3 - 1e-10);
        }
        const g = potGeometry(setup.pot);
        const retention = setup.bed.retentionKgPerKg * r.doseKg;
        expect(r.yieldM3).toBeGreaterThanOrEqual(0);
        // Volumes grow a little as the water warms: 5 % allowance on the fill.
        const bound = 1.05 * setup.fillVolumeM3 - retention / 1000 - g.volumeAtTubeEndM3;
        expect(r.yieldM3).toBeLessThanOrEqual(Math.max(0, bound) + 1e-12);
        if (r.extraction) {
          expect(r.extraction.inBandShare).toBeGreaterThanOrEqual(0);
          expect(r.extraction.inBandShare).toBeLessThanOrEqual(1 + 1e-12);
          expect(r.extraction.p10K).toBeLessThanOrEqual(r.extraction.p50K + 1e-9);
          expect(r.extraction.p50K).toBeLessThanOrEqual(r.extraction.p90K + 1e-9);
        }
      }),
      { numRuns: 250, seed: 20261201, endOnFailure: true },
    );
  });
});

describe('simulateHeatOn: branching off a heat-on run (fast-check, seeded)', () => {
  // The planner's off-heat search relies on it: a branched run must be the run itself.
  it('gives exactly the full run with the heat taken off at that moment, stats aside', () => {
    fc.assert(
      fc.property(setupArb, fc.double({ min: 0, max: 1, noNaN: true }), (drawn, when) => {
        const { heatOffAtS: _ignored, ...setup } = drawn;
        const heatOn = simulateHeatOn(setup);
        const offS = when * heatOn.result.endS;
        const branched = heatOn.heatOffAt(offS);
        const full = simulateBrew({ ...setup, heatOffAtS: offS });
        expect({ ...branched, stats: null }).toStrictEqual({ ...full, stats: null });
        expect(branched.stats.rhsEvaluations).toBeLessThanOrEqual(full.stats.rhsEvaluations + 1);
      }),
      { numRuns: 150, seed: 20261202, endOnFailure: true },
    );
  });

  it('branches after the heat-on run ended, or at its start, as a full run', () => {
    const { heatOffAtS: _ignored, ...setup } = fc.sample(setupArb, { numRuns: 1, seed: 7 })[0]!;
    const heatOn = simulateHeatOn(setup);
    for (const offS of [0, heatOn.result.endS, heatOn.result.endS + 50]) {
      const full = simulateBrew({ ...setup, heatOffAtS: offS });
      expect({ ...heatOn.heatOffAt(offS), stats: null }).toStrictEqual({ ...full, stats: null });
      // Heat off at the very moment of the sputter once ran on with a negative base.
      expect(full.balance.finalBaseLiquidKg).toBeGreaterThanOrEqual(0);
    }
  });
});
