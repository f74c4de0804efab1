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
import type { BedModel, BrewResult } from '../brew/types.ts';
import { ASSUMED_FINAL_SHARE_SIGMA_LN } from '../brew/bed.ts';
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
  BindingCause,
  CardPlan,
  InputSpread,
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
const REFINE_COUNT = 6;
/** The coarse pass takes every 4th start (20 K apart, with the presets between); see planCard. */
const DEFAULT_SEARCH: PlanSearch = { coarseStride: 4 };
/** Below this share in band the card warns that the cup will miss the band. */
const LOW_SHARE = 0.1;
/** Below this share in band the card names what binds (bindingCauseOf). */
export const BINDING_SHARE = 0.3;
/** A recipe's cup is at least this share of the cold start's (heat on to the sputter). */
export const MIN_CUP_OF_COLD = 0.75;
/** Share of the cup a delivery one window-opening's length outside the window costs (our choice). */
export const WINDOW_PENALTY = 0.2;
/** Share of the cup a cup that falls one floor's worth short costs (our choice). */
export const CUP_PENALTY = 1;
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
  /** The share less the delivery-window penalty: what the search maximises. */
  readonly value: number;
  /** The cup is at least MIN_CUP_OF_COLD of the cold start's. */
  readonly fullCup: boolean;
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
      request.fillM3 === undefined || request.fillM3 <= fillFor(pot, startK, room.ambientPa),
  );
  if (starts.length === 0) {
    const limit = maxSafeFill(pot.model, room.ambientK, room.ambientPa);
    return refuse(planNotices.fillAboveValve(request.fillM3!, limit.maxFillM3, VALVE_MARGIN_M));
  }
  const presets = new Set(request.kettlePresetsK ?? []);
  const spread = inputSpread(coffee, stove);

  let simulations = 0;
  const setupOf = (
    startK: number,
    levelIndex: number,
    { offS, series = false, scale = NOMINAL, search = false }: RunChoice = {},
  ) => {
    const fill = request.fillM3 ?? fillFor(pot, startK, room.ambientPa);
    const bed = scaledBed(coffee, scale);
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
  const window = deliveryWindowS(coffee, pot);
  /** The cold start's heat-on cup per level (the 75 % rule's reference), m³. */
  const coldCup = new Map<number, number>();
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
    if (startK === room.ambientK) coldCup.set(levelIndex, heatOn.yieldM3);
    if (heatOn.firstCoffeeS === null) return 'on';
    candidates.push({ startK, levelIndex, run: heatOnRun });
    return 'on';
  };
  // Coarse to fine: every level of every coarseStride-th start first. More heat only
  // pushes harder, so along each start's levels (gentlest first) the search stops at the
  // first level over the pressure limit (a safety limit; the delivery window is only a
  // preference, scored below). Then, at half the stride each time, the starts beside the
  // best candidates, at their level.
  const coarse = coarseStarts(starts, presets, search.coarseStride);
  for (const startK of coarse) {
    for (let levelIndex = 0; levelIndex < stove.levels.length; levelIndex++) {
      if (scan(startK, levelIndex) === 'stop') break;
    }
  }
  const heatOnValue = (c: Candidate) => heatOnScore(c, window);
  const tried = new Set(candidates.map((c) => `${c.startK}/${c.levelIndex}`));
  for (let stride = search.coarseStride / 2; stride >= 1; stride /= 2) {
    const leaders = [...candidates].sort((a, b) => heatOnValue(b) - heatOnValue(a));
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
      return refuse(
        planNotices.pressureNearValve(lowestPeak, pot.model.valveOpeningGaugePa, coffee.grind),
      );
    }
    return refuse(planNotices.noDelivery());
  }

  const cupFloor = (levelIndex: number) => MIN_CUP_OF_COLD * (coldCup.get(levelIndex) ?? 0);
  /** Off-heat search of one candidate: first coffee to the sputter's lead (an early off stays a lever). */
  const refine = (c: Candidate): Scored | null => {
    const first = c.run.result.firstCoffeeS!;
    const latest = Math.max(first, (c.run.result.sputterS ?? c.run.result.endS) - SPUTTER_LEAD_S);
    const best = bestOffHeat(first, latest, window, cupFloor(c.levelIndex), (offS) => {
      simulations++;
      return c.run.heatOffAt(offS);
    });
    if (best.share < 0 || best.result.peakGaugePa > limitPa || !best.result.extraction) return null;
    return { startK: c.startK, levelIndex: c.levelIndex, ...best };
  };
  const refined: Scored[] = [];
  const byHeatOnScore = [...candidates].sort((a, b) => heatOnValue(b) - heatOnValue(a));
  const refineSet = new Set(byHeatOnScore.slice(0, REFINE_COUNT));
  // The cold starts are always refined: a card is never worse than doing nothing.
  for (const c of candidates) if (c.startK === room.ambientK) refineSet.add(c);
  for (const candidate of refineSet) {
    const scored = refine(candidate);
    if (scored) refined.push(scored);
  }
  // Never worse than doing nothing: at each level, a choice below the cold start's share
  // (its own cold start refined by the same rules) is dropped.
  const coldAt = (levelIndex: number) =>
    refined.find((r) => r.startK === room.ambientK && r.levelIndex === levelIndex);
  const atLeastCold = refined.filter((r) => r.share >= (coldAt(r.levelIndex)?.share ?? -Infinity));
  if (atLeastCold.length === 0) {
    return refuse(planNotices.noPlanFits(window[0], window[1], tooFast(candidates, window[0])));
  }

  // The highest-pressure corner (tightest bed, most heat) must also keep the limit.
  const highCorner = cornersOf(spread)[1]!;
  /** The best choice the high corner's pressure turned down (a binding cause). */
  let cornerRejected: { share: number; highPa: number } | null = null;
  const printable = firstPrintable(
    atLeastCold,
    (a, b) => better(a, b, presets),
    (choice, offS) => {
      const brew = run(choice.startK, choice.levelIndex, { offS });
      if (brew.peakGaugePa > limitPa) return brew;
      const high = run(choice.startK, choice.levelIndex, { offS, scale: highCorner, search: true });
      if (high.peakGaugePa <= limitPa) return brew;
      const share = brew.extraction?.inBandShare ?? 0;
      if (!cornerRejected || share > cornerRejected.share)
        cornerRejected = { share, highPa: high.peakGaugePa };
      return { ...brew, peakGaugePa: high.peakGaugePa };
    },
    limitPa,
  );
  if (printable === null) {
    return refuse(planNotices.noPlanFits(window[0], window[1], tooFast(candidates, window[0])));
  }
  let { chosen, brew } = printable;
  // The cold start at the chosen level, taken off the heat by the same rules: what doing
  // nothing gives. The printed run is checked against it too (its off-heat time may have
  // moved); when it falls below, the cold start itself is the recipe.
  const coldChoice = coldAt(chosen.levelIndex);
  let coldBrew = coldChoice
    ? run(room.ambientK, chosen.levelIndex, { offS: coldChoice.offS })
    : run(room.ambientK, chosen.levelIndex);
  const shareOf = (r: BrewResult) => r.extraction?.inBandShare ?? 0;
  if (coldChoice && chosen.startK !== room.ambientK && shareOf(brew) < shareOf(coldBrew)) {
    if (
      coldBrew.endReason !== 'sputter' &&
      coldBrew.peakGaugePa <= limitPa &&
      coldBrew.extraction &&
      run(room.ambientK, chosen.levelIndex, {
        offS: coldChoice.offS,
        scale: highCorner,
        search: true,
      }).peakGaugePa <= limitPa
    ) {
      chosen = coldChoice;
      brew = coldBrew;
    }
  }
  const offCupM3 = brew.events.find((e) => e.kind === 'heat-off')?.cupM3 ?? brew.yieldM3;
  // The corners spread the timings and the peak into ranges: search accuracy is plenty.
  // Each is one heat-on run, whose cup curve dates the off-heat time; its peak is the one
  // the card's rule gives (off the heat at the off-heat time, or at the sputter if that
  // comes first), the rule the high corner's check above used, so the printed range never
  // passes the limit that check keeps.
  const corners = cornersOf(spread).map((scale) => {
    simulations += 2;
    const heatOn = simulateHeatOn(
      setupOf(chosen.startK, chosen.levelIndex, { series: true, scale, search: true }),
    );
    return { ...heatOn.result, peakGaugePa: heatOn.heatOffAt(chosen.offS).peakGaugePa };
  });
  const firstTimes = [
    brew.firstCoffeeS!,
    ...corners.map((r) => r.firstCoffeeS ?? brew.firstCoffeeS!),
  ];
  const offTimes = [chosen.offS, ...corners.map((r) => timeAtCup(r, offCupM3) ?? chosen.offS)];
  const fill = request.fillM3 ?? fillFor(pot, chosen.startK, room.ambientPa);
  const heights = fillHeights(pot.model, fill);
  const extraction = brew.extraction!;
  const deliveryS = brew.endS - brew.firstCoffeeS!;
  const bindingCause =
    extraction.inBandShare < BINDING_SHARE
      ? bindingCauseOf(
          {
            share: extraction.inBandShare,
            extraction,
            deliveryS,
            window,
            cups: pot.cups,
            bandK: coffee.bed.targetBandK,
          },
          // A what-if: the best share over the coarse starts with the inputs scaled.
          (scale) => {
            let bestShare = 0;
            for (const startK of coarse) {
              let heatOnRun: HeatOnBrew;
              try {
                simulations++;
                heatOnRun = simulateHeatOn(
                  setupOf(startK, chosen.levelIndex, { scale, search: true }),
                );
              } catch (error) {
                if (error instanceof BrewSetupError) continue;
                throw error;
              }
              const r = heatOnRun.result;
              if (r.firstCoffeeS === null || r.peakGaugePa > limitPa) continue;
              const latest = Math.max(r.firstCoffeeS, (r.sputterS ?? r.endS) - SPUTTER_LEAD_S);
              const best = bestOffHeat(r.firstCoffeeS, latest, window, 0, (offS) => {
                simulations++;
                return heatOnRun.heatOffAt(offS);
              });
              if (best.result.peakGaugePa <= limitPa) bestShare = Math.max(bestShare, best.share);
            }
            return bestShare;
          },
          stove.levels[0]!.heatToPotW,
          stove.levels[chosen.levelIndex]!.heatToPotW,
          coffee.bed.permeabilityM2,
          cornerRejected === null
            ? null
            : { ...(cornerRejected as { share: number; highPa: number }), limitPa },
        )
      : null;
  const plan: AcceptedPlan = {
    ...context,
    warnings: [
      ...modelRangeWarnings(request, chosen.levelIndex),
      ...(extraction.inBandShare < LOW_SHARE && bindingCause === null
        ? [planNotices.coolCup(extraction.inBandShare)]
        : []),
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
    deliveryS,
    deliveryWindowS: window,
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
    peakGaugePa: brew.peakGaugePa,
    peakGaugeRangePa: {
      lowPa: Math.min(brew.peakGaugePa, ...corners.map((r) => r.peakGaugePa)),
      highPa: Math.max(brew.peakGaugePa, ...corners.map((r) => r.peakGaugePa)),
    },
    spread,
    bindingCause,
    brew: withoutSeries(brew),
    coldBrew: withoutSeries(coldBrew),
    simulations,
  };
  return plan;
}

/**
 * The fill a card prints: the largest safe fill at this start, rounded down to a whole
 * millilitre (what a jug is read to), so the printed number is the planned one and
 * `simulate` accepts it.
 */
export function fillFor(pot: PotEntry, startK: number, ambientPa: number): number {
  const max = maxSafeFill(pot.model, startK, ambientPa).maxFillM3;
  return Math.floor(max * 1e6 + 1e-9) / 1e6;
}

/**
 * How uncertain the two inputs that move the timings most are: measured ones (the σ of
 * the note `fit --write` left beside the value, content/provenance.ts) or assumed ones (heat from a default efficiency ±30 %, a
 * grind-derived permeability ×/÷ 2: our choices, from the spread of stove efficiencies
 * and of grinds within one class).
 */
export function inputSpread(coffee: CoffeeEntry, stove: StoveEntry): InputSpread {
  const sigma = (v: number | undefined) =>
    v !== undefined && Number.isFinite(v) && v > 0 ? v : undefined;
  const kSigma = sigma(coffee.permeabilityProvenance?.sigmaRel);
  const anyFitted = stove.levels.some((l) => l.fitted);
  // The widest σ of the levels fitted (one stove's levels share a log, usually one fit).
  const levelSigmas = stove.levels.flatMap((l) => (l.provenance ? [l.provenance.sigmaRel] : []));
  const heatSigma = sigma(levelSigmas.length > 0 ? Math.max(...levelSigmas) : undefined);
  const permeabilityMeasured = !coffee.permeabilityAssumed;
  const heatMeasured = anyFitted || !stove.efficiencyAssumed;
  return {
    permeabilityFactor: permeabilityMeasured
      ? 1 + Math.min(1, 2 * (kSigma ?? MEASURED_PERMEABILITY_REL))
      : ASSUMED_PERMEABILITY_FACTOR,
    heatShare: heatMeasured
      ? Math.min(0.5, 2 * (heatSigma ?? MEASURED_HEAT_REL))
      : ASSUMED_HEAT_SHARE,
    permeabilityMeasured,
    heatMeasured,
    ...(coffee.bed.tightening ? { finalShare: finalShareSpread(coffee) } : {}),
  };
}

/**
 * A bed that tightens: its final share's corners, f·e^(∓2σ) in ln f (the fit's own scale),
 * within the schema's 0.1–1; σ measured (the note `fit --write` left beside final_share)
 * or assumed (ASSUMED_FINAL_SHARE_SIGMA_LN, the fit's prior too). A measured share with a
 * σ below the assumed one narrows the corners, and so the card's ranges.
 */
export function finalShareSpread(coffee: CoffeeEntry): InputSpread['finalShare'] {
  const tightening = coffee.bed.tightening;
  if (!tightening) return undefined;
  const measuredSigma = coffee.tighteningProvenance?.sigmaRel;
  const measured =
    measuredSigma !== undefined && Number.isFinite(measuredSigma) && measuredSigma > 0;
  const sigmaLn = measured ? measuredSigma : ASSUMED_FINAL_SHARE_SIGMA_LN;
  const f = tightening.finalShare;
  return {
    low: Math.max(FINAL_SHARE_MIN, f * Math.exp(-2 * sigmaLn)),
    high: Math.min(1, f * Math.exp(2 * sigmaLn)),
    sigmaLn,
    measured,
  };
}

/** The schema's lowest final share (coffee.schema.json bed.tightening.final_share). */
const FINAL_SHARE_MIN = 0.1;

/** The coffee's bed with a corner's permeability scale and (tightening on) final share. */
function scaledBed(coffee: CoffeeEntry, scale: Scale): BedModel {
  const { tightening } = coffee.bed;
  return {
    ...coffee.bed,
    permeabilityM2: coffee.bed.permeabilityM2 * scale.permeability,
    ...(tightening && scale.finalShare !== undefined
      ? { tightening: { ...tightening, finalShare: scale.finalShare } }
      : {}),
  };
}

/** Assumed inputs: permeability ×/÷ 2, heat ±30 %. Measured without a σ: 15 % and 5 % (one σ). */
const ASSUMED_PERMEABILITY_FACTOR = 2;
const ASSUMED_HEAT_SHARE = 0.3;
const MEASURED_PERMEABILITY_REL = 0.15;
const MEASURED_HEAT_REL = 0.05;

/**
 * The four corners, the tight ones first: [1] is the highest-pressure corner (tightest
 * bed, most heat). A tightening bed's lower final share goes with the tighter bed (both
 * slow the flow and raise the pressure), its higher with the more open one.
 */
export function cornersOf(spread: InputSpread): Scale[] {
  const k = spread.permeabilityFactor,
    h = spread.heatShare;
  const tight = spread.finalShare ? { finalShare: spread.finalShare.low } : {};
  const open = spread.finalShare ? { finalShare: spread.finalShare.high } : {};
  return [
    { permeability: 1 / k, heat: 1 - h, ...tight },
    { permeability: 1 / k, heat: 1 + h, ...tight },
    { permeability: k, heat: 1 - h, ...open },
    { permeability: k, heat: 1 + h, ...open },
  ];
}

/**
 * Why a cup misses the band (share below BINDING_SHARE), from what-ifs of the chosen
 * recipe: a hotter-than-band cup is a bed too tight; otherwise, half the gentlest heat
 * and half the permeability are tried, and the change that helps most names the cause;
 * when neither helps and the delivery is shorter than the window, the pot is too small
 * for it. SI facts; words/plan.ts says it.
 */
function bindingCauseOf(
  at: {
    share: number;
    extraction: { p10K: number; p90K: number; meanK: number };
    deliveryS: number;
    window: readonly [number, number];
    cups: number;
    bandK: readonly [number, number];
  },
  whatIf: (scale: { permeability: number; heat: number }) => number,
  gentlestW: number,
  chosenW: number,
  permeabilityM2: number,
  cornerRejected: { share: number; highPa: number; limitPa: number } | null,
): BindingCause {
  const base = {
    share: at.share,
    meanK: at.extraction.meanK,
    bandLowK: at.bandK[0],
    bandHighK: at.bandK[1],
    deliveryS: at.deliveryS,
    windowLowS: at.window[0],
    windowHighS: at.window[1],
  };
  if (cornerRejected && cornerRejected.share >= at.share + CAUSE_GAIN) {
    return {
      code: 'pressure-margin-binds',
      facts: {
        ...base,
        shareIfAllowed: cornerRejected.share,
        highCornerGaugePa: cornerRejected.highPa,
        limitGaugePa: cornerRejected.limitPa,
      },
    };
  }
  if (at.extraction.meanK > at.bandK[1]) {
    return { code: 'bed-too-tight', facts: { ...base, permeabilityM2 } };
  }
  const gentler = whatIf({ permeability: 1, heat: (0.5 * gentlestW) / chosenW });
  const finer = whatIf({ permeability: 0.5, heat: 1 });
  const gain = Math.max(gentler, finer) - at.share;
  if (gain >= CAUSE_GAIN && gentler >= finer) {
    return {
      code: 'gentlest-heat-too-strong',
      facts: { ...base, gentlestW, shareAtHalfHeat: gentler },
    };
  }
  if (gain >= CAUSE_GAIN) {
    return {
      code: 'bed-too-open',
      facts: { ...base, permeabilityM2, shareAtHalfPermeability: finer },
    };
  }
  if (at.deliveryS < at.window[0]) {
    return { code: 'pot-too-small-for-window', facts: { ...base, cups: at.cups } };
  }
  return { code: 'band-out-of-reach', facts: base };
}

/** A what-if that gains this much share names the cause. */
const CAUSE_GAIN = 0.1;

/** Scales of the coffee's permeability and the level's heat, and a tightening bed's final share (a corner). */
export interface Scale {
  readonly permeability: number;
  readonly heat: number;
  /** The final share itself (not a scale); absent: the coffee's own. */
  readonly finalShare?: number;
}

interface RunChoice {
  readonly offS?: number;
  readonly series?: boolean;
  /** The corner to run at (the sensitivity corners); absent: nominal. */
  readonly scale?: Scale;
  /** A search run: integrated at SEARCH_RTOL. */
  readonly search?: boolean;
}

const NOMINAL: Scale = { permeability: 1, heat: 1 };
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

function heatOnScore(c: Candidate, window: readonly [number, number]): number {
  const r = c.run.result;
  const share = r.extraction?.inBandShare ?? 0;
  return share - windowPenalty((r.sputterS ?? r.endS) - r.firstCoffeeS!, window);
}

/**
 * The delivery-window preference: no penalty inside the window, and WINDOW_PENALTY of
 * share per window-opening's length outside it (growing with the distance, never a
 * refusal). Delivery is first coffee → last drop, the tail included.
 */
export function windowPenalty(deliveryS: number, [lowS, highS]: readonly [number, number]): number {
  const distance = Math.max(0, lowS - deliveryS, deliveryS - highS);
  return (WINDOW_PENALTY * distance) / Math.max(lowS, 1);
}

/**
 * The cup preference: no penalty at or above the floor (MIN_CUP_OF_COLD of the cold
 * start's cup), and CUP_PENALTY of share per floor's worth of cup missing below it.
 */
export function cupPenalty(cupM3: number, floorM3: number): number {
  return floorM3 > 0 ? (CUP_PENALTY * Math.max(0, floorM3 - cupM3)) / floorM3 : 0;
}

/**
 * Golden-section search of the off-heat time for the best value (share in band less the
 * window penalty; unimodal in practice). A cup under the floor loses to one above it;
 * values within SHARE_RESOLUTION count as equal and the larger cup wins, so a card never
 * cuts the brew short for no gain.
 */
function bestOffHeat(
  earliest: number,
  latest: number,
  window: readonly [number, number],
  cupFloorM3: number,
  simulate: (offS: number) => BrewResult,
): { offS: number; result: BrewResult; share: number; value: number; fullCup: boolean } {
  // A run that still reaches the sputter after the heat is off scores below any other:
  // the sputter's last, steam-driven drops are what the card tells people to avoid.
  const score = (offS: number) => {
    const result = simulate(offS);
    const sputters = result.endReason === 'sputter';
    const share = sputters ? -1 : (result.extraction?.inBandShare ?? 0);
    const value =
      sputters || result.firstCoffeeS === null
        ? -Infinity
        : share -
          windowPenalty(result.endS - result.firstCoffeeS, window) -
          cupPenalty(result.yieldM3, cupFloorM3);
    return { offS, result, share, value, fullCup: result.yieldM3 >= cupFloorM3 };
  };
  type S = ReturnType<typeof score>;
  const wins = (a: S, b: S): boolean => {
    return Math.abs(a.value - b.value) > SHARE_RESOLUTION
      ? a.value > b.value
      : a.result.yieldM3 > b.result.yieldM3;
  };
  if (latest - earliest < 2) return score(latest);
  const phi = (Math.sqrt(5) - 1) / 2;
  let a = earliest,
    b = latest;
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
  for (const left = [...choices]; left.length > 0;) {
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

/**
 * The planner's preference: the value (share in band less the window and cup penalties);
 * values within TIE_SHARE are a tie,
 * won by the gentler level, a kettle preset, the cooler start.
 */
function better(a: Scored, b: Scored, presets: ReadonlySet<number>): boolean {
  if (Math.abs(a.value - b.value) > TIE_SHARE) return a.value > b.value;
  if (a.levelIndex !== b.levelIndex) return a.levelIndex < b.levelIndex;
  const aPreset = presets.has(a.startK),
    bPreset = presets.has(b.startK);
  if (aPreset !== bPreset) return aPreset;
  if (a.startK !== b.startK) return a.startK < b.startK;
  return a.share > b.share;
}

/** True when, even on the gentlest candidates, the delivery finishes before the window opens. */
function tooFast(candidates: readonly Candidate[], windowLowS: number): boolean {
  return candidates.every(
    (c) =>
      (c.run.result.sputterS ?? Infinity) - c.run.result.firstCoffeeS! <
      windowLowS + SPUTTER_LEAD_S,
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
      const a = s[i - 1]!,
        b = s[i]!;
      return a.tS + ((b.tS - a.tS) * (cupM3 - a.cupM3)) / (b.cupM3 - a.cupM3 || 1);
    }
  }
  return null;
}
