/** The three kinds of heat an insert card is laid out by, and which stove kinds fall in each. */
import type { StoveKind } from './types.ts';

export type HeatKind = 'gas' | 'electric' | 'induction';

export const heatKindOf: Record<StoveKind, HeatKind> = {
  gas: 'gas',
  'electric-coil': 'electric',
  radiant: 'electric',
  induction: 'induction',
};
