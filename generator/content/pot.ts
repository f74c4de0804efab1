/**
 * A pot file (content/pots/<id>.yaml) → PotEntry: the geometry checks a schema cannot make,
 * the defaults for what the file leaves out, and the conversion to SI.
 */
import { potGeometry } from '../brew/geometry.ts';
import type { BaseMaterial, PotModel } from '../brew/types.ts';
import { message } from './messages.ts';
import type { Checked, ValidFile } from './entry-file.ts';
import type { ContentIssue } from './issues.ts';
import { ASSUMED_VALVE_OPENING_BAR, defaultHeatLossWPerK } from './pot-defaults.ts';
import type { PotEntry } from './types.ts';
import { barToPa, gramsToKg, millilitresToM3, millimetresToM } from './units.ts';
import { issueAt, refAt } from './yaml-source.ts';

/** The pot file as written (trade units), once it matches schemas/pot.schema.json. */
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
function geometryIssues({ source, data }: ValidFile<PotYaml>, model: PotModel): ContentIssue[] {
  const { base, funnel, upper } = data;
  const { baseHeightM, bedTopM } = potGeometry(model);
  const baseHeightMm = baseHeightM * 1e3;
  const bedTopMm = bedTopM * 1e3;
  const rules = [
    {
      broken: base.valve_height_mm >= baseHeightMm,
      path: ['base', 'valve_height_mm'],
      wording: () => message('valveAboveBase', base.valve_height_mm, baseHeightMm),
    },
    {
      broken: funnel.tube_gap_mm >= base.valve_height_mm,
      path: ['funnel', 'tube_gap_mm'],
      wording: () => message('tubeGapAboveValve', funnel.tube_gap_mm, base.valve_height_mm),
    },
    {
      broken: upper.spout_height_mm <= bedTopMm,
      path: ['upper', 'spout_height_mm'],
      wording: () => message('spoutTooLow', upper.spout_height_mm, bedTopMm),
    },
    {
      broken: funnel.basket_diameter_mm >= base.inner_diameter_mm,
      path: ['funnel', 'basket_diameter_mm'],
      wording: () =>
        message('basketWiderThanBase', funnel.basket_diameter_mm, base.inner_diameter_mm),
    },
    {
      broken: funnel.tube_inner_diameter_mm >= funnel.basket_diameter_mm,
      path: ['funnel', 'tube_inner_diameter_mm'],
      wording: () =>
        message('tubeWiderThanBasket', funnel.tube_inner_diameter_mm, funnel.basket_diameter_mm),
    },
  ];
  return rules
    .filter((rule) => rule.broken)
    .map((rule) => issueAt(source, rule.path, 'geometry', rule.wording()));
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

export function buildPot(file: ValidFile<PotYaml>): Checked<PotEntry> {
  const model = potModel(file.data);
  const issues = geometryIssues(file, model);
  if (issues.length > 0) return { issues };
  const { base } = file.data;
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
