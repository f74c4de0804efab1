/**
 * Words of the print jobs (issue 12): what a set page says about the combinations it left
 * out. Each sentence is a function of facts (counts and codes); the short reasons are the
 * ones the insert rows use (cardWords.refusal.short), so one refusal reads the same
 * everywhere.
 *
 * Not yet in the language catalogue (en.ts): a second catalogue would need these too.
 */
import type { RefusalCode } from '../planning/types.ts';
import { cardWords } from './card.ts';

const plural = (n: number, one: string, many: string): string =>
  n === 1 ? `one ${one}` : `${n} ${many}`;

export const printWords = {
  /** A binder set's kind, on the index and its page (beside "Station cards", "Bag inserts"). */
  binderLabel: 'Training binder',
  /**
   * A set page's note on the pot × coffee combinations it left out because none of them
   * gets a recipe, with how many of each reason ("2 × base does not work on induction").
   */
  leftOut: (codes: readonly RefusalCode[]): string | null => {
    if (codes.length === 0) return null;
    const counts = new Map<RefusalCode, number>();
    for (const code of codes) counts.set(code, (counts.get(code) ?? 0) + 1);
    const reasons = [...counts.entries()]
      .map(([code, n]) => `${n} × ${cardWords.refusal.short[code]}`)
      .join('; ');
    const what = plural(codes.length, 'combination', 'combinations');
    return `Left out of this set: ${what} of pot and coffee that would get no recipe (${reasons}).`;
  },
} as const;
