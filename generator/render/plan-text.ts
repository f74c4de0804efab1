/**
 * A plan's refusal and warnings in words: the planner's codes and SI facts formatted in
 * the output's unit system (format.ts) and put into sentences (generator/words/plan.ts).
 * The CLI and the card views both speak through here, so a card and `stovecard plan`
 * say the same thing.
 */
import type { UnitSystem } from '../content/types.ts';
import type { AcceptedPlan, CheckedQuantity, PlanWarning, Refusal } from '../planning/types.ts';
import type { RefusalText } from '../words/plan.ts';
import {
  altitude,
  fillVolume,
  lengthDown,
  pressure,
  quantity,
  share,
  temperature,
  temperatureBand,
  waterVolume,
  type NumberStyle,
} from './format.ts';
import { asVoice, type Voice } from './voice.ts';

export function refusalText(refusal: Refusal, voice: Voice | UnitSystem): RefusalText {
  const v = asVoice(voice);
  const planWords = v.words.plan;
  const units = v;
  switch (refusal.code) {
    case 'induction-needs-magnetic-base':
      return planWords.inductionNeedsMagneticBase(refusal.facts.potName);
    case 'fill-above-valve': {
      const f = refusal.facts;
      return planWords.fillAboveValve(
        waterVolume(f.askedM3, units).text,
        fillVolume(f.limitM3, units).text,
        lengthDown(f.marginM, units).text,
      );
    }
    case 'pressure-near-valve': {
      const f = refusal.facts;
      return planWords.pressureNearValve(
        pressure(f.peakPa, units).text,
        pressure(f.valvePa, units).text,
        f.grind,
      );
    }
    case 'no-delivery':
      return planWords.noDelivery();
    case 'no-plan-fits': {
      const f = refusal.facts;
      return planWords.noPlanFits(seconds(f.lowS, v), seconds(f.highS, v), f.tooFast);
    }
  }
}

export function warningText(warning: PlanWarning, voice: Voice | UnitSystem): string {
  const v = asVoice(voice);
  const planWords = v.words.plan;
  const units = v;
  switch (warning.code) {
    case 'outside-checked-range': {
      const f = warning.facts;
      const say = (v: number): string => checkedValue(f.quantity, v, units);
      return planWords.outsideCheckedRange(f.quantity, say(f.value), say(f.low), say(f.high));
    }
    case 'cool-cup':
      return planWords.coolCup(share(warning.facts.inBandShare, v).text);
    case 'small-fill':
      return planWords.smallFill();
  }
}

const seconds = (s: number, style: NumberStyle): string => quantity(s, 0, 's', style).text;

/** A checked input in the output's units, to three significant digits where it has no unit choice. */
function checkedValue(what: CheckedQuantity, value: number, units: NumberStyle): string {
  switch (what) {
    case 'permeabilityM2':
      return `${value.toPrecision(2).replace('.', units.decimal)}\u00a0m²`;
    case 'heatToPotW':
      return quantity(value, 0, 'W', units).text;
    case 'altitudeM':
      return altitude(value, units).text;
    case 'sealedVolumeM3':
      return waterVolume(value, units).text;
    case 'ambientK':
      return temperature(value, units).text;
  }
}

/** The binding cause's facts, formatted once here and said by words/card.ts. */
export function bindingCauseText(plan: AcceptedPlan, voice: Voice | UnitSystem): string {
  const units = asVoice(voice);
  const cause = plan.bindingCause!;
  const f = cause.facts;
  const opt = <T>(v: T | undefined, fmt: (v: T) => object): object =>
    v === undefined ? {} : fmt(v);
  return units.words.card.expect.bindingCause(cause.code, {
    share: share(f.share, units).text,
    band: temperatureBand([f.bandLowK, f.bandHighK], units),
    mean: temperature(f.meanK, units).text,
    delivery: `${Math.round(f.deliveryS)} s`,
    window: `${Math.round(f.windowLowS)}–${Math.round(f.windowHighS)} s`,
    cups: String(f.cups ?? ''),
    ...opt(f.gentlestW, (w) => ({ gentlest: `${Math.round(w)} W into the pot` })),
    ...opt(f.shareAtHalfHeat, (v) => ({ shareAtHalfHeat: share(v, units).text })),
    ...opt(f.shareAtHalfPermeability, (v) => ({ shareAtHalfPermeability: share(v, units).text })),
    ...opt(f.shareIfAllowed, (v) => ({ shareIfAllowed: share(v, units).text })),
    ...opt(f.highCornerGaugePa, (v) => ({ highCorner: pressure(v, units).text })),
    ...opt(f.limitGaugePa, (v) => ({ limit: pressure(v, units).text })),
  });
}
