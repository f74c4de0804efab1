/**
 * The planner: for one pot × coffee × stove in one room, search fill, start temperature,
 * stove level and the moment to take the pot off the heat; each candidate is one brew
 * simulation.
 *
 * Objective: the largest share of the cup extracted inside the coffee's target band, with
 * the delivery phase (first coffee → off the heat) inside the coffee's delivery window
 * (its own, or the default for the pot's size: delivery.ts).
 * Shares within TIE_SHARE of each other are a tie, won by the gentler level and then the
 * cooler start (easier and safer to handle).
 * Hard limits (a refusal, never a recipe): the fill stays below the valve after expansion;
 * the peak gauge pressure stays at or below half the valve's opening pressure; an
 * induction stove needs a magnetic base. A plan whose tail would still reach the sputter
 * after the heat is off is not offered (the sputter's steam-driven last drops are what
 * the trade takes the pot off the heat to avoid: common practice, no source).
 */
import { simulateBrew, simulateHeatOn, type HeatOnBrew } from '../brew/simulate.ts';
import { BrewSetupError } from '../brew/errors.ts';
import type { BrewResult } from '../brew/types.ts';
import type { CoffeeEntry, PotEntry, StoveEntry } from '../content/types.ts';
import { saturationTemperatureK } from '../physics/if97-region4.ts';
import { CELSIUS_OFFSET_K } from '../physics/constants.ts';
import { maxSafeFill, fillHeights, VALVE_MARGIN_M } from './fill.ts';
import { brewSetup, roomModel, type Room } from './setup.ts';
import { modelRangeWarnings } from './model-range.ts';
import { deliveryWindowS } from './delivery.ts';
import { planNotices } from './notices.ts';
import type {
  AcceptedPlan,
  CardPlan,
  PlanContext,
  PlannedBrew,
  Refusal,
  TimeRange,
} from './types.ts';

export const PRESSURE_LIMIT_SHARE_OF_VALVE = 0.5;
export const TIE_SHARE = 0.02;
/** Highest start temperature offered (°C → K), and the gap kept below boiling. */
export const HOTTEST_START_K = 90 + CELSIUS_OFFSET_K;
export const BELOW_BOILING_K = 2;
const START_STEP_K = 5;
/** Off-heat no later than this before the sputter the pot would reach with the heat on, s. */
const SPUTTER_LEAD_S = 5;
/** Candidates refined with an off-heat search, best first by the heat-on score. */
const REFINE_COUNT = 4;
/** The coarse pass takes every 4th start (20 K apart, with the presets between); see planCard. */
const DEFAULT_SEARCH: PlanSearch = { coarseStride: 4 };
/** Below this share in band the card warns that the cup will miss the band. */
const LOW_SHARE = 0.1;
/** Shares of the cup closer than this are equal for the off-heat search. */
const SHARE_RESOLUTION = 0.005;
/** The off-heat time is searched to this, s (a card prints whole seconds in ranges). */
const OFF_HEAT_RESOLUTION_S = 4;
/** Earlier off-heat times tried when the printed run of a choice reaches the sputter. */
const EDGE_RETRIES = 2;
/**
 * Relative tolerance of the search's runs; the chosen plan is simulated again at the
 * model's own 1e-6 (DEFAULT_RTOL), and only those runs are printed.
 */
const SEARCH_RTOL = 1e-5;

export interface PlanRequest {
  readonly pot: PotEntry;
  readonly coffee: CoffeeEntry;
  readonly stove: StoveEntry;
  readonly room: Room;
  /** Kettle presets, K: offered beside 5 K steps, and preferred on ties. */
  readonly kettlePresetsK?: readonly number[];
  /** A smaller cup than the pot's safe maximum, m³ (refused when above the safe fill). */
  readonly fillM3?: number;
}

interface Candidate {
  readonly startK: number;
  readonly levelIndex: number;
  /** The heat-on run, kept so the off-heat search branches off it. */
  readonly run: HeatOnBrew;
}

interface Scored {
  readonly startK: number;
  readonly levelIndex: number;
  readonly offS: number;
  readonly result: BrewResult;
  readonly share: number;
}

/** How the planner searches the start temperatures (tests compare strides). */
export interface PlanSearch {
  /** The coarse pass takes every coarseStride-th start (a power of two; 1: every start). */
  readonly coarseStride: number;
}

export function planCard(request: PlanRequest, search: PlanSearch = DEFAULT_SEARCH): CardPlan {
  const { pot, coffee, stove } = request;
  const room = roomModel(request.room);
  const context: PlanContext = {
    potId: pot.id,
    coffeeId: coffee.id,
    stoveId: stove.id,
    ambientK: room.ambientK,
    ambientPa: room.ambientPa,
    altitudeM: request.room.altitudeM,
    boilingK: saturationTemperatureK(room.ambientPa),
    valveOpeningGaugePa: pot.model.valveOpeningGaugePa,
    warnings: modelRangeWarnings(request, null),
  };
  const refuse = (refusal: Refusal): CardPlan => ({ ...context, refused: refusal });

  if (stove.stoveKind === 'induction' && !pot.inductionReady) {
    return refuse(planNotices.inductionNeedsMagneticBase(pot.name));
  }
  // A requested fill must stay below the valve from whatever start it is poured at.
  const starts = startCandidates(request, context.boilingK).filter(
    (startK) =>
      request.fillM3 === undefined ||
      request.fillM3 <= maxSafeFill(pot.model, startK, room.ambientPa).maxFillM3,
  );
  if (starts.length === 0) {
    const limit = maxSafeFill(pot.model, room.ambientK, room.ambientPa);
    return refuse(planNotices.fillAboveValve(request.fillM3!, limit.maxFillM3, VALVE_MARGIN_M));
  }
  const presets = new Set(request.kettlePresetsK ?? []);

  let simulations = 0;
  const setupOf = (
    startK: number,
    levelIndex: number,
    { offS, series = false, scale = NOMINAL, search = false }: RunChoice = {},
  ) => {
    const fill = request.fillM3 ?? maxSafeFill(pot.model, startK, room.ambientPa).maxFillM3;
    const bed = { ...coffee.bed, permeabilityM2: coffee.bed.permeabilityM2 * scale.permeability };
    return brewSetup(pot.model, bed, room, {
      fillVolumeM3: fill,
      startK,
      heatInputW: stove.levels[levelIndex]!.heatToPotW * scale.heat,
      ...(offS !== undefined ? { heatOffAtS: offS } : {}),
      collectSeries: series,
      ...(search ? { relativeTolerance: SEARCH_RTOL } : {}),
    });
  };
  const run = (startK: number, levelIndex: number, choice: RunChoice = {}) => {
    simulations++;
    return simulateBrew(setupOf(startK, levelIndex, choice));
  };

  const limitPa = PRESSURE_LIMIT_SHARE_OF_VALVE * pot.model.valveOpeningGaugePa;
  const candidates: Candidate[] = [];
  let lowestPeak = Infinity;
  const [windowLow, windowHigh] = deliveryWindowS(coffee, pot);
  /** One heat-on run; 'stop' when this start can take no more heat (or no such brew). */
  const scan = (startK: number, levelIndex: number): 'stop' | 'on' => {
    let heatOnRun: HeatOnBrew;
    try {
      simulations++;
      heatOnRun = simulateHeatOn(setupOf(startK, levelIndex, { search: true }));
    } catch (error) {
      if (error instanceof BrewSetupError) return 'stop';
      throw error;
    }
    const heatOn = heatOnRun.result;
    lowestPeak = Math.min(lowestPeak, heatOn.peakGaugePa);
    if (heatOn.peakGaugePa > limitPa) return 'stop';
    if (heatOn.firstCoffeeS === null) return 'on';
    candidates.push({ startK, levelIndex, run: heatOnRun });
    const delivery = (heatOn.sputterS ?? Infinity) - heatOn.firstCoffeeS;
    return delivery < windowLow + SPUTTER_LEAD_S ? 'stop' : 'on';
  };
  // Coarse to fine: every level of every coarseStride-th start first. More heat only
  // brews faster and pushes harder, so along each start's levels (gentlest first) the
  // search stops at the first level over the pressure limit or too fast for the delivery
  // window. Then, at half the stride each time, the starts beside the best candidates, at
  // their level.
  const coarse = coarseStarts(starts, presets, search.coarseStride);
  for (const startK of coarse) {
    for (let levelIndex = 0; levelIndex < stove.levels.length; levelIndex++) {
      if (scan(startK, levelIndex) === 'stop') break;
    }
  }
  const tried = new Set(candidates.map((c) => `${c.startK}/${c.levelIndex}`));
  for (let stride = search.coarseStride / 2; stride >= 1; stride /= 2) {
    const leaders = [...candidates].sort((a, b) => heatOnScore(b) - heatOnScore(a));
    for (const leader of leaders.slice(0, REFINE_COUNT)) {
      const at = starts.indexOf(leader.startK);
      for (const startK of [starts[at - stride], starts[at + stride]]) {
        const id = `${startK}/${leader.levelIndex}`;
        if (startK === undefined || tried.has(id)) continue;
        tried.add(id);
        scan(startK, leader.levelIndex);
      }
    }
  }
  if (candidates.length === 0) {
    if (lowestPeak > limitPa) {
      return refuse(planNotices.pressureNearValve(lowestPeak, pot.model.valveOpeningGaugePa, coffee.grind));
    }
    return refuse(planNotices.noDelivery());
  }

  const offHeatWindow = (c: Candidate): [number, number] => {
    const first = c.run.result.firstCoffeeS!;
    const latest = Math.min(first + windowHigh, (c.run.result.sputterS ?? Infinity) - SPUTTER_LEAD_S);
    return [first + windowLow, latest];
  };
  const feasible = candidates.filter((c) => {
    const [earliest, latest] = offHeatWindow(c);
    return latest >= earliest;
  });
  if (feasible.length === 0) {
    return refuse(planNotices.noPlanFits(windowLow, windowHigh, tooFast(candidates, windowLow)));
  }
  const refined: Scored[] = [];
  const byHeatOnScore = [...feasible].sort((a, b) => heatOnScore(b) - heatOnScore(a));
  for (const candidate of byHeatOnScore.slice(0, REFINE_COUNT)) {
    const [earliest, latest] = offHeatWindow(candidate);
    const best = bestOffHeat(earliest, latest, (offS) => {
      simulations++;
      return candidate.run.heatOffAt(offS);
    });
    if (best.share >= 0 && best.result.peakGaugePa <= limitPa && best.result.extraction) {
      refined.push({ startK: candidate.startK, levelIndex: candidate.levelIndex, ...best });
    }
  }
  if (refined.length === 0) {
    return refuse(planNotices.noPlanFits(windowLow, windowHigh, tooFast(candidates, windowLow)));
  }

  const printable = firstPrintable(
    refined,
    (a, b) => better(a, b, presets),
    (choice, offS) => run(choice.startK, choice.levelIndex, { offS }),
    limitPa,
  );
  if (printable === null) {
    return refuse(planNotices.noPlanFits(windowLow, windowHigh, tooFast(candidates, windowLow)));
  }
  const { chosen, brew } = printable;
  const coldBrew = run(room.ambientK, chosen.levelIndex);
  const offCupM3 = brew.events.find((e) => e.kind === 'heat-off')?.cupM3 ?? brew.yieldM3;
  // The corners only spread the timings into ranges: search accuracy is plenty.
  const corners = SENSITIVITY.map((scale) =>
    run(chosen.startK, chosen.levelIndex, { series: true, scale, search: true }),
  );
  const firstTimes = [brew.firstCoffeeS!, ...corners.map((r) => r.firstCoffeeS ?? brew.firstCoffeeS!)];
  const offTimes = [chosen.offS, ...corners.map((r) => timeAtCup(r, offCupM3) ?? chosen.offS)];
  const fill = request.fillM3 ?? maxSafeFill(pot.model, chosen.startK, room.ambientPa).maxFillM3;
  const heights = fillHeights(pot.model, fill);
  const extraction = brew.extraction!;
  const plan: AcceptedPlan = {
    ...context,
    warnings: [
      ...modelRangeWarnings(request, chosen.levelIndex),
      ...(extraction.inBandShare < LOW_SHARE ? [planNotices.coolCup(extraction.inBandShare)] : []),
    ],
    refused: null,
    fillM3: fill,
    fillKg: brew.balance.initialWaterKg,
    fillHeightM: heights.heightM,
    belowValveM: heights.belowValveM,
    expansionMarginM: VALVE_MARGIN_M,
    doseKg: brew.doseKg,
    startK: chosen.startK,
    kettlePresetK: presets.has(chosen.startK) ? chosen.startK : null,
    levelIndex: chosen.levelIndex,
    levelLabel: stove.levels[chosen.levelIndex]!.label,
    heatToPotW: stove.levels[chosen.levelIndex]!.heatToPotW,
    firstCoffeeS: range(brew.firstCoffeeS!, firstTimes),
    offHeatS: range(chosen.offS, offTimes),
    yieldM3: brew.yieldM3,
    extraction: {
      meanK: extraction.meanK,
      p10K: extraction.p10K,
      p50K: extraction.p50K,
      p90K: extraction.p90K,
      inBandShare: extraction.inBandShare,
    },
    targetBandK: coffee.bed.targetBandK,
    coldStart: {
      meanK: coldBrew.extraction?.meanK ?? NaN,
      inBandShare: coldBrew.extraction?.inBandShare ?? 0,
      firstCoffeeS: coldBrew.firstCoffeeS,
    },
    peakGaugePa: Math.max(brew.peakGaugePa, ...corners.map((r) => r.peakGaugePa)),
    brew: withoutSeries(brew),
    coldBrew: withoutSeries(coldBrew),
    simulations,
  };
  return plan;
}

interface RunChoice {
  readonly offS?: number;
  readonly series?: boolean;
  /** Scales of the coffee's permeability and the level's heat (the sensitivity corners). */
  readonly scale?: { readonly permeability: number; readonly heat: number };
  /** A search run: integrated at SEARCH_RTOL. */
  readonly search?: boolean;
}

const NOMINAL = { permeability: 1, heat: 1 };
/** The model's sensitivity corners: permeability ±30 %, heat ±10 %. */
const SENSITIVITY = [
  { permeability: 0.7, heat: 0.9 },
  { permeability: 0.7, heat: 1.1 },
  { permeability: 1.3, heat: 0.9 },
  { permeability: 1.3, heat: 1.1 },
];

/**
 * Room temperature, the kettle presets, and 5 K steps (a thermometer), up to 90 °C and
 * 2 K below boiling, ascending.
 */
export function startCandidates(request: PlanRequest, boilingK: number): number[] {
  const ceiling = Math.min(HOTTEST_START_K, boilingK - BELOW_BOILING_K);
  const ambient = request.room.ambientK;
  const steps: number[] = [...(request.kettlePresetsK ?? [])];
  const firstStepC = Math.floor((ambient - CELSIUS_OFFSET_K) / START_STEP_K + 1) * START_STEP_K;
  for (let c = firstStepC; c + CELSIUS_OFFSET_K <= ceiling + 1e-9; c += START_STEP_K) {
    steps.push(c + CELSIUS_OFFSET_K);
  }
  const hotter = steps.filter((k) => k > ambient + 0.5 && k <= ceiling + 1e-9);
  return [ambient, ...new Set(hotter.map((k) => Math.round(k * 1e6) / 1e6))].sort((a, b) => a - b);
}

/**
 * The coarse search's starts: room temperature, the kettle presets, the hottest start and
 * every `stride`-th one between.
 */
export function coarseStarts(
  starts: readonly number[],
  presets: ReadonlySet<number>,
  stride: number,
): number[] {
  return starts.filter(
    (startK, i) => i % stride === 0 || i === starts.length - 1 || presets.has(startK),
  );
}

function heatOnScore(c: Candidate): number {
  return c.run.result.extraction?.inBandShare ?? 0;
}

/**
 * Golden-section search of the off-heat time for the best share in band (unimodal in
 * practice). Shares within SHARE_RESOLUTION count as equal and the larger cup wins, so a
 * card never cuts the brew short for no gain.
 */
function bestOffHeat(
  earliest: number,
  latest: number,
  simulate: (offS: number) => BrewResult,
): { offS: number; result: BrewResult; share: number } {
  // A run that still reaches the sputter after the heat is off scores below any other:
  // the sputter's last, steam-driven drops are what the card tells people to avoid.
  const score = (offS: number) => {
    const result = simulate(offS);
    const share = result.endReason === 'sputter' ? -1 : (result.extraction?.inBandShare ?? 0);
    return { offS, result, share };
  };
  const wins = (a: ReturnType<typeof score>, b: ReturnType<typeof score>): boolean =>
    Math.abs(a.share - b.share) > SHARE_RESOLUTION ? a.share > b.share : a.result.yieldM3 > b.result.yieldM3;
  if (latest - earliest < 2) return score(latest);
  const phi = (Math.sqrt(5) - 1) / 2;
  let a = earliest, b = latest;
  let x1 = score(b - phi * (b - a));
  let x2 = score(a + phi * (b - a));
  let best = wins(x1, x2) ? x1 : x2;
  while (b - a > OFF_HEAT_RESOLUTION_S) {
    if (wins(x1, x2)) {
      b = x2.offS;
      x2 = x1;
      x1 = score(b - phi * (b - a));
      if (wins(x1, best)) best = x1;
    } else {
      a = x1.offS;
      x1 = x2;
      x2 = score(a + phi * (b - a));
      if (wins(x2, best)) best = x2;
    }
  }
  const end = score(latest);
  return wins(end, best) ? end : best;
}

/**
 * The search ran at SEARCH_RTOL: the run to be printed must itself keep the pressure limit
 * and end before the sputter. Takes the choices best first (`better`); one whose printed
 * run fails (an off-heat time on the sputter's edge) is tried with the heat off
 * OFF_HEAT_RESOLUTION_S earlier, EDGE_RETRIES times, before the next choice. Null when
 * none passes.
 */
export function firstPrintable<C extends { readonly offS: number }>(
  choices: readonly C[],
  better: (a: C, b: C) => boolean,
  printedRun: (choice: C, offS: number) => BrewResult,
  limitPa: number,
): { chosen: C; brew: BrewResult } | null {
  for (const left = [...choices]; left.length > 0; ) {
    const next = left.reduce((best, other) => (better(other, best) ? other : best));
    left.splice(left.indexOf(next), 1);
    for (let retry = 0; retry <= EDGE_RETRIES; retry++) {
      const offS = next.offS - retry * OFF_HEAT_RESOLUTION_S;
      const brew = printedRun(next, offS);
      if (brew.peakGaugePa <= limitPa && brew.endReason !== 'sputter' && brew.extraction) {
        return { chosen: { ...next, offS }, brew };
      }
    }
  }
  return null;
}

/** Tie-breaks (shares within TIE_SHARE): gentler level, a kettle preset, cooler start. */
function better(a: Scored, b: Scored, presets: ReadonlySet<number>): boolean {
  if (Math.abs(a.share - b.share) > TIE_SHARE) return a.share > b.share;
  if (a.levelIndex !== b.levelIndex) return a.levelIndex < b.levelIndex;
  const aPreset = presets.has(a.startK), bPreset = presets.has(b.startK);
  if (aPreset !== bPreset) return aPreset;
  if (a.startK !== b.startK) return a.startK < b.startK;
  return a.share > b.share;
}

/** True when, even on the gentlest candidates, the delivery finishes before the window opens. */
function tooFast(candidates: readonly Candidate[], windowLowS: number): boolean {
  return candidates.every(
    (c) => (c.run.result.sputterS ?? Infinity) - c.run.result.firstCoffeeS! < windowLowS + SPUTTER_LEAD_S,
  );
}

function range(mid: number, values: readonly number[]): TimeRange {
  return { lowS: Math.min(...values), midS: mid, highS: Math.max(...values) };
}

function withoutSeries(result: BrewResult): PlannedBrew {
  const { series: _series, ...kept } = result;
  return kept;
}

/** First time the run's cup holds `cupM3`, or null when it never does. */
function timeAtCup(result: BrewResult, cupM3: number): number | null {
  const s = result.series;
  for (let i = 1; i < s.length; i++) {
    if (s[i]!.cupM3 >= cupM3) {
      const a = s[i - 1]!, b = s[i]!;
      return a.tS + ((b.tS - a.tS) * (cupM3 - a.cupM3)) / (b.cupM3 - a.cupM3 || 1);
    }
  }
  return null;
}

