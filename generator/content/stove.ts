/**
 * A stove file (content/stoves/<id>.yaml) → StoveEntry: levels named once and rising in
 * power, the kind's default efficiency, and the heat each level puts into the pot.
 */
import { message } from './messages.ts';
import { provenanceAt } from './provenance.ts';
import type { Checked, ValidFile } from './entry-file.ts';
import type { ContentIssue } from './issues.ts';
import { DEFAULT_STOVE_EFFICIENCY } from './stove-efficiency.ts';
import type { StoveEntry, StoveKind, StoveLevel } from './types.ts';
import { issueAt, positionAt, refAt } from './yaml-source.ts';

/** The stove file as written, once it matches schemas/stove.schema.json. */
export interface StoveYaml {
  readonly name: string;
  readonly kind: StoveKind;
  readonly efficiency?: number;
  readonly levels: readonly {
    /** A number when the knob is marked 1, 2, 3 …. */
    readonly label: string | number;
    readonly power_w: number;
    readonly heat_to_pot_w?: number;
  }[];
}

function levelIssues({ source, data }: ValidFile<StoveYaml>): ContentIssue[] {
  const issues: ContentIssue[] = [];
  const firstLineOf = new Map<string, number>();
  data.levels.forEach((level, index) => {
    const label = String(level.label);
    const firstLine = firstLineOf.get(label);
    if (firstLine !== undefined) {
      issues.push(
        issueAt(
          source,
          ['levels', index, 'label'],
          'repeated',
          message('repeatedLevel', label, firstLine),
        ),
      );
    } else {
      firstLineOf.set(label, positionAt(source, ['levels', index, 'label']).line);
    }
    const previous = data.levels[index - 1];
    if (previous && level.power_w <= previous.power_w) {
      const wording = message(
        'powerNotIncreasing',
        level.power_w,
        String(previous.label),
        previous.power_w,
      );
      issues.push(issueAt(source, ['levels', index, 'power_w'], 'order', wording));
    }
  });
  return issues;
}

export function buildStove(file: ValidFile<StoveYaml>): Checked<StoveEntry> {
  const issues = levelIssues(file);
  if (issues.length > 0) return { issues };
  const { data } = file;
  const efficiency = data.efficiency ?? DEFAULT_STOVE_EFFICIENCY[data.kind];
  const levels: StoveLevel[] = data.levels.map((level, i) => {
    const provenance =
      level.heat_to_pot_w === undefined
        ? undefined
        : provenanceAt(file.source, ['levels', i, 'heat_to_pot_w']);
    return {
      label: String(level.label),
      powerW: level.power_w,
      heatToPotW: level.heat_to_pot_w ?? level.power_w * efficiency,
      fitted: level.heat_to_pot_w !== undefined,
      ...(provenance ? { provenance } : {}),
    };
  });
  const entry: StoveEntry = {
    kind: 'stove',
    id: file.id,
    name: data.name,
    source: refAt(file.source, []),
    hash: file.hash,
    stoveKind: data.kind,
    efficiency,
    efficiencyAssumed: data.efficiency === undefined,
    levels,
  };
  return { value: entry, issues: [] };
}
