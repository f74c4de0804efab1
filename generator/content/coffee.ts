/**
 * A coffee file (content/coffees/<id>.yaml) → CoffeeEntry: ranges that must run low to
 * high, the defaults for what the file leaves out, and the conversion to SI.
 */
import { message } from './messages.ts';
import { provenanceAt } from './provenance.ts';
import type { Checked, ValidFile } from './entry-file.ts';
import { GRIND_PERMEABILITY_M2 } from './grind-permeability.ts';
import type { ContentIssue } from './issues.ts';
import type { CoffeeEntry, GrindClass } from './types.ts';
import {
  celsiusToK,
  gramsPerGramToKgPerKg,
  gramsPerMlToKgPerM3,
  millilitresToM3,
} from './units.ts';
import { issueAt, refAt, type YamlSource } from './yaml-source.ts';

/** Extraction band when the file gives none, °C: SCA Golden Cup Standard (revised 2015), 93.0 °C ± 3 °C (200 °F ± 5 °F) at the point of contact. */
export const DEFAULT_TARGET_C: readonly [number, number] = [90, 96];

/** The coffee file as written, once it matches schemas/coffee.schema.json. */
export interface CoffeeYaml {
  readonly name: string;
  readonly roast: string;
  readonly grind: GrindClass;
  readonly permeability_m2?: number;
  readonly bulk_density_g_ml: number;
  readonly retention_g_per_g: number;
  readonly target_c?: readonly [number, number];
  readonly delivery_window_s?: readonly [number, number];
  readonly bed?: {
    readonly tightening?: { readonly final_share: number; readonly over_ml: number };
  };
  readonly notes?: string;
}

/** An issue when a written [low, high] pair does not rise. */
export function reversedRangeIssue(
  source: YamlSource,
  key: string,
  pair: readonly [number, number] | undefined,
): ContentIssue[] {
  if (!pair || pair[0] < pair[1]) return [];
  return [issueAt(source, [key], 'order', message('reversedRange', pair[0], pair[1]))];
}

export function buildCoffee(file: ValidFile<CoffeeYaml>): Checked<CoffeeEntry> {
  const { data, source } = file;
  const issues = [
    ...reversedRangeIssue(source, 'target_c', data.target_c),
    ...reversedRangeIssue(source, 'delivery_window_s', data.delivery_window_s),
  ];
  if (issues.length > 0) return { issues };
  const [lowC, highC] = data.target_c ?? DEFAULT_TARGET_C;
  const provenance =
    data.permeability_m2 === undefined ? undefined : provenanceAt(source, ['permeability_m2']);
  const tightening = data.bed?.tightening;
  const tighteningProvenance = tightening
    ? provenanceAt(source, ['bed', 'tightening', 'final_share'])
    : undefined;
  const entry: CoffeeEntry = {
    kind: 'coffee',
    id: file.id,
    name: data.name,
    source: refAt(source, []),
    hash: file.hash,
    roast: data.roast,
    grind: data.grind,
    notes: data.notes,
    bed: {
      permeabilityM2: data.permeability_m2 ?? GRIND_PERMEABILITY_M2[data.grind],
      bulkDensityKgM3: gramsPerMlToKgPerM3(data.bulk_density_g_ml),
      retentionKgPerKg: gramsPerGramToKgPerKg(data.retention_g_per_g),
      targetBandK: [celsiusToK(lowC), celsiusToK(highC)],
      // Absent: the classic bed (no key at all, so plans and cache keys stay as they were).
      ...(tightening
        ? {
            tightening: {
              finalShare: tightening.final_share,
              overM3: millilitresToM3(tightening.over_ml),
            },
          }
        : {}),
    },
    permeabilityAssumed: data.permeability_m2 === undefined,
    ...(provenance ? { permeabilityProvenance: provenance } : {}),
    ...(tighteningProvenance ? { tighteningProvenance } : {}),
    deliveryWindowS: data.delivery_window_s
      ? [data.delivery_window_s[0], data.delivery_window_s[1]]
      : null,
  };
  return { value: entry, issues: [] };
}
