/**
 * A training binder's exercises (a set with `layout: binder`): practical tasks on the
 * binder's own cards, for its PDF (render/pdf/binder-pages.ts exercisesItems) and its set
 * page (templates/set.njk), which both place this view's strings and nothing else.
 *
 * One number, one source: every number an exercise quotes is a string the card's view
 * already holds (StationCardView: the water, coffee, heat, times and what-to-expect blocks)
 * or a row of the troubleshooting table (MovesView), never formatted again here.
 *
 * Which card each exercise uses, of the binder's cards with a recipe, in the set's order:
 *   1 cold water against hot   the first;
 *   2 one step finer           the troubleshooting table's own card when the binder holds
 *                              it, else the first (the table then named as another card's);
 *                              left out when the site has no table;
 *   3 the fill line and valve  the first of another pot than exercise 1's, else the first;
 *   4 three brews on the log   the last (another combination than exercise 1's when the
 *                              binder has two).
 */
import type { Messages } from '../words/catalogue.ts';
import type { ExerciseCardFacts, ExerciseText } from '../words/binder.ts';
import type { StationCardView, StationRecipe } from './card-view.ts';
import type { MovesView } from './site-view.ts';
import type { Voice } from './voice.ts';

export interface ExerciseView extends ExerciseText {
  /** The card the exercise uses, as the contents names it. */
  readonly card: string;
}

export interface ExercisesView {
  readonly title: string;
  readonly intro: string;
  readonly labels: {
    readonly card: string;
    readonly goal: string;
    readonly steps: string;
    readonly record: string;
    readonly good: string;
    readonly safety: string;
  };
  readonly exercises: readonly ExerciseView[];
}

type WithRecipe = StationCardView & { readonly recipe: StationRecipe };

/** The card's own strings for an exercise's words. */
function cardFacts(card: WithRecipe, words: Messages): ExerciseCardFacts {
  const r = card.recipe;
  const [yieldRow] = r.expect.rows;
  if (yieldRow?.label !== words.card.expect.yield)
    throw new Error(`exercises: card ${card.id} has no "${words.card.expect.yield}" row first`);
  return {
    card: words.pdf.contents.station(card.title, card.subtitle),
    pot: card.potName,
    temperature: r.water.temperature.text,
    fill: r.water.fillVolume.text,
    fillMass: r.water.fillMassText,
    dose: r.coffee.dose.text,
    level: r.heat.level,
    firstCoffee: r.timings.firstCoffee.text,
    offHeat: r.timings.offHeat.text,
    yield: yieldRow.value,
  };
}

/** The card's "Brewed at <band>" row as it prints (the second of what to expect). */
function inBandRow(card: WithRecipe): { readonly label: string; readonly value: string } {
  const row = card.recipe.expect.rows[1];
  if (!row) throw new Error(`exercises: card ${card.id} has no in-band row`);
  return row;
}

/**
 * The exercises of a binder whose cards are `cards` (in the set's order), in the set's
 * voice; `moves` is the troubleshooting table the binder prints (null when there is none).
 */
export function exercisesView(
  cards: readonly StationCardView[],
  moves: MovesView | null,
  voice: Voice,
): ExercisesView {
  const words = voice.words;
  const ex = words.binder.exercises;
  const view = (title: string, intro: string, exercises: ExerciseView[]): ExercisesView => ({
    title,
    intro,
    labels: {
      card: ex.cardLabel,
      goal: ex.goalLabel,
      steps: ex.stepsLabel,
      record: ex.recordLabel,
      good: ex.goodLabel,
      safety: ex.safetyLabel,
    },
    exercises,
  });
  const brewing = cards.filter((card): card is WithRecipe => card.recipe !== null);
  const first = brewing[0];
  if (!first) return view(ex.title, ex.none, []);
  const facts = (card: WithRecipe) => cardFacts(card, words);
  const on = (card: WithRecipe, text: ExerciseText): ExerciseView => ({
    ...text,
    card: facts(card).card,
  });

  const out: ExerciseView[] = [on(first, ex.hotCold(facts(first), inBandRow(first)))];

  const baseline = moves?.rows.find((row) => row.code === 'baseline');
  const finer = moves?.rows.find((row) => row.code === 'finer');
  if (moves && baseline && finer) {
    const own = brewing.find(
      (card) =>
        card.potId === moves.card.potId &&
        card.coffeeId === moves.card.coffeeId &&
        card.stoveId === moves.card.stoveId,
    );
    const card = own ?? first;
    out.push(
      on(
        card,
        ex.finer(
          facts(card),
          baseline,
          finer,
          own ? null : ex.tableCard(moves.card.coffee, moves.card.pot, moves.card.stove),
        ),
      ),
    );
  }

  const otherPot = brewing.find((card) => card.potId !== first.potId) ?? first;
  out.push(on(otherPot, ex.fillLine(facts(otherPot), otherPot.recipe.water.fillLineText)));

  const last = brewing[brewing.length - 1]!;
  out.push(on(last, ex.logThree(facts(last), words.binder.logSheet.title)));

  return view(ex.title, ex.intro, out);
}
