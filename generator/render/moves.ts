/** The troubleshooting page's "which input moves what" table: planning's facts, worded and formatted. */
import type { UnitSystem } from '../content/types.ts';
import type { MoveCode, MoveFacts } from '../planning/sensitivity.ts';
import { troubleshootingWords } from '../words/card.ts';
import { clock, pressure, share, temperature } from './format.ts';
import type { MoveRow, MovesView } from './site-view.ts';

const changeWords: Record<MoveCode, string> = {
  baseline: troubleshootingWords.moves.baseline,
  finer: troubleshootingWords.moves.finer,
  coarser: troubleshootingWords.moves.coarser,
  'less-water': troubleshootingWords.moves.lessWater,
  'less-heat': troubleshootingWords.moves.lessHeat,
  'more-heat': troubleshootingWords.moves.moreHeat,
  'cold-start': troubleshootingWords.moves.coldStart,
};

export function movesView(
  rows: readonly MoveFacts[],
  names: { readonly pot: string; readonly coffee: string; readonly stove: string },
  units: UnitSystem,
): MovesView {
  return {
    heading: troubleshootingWords.movesHeading,
    intro: troubleshootingWords.movesIntro(names.pot, names.coffee, names.stove),
    columns: troubleshootingWords.movesColumns,
    rows: rows.map((row): MoveRow => ({
      change: changeWords[row.change],
      firstCoffee:
        row.firstCoffeeS === null ? troubleshootingWords.noCoffee : clock(row.firstCoffeeS),
      meanTemperature: row.meanK === null ? '—' : temperature(row.meanK, units).text,
      inBand: row.inBandShare === null ? '—' : share(row.inBandShare).text,
      peak: pressure(row.peakGaugePa, units).text,
    })),
  };
}
