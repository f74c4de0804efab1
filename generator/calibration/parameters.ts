/**
 * The quantities a brew log can calibrate, each with its prior (the entry's current value)
 * and the range the search may explore (the range the entry's schema accepts, so a fitted
 * value can always be written back):
 *   permeability  the coffee bed's Darcy permeability k, m²       → coffees/<id>.yaml permeability_m2
 *   heat          heat reaching the pot at one stove level, W     → stoves/<id>.yaml levels[i].heat_to_pot_w
 *   heat-loss     the base's heat-loss coefficient U·A, W/K       → pots/<id>.yaml base.heat_loss_w_per_k
 *   tightening    the bed's final share f of its first permeability
 *                 (a candidate only when the coffee turns the
 *                 tightening on, ../brew/bed.ts)                   → coffees/<id>.yaml bed.tightening.final_share
 * The fit works on their natural logarithms, so they stay positive and a step means the
 * same relative change whatever the unit.
 */
import { ASSUMED_FINAL_SHARE_SIGMA_LN } from '../brew/bed.ts';
import coffeeSchema from '../content/schemas/coffee.schema.json' with { type: 'json' };
import potSchema from '../content/schemas/pot.schema.json' with { type: 'json' };
import stoveSchema from '../content/schemas/stove.schema.json' with { type: 'json' };
import type { CoffeeEntry, LogEntry, PotEntry, StoveEntry } from '../content/types.ts';

export type ParameterKind = 'permeability' | 'heat' | 'heat-loss' | 'tightening';

export interface Parameter {
  /** `permeability`, `heat:<level>`, `heat-loss`, `tightening`. */
  readonly id: string;
  readonly kind: ParameterKind;
  /** The stove level, for kind 'heat'. */
  readonly level?: string;
  /** The entry's current value, SI. */
  readonly prior: number;
  /** Range the search may explore, SI. */
  readonly min: number;
  readonly max: number;
  /**
   * How far the prior may be off, as σ of ln(value): what propagates into the fitted
   * parameters' σ while this one is held at its prior. Assumed values (a grind-derived
   * permeability: ×/÷ 2; heat from a default efficiency: ±30 %; the default U·A: ±30 %)
   * or measured ones (an entry's own value: 15 %; a fitted heat: 5 %). Our choices.
   */
  readonly priorSigmaLn: number;
}

/** The values one simulation needs, SI. */
export interface ModelValues {
  readonly permeabilityM2: number;
  readonly heatW: ReadonlyMap<string, number>;
  readonly heatLossWPerK: number;
  /** The bed's final share (tightening on), or null: the coffee's bed as it is. */
  readonly finalShare: number | null;
}

const RANGE = {
  permeability: range(coffeeSchema.properties.permeability_m2),
  heat: range(stoveSchema.properties.levels.items.properties.heat_to_pot_w),
  'heat-loss': range(potSchema.properties.base.properties.heat_loss_w_per_k),
  tightening: range(coffeeSchema.properties.bed.properties.tightening.properties.final_share),
} as const;

function range(spec: { minimum: number; maximum: number }): { min: number; max: number } {
  return { min: spec.minimum, max: spec.maximum };
}

/**
 * The candidate parameters of a log: the coffee's permeability, one heat per stove level
 * the log uses (in the stove's order, gentlest first), and the pot's U·A.
 */
export function candidateParameters(
  log: LogEntry,
  pot: PotEntry,
  coffee: CoffeeEntry,
  stove: StoveEntry,
): Parameter[] {
  const used = new Set(log.brews.map((brew) => brew.level));
  const heats = stove.levels
    .filter((level) => used.has(level.label))
    .map((level) => ({
      id: `heat:${level.label}`,
      kind: 'heat' as const,
      level: level.label,
      prior: level.heatToPotW,
      ...RANGE.heat,
      priorSigmaLn: level.fitted ? 0.05 : stove.efficiencyAssumed ? 0.3 : 0.15,
    }));
  return [
    {
      id: 'permeability',
      kind: 'permeability',
      prior: coffee.bed.permeabilityM2,
      ...RANGE.permeability,
      priorSigmaLn: coffee.permeabilityAssumed ? Math.LN2 : 0.15,
    },
    ...heats,
    {
      id: 'heat-loss',
      kind: 'heat-loss',
      prior: pot.model.heatLossWPerK,
      ...RANGE['heat-loss'],
      priorSigmaLn: 0.3,
    },
    // Only a coffee that turns the tightening on has it to fit (off by default: the
    // classic bed has no such parameter). A share the entry states: ±30 %, our choice;
    // one `fit --write` measured: its σ.
    ...(coffee.bed.tightening
      ? [
          {
            id: 'tightening',
            kind: 'tightening' as const,
            prior: coffee.bed.tightening.finalShare,
            ...RANGE.tightening,
            priorSigmaLn: coffee.tighteningProvenance?.sigmaRel ?? ASSUMED_FINAL_SHARE_SIGMA_LN,
          },
        ]
      : []),
  ];
}

/** The model values with `parameters[i]` set to `values[i]`. */
export function modelValues(
  parameters: readonly Parameter[],
  values: readonly number[],
): ModelValues {
  let permeabilityM2 = NaN;
  let heatLossWPerK = NaN;
  let finalShare: number | null = null;
  const heatW = new Map<string, number>();
  parameters.forEach((parameter, i) => {
    const value = values[i]!;
    if (parameter.kind === 'permeability') permeabilityM2 = value;
    else if (parameter.kind === 'heat-loss') heatLossWPerK = value;
    else if (parameter.kind === 'tightening') finalShare = value;
    else heatW.set(parameter.level!, value);
  });
  return { permeabilityM2, heatW, heatLossWPerK, finalShare };
}
