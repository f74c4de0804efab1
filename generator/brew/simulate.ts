/**
 * The sealed-boiler brew simulation: a lumped model built from published laws (ideal-gas
 * law, IF97 saturation pressure, Darcy's law, Hagen–Poiseuille, an energy balance);
 * DEVELOPERS.md, "The brew model", lists its modelling choices.
 *
 * State (SI), integrated by Dormand–Prince 5(4) with dense output and event location:
 *   y[T]      water (and base metal) temperature, K
 *   y[ML]     liquid mass in the base, kg
 *   y[MD]     mass displaced up the funnel so far, kg
 *   y[TBED]   temperature of the coffee bed (= of the coffee leaving it), K
 *   y[EIN]    heat put in, J            ┐ bookkeeping for the energy check;
 *   y[ELOSS]  heat lost to the room, J  │ they do not feed back into the dynamics
 *   y[HOUT]   enthalpy carried out, J   ┘
 *   y[VCUP]   volume in the cup, m³ (measured at the base's temperature)
 *
 * Laws: p = n_air·R·T/V_g + p_sat(T); Δp = p − p_amb − ρ·g·(z_front − z_l);
 * Q = Δp / (R_tube + R_bed + R_column) while flowing (no back-flow: the kink at Δp = 0 is
 * an event that switches the flow off and on); vapour stays saturated, so its mass
 * m_v = p_sat·V_g·M_w/(R·T) and its rate couple the mass and energy balances, which are
 * solved together in closed form at each evaluation (see `derivatives`).
 *
 * Wet-up, by displaced mass: first the tube above the water fills; then the grounds take
 * up `retention × dose` (the bed warms as it is wetted); then the upper column fills to the
 * spout; only what passes after that reaches the cup (first coffee). The bed's full Darcy
 * resistance applies from the first millilitre (modelling choice: the dry grounds resist
 * at least as much as the wet bed). A tightening bed (setup.bed.tightening, bed.ts) loses a
 * share of its permeability as water passes the wet grounds. The coffee leaves the bed at the bed's temperature:
 * the grounds start at room temperature and exchange heat perfectly with the water that
 * passes (a lumped node), so the first coffee is cooler than the water below. The
 * extraction temperature of each millilitre is the water's as it reaches the grounds (the
 * SCA's band is defined at the point of contact), recorded in `cupCurve`.
 *
 * Properties: the liquid's ρ, h, c_p, α_v and μ, the bed water's μ and h_fg come from
 * ../physics/water-table.ts (tables of IF97 Region 1, R12-08 and SR1-86, within 1e-8 of
 * them); the stored-energy bookkeeping and the initial state use the correlations directly.
 *
 * Tolerances: rtol 1e-6 (setup.relativeTolerance) on every state, atol per state (ATOL
 * below); event times to 1e-9 s.
 */
import { integrate, type EventFunction, type DenseStep } from '../numerics/dormand-prince.ts';
import {
  MOLAR_GAS_CONSTANT,
  STANDARD_GRAVITY,
  WATER_MOLAR_MASS_KG_PER_MOL,
} from '../physics/constants.ts';
import {
  saturationPressurePa,
  saturationPressureSlopePaPerK,
  saturationTemperatureK,
} from '../physics/if97-region4.ts';
import { region1 } from '../physics/if97-region1.ts';
import { vaporisationEnthalpyJPerKg } from '../physics/saturation.ts';
import {
  liquidAt,
  newLiquidSample,
  saturatedLiquidViscosityPaS,
  tabulatedVaporisationEnthalpyJPerKg,
  type LiquidSample,
} from '../physics/water-table.ts';
import { airIsochoricMolarHeatCapacity } from '../physics/air.ts';
import { metalSpecificHeatJPerKgK } from '../physics/metals.ts';
import { OutOfRangeError } from '../physics/errors.ts';
import { darcyBedResistance, poiseuilleTubeResistance } from '../physics/flow-resistance.ts';
import { potGeometry, type PotGeometry } from './geometry.ts';
import { tighteningShare, type BedTightening } from './bed.ts';
import { BrewSetupError, BrewDidNotFinishError, type BrewSetupCode } from './errors.ts';
import { summariseExtraction } from './extraction.ts';
import type { BrewEvent, BrewEventKind, BrewResult, BrewSetup, SeriesPoint } from './types.ts';

/**
 * Specific heat of roasted, ground coffee (dry), J/(kg·K). From memory: published values
 * for roasted coffee lie around 1.6–1.8 kJ/(kg·K); the bed node is a refinement and this
 * value moves the first coffee's temperature by a degree or two at most.
 */
export const GROUND_COFFEE_SPECIFIC_HEAT_J_PER_KG_K = 1700;

/** After the heat is off, the brew counts as finished when the flow falls below this, m³/s. */
export const TAIL_END_FLOW_M3_PER_S = 0.005e-6;

const T = 0,
  ML = 1,
  MD = 2,
  TBED = 3,
  EIN = 4,
  ELOSS = 5,
  HOUT = 6,
  VCUP = 7;
const STATE_SIZE = 8;
export const DEFAULT_RTOL = 1e-6;
const ATOL = Float64Array.from([1e-5, 1e-9, 1e-9, 1e-5, 1e-2, 1e-2, 1e-2, 1e-12]);
const SERIES_INTERVAL_S = 1;
/** Where in each step the cup curve and peak pressure are sampled. */
const SAMPLE_FRACTIONS = [0.5, 1];

/** Everything the derivative needs that does not change during a run. */
interface Constants {
  readonly geometry: PotGeometry;
  readonly setup: BrewSetup;
  readonly airMoles: number;
  readonly tubeFullKg: number;
  readonly bedWetKg: number;
  readonly firstCoffeeKg: number;
  readonly retainedKg: number;
  readonly doseKg: number;
  readonly initialLevelM: number;
  /** The bed's tightening (bed.ts), null for the classic bed of constant permeability. */
  readonly tightening: BedTightening | null;
  /** Density the passed volume is counted at (the water's at the start), kg/m³. */
  readonly startDensity: number;
}

/** Quantities derived from a state, shared by the derivative, events and outputs. */
interface Algebraic {
  waterDensity: number;
  gasVolume: number;
  liquidVolume: number;
  pressurePa: number;
  saturationPa: number;
  drivingPa: number;
  resistance: number;
  enthalpy: number;
  vapourKg: number;
  /** The liquid's properties at the state (water-table.ts), valid when `key` matches. */
  liquid: LiquidSample;
  valid: boolean;
  /** The state these values belong to (events and outputs re-ask for the same state). */
  key: [number, number, number, number];
}

interface Mode {
  heatOn: boolean;
  flowing: boolean;
}

/** Run one brew. Throws BrewSetupError for impossible setups; never returns NaN. */
export function simulateBrew(setup: BrewSetup): BrewResult {
  return runBrew(setup, prepare(setup), null, null);
}

/**
 * A brew with the heat left on, kept so that the same brew with the heat taken off later
 * can branch off it: the planner tries many off-heat moments per candidate, and every one
 * of those runs has the heat-on run's past.
 */
export interface HeatOnBrew {
  readonly result: BrewResult;
  /**
   * The brew with the heat taken off at `offS` (before the heat-on run ended): exactly
   * simulateBrew({ ...setup, heatOffAtS: offS }), bit for bit, but only the steps from the
   * one containing `offS` on are integrated (and `stats` counts only those).
   */
  heatOffAt(offS: number): BrewResult;
}

export function simulateHeatOn(setup: BrewSetup): HeatOnBrew {
  if (setup.heatOffAtS !== undefined) {
    throw new BrewSetupError('heatOffAtS', 'heat-on-run-with-off-time');
  }
  const c = prepare(setup);
  const log: RunLog = { checkpoints: [], events: [], series: [], cupCurve: [] };
  const result = runBrew(setup, c, log, null);
  return {
    result,
    heatOffAt(offS) {
      const branched = { ...setup, heatOffAtS: offS };
      const points = log.checkpoints;
      // The last step boundary strictly before offS: the full run's step that reaches offS
      // starts there (a boundary at offS itself would not see the event's sign change).
      if (points.length === 0 || !(points[0]!.t < offS) || !(offS < result.endS)) {
        return runBrew(branched, c, null, null);
      }
      let lo = 0;
      let hi = points.length - 1;
      while (lo < hi) {
        const mid = (lo + hi + 1) >> 1;
        if (points[mid]!.t < offS) lo = mid;
        else hi = mid - 1;
      }
      return runBrew(branched, c, null, { log, at: points[lo]! });
    },
  };
}

/** Where a run can be taken up again: a step boundary and everything recorded up to it. */
interface Checkpoint {
  readonly t: number;
  readonly y: Float64Array;
  /** The integrator's next step (undefined: its own starting step) and controller memory. */
  readonly h: number | undefined;
  readonly errPrev: number | undefined;
  readonly flowing: boolean;
  readonly events: number;
  readonly series: number;
  readonly cupCurve: number;
  readonly peakGaugePa: number;
  readonly nextSeriesT: number;
  readonly firstCoffeeK: number | null;
  /** The integration call's maxStep (its default, tEnd − t0, from where the call began). */
  readonly maxStep: number;
}

/** A heat-on run's checkpoints and records (append-only, so a checkpoint's prefix stays valid). */
interface RunLog {
  readonly checkpoints: Checkpoint[];
  readonly events: BrewEvent[];
  readonly series: SeriesPoint[];
  readonly cupCurve: { cupM3: number; extractionK: number }[];
}

function runBrew(
  setup: BrewSetup,
  prepared: Constants,
  log: RunLog | null,
  resume: { readonly log: RunLog; readonly at: Checkpoint } | null,
): BrewResult {
  // Only the heat-off time differs between a heat-on run's constants and a branch's.
  const c: Constants = prepared.setup === setup ? prepared : { ...prepared, setup };
  const alg = newAlgebraic();
  const from = resume?.at ?? null;
  const mode: Mode = {
    heatOn: (setup.heatOffAtS ?? Infinity) > (from?.t ?? 0),
    flowing: from?.flowing ?? true,
  };
  const timeLimitS = setup.timeLimitS ?? 1800;
  const collectSeries = setup.collectSeries ?? true;

  const y0 = new Float64Array(STATE_SIZE);
  y0[T] = setup.startK;
  y0[ML] = region1(setup.startK, setup.room.ambientPa).densityKgM3 * setup.fillVolumeM3;
  y0[TBED] = setup.room.ambientK;
  algebraic(c, y0, alg);
  const initialVapourKg = alg.vapourKg;
  const initialEnthalpy = storedEnergy(c, y0, alg);

  const events: BrewEvent[] = log?.events ?? resume?.log.events.slice(0, from!.events) ?? [];
  const series: SeriesPoint[] = log?.series ?? resume?.log.series.slice(0, from!.series) ?? [];
  const cupCurve = log?.cupCurve ?? resume?.log.cupCurve.slice(0, from!.cupCurve) ?? [];
  let peakGaugePa = from?.peakGaugePa ?? 0;
  let nextSeriesT = from?.nextSeriesT ?? 0;
  let steps = 0;
  let evaluations = 0;
  const sample = new Float64Array(STATE_SIZE);

  const boilingK = saturationTemperatureK(setup.room.ambientPa);
  const record = (y: Float64Array): void => {
    algebraic(c, y, alg);
    const gauge = alg.pressurePa - setup.room.ambientPa;
    if (gauge > peakGaugePa) peakGaugePa = gauge;
    if (y[VCUP]! > 0) {
      const last = cupCurve[cupCurve.length - 1];
      if (!last || y[VCUP]! > last.cupM3) cupCurve.push({ cupM3: y[VCUP]!, extractionK: y[T]! });
    }
  };
  const pushSeries = (t: number, y: Float64Array): void => {
    algebraic(c, y, alg);
    series.push({
      tS: t,
      waterK: y[T]!,
      coffeeK: y[TBED]!,
      spoutK: Math.min(y[TBED]!, boilingK),
      gaugePa: alg.pressurePa - setup.room.ambientPa,
      cupM3: y[VCUP]!,
      flowM3PerS: mode.flowing ? Math.max(0, alg.drivingPa / alg.resistance) : 0,
      baseLiquidM3: alg.liquidVolume,
    });
  };
  const onStep = (step: DenseStep): void => {
    // A mid-step sample keeps the cup curve and the peak pressure faithful.
    for (const f of SAMPLE_FRACTIONS) {
      const t = step.t0 + f * (step.t1 - step.t0);
      step.interpolate(t, sample);
      record(sample);
    }
    if (collectSeries) {
      while (nextSeriesT <= step.t1) {
        step.interpolate(nextSeriesT, sample);
        pushSeries(nextSeriesT, sample);
        nextSeriesT += SERIES_INTERVAL_S;
      }
    }
  };
  const note = (kind: BrewEventKind, t: number, y: Float64Array): void => {
    algebraic(c, y, alg);
    events.push({
      kind,
      tS: t,
      waterK: y[T]!,
      gaugePa: alg.pressurePa - setup.room.ambientPa,
      cupM3: y[VCUP]!,
    });
  };

  // A trial stage can probe a state outside a correlation's range (an overshoot the step
  // control will reject): report it as non-finite so the integrator shrinks the step.
  const f = (_t: number, y: Float64Array, out: Float64Array): void => {
    try {
      derivatives(c, mode, y, out, alg);
    } catch (error) {
      if (!(error instanceof OutOfRangeError)) throw error;
      out.fill(NaN);
    }
  };

  let t = from?.t ?? 0;
  let y = from ? from.y.slice() : y0;
  let h: number | undefined = from ? from.h : undefined;
  let errPrev: number | undefined = from?.errPrev;
  let endReason: BrewResult['endReason'] | null = null;
  let firstCoffeeK: number | null = from ? from.firstCoffeeK : null;
  if (!from) record(y);

  let maxStep = from?.maxStep ?? timeLimitS;
  const checkpoint = (
    at: number,
    state: Float64Array,
    next: number | undefined,
    memory: number | undefined,
  ): void => {
    log?.checkpoints.push({
      t: at,
      y: state.slice(),
      h: next,
      errPrev: memory,
      flowing: mode.flowing,
      events: events.length,
      series: series.length,
      cupCurve: cupCurve.length,
      peakGaugePa,
      nextSeriesT,
      firstCoffeeK,
      maxStep,
    });
  };

  while (endReason === null) {
    const active = activeEvents(c, mode, y, alg);
    if (log) checkpoint(t, y, h, errPrev);
    const outcome = integrate(f, t, y, timeLimitS, {
      rtol: setup.relativeTolerance ?? DEFAULT_RTOL,
      atol: ATOL,
      events: active,
      onStep,
      ...(maxStep > 0 ? { maxStep } : {}),
      ...(h !== undefined ? { initialStep: h } : {}),
      ...(errPrev !== undefined ? { errPrev } : {}),
      ...(log ? { onContinue: checkpoint } : {}),
      maxSteps: 200_000,
    });
    steps += outcome.steps;
    evaluations += outcome.evaluations;
    errPrev = undefined;
    t = outcome.t;
    y = Float64Array.from(outcome.y);
    h = outcome.lastStep > 0 ? outcome.lastStep : undefined;
    maxStep = timeLimitS - t;
    if (outcome.kind === 'finished') {
      note('time-limit', t, y);
      endReason = 'time-limit';
      break;
    }
    if (outcome.kind !== 'event') {
      throw new BrewDidNotFinishError(outcome.kind, t);
    }
    switch (outcome.eventId as InternalEvent) {
      case 'reaches-grounds':
        note('flow-start', t, y);
        break;
      case 'bed-wet':
        break;
      case 'first-coffee':
        note('first-coffee', t, y);
        firstCoffeeK = y[TBED]!;
        cupCurve.push({ cupM3: 0, extractionK: y[T]! });
        break;
      case 'heat-off':
        mode.heatOn = false;
        note('heat-off', t, y);
        break;
      case 'flow-stops':
        mode.flowing = false;
        note('flow-stop', t, y);
        if (!mode.heatOn) endReason = 'flow-stopped';
        break;
      case 'flow-resumes':
        mode.flowing = true;
        break;
      case 'tail-ends':
        note('flow-stop', t, y);
        endReason = 'flow-stopped';
        break;
      case 'sputter':
        note('sputter', t, y);
        endReason = 'sputter';
        break;
      case 'valve-opens':
        note('valve-opens', t, y);
        endReason = 'valve-opens';
        break;
    }
    // Two events in one bracket (the heat taken off at the sputter, say): the run restarts
    // after the first where the other's value is already zero or past it, and a restart
    // never fires at its own start (the integrator's rule), so an end already reached is
    // taken here.
    if (endReason === null) {
      algebraic(c, y, alg);
      if (alg.liquidVolume <= c.geometry.volumeAtTubeEndM3) {
        note('sputter', t, y);
        endReason = 'sputter';
      } else if (alg.pressurePa - setup.room.ambientPa >= setup.pot.valveOpeningGaugePa) {
        note('valve-opens', t, y);
        endReason = 'valve-opens';
      }
    }
  }
  record(y);
  if (collectSeries && (series.length === 0 || series[series.length - 1]!.tS < t)) pushSeries(t, y);

  algebraic(c, y, alg);
  const at = (kind: BrewEventKind): number | null =>
    events.find((e) => e.kind === kind)?.tS ?? null;
  const cupKg = Math.max(0, y[MD]! - c.firstCoffeeKg);
  const heldUpKg = Math.min(y[MD]!, c.firstCoffeeKg);

  return {
    events,
    flowStartS: at('flow-start'),
    firstCoffeeS: at('first-coffee'),
    firstCoffeeK,
    heatOffS: at('heat-off'),
    sputterS: at('sputter'),
    endS: t,
    endReason,
    // The integrator's weights are not all positive: the cup can read −1e-11 m³ before it fills.
    yieldM3: Math.max(0, y[VCUP]!),
    leftInBaseM3: alg.liquidVolume,
    retainedM3: heldUpKg / alg.waterDensity,
    doseKg: c.doseKg,
    extraction: summariseExtraction(cupCurve, setup.bed.targetBandK),
    flash: spoutFlash(cupCurve, setup.room.ambientPa),
    cupCurve,
    peakGaugePa,
    valveOpens: endReason === 'valve-opens',
    series,
    balance: {
      initialWaterKg: y0[ML]!,
      finalBaseLiquidKg: y[ML]!,
      finalVapourKg: alg.vapourKg,
      initialVapourKg,
      heldUpKg,
      cupKg,
      heatInJ: y[EIN]!,
      heatLostJ: y[ELOSS]!,
      storedEnergyChangeJ: storedEnergy(c, y, alg) - initialEnthalpy,
      enthalpyOutJ: y[HOUT]!,
    },
    stats: { steps, rhsEvaluations: evaluations },
  };
}

type InternalEvent =
  | 'reaches-grounds'
  | 'bed-wet'
  | 'first-coffee'
  | 'heat-off'
  | 'flow-stops'
  | 'flow-resumes'
  | 'tail-ends'
  | 'sputter'
  | 'valve-opens';

function prepare(setup: BrewSetup): Constants {
  const { pot, bed, room } = setup;
  const geometry = potGeometry(pot);
  const check = (ok: boolean, field: string, problem: BrewSetupCode): void => {
    if (!ok) throw new BrewSetupError(field, problem);
  };
  const boilingNow = saturationPressurePa(Math.min(setup.startK, 647)) >= room.ambientPa;
  check(!boilingNow, 'startK', 'boils-before-sealing');
  check(setup.startK >= 274.15, 'startK', 'freezes');
  check(setup.fillVolumeM3 > geometry.volumeAtTubeEndM3, 'fillVolumeM3', 'below-funnel-tube');
  check(setup.fillVolumeM3 < 0.98 * pot.sealedVolumeM3, 'fillVolumeM3', 'no-air-space');
  check(setup.heatInputW >= 0, 'heatInputW', 'negative-heat');
  check(bed.permeabilityM2 > 0, 'permeabilityM2', 'non-positive-permeability');
  const tightening = bed.tightening ?? null;
  check(
    tightening === null || (tightening.finalShare > 0 && tightening.overM3 > 0),
    'tightening',
    'bad-tightening',
  );

  const startDensity = region1(setup.startK, room.ambientPa).densityKgM3;
  const airVolume = pot.sealedVolumeM3 - setup.fillVolumeM3;
  const airMoles =
    ((room.ambientPa - saturationPressurePa(setup.startK)) * airVolume) /
    (MOLAR_GAS_CONSTANT * setup.startK);
  const doseKg = geometry.basketVolumeM3 * bed.bulkDensityKgM3;
  const retainedKg = bed.retentionKgPerKg * doseKg;
  const initialLevelM = setup.fillVolumeM3 / geometry.baseAreaM2;
  const tubeFullKg = startDensity * geometry.tubeAreaM2 * (geometry.baseHeightM - initialLevelM);
  const bedWetKg = tubeFullKg + retainedKg;
  const firstCoffeeKg = bedWetKg + startDensity * geometry.tubeAreaM2 * geometry.columnLengthM;
  return {
    geometry,
    setup,
    airMoles,
    tubeFullKg,
    bedWetKg,
    firstCoffeeKg,
    retainedKg,
    doseKg,
    initialLevelM,
    tightening,
    startDensity,
  };
}

function newAlgebraic(): Algebraic {
  return {
    waterDensity: 0,
    gasVolume: 0,
    liquidVolume: 0,
    pressurePa: 0,
    saturationPa: 0,
    drivingPa: 0,
    resistance: 0,
    enthalpy: 0,
    vapourKg: 0,
    liquid: newLiquidSample(),
    valid: false,
    key: [NaN, NaN, NaN, NaN],
  };
}

/** Height the liquid front has reached, from the mass displaced so far. */
function frontHeightM(c: Constants, displacedKg: number, density: number): number {
  const g = c.geometry;
  if (displacedKg < c.tubeFullKg) {
    return c.initialLevelM + displacedKg / (density * g.tubeAreaM2);
  }
  if (displacedKg < c.bedWetKg) {
    return g.baseHeightM + (c.setup.pot.basketDepthM * (displacedKg - c.tubeFullKg)) / c.retainedKg;
  }
  if (displacedKg < c.firstCoffeeKg) {
    return g.bedTopM + (displacedKg - c.bedWetKg) / (density * g.tubeAreaM2);
  }
  return Math.max(g.bedTopM, c.setup.pot.spoutHeightM);
}

/** Fills `a` with what the state implies (pressure, driving pressure, resistance, ...). */
function algebraic(c: Constants, y: Float64Array, a: Algebraic): LiquidSample {
  const { setup, geometry } = c;
  const temperature = y[T]!;
  const key = a.key;
  if (
    a.valid &&
    key[0] === temperature &&
    key[1] === y[ML] &&
    key[2] === y[MD] &&
    key[3] === y[TBED]
  ) {
    return a.liquid;
  }
  const pSat = saturationPressurePa(temperature);
  // ρ depends on p only weakly (4.5e-10 /Pa): one estimate of p with a nominal density is
  // enough to pick the liquid state, and keeps the state → properties map a pure function.
  const roughGas = setup.pot.sealedVolumeM3 - y[ML]! / 958;
  const roughP = pSat + (c.airMoles * MOLAR_GAS_CONSTANT * temperature) / roughGas;
  const liquid = liquidAt(temperature, roughP, pSat, a.liquid);
  const rho = liquid.densityKgM3;
  const liquidVolume = y[ML]! / rho;
  const gasVolume = setup.pot.sealedVolumeM3 - liquidVolume;
  const pressure = pSat + (c.airMoles * MOLAR_GAS_CONSTANT * temperature) / gasVolume;
  const level = liquidVolume / geometry.baseAreaM2;
  const head = rho * STANDARD_GRAVITY * (frontHeightM(c, y[MD]!, rho) - level);
  const muTube = liquid.viscosityPaS;
  const muBed = saturatedLiquidViscosityPaS(y[TBED]!);
  const columnFilled = Math.min(
    1,
    Math.max(0, (y[MD]! - c.bedWetKg) / (c.firstCoffeeKg - c.bedWetKg || 1)),
  );
  // The classic bed keeps its permeability; a tightening bed loses a share of it as water
  // passes the wet grounds (bed.ts): V from the bed-wet threshold on.
  const permeability =
    c.tightening === null
      ? setup.bed.permeabilityM2
      : setup.bed.permeabilityM2 *
        tighteningShare(c.tightening, (y[MD]! - c.bedWetKg) / c.startDensity);
  const resistance =
    poiseuilleTubeResistance(muTube, geometry.tubeLengthM, setup.pot.tubeInnerDiameterM) +
    darcyBedResistance(muBed, setup.pot.basketDepthM, permeability, geometry.bedAreaM2) +
    poiseuilleTubeResistance(
      muBed,
      geometry.columnLengthM * columnFilled,
      setup.pot.tubeInnerDiameterM,
    );
  a.waterDensity = rho;
  a.liquidVolume = liquidVolume;
  a.gasVolume = gasVolume;
  a.pressurePa = pressure;
  a.saturationPa = pSat;
  a.drivingPa = pressure - setup.room.ambientPa - head;
  a.resistance = resistance;
  a.enthalpy = liquid.enthalpyJPerKg;
  a.vapourKg =
    (pSat * gasVolume * WATER_MOLAR_MASS_KG_PER_MOL) / (MOLAR_GAS_CONSTANT * temperature);
  a.valid = true;
  key[0] = temperature;
  key[1] = y[ML]!;
  key[2] = y[MD]!;
  key[3] = y[TBED]!;
  return liquid;
}

/**
 * dy/dt. Mass and energy are coupled through the vapour: with m_v = p_sat(T)·V_g·M/(R·T),
 *   ṁ_v = a·Ṫ + b·V̇_g,  a = ∂m_v/∂T|V_g = V_g·M/R·(p_sat′/T − p_sat/T²),  b = ρ_v,
 *   V̇_g = −ṁ_l/ρ − κ·Ṫ,  κ = m_l·α_v/ρ (thermal expansion of the liquid),
 *   ṁ_l = −ρQ − ṁ_v,
 *   C·Ṫ = P − UA·(T − T_amb) − h_fg·ṁ_v,  C = m_l·c_p + m_metal·c_metal + n_air·c_v.
 * With ε = b/ρ these solve to
 *   Ṫ = (P − L − h_fg·ε·ρQ/(1−ε)) / (C + h_fg·(a − bκ)/(1−ε)),
 *   ṁ_v = (ε·ρQ + (a − bκ)·Ṫ)/(1−ε).
 */
function derivatives(
  c: Constants,
  mode: Mode,
  y: Float64Array,
  out: Float64Array,
  a: Algebraic,
): void {
  const { setup } = c;
  const liquid = algebraic(c, y, a);
  const temperature = y[T]!;
  const rho = a.waterDensity;
  const q = mode.flowing ? Math.max(0, a.drivingPa / a.resistance) : 0;
  const pSatSlope = saturationPressureSlopePaPerK(temperature);
  const massPerMoleOverR = WATER_MOLAR_MASS_KG_PER_MOL / MOLAR_GAS_CONSTANT;
  const dVapourDT =
    a.gasVolume *
    massPerMoleOverR *
    (pSatSlope / temperature - a.saturationPa / (temperature * temperature));
  const vapourDensity = (a.saturationPa * massPerMoleOverR) / temperature;
  const kappa = (y[ML]! * liquid.expansivityPerK) / rho;
  const eps = vapourDensity / rho;
  const hfg = tabulatedVaporisationEnthalpyJPerKg(temperature);
  const heatCapacity =
    y[ML]! * liquid.isobaricHeatCapacityJPerKgK +
    setup.pot.baseMassKg * metalSpecificHeatJPerKgK(setup.pot.baseMaterial, temperature) +
    c.airMoles * airIsochoricMolarHeatCapacity(temperature);
  const power = mode.heatOn ? setup.heatInputW : 0;
  const loss = setup.pot.heatLossWPerK * (temperature - setup.room.ambientK);
  const massFlow = rho * q;
  const coupling = dVapourDT - vapourDensity * kappa;
  const dT =
    (power - loss - (hfg * eps * massFlow) / (1 - eps)) /
    (heatCapacity + (hfg * coupling) / (1 - eps));
  const dVapour = (eps * massFlow + coupling * dT) / (1 - eps);

  out[T] = dT;
  out[ML] = -massFlow - dVapour;
  out[MD] = massFlow;
  const displaced = y[MD]!;
  if (displaced > c.tubeFullKg && massFlow > 0) {
    const wettedKg = Math.min(displaced - c.tubeFullKg, c.retainedKg);
    const bedCapacity =
      c.doseKg * GROUND_COFFEE_SPECIFIC_HEAT_J_PER_KG_K +
      wettedKg * liquid.isobaricHeatCapacityJPerKgK;
    out[TBED] =
      (massFlow * liquid.isobaricHeatCapacityJPerKgK * (temperature - y[TBED]!)) / bedCapacity;
  } else {
    out[TBED] = 0;
  }
  out[EIN] = power;
  out[ELOSS] = loss;
  out[HOUT] = massFlow * a.enthalpy;
  out[VCUP] = displaced >= c.firstCoffeeKg ? q : 0;
}

/**
 * Energy stored in the base relative to 0 K-ish references (only differences are used):
 * liquid and vapour enthalpy (IF97 h of the liquid, plus h_fg for the vapour), the metal
 * and the air (trapezoid in T for their slowly varying heat capacities).
 */
function storedEnergy(c: Constants, y: Float64Array, a: Algebraic): number {
  const { setup } = c;
  const temperature = y[T]!;
  const t0 = setup.startK;
  const metal =
    (setup.pot.baseMassKg *
      (metalSpecificHeatJPerKgK(setup.pot.baseMaterial, temperature) +
        metalSpecificHeatJPerKgK(setup.pot.baseMaterial, t0)) *
      (temperature - t0)) /
    2;
  const air =
    (c.airMoles *
      (airIsochoricMolarHeatCapacity(temperature) + airIsochoricMolarHeatCapacity(t0)) *
      (temperature - t0)) /
    2;
  const vapour = a.vapourKg * (a.enthalpy + vaporisationEnthalpyJPerKg(temperature));
  return y[ML]! * a.enthalpy + vapour + metal + air;
}

function activeEvents(c: Constants, mode: Mode, y: Float64Array, a: Algebraic): EventFunction[] {
  const { setup, geometry } = c;
  const list: EventFunction[] = [];
  const displaced = y[MD]!;
  const threshold = (id: InternalEvent, kg: number): void => {
    if (displaced < kg) list.push({ id, direction: 1, value: (_t, s) => s[MD]! - kg });
  };
  threshold('reaches-grounds', c.tubeFullKg);
  threshold('bed-wet', c.bedWetKg);
  threshold('first-coffee', c.firstCoffeeKg);
  if (mode.heatOn && setup.heatOffAtS !== undefined) {
    const off = setup.heatOffAtS;
    list.push({ id: 'heat-off', direction: 1, value: (t) => t - off });
  }
  const driving = (s: Float64Array): number => {
    algebraic(c, s, a);
    return a.drivingPa;
  };
  if (mode.flowing) {
    list.push({ id: 'flow-stops', direction: -1, value: (_t, s) => driving(s) });
    if (!mode.heatOn) {
      list.push({
        id: 'tail-ends',
        direction: -1,
        value: (_t, s) => driving(s) / a.resistance - TAIL_END_FLOW_M3_PER_S,
      });
    }
  } else {
    list.push({ id: 'flow-resumes', direction: 1, value: (_t, s) => driving(s) });
  }
  list.push({
    id: 'sputter',
    direction: -1,
    value: (_t, s) => {
      algebraic(c, s, a);
      return a.liquidVolume - geometry.volumeAtTubeEndM3;
    },
  });
  list.push({
    id: 'valve-opens',
    direction: 1,
    value: (_t, s) => {
      algebraic(c, s, a);
      return a.pressurePa - setup.room.ambientPa - setup.pot.valveOpeningGaugePa;
    },
  });
  return list;
}

/**
 * Coffee leaves the spout at the room's pressure, so at most at the local boiling point
 * (IF97 Region 4): any excess flashes to steam there. The share flashed of each piece of
 * the cup is c_p·(T − T_boil)/h_fg (an energy balance on the piece, IF97 Region 1 and
 * the saturation enthalpy of vaporisation). T is the water's temperature as it reached the
 * grounds, an upper bound of the coffee's as it leaves them (the grounds cool it), so the
 * count is an upper bound too. Counted, not taken out of the cup (well under 2 % at the
 * half-valve pressure limit).
 */
export function spoutFlash(
  cupCurve: readonly { readonly cupM3: number; readonly extractionK: number }[],
  ambientPa: number,
): { readonly boilingK: number; readonly flashedKg: number; readonly aboveBoilingM3: number } {
  const boilingK = saturationTemperatureK(ambientPa);
  const hfg = vaporisationEnthalpyJPerKg(boilingK);
  let flashedKg = 0;
  let aboveBoilingM3 = 0;
  for (let i = 1; i < cupCurve.length; i++) {
    const a = cupCurve[i - 1]!,
      b = cupCurve[i]!;
    const k = (a.extractionK + b.extractionK) / 2;
    if (k <= boilingK) continue;
    const dv = b.cupM3 - a.cupM3;
    const liquid = region1(k, ambientPa + saturationPressurePa(k));
    flashedKg +=
      (dv * liquid.densityKgM3 * liquid.isobaricHeatCapacityJPerKgK * (k - boilingK)) / hfg;
    aboveBoilingM3 += dv;
  }
  return { boilingK, flashedKg, aboveBoilingM3 };
}
