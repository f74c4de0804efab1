/**
 * A brew-log file (content/logs/<id>.yaml) → LogEntry: each brew must record something,
 * readings run forward in time, and everything is converted to SI. Whether the pot, coffee,
 * stove and levels it names exist is checked when the whole catalogue is loaded.
 */
import { message } from './messages.ts';
import type { Checked, ValidFile } from './entry-file.ts';
import type { ContentIssue } from './issues.ts';
import { unknownIdIssues, unknownLevelIssues, type KnownIds } from './references.ts';
import type { LogEntry, LoggedBrew, StoveEntry } from './types.ts';
import { celsiusToK, gramsToKg, millilitresToM3 } from './units.ts';
import { issueAt, refAt, type YamlSource } from './yaml-source.ts';

type Reading = readonly [number, number];

export interface BrewYaml {
  /** A number when the knob is marked 1, 2, 3 …. */
  readonly level: string | number;
  readonly fill_ml: number;
  readonly start_c: number;
  readonly room_c: number;
  readonly first_coffee_s?: number;
  readonly sputter_s?: number;
  readonly off_heat_s?: number;
  readonly yield_ml?: number;
  readonly cup_g?: readonly Reading[];
  readonly water_c?: readonly Reading[];
}

/** The log file as written, once it matches schemas/log.schema.json. */
export interface LogYaml {
  readonly pot: string;
  readonly coffee: string;
  readonly stove: string;
  readonly altitude_m?: number;
  readonly brews: readonly BrewYaml[];
}

const OBSERVATIONS = [
  'first_coffee_s',
  'sputter_s',
  'off_heat_s',
  'yield_ml',
  'cup_g',
  'water_c',
] as const;

function brewIssues(source: YamlSource, brew: BrewYaml, index: number): ContentIssue[] {
  const at = ['brews', index] as const;
  const issues: ContentIssue[] = [];
  if (OBSERVATIONS.every((key) => brew[key] === undefined)) {
    issues.push(issueAt(source, at, 'missing-key', message('brewWithoutObservation')));
  }
  if (
    brew.first_coffee_s !== undefined &&
    brew.sputter_s !== undefined &&
    brew.sputter_s < brew.first_coffee_s
  ) {
    const wording = message('sputterBeforeFirstCoffee', brew.sputter_s, brew.first_coffee_s);
    issues.push(issueAt(source, [...at, 'sputter_s'], 'order', wording));
  }
  for (const key of ['cup_g', 'water_c'] as const) {
    brew[key]?.forEach(([tS], i, readings) => {
      const previousS = readings[i - 1]?.[0];
      if (previousS !== undefined && tS <= previousS) {
        issues.push(
          issueAt(
            source,
            [...at, key, i, 0],
            'order',
            message('readingsOutOfOrder', tS, previousS),
          ),
        );
      }
    });
  }
  return issues;
}

function loggedBrew(source: YamlSource, brew: BrewYaml, index: number): LoggedBrew {
  const at = ['brews', index] as const;
  return {
    source: refAt(source, at),
    level: String(brew.level),
    fillVolumeM3: millilitresToM3(brew.fill_ml),
    startK: celsiusToK(brew.start_c),
    ambientK: celsiusToK(brew.room_c),
    firstCoffeeS: brew.first_coffee_s,
    sputterS: brew.sputter_s,
    heatOffS: brew.off_heat_s,
    yieldM3: brew.yield_ml === undefined ? undefined : millilitresToM3(brew.yield_ml),
    cupMass: brew.cup_g?.map(([tS, g], i) => ({
      tS,
      kg: gramsToKg(g),
      source: refAt(source, [...at, 'cup_g', i]),
    })),
    waterTemperature: brew.water_c?.map(([tS, c], i) => ({
      tS,
      k: celsiusToK(c),
      source: refAt(source, [...at, 'water_c', i]),
    })),
  };
}

/** What a log is checked against when it is loaded with the whole catalogue. */
export interface LogReferences {
  readonly known: KnownIds;
  /** The stoves that loaded; a log's levels are checked when its stove is among them. */
  readonly stoves: ReadonlyMap<string, StoveEntry>;
}

function referenceIssues(
  { source, data }: ValidFile<LogYaml>,
  references: LogReferences,
): ContentIssue[] {
  const issues = [
    ...unknownIdIssues(source, ['pot'], 'pot', data.pot, references.known),
    ...unknownIdIssues(source, ['coffee'], 'coffee', data.coffee, references.known),
    ...unknownIdIssues(source, ['stove'], 'stove', data.stove, references.known),
  ];
  const stove = references.stoves.get(data.stove);
  if (stove) {
    data.brews.forEach((brew, index) => {
      issues.push(
        ...unknownLevelIssues(source, ['brews', index, 'level'], stove, String(brew.level)),
      );
    });
  }
  return issues;
}

/** The log as an entry; with `references`, also check the ids and levels it names. */
export function buildLog(file: ValidFile<LogYaml>, references?: LogReferences): Checked<LogEntry> {
  const { data, source } = file;
  const issues = [
    ...data.brews.flatMap((brew, index) => brewIssues(source, brew, index)),
    ...(references ? referenceIssues(file, references) : []),
  ];
  if (issues.length > 0) return { issues };
  const entry: LogEntry = {
    kind: 'log',
    id: file.id,
    name: file.id,
    source: refAt(source, []),
    hash: file.hash,
    potId: data.pot,
    coffeeId: data.coffee,
    stoveId: data.stove,
    altitudeM: data.altitude_m ?? 0,
    brews: data.brews.map((brew, index) => loggedBrew(source, brew, index)),
  };
  return { value: entry, issues: [] };
}
