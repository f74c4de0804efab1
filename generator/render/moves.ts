/** The troubleshooting page's "which input moves what" table: planning's facts, worded and formatted. */
import type { UnitSystem } from '../content/types.ts';
import type { MoveCode, MoveFacts } from '../planning/sensitivity.ts';
import type { Messages } from '../words/catalogue.ts';
import { clock, pressure, share, temperature } from './format.ts';
import type { MoveRow, MovesView } from './site-view.ts';
import { asVoice, type Voice } from './voice.ts';

function changeWords(moves: Messages['troubleshooting']['moves']): Record<MoveCode, string> {
  return {
    baseline: moves.baseline,
    finer: moves.finer,
    coarser: moves.coarser,
    'less-water': moves.lessWater,
    'less-heat': moves.lessHeat,
    'more-heat': moves.moreHeat,
    'cold-start': moves.coldStart,
  };
}

export function movesView(
  rows: readonly MoveFacts[],
  names: { readonly pot: string; readonly coffee: string; readonly stove: string },
  voice: Voice | UnitSystem,
  /** The card's entry ids (which of a binder's cards the table is for). */
  ids: { readonly potId: string; readonly coffeeId: string; readonly stoveId: string },
): MovesView {
  const units = asVoice(voice);
  const troubleshootingWords = units.words.troubleshooting;
  const changes = changeWords(troubleshootingWords.moves);
  return {
    card: { ...ids, ...names },
    heading: troubleshootingWords.movesHeading,
    intro: troubleshootingWords.movesIntro(names.pot, names.coffee, names.stove),
    columns: troubleshootingWords.movesColumns,
    rows: rows.map((row): MoveRow => ({
      code: row.change,
      change: changes[row.change],
      firstCoffee:
        row.firstCoffeeS === null ? troubleshootingWords.noCoffee : clock(row.firstCoffeeS),
      meanTemperature: row.meanK === null ? '—' : temperature(row.meanK, units).text,
      inBand: row.inBandShare === null ? '—' : share(row.inBandShare, units).text,
      peak: pressure(row.peakGaugePa, units).text,
    })),
  };
}
