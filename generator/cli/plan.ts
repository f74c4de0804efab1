/** `stovecard plan`: the recipe a card would print for one pot × coffee × stove. */
import { loadCoffeeFile, loadPotFile, loadStoveFile } from '../content/index.ts';
import { planCard } from '../planning/plan.ts';
import { maxSafeFill } from '../planning/fill.ts';
import { DEFAULT_ROOM, roomModel } from '../planning/setup.ts';
import type { CardPlan } from '../planning/types.ts';
import { refusalText } from '../render/plan-text.ts';
import { planJson } from '../render/plan-json.ts';
import { cliWords } from '../words/cli.ts';
import { bindingCauseText } from '../render/plan-text.ts';
import { faultWords } from '../words/build-faults.ts';
import { pressure, pressureRough } from '../render/format.ts';
import { fromCelsius, fromMl, toMl } from '../units.ts';
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

export { planJson };
