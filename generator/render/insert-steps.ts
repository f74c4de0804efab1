/**
 * The insert's numbered steps for a stranger, and its heat setting in plain words.
 *
 * The steps print the plan's own numbers, already formatted for the insert's rows
 * (card-view.ts insertRow): a number appears in a step only when every row of the table
 * prints the same text for it; otherwise the step points at the table's column. Nothing
 * is computed here beyond that choice, so the step and the table can never disagree.
 */
import type { StoveEntry } from '../content/types.ts';
import type { HeatFeel } from '../words/card.ts';
import { asVoice, type Voice } from './voice.ts';
import { INSERT_STEP_ORDER, pictogramSvg, type InsertStepCode } from './pictograms.ts';

export interface InsertStep {
  /** 1-based, in the order a person works. */
  readonly n: number;
  readonly code: InsertStepCode;
  readonly text: string;
  /** Our own line drawing of the step (pictograms.ts), decorative. */
  readonly pictogramSvg: string;
}

/** What the steps read from the table's rows (the printed texts, not numbers). */
export interface StepRowTexts {
  readonly start: string;
  /** True when the row's water is at room temperature (no kettle). */
  readonly room: boolean;
  readonly fill: string;
  readonly dose: string;
  readonly setting: string;
  readonly offHeat: string;
}

export interface StepColumns {
  readonly start: string;
  readonly fill: string;
  readonly dose: string;
  readonly level: string;
  readonly offHeat: string;
}

/**
 * How strong a level is, from its power as a share of the stove's strongest level
 * (about a third of it or less gentle, up to about two thirds medium, above that strong,
 * the top level full). Common practice, no source: cookbooks say "gentle", "medium",
 * "strong" for these thirds of a knob's range.
 */
export function heatFeel(
  stove: { readonly levels: readonly Pick<StoveEntry['levels'][number], 'powerW'>[] },
  levelIndex: number,
): HeatFeel {
  const top = Math.max(...stove.levels.map((level) => level.powerW));
  const share = (stove.levels[levelIndex]?.powerW ?? top) / top;
  if (levelIndex === stove.levels.length - 1 || share >= 0.95) return 'full';
  if (share <= 0.35) return 'gentle';
  if (share <= 0.65) return 'medium';
  return 'strong';
}

/**
 * Whether a knob label needs the heat said in words beside it: a number or code ("2",
 * "P5") does; a label that is words already ("low", "simmer") does not, and a second word
 * would contradict it where the maker's "low" is a medium share of a strong burner
 * ("low · medium heat"). Our own rule.
 */
export function labelNeedsFeel(label: string): boolean {
  return /\d/.test(label);
}

/** The one text every row prints, or null when they differ (or there are no rows). */
function common(texts: readonly string[]): string | null {
  return texts.length > 0 && texts.every((t) => t === texts[0]) ? texts[0]! : null;
}

/** The seven steps of an insert whose table shows `rows` (its rows with a recipe). */
export function insertSteps(
  rows: readonly StepRowTexts[],
  columns: StepColumns,
  voice?: Voice,
): InsertStep[] {
  const words = asVoice(voice).words.card.insert.steps;
  const allRoom = rows.length > 0 && rows.every((r) => r.room);
  const heated = rows.filter((r) => !r.room);
  const kettle = allRoom
    ? words.roomWater
    : words.kettle(
        heated.length === rows.length ? common(heated.map((r) => r.start)) : null,
        columns.start,
      );
  const texts: Record<InsertStepCode, string> = {
    kettle,
    fill: words.fill(common(rows.map((r) => r.fill)), columns.fill),
    basket: words.basket(common(rows.map((r) => r.dose)), columns.dose),
    seal: words.seal,
    heat: words.heat(common(rows.map((r) => r.setting)), columns.level),
    time: words.time(common(rows.map((r) => r.offHeat)), columns.offHeat),
    cool: words.cool,
  };
  return INSERT_STEP_ORDER.map((code, i) => ({
    n: i + 1,
    code,
    text: texts[code],
    pictogramSvg: pictogramSvg(code),
  }));
}
