/** `stovecard plan`: the recipe a card would print for one pot × coffee × stove. */
import { loadCoffeeFile, loadPotFile, loadStoveFile } from '../content/index.ts';
import { planCard } from '../planning/plan.ts';
import { maxSafeFill } from '../planning/fill.ts';
import { DEFAULT_ROOM, roomModel } from '../planning/setup.ts';
import type { CardPlan } from '../planning/types.ts';
import { refusalText, warningText } from '../render/plan-text.ts';
import { cliWords } from '../words/cli.ts';
import { bindingCauseText } from '../render/plan-text.ts';
import { faultWords } from '../words/build-faults.ts';
import { pressure, pressureRough } from '../render/format.ts';
import { fromCelsius, fromMl, round, toBar, toCelsius, toMl, toMm } from '../units.ts';
import { InputError, UsageError } from './errors.ts';
import { allEntries } from './load-entries.ts';
import { numberOption, parseOptions, requiredString } from './options.ts';

export async function run(argv: string[]): Promise<number> {
  const { values, help } = parseOptions(argv, {
    pot: { type: 'string' },
    coffee: { type: 'string' },
    stove: { type: 'string' },
    'ambient-c': { type: 'string' },
    'altitude-m': { type: 'string' },
    'presets-c': { type: 'string' },
    'fill-ml': { type: 'string' },
    json: { type: 'boolean' },
  });
  if (help) {
    process.stdout.write(cliWords.planHelp);
    return 0;
  }
  const files = {
    pot: requiredString(values, 'pot', cliWords.planHelp),
    coffee: requiredString(values, 'coffee', cliWords.planHelp),
    stove: requiredString(values, 'stove', cliWords.planHelp),
  };
  const ambientC = rangedOption(numberOption(values, 'ambient-c'), '--ambient-c', AMBIENT_C);
  const altitudeM = rangedOption(numberOption(values, 'altitude-m'), '--altitude-m', ALTITUDE_M);
  const presets =
    typeof values['presets-c'] === 'string' ? parsePresets(values['presets-c']) : undefined;
  const fillMl = numberOption(values, 'fill-ml');
  const [pot, coffee, stove] = await allEntries([
    loadPotFile(files.pot),
    loadCoffeeFile(files.coffee),
    loadStoveFile(files.stove),
  ]);
  const room = {
    ambientK: ambientC !== undefined ? fromCelsius(ambientC) : DEFAULT_ROOM.ambientK,
    altitudeM: altitudeM ?? DEFAULT_ROOM.altitudeM,
  };
  const plan = planCard({
    pot,
    coffee,
    stove,
    room,
    ...(presets ? { kettlePresetsK: presets.map(fromCelsius) } : {}),
    ...(fillMl !== undefined ? { fillM3: fromMl(fillMl) } : {}),
  });
  // A --fill-ml above the valve is a wrong flag, as in `simulate`: one line and exit 2.
  if (fillMl !== undefined && plan.refused?.code === 'fill-above-valve') {
    const limit = maxSafeFill(pot.model, room.ambientK, roomModel(room).ambientPa);
    throw new InputError(cliWords.fillAboveValve(fillMl, Math.floor(toMl(limit.maxFillM3))));
  }
  process.stdout.write(
    values.json
      ? JSON.stringify(planJson(plan)) + '\n'
      : planSummary(plan, pot.valveOpeningAssumed),
  );
  return plan.refused ? 3 : 0;
}

/** The ranges site.yaml allows for the room (site.schema.json), the flags' too. */
const AMBIENT_C = { min: 1, max: 45, unit: '°C' } as const;
const ALTITUDE_M = { min: -500, max: 5000, unit: 'm' } as const;

function rangedOption(
  value: number | undefined,
  flag: string,
  range: { readonly min: number; readonly max: number; readonly unit: string },
): number | undefined {
  if (value !== undefined && (value < range.min || value > range.max))
    throw new UsageError(faultWords.flagOutOfRange(flag, value, range.min, range.max, range.unit));
  return value;
}

function parsePresets(raw: string): number[] {
  return raw.split(',').map((part) => {
    const value = Number(part.trim());
    if (part.trim() === '' || !Number.isFinite(value))
      throw new UsageError(cliWords.badNumber('--presets-c', part));
    return value;
  });
}

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

export function planSummary(plan: CardPlan, valveAssumed: boolean): string {
  const j = planJson(plan);
  const cautions = cliWords.planCautions().join('\n') + '\n';
  if (plan.refused) {
    const text = refusalText(plan.refused, 'metric');
    return `REFUSED: ${text.reason}\nFix: ${text.suggestion}\n${cautions}`;
  }
  const p = j as Exclude<ReturnType<typeof planJson>, { refused: object }>;
  if (!('fillMl' in p)) return '';
  return (
    [
      `water     ${p.fillMl} mL (${p.fillHeightMm} mm above the floor, ${p.belowValveMm} mm below the valve) at ${p.startC} °C`,
      `coffee    ${p.doseG} g, level basket, do not tamp`,
      `heat      ${p.level}`,
      `timings   first coffee ${p.firstCoffeeS.low}–${p.firstCoffeeS.high} s, off the heat ${p.offHeatS.low}–${p.offHeatS.high} s`,
      `cup       ${p.yieldMl} mL, mean ${p.extraction.meanC} °C, ${Math.round(p.extraction.inBandShare * 100)} % in band (${
        Number.isFinite(p.coldStart.meanC)
          ? `cold start: ${p.coldStart.meanC} °C, ${Math.round(p.coldStart.inBandShare * 100)} %`
          : faultWords.coldStartNoCoffee
      })`,
      `pressure  peak ${p.peakGaugeBar} bar gauge (${p.peakGaugeRangeBar.low}–${p.peakGaugeRangeBar.high} if the inputs are off)`,
      `valve     ${cliWords.planValve(valveText(plan.valveOpeningGaugePa, valveAssumed), valveAssumed)}`,
      ...(plan.bindingCause ? [`why       ${bindingCauseText(plan, 'metric')}`] : []),
      ...p.warnings.map((w) => `warning   ${w}`),
    ].join('\n') +
    '\n' +
    cautions
  );
}

/** An assumed valve pressure is shown to two significant figures (nobody measured it). */
function valveText(pa: number, assumed: boolean): string {
  return (assumed ? pressureRough(pa, 'metric') : pressure(pa, 'metric')).text;
}
