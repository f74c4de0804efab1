/**
 * `stovecard fit LOGFILE [--content DIR] [--write] [--json]`: calibrate the coffee, stove and
 * pot a brew log names from what it saw (generator/calibration/fit.ts), print the report,
 * and with --write put the fitted values into the entries.
 *
 *   LOGFILE ─ loadLogFile (schema, own checks) ─ ids and levels checked against DIR ─▶
 *   pot, coffee, stove entries ─ fitLog ─▶ report (text or JSON) ─ --write ─▶ each entry:
 *   values spliced into its text, written to a temp file beside it, loaded and validated
 *   again, then renamed over the entry (a crash leaves the old file or the new, never half)
 */
import { provenanceNote } from '../content/provenance.ts';
import { randomBytes } from 'node:crypto';
import { readdir, readFile, rename, stat, unlink, writeFile } from 'node:fs/promises';
import { basename, dirname, extname, join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { nearestOption } from './options.ts';
import { BrewNotSimulatedError } from '../calibration/errors.ts';
import { brewWords } from '../words/brew.ts';
import { fitLog, type FitInput } from '../calibration/fit.ts';
import type { Observation } from '../calibration/observations.ts';
import type { Parameter } from '../calibration/parameters.ts';
import type { Estimate, FitReport } from '../calibration/types.ts';
import { ASSUMED_SIGMA } from '../calibration/uncertainty.ts';
import {
  editedText,
  plannedEdits,
  previousValueText,
  type EntryEdit,
  type EntryKind,
} from '../calibration/write-back.ts';
import {
  ContentErrors,
  ContentIssue,
  loadCoffeeFile,
  loadLogFile,
  loadPotFile,
  loadStoveFile,
  parseYamlSource,
  positionAt,
  fieldName,
  type LogEntry,
  type StoveEntry,
} from '../content/index.ts';
import { loadEntry, type ValidFile } from '../content/entry-file.ts';
import { buildLog, type LogYaml } from '../content/log.ts';
import type { KnownIds } from '../content/references.ts';
import { toCelsius, toGrams, toMl } from '../units.ts';
import {
  fitWords,
  type FittedLine,
  type KeptLine,
  type ResidualLine,
  type WrittenLine,
} from '../words/fit.ts';
import { InputError, UsageError } from './errors.ts';

const FOLDERS: Readonly<Record<EntryKind, string>> = {
  pot: 'pots',
  coffee: 'coffees',
  stove: 'stoves',
};

interface FitArguments {
  readonly logPath: string;
  readonly contentDir: string;
  readonly write: boolean;
  readonly json: boolean;
}

/** The entries a log names, loaded from the content folder, and where each file is. */
export interface LoadedFit extends FitInput {
  /** Entry files: path on disk and name relative to the content folder. */
  readonly files: Readonly<Record<EntryKind, { readonly path: string; readonly name: string }>>;
}

export async function run(argv: string[]): Promise<number> {
  const args = parseFitArguments(argv);
  if (args === 'help') {
    process.stdout.write(fitWords.help);
    return 0;
  }
  const loaded = await loadFitInput(args.logPath, args.contentDir);
  const started = performance.now();
  let report: FitReport;
  try {
    report = fitLog(loaded);
  } catch (error) {
    if (error instanceof BrewNotSimulatedError) {
      throw new InputError(
        fitWords.brewNotSimulated(error.source, error.field, brewWords.setupProblem(error.code)),
      );
    }
    throw error;
  }
  const elapsedS = (performance.now() - started) / 1000;
  const logText = await readFile(args.logPath, 'utf8');
  const written = args.write ? await writeFitted(report, loaded) : null;
  process.stdout.write(
    args.json
      ? `${JSON.stringify(fitJson(report, loaded, logText, args.logPath, elapsedS, written))}\n`
      : fitText(report, loaded, logText, args.logPath, elapsedS, written),
  );
  return 0;
}

// ── Arguments ───────────────────────────────────────────────────────────────────────────

export function parseFitArguments(argv: string[]): FitArguments | 'help' {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      options: {
        content: { type: 'string' },
        write: { type: 'boolean' },
        json: { type: 'boolean' },
        help: { type: 'boolean', short: 'h' },
      },
      strict: true,
      allowPositionals: true,
    });
  } catch (error) {
    throw new UsageError(argumentProblem(error));
  }
  const { values, positionals } = parsed;
  if (values.help) return 'help';
  if (positionals.length === 0) throw new UsageError(fitWords.missingLog());
  if (positionals.length > 1) throw new UsageError(fitWords.tooManyLogs(positionals));
  const logPath = positionals[0]!;
  if (values.content === '') throw new UsageError(fitWords.optionNeedsValue('--content'));
  return {
    logPath,
    contentDir: values.content ?? resolve(dirname(logPath), '..'),
    write: values.write === true,
    json: values.json === true,
  };
}

function argumentProblem(error: unknown): string {
  const code = (error as NodeJS.ErrnoException).code;
  const message = error instanceof Error ? error.message : String(error);
  const option = /'(-[^' ]*)/.exec(message)?.[1] ?? '';
  if (code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') {
    return fitWords.unknownOption(
      option,
      nearestOption(option, ['content', 'write', 'json', 'help']),
    );
  }
  if (code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') {
    return option === '--content'
      ? fitWords.optionNeedsValue(option)
      : fitWords.optionTakesNoValue(option);
  }
  return fitWords.badArguments(message.split('\n')[0]!);
}

// ── Loading ─────────────────────────────────────────────────────────────────────────────

/** The entry files of the content folder by kind: id → file name. */
async function entryFiles(contentDir: string): Promise<Record<EntryKind, Map<string, string>>> {
  const found = { pot: new Map(), coffee: new Map(), stove: new Map() } as Record<
    EntryKind,
    Map<string, string>
  >;
  let folders = 0;
  for (const kind of Object.keys(FOLDERS) as EntryKind[]) {
    let names: string[];
    try {
      names = await readdir(join(contentDir, FOLDERS[kind]));
      folders += 1;
    } catch {
      continue;
    }
    for (const name of names.sort()) {
      if (['.yaml', '.yml'].includes(extname(name)))
        found[kind].set(basename(name, extname(name)), name);
    }
  }
  if (folders === 0) throw new InputError(fitWords.noContentFolder(contentDir));
  return found;
}

/**
 * The log and the entries it names. Problems of the log (shape, values, unknown ids or
 * levels) and of the entries come together as one ContentErrors, each with file and line.
 */
export async function loadFitInput(logPath: string, contentDir: string): Promise<LoadedFit> {
  const first = await loadLogFile(logPath);
  const files = await entryFiles(contentDir);
  const pathOf = (kind: EntryKind, id: string): { path: string; name: string } | undefined => {
    const name = files[kind].get(id);
    return name === undefined
      ? undefined
      : { path: join(contentDir, FOLDERS[kind], name), name: `${FOLDERS[kind]}/${name}` };
  };
  const issues: ContentIssue[] = [];
  const attempt = async <T>(load: () => Promise<T>): Promise<T | undefined> => {
    try {
      return await load();
    } catch (error) {
      if (!(error instanceof ContentErrors)) throw error;
      issues.push(...error.issues);
      return undefined;
    }
  };
  const located = {
    pot: pathOf('pot', first.potId),
    coffee: pathOf('coffee', first.coffeeId),
    stove: pathOf('stove', first.stoveId),
  };
  const [pot, coffee, stove] = await Promise.all([
    located.pot && attempt(() => loadPotFile(located.pot!.path)),
    located.coffee && attempt(() => loadCoffeeFile(located.coffee!.path)),
    located.stove && attempt(() => loadStoveFile(located.stove!.path)),
  ]);
  const known: KnownIds = {
    pot: [...files.pot.keys()],
    coffee: [...files.coffee.keys()],
    stove: [...files.stove.keys()],
  };
  const stoves = new Map<string, StoveEntry>(stove ? [[first.stoveId, stove]] : []);
  const checked = await loadEntry('log', logPath, logPath, (file: ValidFile<LogYaml>) =>
    buildLog(file, { known, stoves }),
  );
  issues.push(...checked.issues);
  const log: LogEntry | undefined = checked.value;
  if (issues.length > 0 || !log || !pot || !coffee || !stove) throw new ContentErrors(issues);
  return {
    log,
    pot,
    coffee,
    stove,
    files: { pot: located.pot!, coffee: located.coffee!, stove: located.stove! },
  };
}

// ── Writing ─────────────────────────────────────────────────────────────────────────────

const loaders: Readonly<Record<EntryKind, (path: string) => Promise<unknown>>> = {
  pot: loadPotFile,
  coffee: loadCoffeeFile,
  stove: loadStoveFile,
};

/**
 * Put the fitted values into their entries: every file is edited in a temp file beside it
 * and loaded and validated again before any is renamed over its entry.
 */
export async function writeFitted(report: FitReport, loaded: LoadedFit): Promise<WrittenLine[]> {
  const date = new Date().toISOString().slice(0, 10);
  const edits = plannedEdits(report, loaded.stove).map((edit) => {
    const e = report.estimates.find((x) => x.parameter.id === edit.parameterId);
    return e?.status === 'fitted'
      ? {
          ...edit,
          note: provenanceNote(
            percent(e.relativeSigma),
            `logs/${basename(loaded.log.source.file)}`,
            date,
          ),
        }
      : edit;
  });
  const byEntry = new Map<EntryKind, EntryEdit[]>();
  for (const edit of edits) byEntry.set(edit.entry, [...(byEntry.get(edit.entry) ?? []), edit]);
  const staged: { temp: string; path: string }[] = [];
  const lines: WrittenLine[] = [];
  try {
    for (const [entry, own] of byEntry) {
      const { path, name } = loaded.files[entry];
      const text = await readFile(path, 'utf8');
      const next = editedText(text, name, own);
      const temp = join(
        dirname(path),
        `.${basename(path)}.${randomBytes(4).toString('hex')}.fit-tmp`,
      );
      await writeFile(temp, next, { flag: 'wx', mode: (await stat(path)).mode });
      staged.push({ temp, path });
      await loaders[entry](temp);
      for (const edit of own) {
        lines.push({
          file: name,
          field: fieldName(edit.path),
          value: String(edit.value),
          was: previousValueText(text, name, edit.path),
        });
      }
    }
  } catch (error) {
    await Promise.all(staged.map(({ temp }) => unlink(temp).catch(() => undefined)));
    const reason =
      error instanceof ContentErrors
        ? error.issues.map(String).join('; ')
        : (error as Error).message;
    const file = staged.at(-1)?.path ?? '';
    throw new InputError(fitWords.writeFailed(file, reason));
  }
  for (const { temp, path } of staged) await rename(temp, path);
  return lines;
}

// ── The report ──────────────────────────────────────────────────────────────────────────

const UNIT: Readonly<Record<Parameter['kind'], string>> = {
  permeability: 'm²',
  heat: 'W',
  'heat-loss': 'W/K',
  tightening: '',
};

function label(
  parameter: Parameter,
  loaded: LoadedFit,
): { key: string; owner: string; unit: string } {
  switch (parameter.kind) {
    case 'permeability':
      return { key: 'permeability_m2', owner: loaded.coffee.id, unit: UNIT.permeability };
    case 'heat':
      return {
        key: 'heat_to_pot_w',
        owner: `${loaded.stove.id} ${parameter.level}`,
        unit: UNIT.heat,
      };
    case 'heat-loss':
      return { key: 'heat_loss_w_per_k', owner: loaded.pot.id, unit: UNIT['heat-loss'] };
    case 'tightening':
      return { key: 'bed.tightening.final_share', owner: loaded.coffee.id, unit: UNIT.tightening };
  }
}

/** `digits` significant digits, trailing zeros kept (0.120), no exponent for 1e-3 ≤ |v| < 1e6. */
function sig(value: number, digits: number): string {
  const text = value.toPrecision(Math.min(15, Math.max(1, digits)));
  return /e\+/.test(text) ? String(Math.round(value)) : text;
}

/** The value to the digit of the second significant digit of its σ (as it is written back). */
function valueText(value: number, sigma: number): string {
  const digits = Math.floor(Math.log10(Math.abs(value))) - Math.floor(Math.log10(sigma)) + 2;
  return sig(value, Math.max(2, digits));
}

function percent(relative: number): string {
  const p = relative * 100;
  return p >= 100 ? String(Math.round(p)) : String(Number(p.toPrecision(2)));
}

/** An observation's value in the unit a person reads: s, mL, g, °C. */
function observationUnit(o: Observation): {
  unit: string;
  fromSi: (v: number) => number;
  difference: (v: number) => number;
} {
  switch (o.kind) {
    case 'first-coffee':
    case 'sputter':
      return { unit: 's', fromSi: (v) => v, difference: (v) => v };
    case 'yield':
      return { unit: 'mL', fromSi: toMl, difference: toMl };
    case 'cup-mass':
      return { unit: 'g', fromSi: toGrams, difference: toGrams };
    case 'water-temperature':
      return { unit: '°C', fromSi: toCelsius, difference: (v) => v };
  }
}

const fixed = (value: number, decimals = 1): string => {
  const text = value.toFixed(decimals);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
};
const signed = (value: number, decimals = 1): string => {
  const text = fixed(value, decimals);
  return text.startsWith('-') || /^0\.?0*$/.test(text) ? text : `+${text}`;
};

function kept(
  estimate: Extract<Estimate, { status: 'kept' }>,
  report: FitReport,
  loaded: LoadedFit,
): KeptLine {
  const { parameter } = estimate;
  const reason: KeptLine['reason'] =
    estimate.reason === 'no-information'
      ? { kind: 'no-information' }
      : estimate.reason === 'too-few-observations'
        ? {
            kind: 'too-few-observations',
            observations: report.observationCount,
            parameters: report.estimates.length,
          }
        : {
            kind: 'too-uncertain',
            relativePercent:
              estimate.relativeSigmaIfFitted === undefined ||
              !Number.isFinite(estimate.relativeSigmaIfFitted)
                ? null
                : percent(estimate.relativeSigmaIfFitted),
            limitPercent: percent(report.relativeSigmaLimit),
            notSeparableFrom: estimate.notSeparableFrom ?? [],
            readingsPercent:
              estimate.readingsRelativeSigma === undefined
                ? null
                : percent(estimate.readingsRelativeSigma),
          };
  return {
    ...label(parameter, loaded),
    parameterKind: parameter.kind,
    value: String(Number(estimate.value.toPrecision(3))),
    reason,
  };
}

export function fitText(
  report: FitReport,
  loaded: LoadedFit,
  logText: string,
  logPath: string,
  elapsedS: number,
  written: readonly WrittenLine[] | null,
): string {
  const fitted: FittedLine[] = report.estimates.flatMap((e) =>
    e.status === 'fitted'
      ? [
          {
            ...label(e.parameter, loaded),
            value: valueText(e.value, e.sigma),
            sigma: sig(e.sigma, 2),
            relativePercent: percent(e.relativeSigma),
            prior: String(Number(e.parameter.prior.toPrecision(3))),
          },
        ]
      : [],
  );
  const keptLines = report.estimates.flatMap((e) =>
    e.status === 'kept' ? [kept(e, report, loaded)] : [],
  );
  const source = parseYamlSource(logText, logPath).source;
  const residuals: ResidualLine[] = report.residuals.map((r) => {
    const u = observationUnit(r.observation);
    return {
      line: positionAt(source, r.observation.path).line,
      field: r.observation.field,
      seen: `${fixed(u.fromSi(r.observation.seen))} ${u.unit}`,
      model: `${fixed(u.fromSi(r.model))} ${u.unit}`,
      difference: `${signed(u.difference(r.difference))} ${u.unit}`,
      normalised: signed(r.normalised, 2),
    };
  });
  const plain = report.estimates.flatMap((e): string[] => {
    if (e.status !== 'fitted') {
      if (e.parameter.kind !== 'tightening') return [];
      const ifFitted = e.relativeSigmaIfFitted;
      return [
        fitWords.plainTighteningKept(
          loaded.coffee.name,
          String(Math.round(e.value * 100)),
          ifFitted !== undefined && Number.isFinite(ifFitted) ? percent(ifFitted) : null,
          e.notSeparableFrom ?? [],
        ),
      ];
    }
    const pct = percent(e.relativeSigma);
    switch (e.parameter.kind) {
      case 'heat':
        return [
          fitWords.plainHeat(
            loaded.stove.name,
            e.parameter.level!,
            sig(e.value, 2),
            pct,
            e.entangledWith,
          ),
        ];
      case 'permeability':
        return [fitWords.plainPermeability(loaded.coffee.name, pct, e.entangledWith)];
      case 'heat-loss':
        return [fitWords.plainHeatLoss(loaded.pot.name, sig(e.value, 2), pct)];
      case 'tightening':
        return [
          fitWords.plainTightening(
            loaded.coffee.name,
            String(Math.round(e.value * 100)),
            pct,
            e.entangledWith,
          ),
        ];
    }
  });
  const parts = report.estimates.flatMap((e) =>
    e.status === 'fitted' && e.relativeSigma > e.statisticalRelativeSigma * 1.05
      ? [
          fitWords.sigmaParts(
            label(e.parameter, loaded).key,
            label(e.parameter, loaded).owner,
            percent(e.statisticalRelativeSigma),
            percent(e.relativeSigma),
            e.entangledWith,
          ),
        ]
      : [],
  );
  const lines = [
    fitWords.plainHeading,
    ...(report.fittedCount > 0 ? plain : [fitWords.plainNothing, ...plain]),
    ...(report.misfit ? [fitWords.plainMisfit(report.misfit.brews)] : []),
    ...(report.leaveOneOut
      ? [fitWords.plainPrediction(sig(report.leaveOneOut.rmsNormalised, 2))]
      : []),
    '',
    fitWords.heading(logPath, loaded.pot.id, loaded.coffee.id, loaded.stove.id),
    fitWords.counts(
      loaded.log.brews.length,
      report.observationCount,
      report.fittedCount,
      report.dof,
    ),
    '',
    fitWords.fittedHeading(
      report.residualVariance === null ? null : sig(report.residualVariance, 2),
    ),
    ...fitWords.fittedTable(fitted),
    ...(parts.length > 0 ? [fitWords.sigmaPartsHeading, ...parts] : []),
    ...(keptLines.length > 0
      ? ['', fitWords.keptHeading, ...keptLines.map(fitWords.keptLine)]
      : []),
    '',
    fitWords.residualsHeading(
      String(ASSUMED_SIGMA.stopwatchS),
      String(toGrams(ASSUMED_SIGMA.scaleKg)),
      String(ASSUMED_SIGMA.probeK),
      String(toMl(ASSUMED_SIGMA.yieldM3)),
    ),
    ...(residuals.length > 0 ? fitWords.residualTable(residuals) : []),
    '',
    fitWords.summary(
      sig(report.chiSquare, 3),
      report.dof,
      report.simulations,
      elapsedS.toFixed(2),
      report.iterations,
    ),
    ...(report.converged ? [] : [fitWords.notConverged]),
  ];
  if (written !== null) {
    lines.push('');
    lines.push(...(written.length > 0 ? written.map(fitWords.written) : [fitWords.nothingWritten]));
    const notWritten = keptLines.map((l) => `${l.key} (${l.owner})`);
    if (written.length > 0 && notWritten.length > 0) lines.push(fitWords.notWritten(notWritten));
  }
  return `${lines.join('\n')}\n`;
}

const finiteOrNull = (value: number | undefined): number | null =>
  value === undefined || !Number.isFinite(value) ? null : value;

/** The report as one JSON object, trade units (m², W, W/K; s, mL, g, °C). */
export function fitJson(
  report: FitReport,
  loaded: LoadedFit,
  logText: string,
  logPath: string,
  elapsedS: number,
  written: readonly WrittenLine[] | null,
) {
  const source = parseYamlSource(logText, logPath).source;
  return {
    log: logPath,
    pot: loaded.pot.id,
    coffee: loaded.coffee.id,
    stove: loaded.stove.id,
    assumedSigma: {
      stopwatchS: ASSUMED_SIGMA.stopwatchS,
      scaleG: toGrams(ASSUMED_SIGMA.scaleKg),
      probeC: ASSUMED_SIGMA.probeK,
      yieldMl: toMl(ASSUMED_SIGMA.yieldM3),
    },
    brews: loaded.log.brews.length,
    observations: report.observationCount,
    fitted: report.fittedCount,
    dof: report.dof,
    chiSquare: report.chiSquare,
    residualVariance: report.residualVariance,
    relativeSigmaLimit: report.relativeSigmaLimit,
    parameters: report.estimates.map((e) => ({
      id: e.parameter.id,
      kind: e.parameter.kind,
      ...(e.parameter.level !== undefined ? { level: e.parameter.level } : {}),
      file: loaded.files[entryOf(e.parameter)].name,
      ...label(e.parameter, loaded),
      prior: e.parameter.prior,
      value: e.value,
      ...(e.status === 'fitted'
        ? { identifiable: true, sigma: e.sigma, relativeSigma: e.relativeSigma }
        : {
            identifiable: false,
            reason: e.reason,
            relativeSigmaIfFitted: finiteOrNull(e.relativeSigmaIfFitted),
          }),
    })),
    residuals: report.residuals.map((r) => {
      const u = observationUnit(r.observation);
      return {
        field: r.observation.field,
        line: positionAt(source, r.observation.path).line,
        kind: r.observation.kind,
        ...(r.observation.atS !== undefined ? { atS: r.observation.atS } : {}),
        unit: u.unit,
        seen: u.fromSi(r.observation.seen),
        model: u.fromSi(r.model),
        difference: u.difference(r.difference),
        sigma: u.difference(r.observation.sigma),
        normalised: r.normalised,
      };
    }),
    iterations: report.iterations,
    converged: report.converged,
    simulations: report.simulations,
    elapsedS,
    ...(written !== null ? { written } : {}),
  };
}

function entryOf(parameter: Parameter): EntryKind {
  return parameter.kind === 'permeability' || parameter.kind === 'tightening'
    ? 'coffee'
    : parameter.kind === 'heat'
      ? 'stove'
      : 'pot';
}
