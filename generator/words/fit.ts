/**
 * User-facing words of calibration (`stovecard fit`): the help, the report, what was
 * written, and the errors. Numbers arrive in trade units, already rounded; this module
 * only lays them out.
 */
import type { SourceRef } from '../content/types.ts';

/** One parameter as the report names it. */
export interface ParameterLabel {
  /** The YAML key it is written to: `permeability_m2`. */
  readonly key: string;
  /** Whose value it is: `house-blend`, `bar-gas medium`. */
  readonly owner: string;
  readonly unit: string;
}

export interface FittedLine extends ParameterLabel {
  readonly value: string;
  readonly sigma: string;
  readonly relativePercent: string;
  readonly prior: string;
}

export type KeptReason =
  | { readonly kind: 'no-information' }
  | {
      readonly kind: 'too-few-observations';
      readonly observations: number;
      readonly parameters: number;
    }
  | {
      readonly kind: 'too-uncertain';
      readonly relativePercent: string | null;
      readonly limitPercent: string;
      /** Held values (ids) whose own doubt makes up most of that σ: not separable from them. */
      readonly notSeparableFrom: readonly string[];
      /** The readings' part of that σ, when the held values' doubt is what passed the limit. */
      readonly readingsPercent: string | null;
    };

export interface KeptLine extends ParameterLabel {
  readonly parameterKind: 'permeability' | 'heat' | 'heat-loss' | 'tightening';
  readonly value: string;
  readonly reason: KeptReason;
}

export interface ResidualLine {
  readonly line: number;
  readonly field: string;
  readonly seen: string;
  readonly model: string;
  readonly difference: string;
  readonly normalised: string;
}

export interface WrittenLine {
  readonly file: string;
  readonly field: string;
  readonly value: string;
  /** The value the file had, as written there; null when the key is new. */
  readonly was: string | null;
}

const table = (rows: readonly (readonly string[])[], indent = '  '): string[] => {
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((row) => row[c]!.length)));
  return rows.map((row) =>
    (
      indent +
      row.map((cell, c) => (c === row.length - 1 ? cell : cell.padEnd(widths[c]! + 2))).join('')
    ).trimEnd(),
  );
};

/** What would inform a parameter the log could not pin down. */
/** Held inputs, in words for the plain summary. */
function plainName(id: string): string {
  return id === 'retention'
    ? "grounds' water retention"
    : id === 'permeability'
      ? 'coffee bed'
      : id === 'tightening'
        ? "bed's tightening"
        : id === 'heat-loss'
          ? "pot's heat loss"
          : `stove's ${id.replace('heat:', '')} setting`;
}

const wouldInform: Record<KeptLine['parameterKind'], string> = {
  permeability:
    'scale readings through the delivery and probe readings of the water in the base inform it',
  heat: 'a first-coffee or sputter time at that level informs it',
  'heat-loss':
    'probe readings of the water through a long, gentle brew, or many brews at different start temperatures, inform it',
  tightening:
    "scale readings of the cup (cup_g) through the delivery inform it, but only as well as the grounds' water retention is known; first-coffee times hardly depend on it",
};

function reasonWords(reason: KeptReason): string {
  switch (reason.kind) {
    case 'no-information':
      return 'none of the observations depends on it';
    case 'too-few-observations':
      return `${reason.observations} observation${reason.observations === 1 ? '' : 's'} cannot fit ${reason.parameters} parameters; the ones the log informs most were fitted`;
    case 'too-uncertain':
      return reason.relativePercent === null
        ? "its effect on the observations cannot be told apart from the other parameters'"
        : `fitted, its 1-σ came out at ${reason.relativePercent} %, more than the ${reason.limitPercent} % a fit may leave${reason.notSeparableFrom.length ? `, most of it from the doubt of the ${reason.notSeparableFrom.map(plainName).join(' and ')}, which this log cannot separate it from` : ''}${reason.readingsPercent !== null ? ` (± ${reason.readingsPercent} % from the readings alone)` : ''}`;
  }
}

export const fitWords = {
  help: [
    'Usage: stovecard fit LOGFILE [--content DIR] [--write] [--json]',
    '',
    "Calibrates from a brew log (content/logs/<id>.yaml): the coffee's permeability, the heat",
    "each stove level used puts into the pot and, when the log can tell, the pot's heat-loss",
    "coefficient U·A and (when the coffee turns on bed.tightening) the bed's final share,",
    'by least squares of the simulated brews against what was timed, weighed',
    'and measured. Prints each value ± 1 σ, every observation against the model, and the values',
    "the log cannot pin down (those keep the entry's value).",
    '',
    'Assumed uncertainty (1 σ) of each reading: stopwatch 2 s, scale 1 g, probe 1 °C, yield 3 mL.',
    '',
    '  LOGFILE        the brew log; it names the pot, coffee and stove by id',
    "  --content DIR  the folder holding pots/, coffees/ and stoves/ (default: the log's folder's parent)",
    '  --write        put the fitted values into the coffee, stove and pot entries (comments and',
    '                 layout are kept; values the log cannot pin down are never written)',
    '  --json         print the report as one JSON object',
    '',
  ].join('\n'),

  // ── Errors (one line each; the CLI prefixes "stovecard: ") ──────────────────────────────
  missingLog: (): string =>
    'fit needs a brew log: stovecard fit LOGFILE [--content DIR] [--write] [--json] (see stovecard fit --help)',
  tooManyLogs: (given: readonly string[]): string =>
    `fit takes one brew log, got ${given.length}: ${given.join(' ')}; run it once per log`,
  unknownOption: (option: string, suggestion?: string): string =>
    `fit has no option ${option}${suggestion ? `; did you mean ${suggestion}?` : ''} ` +
    `Its options are --content DIR, --write, --json (see stovecard fit --help)`,
  optionNeedsValue: (option: string): string =>
    `${option} needs a folder after it, e.g. ${option} content`,
  optionTakesNoValue: (option: string): string => `${option} takes no value; write it alone`,
  badArguments: (detail: string): string => `fit: ${detail} (see stovecard fit --help)`,
  noContentFolder: (dir: string): string =>
    `${dir} is not a content folder (it has no pots/, coffees/ or stoves/); give the folder holding them with --content DIR`,
  brewNotSimulated: (at: SourceRef, field: string, problem: string): string =>
    `${at.file}:${at.line}:${at.column} ${field} — this brew cannot be simulated as logged: ${problem}. Check its fill_ml and start_c.`,
  writeFailed: (file: string, reason: string): string =>
    `could not write ${file} (${reason}); nothing was changed in it`,

  // ── The report: plain words first, for the person running the café ───────────────────
  plainHeading: 'In short:',
  plainHeat: (
    stove: string,
    level: string,
    watts: string,
    percent: string,
    entangled: readonly string[],
  ): string =>
    `  Your ${stove}'s ${level} puts about ${watts} W into this pot, give or take ${percent} %${entangled.length ? ` (part of that doubt is the ${entangled.map(plainName).join(' and ')}, which this log cannot separate)` : ''}.`,
  plainPermeability: (coffee: string, percent: string, entangled: readonly string[]): string =>
    `  ${coffee} lets water through the bed as measured, give or take ${percent} %${entangled.length ? ` (not separable from the ${entangled.map(plainName).join(' and ')})` : ''}.`,
  plainTightening: (
    coffee: string,
    sharePercent: string,
    percent: string,
    entangled: readonly string[],
  ): string =>
    `  ${coffee}'s bed tightens as it brews: once most of the water has passed it lets through about ${sharePercent} % of what it did at first, give or take ${percent} %${entangled.length ? ` (not separable from the ${entangled.map(plainName).join(' and ')})` : ''}.`,
  /** The share kept at the entry's value: `percent` is the σ a fit would have left (null: no estimate). */
  plainTighteningKept: (
    coffee: string,
    sharePercent: string,
    percent: string | null,
    entangled: readonly string[],
  ): string =>
    `  This log cannot tell how much ${coffee}'s bed tightens as it brews${percent !== null ? ` (a fit would leave ± ${percent} %${entangled.length ? `, mostly from the doubt of the ${entangled.map(plainName).join(' and ')}` : ''})` : ''}: the entry's ${sharePercent} % is kept, and nothing is written for it.`,
  plainHeatLoss: (pot: string, value: string, percent: string): string =>
    `  The ${pot} loses about ${value} W for each °C above the room, give or take ${percent} %.`,
  plainMisfit: (brews: readonly number[]): string =>
    `  These readings do not agree with each other: brew${brews.length === 1 ? '' : 's'} ${brews.map((b) => b + 1).join(', ')} ${brews.length === 1 ? 'stands' : 'stand'} out. Check ${brews.length === 1 ? 'its' : 'their'} numbers, the stove level and the grind used that day before writing anything back.`,
  plainPrediction: (rms: string): string =>
    `  Each brew, predicted from the others alone, is off by about ${rms} times what a stopwatch, scale or probe can tell apart${Number(rms) <= 2 ? ': the values carry over to brews not in the log' : ': treat cards made from these values as rough'}.`,
  plainNothing:
    '  This log cannot pin down anything yet: time the first coffee and the sputter of a few brews.',

  // ── The report ──────────────────────────────────────────────────────────────────────
  heading: (log: string, pot: string, coffee: string, stove: string): string =>
    `Calibration from ${log}: pot ${pot}, coffee ${coffee}, stove ${stove}`,
  counts: (brews: number, observations: number, fitted: number, dof: number): string =>
    `${brews} brew${brews === 1 ? '' : 's'}, ${observations} observation${observations === 1 ? '' : 's'}; ${fitted} parameter${fitted === 1 ? '' : 's'} fitted, ${dof} degree${dof === 1 ? '' : 's'} of freedom`,
  fittedHeading: (residualVariance: string | null): string =>
    residualVariance === null
      ? 'Fitted (± 1 σ from the Jacobian at the optimum; no degrees of freedom left, so the σ of each reading is taken as assumed):'
      : `Fitted (± 1 σ from the Jacobian at the optimum; χ²/dof = ${residualVariance}, by which the covariance is scaled only when above 1, so no σ falls below what the readings' own σ allow):`,
  fittedTable: (lines: readonly FittedLine[]): string[] =>
    lines.length === 0
      ? ['  nothing: the log cannot pin down any of the values']
      : table(
          lines.map((l) => [
            l.key,
            l.owner,
            `${l.value} ${l.unit}`,
            `± ${l.sigma} (${l.relativePercent} %)`,
            `was ${l.prior}`,
          ]),
        ),
  keptHeading: "Not identifiable from this log, kept at the entry's value:",
  /** Fitted σ = readings' part ⊕ what the held values' own doubt adds. */
  sigmaParts: (
    key: string,
    owner: string,
    readings: string,
    total: string,
    entangled: readonly string[],
  ): string =>
    `  ${key} (${owner}): ± ${readings} % from the readings, ± ${total} % with the doubt of ${entangled.length ? entangled.join(', ') : 'the values held'}`,
  sigmaPartsHeading: 'Of which the held values (at their priors, with their own doubt) add:',
  keptLine: (l: KeptLine): string =>
    `  ${l.key} (${l.owner}) ${l.value} ${l.unit}: ${reasonWords(l.reason)}; ${wouldInform[l.parameterKind]}.`,
  residualsHeading: (stopwatch: string, scale: string, probe: string, yieldMl: string): string =>
    `Residuals (σ assumed: stopwatch ${stopwatch} s, scale ${scale} g, probe ${probe} °C, yield ${yieldMl} mL):`,
  residualTable: (lines: readonly ResidualLine[]): string[] =>
    table([
      ['line', 'observation', 'seen', 'model', 'seen − model', 'in σ'],
      ...lines.map((l) => [String(l.line), l.field, l.seen, l.model, l.difference, l.normalised]),
    ]),
  summary: (
    chiSquare: string,
    dof: number,
    simulations: number,
    seconds: string,
    iterations: number,
  ): string =>
    `χ² = ${chiSquare} for ${dof} degree${dof === 1 ? '' : 's'} of freedom; ${simulations} simulations in ${seconds} s (${iterations} iterations)`,
  notConverged:
    'The least-squares search stopped before it settled; treat the values as rough and check the log for a mistyped number.',

  // ── --write ─────────────────────────────────────────────────────────────────────────
  written: (l: WrittenLine): string =>
    `Wrote ${l.file}: ${l.field} ${l.value}${l.was === null ? ' (new)' : ` (was ${l.was})`}`,
  /** The comment `fit --write` leaves beside a value it writes (kept short: one line). */
  nothingWritten: 'Nothing written: the log cannot pin down any of the values.',
  notWritten: (keys: readonly string[]): string =>
    `Not written (not identifiable): ${keys.join(', ')}`,
};
