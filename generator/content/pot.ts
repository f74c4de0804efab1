/**
 * A pot file (content/pots/<id>.yaml) → PotEntry: the geometry checks a schema cannot make,
 * the defaults for what the file leaves out, and the conversion to SI.
 */
import { potGeometry } from '../brew/geometry.ts';
import type { BaseMaterial, PotModel } from '../brew/types.ts';
import { message, type ContentMessage } from './messages.ts';
import type { Checked, ValidFile } from './entry-file.ts';
import type { ContentIssue } from './issues.ts';
import { ASSUMED_VALVE_OPENING_BAR, defaultHeatLossWPerK } from './pot-defaults.ts';
import type { PotEntry } from './types.ts';
import { barToPa, gramsToKg, millilitresToM3, millimetresToM } from './units.ts';
import { issueAt, refAt } from './yaml-source.ts';

/**
 * The pot's lengths, each written as `<name>_mm` or `<name>_in` (exactly one of the pair),
 * by the part of the pot they belong to.
 */
const LENGTHS = {
  base: ['inner_diameter', 'valve_height'],
  funnel: ['basket_diameter', 'basket_depth', 'tube_inner_diameter', 'tube_gap'],
  upper: ['spout_height'],
} as const;

type LengthUnit = 'mm' | 'in';
type Part = keyof typeof LENGTHS;

/** 1 in = 25.4 mm exactly (NIST SP 811, B.8). */
const MM_PER_IN = 25.4;

/** The pot file as written (lengths in mm or in), once it matches schemas/pot.schema.json. */
export type PotFileYaml = {
  readonly [P in keyof PotYaml]: PotYaml[P] extends object
    ? Partial<PotYaml[P]> & Readonly<Record<string, unknown>>
    : PotYaml[P];
};

/** Where one length was written: its key, its unit and its value in that unit. */
interface WrittenLength {
  readonly key: string;
  readonly unit: LengthUnit;
  readonly value: number;
}

/** Each length's written form (the schema's `x-one-of-keys` made sure there is exactly one). */
function writtenLengths(file: ValidFile<PotFileYaml>): Map<string, WrittenLength> {
  const lengths = new Map<string, WrittenLength>();
  for (const part of Object.keys(LENGTHS) as Part[]) {
    const values = file.data[part] as Readonly<Record<string, unknown>>;
    for (const name of LENGTHS[part]) {
      const mm = values[`${name}_mm`] as number | undefined;
      lengths.set(
        `${part}.${name}`,
        mm !== undefined
          ? { key: `${name}_mm`, unit: 'mm', value: mm }
          : { key: `${name}_in`, unit: 'in', value: values[`${name}_in`] as number },
      );
    }
  }
  return lengths;
}

/** The file with every length in millimetres, as the rest of this module reads it. */
function inMillimetres(data: PotFileYaml, lengths: ReadonlyMap<string, WrittenLength>): PotYaml {
  const part = (name: Part): Record<string, unknown> => {
    const out: Record<string, unknown> = { ...data[name] };
    for (const length of LENGTHS[name]) {
      const written = lengths.get(`${name}.${length}`)!;
      delete out[`${length}_in`];
      out[`${length}_mm`] = written.unit === 'mm' ? written.value : written.value * MM_PER_IN;
    }
    return out;
  };
  return {
    ...data,
    base: part('base'),
    funnel: part('funnel'),
    upper: part('upper'),
  } as unknown as PotYaml;
}

/** The pot with every length in millimetres (the form the checks and the conversion read). */
export interface PotYaml {
  readonly name: string;
  readonly cups: number;
  readonly base: {
    readonly sealed_volume_ml: number;
    readonly inner_diameter_mm: number;
    readonly valve_height_mm: number;
    readonly valve_opening_bar?: number;
    readonly material: BaseMaterial;
    readonly mass_g: number;
    readonly induction_plate?: boolean;
    readonly heat_loss_w_per_k?: number;
  };
  readonly funnel: {
    readonly basket_diameter_mm: number;
    readonly basket_depth_mm: number;
    readonly tube_inner_diameter_mm: number;
    readonly tube_gap_mm: number;
  };
  readonly upper: { readonly spout_height_mm: number; readonly capacity_ml: number };
}

/**
 * The geometry a working pot must have, each broken rule an issue at the value to fix.
 * Heights come from the brew model's own geometry (the base as its equivalent cylinder).
 */
function geometryIssues(
  file: ValidFile<PotFileYaml>,
  data: PotYaml,
  lengths: ReadonlyMap<string, WrittenLength>,
  model: PotModel,
): ContentIssue[] {
  const { base, funnel, upper } = data;
  const { baseHeightM, bedTopM } = potGeometry(model);
  const baseHeightMm = baseHeightM * 1e3;
  const bedTopMm = bedTopM * 1e3;
  /** A rule's numbers in the unit the person wrote the faulty length in. */
  const rule = (
    broken: boolean,
    part: Part,
    name: string,
    say: (inUnit: (mm: number) => number, unit: LengthUnit) => ContentMessage,
  ) => {
    const written = lengths.get(`${part}.${name}`)!;
    const inUnit = (mm: number): number =>
      written.unit === 'mm' ? mm : Math.round((mm / MM_PER_IN) * 1000) / 1000;
    return { broken, path: [part, written.key], wording: () => say(inUnit, written.unit) };
  };
  const rules = [
    rule(base.valve_height_mm >= baseHeightMm, 'base', 'valve_height', (u, unit) =>
      message('valveAboveBase', u(base.valve_height_mm), u(baseHeightMm), unit),
    ),
    rule(funnel.tube_gap_mm >= base.valve_height_mm, 'funnel', 'tube_gap', (u, unit) =>
      message('tubeGapAboveValve', u(funnel.tube_gap_mm), u(base.valve_height_mm), unit),
    ),
    rule(upper.spout_height_mm <= bedTopMm, 'upper', 'spout_height', (u, unit) =>
      message('spoutTooLow', u(upper.spout_height_mm), u(bedTopMm), unit),
    ),
    rule(
      funnel.basket_diameter_mm >= base.inner_diameter_mm,
      'funnel',
      'basket_diameter',
      (u, unit) =>
        message(
          'basketWiderThanBase',
          u(funnel.basket_diameter_mm),
          u(base.inner_diameter_mm),
          unit,
        ),
    ),
    rule(
      funnel.tube_inner_diameter_mm >= funnel.basket_diameter_mm,
      'funnel',
      'tube_inner_diameter',
      (u, unit) =>
        message(
          'tubeWiderThanBasket',
          u(funnel.tube_inner_diameter_mm),
          u(funnel.basket_diameter_mm),
          unit,
        ),
    ),
  ];
  return rules
    .filter((r) => r.broken)
    .map((r) => issueAt(file.source, r.path, 'geometry', r.wording()));
}

function potModel({ base, funnel, upper }: PotYaml): PotModel {
  const sealedVolumeM3 = millilitresToM3(base.sealed_volume_ml);
  const baseInnerDiameterM = millimetresToM(base.inner_diameter_mm);
  return {
    sealedVolumeM3,
    baseInnerDiameterM,
    valveHeightM: millimetresToM(base.valve_height_mm),
    valveOpeningGaugePa: barToPa(base.valve_opening_bar ?? ASSUMED_VALVE_OPENING_BAR),
    baseMaterial: base.material,
    baseMassKg: gramsToKg(base.mass_g),
    basketDiameterM: millimetresToM(funnel.basket_diameter_mm),
    basketDepthM: millimetresToM(funnel.basket_depth_mm),
    tubeInnerDiameterM: millimetresToM(funnel.tube_inner_diameter_mm),
    tubeGapM: millimetresToM(funnel.tube_gap_mm),
    spoutHeightM: millimetresToM(upper.spout_height_mm),
    upperCapacityM3: millilitresToM3(upper.capacity_ml),
    heatLossWPerK:
      base.heat_loss_w_per_k ?? defaultHeatLossWPerK(sealedVolumeM3, baseInnerDiameterM),
  };
}

export function buildPot(file: ValidFile<PotFileYaml>): Checked<PotEntry> {
  const lengths = writtenLengths(file);
  const data = inMillimetres(file.data, lengths);
  const model = potModel(data);
  const issues = geometryIssues(file, data, lengths, model);
  if (issues.length > 0) return { issues };
  const { base } = data;
  const entry: PotEntry = {
    kind: 'pot',
    id: file.id,
    name: file.data.name,
    source: refAt(file.source, []),
    hash: file.hash,
    cups: file.data.cups,
    model,
    valveOpeningAssumed: base.valve_opening_bar === undefined,
    inductionReady: base.material === 'stainless-steel' || base.induction_plate === true,
  };
  return { value: entry, issues: [] };
}
