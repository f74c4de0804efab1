/** `stovecard simulate`: one brew, summarised or as JSON. */
import { loadCoffeeFile, loadPotFile, loadStoveFile } from '../content/index.ts';
import { simulateBrew } from '../brew/simulate.ts';
import { brewSetup, DEFAULT_ROOM, roomModel } from '../planning/setup.ts';
import { maxSafeFill } from '../planning/fill.ts';
import { fillFor } from '../planning/plan.ts';
import { cliWords } from '../words/cli.ts';
import { fromCelsius, fromMl, round, toMl } from '../units.ts';
import { InputError, UsageError } from './errors.ts';
import { allEntries } from './load-entries.ts';
import { numberOption, parseOptions, requiredString } from './options.ts';
import { brewJson, brewSummary } from './brew-output.ts';

export async function run(argv: string[]): Promise<number> {
  const { values, help } = parseOptions(argv, {
    pot: { type: 'string' },
    coffee: { type: 'string' },
    stove: { type: 'string' },
    level: { type: 'string' },
    'power-w': { type: 'string' },
    'fill-ml': { type: 'string' },
    'start-c': { type: 'string' },
    'ambient-c': { type: 'string' },
    'altitude-m': { type: 'string' },
    'heat-off-s': { type: 'string' },
    json: { type: 'boolean' },
  });
  if (help) {
    process.stdout.write(cliWords.simulateHelp);
    return 0;
  }
  const potFile = requiredString(values, 'pot', cliWords.simulateHelp);
  const coffeeFile = requiredString(values, 'coffee', cliWords.simulateHelp);
  const stoveFile = typeof values.stove === 'string' ? values.stove : undefined;
  const powerW = numberOption(values, 'power-w');
  // Exactly one of the two ways to say the heat.
  if ((stoveFile === undefined) === (powerW === undefined))
    throw new UsageError(cliWords.levelOrPower);
  const label =
    stoveFile !== undefined ? requiredString(values, 'level', cliWords.simulateHelp) : '';
  const [pot, coffee, stove] = await allEntries([
    loadPotFile(potFile),
    loadCoffeeFile(coffeeFile),
    stoveFile !== undefined ? loadStoveFile(stoveFile) : undefined,
  ]);

  let heatInputW: number;
  if (stove !== undefined) {
    const level = stove.levels.find((l) => l.label === label);
    if (!level)
      throw new UsageError(
        cliWords.levelNotFound(
          label,
          stoveFile!,
          stove.levels.map((l) => l.label),
        ),
      );
    heatInputW = level.heatToPotW;
  } else {
    heatInputW = powerW!;
  }

  const ambientC = numberOption(values, 'ambient-c');
  const room = roomModel({
    ambientK: ambientC !== undefined ? fromCelsius(ambientC) : DEFAULT_ROOM.ambientK,
    altitudeM: numberOption(values, 'altitude-m') ?? DEFAULT_ROOM.altitudeM,
  });
  const startC = numberOption(values, 'start-c');
  const startK = startC !== undefined ? fromCelsius(startC) : room.ambientK;
  const limit = maxSafeFill(pot.model, startK, room.ambientPa);
  const fillMl = numberOption(values, 'fill-ml');
  if (fillMl !== undefined && fromMl(fillMl) > limit.maxFillM3) {
    throw new InputError(cliWords.fillAboveValve(fillMl, Math.floor(toMl(limit.maxFillM3))));
  }
  // The default fill is the planner's: the safe limit rounded down to a whole mL.
  const defaultFill = fillFor(pot, startK, room.ambientPa);
  const heatOffS = numberOption(values, 'heat-off-s');
  const result = simulateBrew({
    ...brewSetup(pot.model, coffee.bed, room, {
      fillVolumeM3: fillMl !== undefined ? fromMl(fillMl) : defaultFill,
      startK,
      heatInputW,
      ...(heatOffS !== undefined ? { heatOffAtS: heatOffS } : {}),
      collectSeries: true,
    }),
  });
  process.stdout.write(
    values.json
      ? JSON.stringify(brewJson(result)) + '\n'
      : brewSummary(result, round(toMl(fillMl !== undefined ? fromMl(fillMl) : defaultFill))),
  );
  return 0;
}
