/// <reference lib="dom" />
/**
 * The customer's page, in the browser (bundled by generator/pipeline/browser-bundle.ts into
 * assets/planner.js). It plans the page's coffee for the pot, stove and kettle in the form
 * with the build's own code: the content checks (entry-text.ts, pot.ts, stove.ts), the
 * planner (planning/plan.ts), the plan's --json fields (render/plan-json.ts), the card's
 * view (render/card-view.ts) and markup (render/card-html.ts). So for the same inputs it
 * shows what `stovecard plan` prints and the card the build would print.
 *
 * The form's values live in the page's address (?cups=3&stove=bar-gas…): a recipe can be
 * bookmarked or sent. The brew timer writes a log entry `stovecard fit` reads.
 * The script asks nothing of the network: its data is in the page (#planner-data).
 */
import { validText } from '../content/entry-text.ts';
import { brewLogYaml, ownPotYaml, ownStoveYaml, type StovePower } from '../content/own-entries.ts';
import { buildPot, type PotFileYaml } from '../content/pot.ts';
import { buildStove } from '../content/stove.ts';
import type { ContentIssue } from '../content/issues.ts';
import type {
  Catalogue,
  CoffeeEntry,
  PotEntry,
  SiteEntry,
  StoveEntry,
  StoveKind,
} from '../content/types.ts';
import { planCard } from '../planning/plan.ts';
import type { CardPlan } from '../planning/types.ts';
import { stationCardHtml } from '../render/card-html.ts';
import { stationCardView } from '../render/card-view.ts';
import { dose, fillVolume, temperature, timeRange, waterVolume } from '../render/format.ts';
import { planJson } from '../render/plan-json.ts';
import { refusalText } from '../render/plan-text.ts';
import type { AnswerField, PlannerData } from '../render/planner-view.ts';
import {
  fromCelsius,
  fromFahrenheit,
  M_PER_FT,
  ML_PER_US_FL_OZ,
  toCelsius,
  toFahrenheit,
  toFlOz,
  toMl,
} from '../units.ts';
import { wording } from '../words/content.ts';
import { plannerWords as words } from '../words/planner.ts';

type Form = HTMLFormElement;

const OWN = 'own';
const OWN_POT_ID = 'your-pot';
const OWN_STOVE_ID = 'your-stove';
/** The same ranges `stovecard plan` allows for --altitude-m (cli/plan.ts). */
const ALTITUDE_M = { min: -500, max: 5000 } as const;

interface Planned {
  readonly plan: CardPlan;
  readonly pot: PotEntry;
  readonly stove: StoveEntry;
}

class FieldProblems {
  readonly byField = new Map<string, string>();
  add(field: string, text: string): void {
    if (!this.byField.has(field)) this.byField.set(field, text);
  }
  addIssues(issues: readonly ContentIssue[], fallbackField: string): void {
    for (const issue of issues) {
      const { problem, fix } = wording(issue.message);
      const leaf =
        issue.field
          .split('.')
          .pop()
          ?.replace(/\[\d+\]$/, '') ?? '';
      this.add(leaf === '' ? fallbackField : leaf, `${problem}. ${fix}`);
    }
  }
}

function value(form: Form, name: string): string {
  const control = form.elements.namedItem(name) as HTMLInputElement | HTMLSelectElement | null;
  return control ? control.value : '';
}

function fieldValues(form: Form): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, v] of new FormData(form).entries()) out[key] = String(v);
  return out;
}

/** The site's pot of the chosen size, or the customer's own from its measures. */
function chosenPot(form: Form, data: PlannerData, units: 'metric' | 'us', problems: FieldProblems) {
  const cups = value(form, 'cups');
  if (cups !== OWN) return data.pots.find((pot) => String(pot.cups) === cups) ?? data.pots[0]!;
  // An empty field is said in the form's words (once the customer has been at it; until
  // every one is filled a general line asks for them); a value written wrong gets the
  // build's own message.
  const empty = [
    ...form.querySelectorAll<HTMLInputElement>('fieldset[data-when="own-pot"] input[required]'),
  ].filter((control) => control.value.trim() === '');
  for (const control of empty)
    if (control.dataset.touched) problems.add(control.name, words.form.missing);
  if (empty.length > 0) {
    problems.add('', words.form.fillIn);
    return undefined;
  }
  const text = ownPotYaml(words.pot.ownName, value(form, 'own_cups'), fieldValues(form), units);
  const valid = validText<PotFileYaml>('pot', text, 'form', OWN_POT_ID, words.pot.ownName);
  if (!valid.value) return problems.addIssues(valid.issues, 'own_cups');
  const built = buildPot(valid.value);
  if (!built.value) return problems.addIssues(built.issues, 'own_cups');
  return built.value;
}

function chosenStove(form: Form, data: PlannerData, problems: FieldProblems) {
  const id = value(form, 'stove');
  if (id !== OWN) return data.stoves.find((stove) => stove.id === id) ?? data.stoves[0]!;
  const kind = value(form, 'stove_kind') as StoveKind;
  const power = value(form, 'stove_power') as StovePower;
  const text = ownStoveYaml(words.stove.ownName(kind, power), kind, power);
  const valid = validText<Parameters<typeof buildStove>[0]['data']>(
    'stove',
    text,
    'form',
    OWN_STOVE_ID,
    words.stove.own,
  );
  if (!valid.value) return problems.addIssues(valid.issues, 'stove_kind');
  const built = buildStove(valid.value);
  if (!built.value) return problems.addIssues(built.issues, 'stove_kind');
  return built.value;
}

function numberList(text: string): number[] | null {
  const parts = text.split(',').map((part) => part.trim());
  if (parts.length === 1 && parts[0] === '') return [];
  const numbers: number[] = parts.map(Number);
  return parts.some((p) => p === '') || numbers.some((n) => !Number.isFinite(n)) ? null : numbers;
}

function plan(form: Form, data: PlannerData, problems: FieldProblems): Planned | null {
  const units = data.site.units;
  const pot = chosenPot(form, data, units, problems);
  const stove = chosenStove(form, data, problems);
  const presetsName = units === 'us' ? 'kettle_presets_f' : 'kettle_presets_c';
  const presets = numberList(value(form, presetsName));
  if (presets === null) problems.add(presetsName, words.form.badList(value(form, presetsName)));
  const altitudeName = units === 'us' ? 'altitude_ft' : 'altitude_m';
  const altitudeRaw = value(form, altitudeName).trim();
  const altitudeInput = altitudeRaw === '' ? null : Number(altitudeRaw);
  const altitudeM =
    altitudeInput === null
      ? data.site.room.altitudeM
      : units === 'us'
        ? altitudeInput * M_PER_FT
        : altitudeInput;
  if (!Number.isFinite(altitudeM) || altitudeM < ALTITUDE_M.min || altitudeM > ALTITUDE_M.max)
    problems.add(altitudeName, words.form.badAltitude(altitudeRaw, units));
  if (!pot || !stove || presets === null || problems.byField.size > 0) return null;
  const toK = units === 'us' ? fromFahrenheit : fromCelsius;
  const result = planCard({
    pot,
    coffee: data.coffee,
    stove,
    room: { ambientK: data.site.room.ambientK, altitudeM },
    kettlePresetsK: presets.map((v) => toK(v)).sort((a, b) => a - b),
  });
  return { plan: result, pot, stove };
}

/** A short, stable fingerprint of the page's choices, for the card's footer (FNV-1a). */
function fingerprint(text: string): string {
  let hash = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    hash ^= text.charCodeAt(i);
    hash = Math.imul(hash, 0x01000193) >>> 0;
  }
  return hash.toString(16).padStart(8, '0');
}

function catalogueOf(data: PlannerData, planned: Planned, coffee: CoffeeEntry): Catalogue {
  const site = {
    ...data.site,
    kind: 'site',
    source: { file: 'site', line: 1, column: 1 },
    hash: '',
    sets: [],
  } as unknown as SiteEntry;
  return {
    contentDir: '',
    site,
    pots: new Map([[planned.pot.id, planned.pot]]),
    coffees: new Map([[coffee.id, coffee]]),
    stoves: new Map([[planned.stove.id, planned.stove]]),
    logs: new Map(),
  };
}

/** The visible text of an answer row, in the page's units; its data-value is the --json value. */
function answerText(field: AnswerField, p: CardPlan, units: 'metric' | 'us'): string {
  if (p.refused !== null) return field === 'refused' ? refusalText(p.refused, units).reason : '—';
  switch (field) {
    case 'startC':
      return temperature(p.startK, units).text;
    case 'fillMl':
      return fillVolume(p.fillM3, units).text;
    case 'doseG':
      return dose(p.doseKg, units).text;
    case 'level':
      return String(p.levelLabel);
    case 'firstCoffeeS':
      return timeRange(p.firstCoffeeS.lowS, p.firstCoffeeS.highS).text;
    case 'offHeatS':
      return timeRange(p.offHeatS.lowS, p.offHeatS.highS).text;
    case 'yieldMl':
      return waterVolume(p.yieldM3, units).text;
    case 'refused':
      return '—';
  }
}

function showProblems(form: Form, problems: FieldProblems, box: HTMLElement): void {
  for (const control of Array.from(form.elements) as HTMLInputElement[]) {
    if (!control.name) continue;
    const text = problems.byField.get(control.name);
    const note = document.getElementById(`problem-${control.name}`);
    control.toggleAttribute('aria-invalid', text !== undefined);
    if (note) {
      note.textContent = text ?? '';
      note.hidden = text === undefined;
    }
  }
  const unplaced = [...problems.byField.entries()].filter(
    ([field]) => !document.getElementById(`problem-${field}`),
  );
  const general = problems.byField.get('');
  const placed = problems.byField.size - (general === undefined ? 0 : 1) - unplaced.length;
  box.textContent =
    problems.byField.size === 0
      ? ''
      : [
          ...(placed > 0 ? [words.answer.fixFirst] : []),
          ...unplaced.map(([field, text]) => (field === '' ? text : `${field}: ${text}`)),
        ].join(' ');
}

function syncSections(form: Form): void {
  const ownPot = value(form, 'cups') === OWN;
  const ownStove = value(form, 'stove') === OWN;
  for (const el of document.querySelectorAll<HTMLElement>('[data-when="own-pot"]'))
    el.hidden = !ownPot;
  for (const el of document.querySelectorAll<HTMLElement>('[data-when="own-stove"]'))
    el.hidden = !ownStove;
  // Hidden sections take no part in the address or the checks.
  for (const section of document.querySelectorAll<HTMLFieldSetElement>('fieldset[data-when]'))
    section.disabled = section.hidden;
}

function restoreFromAddress(form: Form): void {
  const params = new URLSearchParams(location.search);
  for (const [key, v] of params) {
    const control = form.elements.namedItem(key) as HTMLInputElement | HTMLSelectElement | null;
    if (control && 'value' in control) control.value = v;
  }
}

function writeAddress(form: Form): string {
  const params = new URLSearchParams();
  for (const [key, v] of new FormData(form).entries()) params.set(key, String(v));
  const query = params.toString();
  try {
    history.replaceState(null, '', `${location.pathname}${query ? `?${query}` : ''}`);
  } catch {
    // A page opened from disk may not rewrite its own address in some browsers.
  }
  return query;
}

async function start(): Promise<void> {
  const form = document.getElementById('planner-form') as Form | null;
  const dataElement = document.getElementById('planner-data');
  if (!form || !dataElement) return;
  const data = JSON.parse(dataElement.textContent ?? '{}') as PlannerData;
  const units = data.site.units;
  const answer = document.getElementById('planner-answer')!;
  const cardBox = document.getElementById('planner-card')!;
  const messages = document.getElementById('planner-messages')!;
  // The drawings' labels are measured in the page's own font: wait until it is there.
  await Promise.all(
    ['11px', 'bold 11px', '9px', 'bold 9px'].map((font) =>
      document.fonts.load(`${font} "DejaVu Sans"`).catch(() => []),
    ),
  );
  restoreFromAddress(form);
  let current: Planned | null = null;
  let runs = 0;

  const replan = async (): Promise<void> => {
    const started = performance.now();
    syncSections(form);
    const problems = new FieldProblems();
    const planned = plan(form, data, problems);
    showProblems(form, problems, messages);
    const query = writeAddress(form);
    current = planned;
    const pageCautions = document.getElementById('planner-cautions');
    if (!planned) {
      // No recipe for inputs that are wrong: the last one would not be theirs.
      for (const row of answer.querySelectorAll<HTMLElement>('[data-field]')) {
        row.textContent = '';
        delete row.dataset.value;
      }
      cardBox.replaceChildren();
      if (pageCautions) pageCautions.hidden = false;
      answer.dataset.state = 'invalid';
      answer.dataset.runs = String(++runs);
      return;
    }
    // The card carries the cautions; the page's own are for when there is no card.
    if (pageCautions) pageCautions.hidden = true;
    const json = planJson(planned.plan) as Record<string, unknown>;
    for (const row of answer.querySelectorAll<HTMLElement>('[data-field]')) {
      const field = row.dataset.field as AnswerField;
      row.dataset.value = JSON.stringify(json[field] ?? null);
      row.textContent = answerText(field, planned.plan, units);
    }
    const view = await stationCardView(planned.plan, catalogueOf(data, planned, data.coffee), {
      builtOn: data.builtOn,
      fingerprint: fingerprint(query),
      units,
      paper: data.site.paper,
      language: data.language,
    });
    cardBox.innerHTML = stationCardHtml(view);
    syncTimer(planned, units);
    answer.dataset.state = planned.plan.refused ? 'refused' : 'planned';
    answer.dataset.runs = String(++runs);
    answer.dataset.ms = String(Math.round(performance.now() - started));
    // When the first card was in the page, ms since navigation (bench/planner.ts).
    answer.dataset.at ??= String(Math.round(performance.now()));
  };

  let queued: Promise<void> = Promise.resolve();
  const schedule = () => {
    queued = queued.then(replan).catch((error: unknown) => {
      answer.dataset.state = 'failed';
      console.error(error);
    });
  };
  form.addEventListener('input', (event) => {
    const target = event.target as HTMLElement;
    target.dataset.touched = '1';
    schedule();
  });
  form.addEventListener(
    'blur',
    (event) => ((event.target as HTMLElement).dataset.touched = '1'),
    true,
  );
  form.addEventListener('change', schedule);
  form.addEventListener('submit', (event) => {
    event.preventDefault();
    schedule();
  });
  document.getElementById('planner-print')?.addEventListener('click', () => window.print());
  startTimer(data, () => current);
  schedule();
}

/** The timer's level choices follow the stove; its fields start from the recipe. */
function syncTimer(planned: Planned, units: 'metric' | 'us'): void {
  const timer = document.getElementById('timer-form') as Form | null;
  if (!timer) return;
  const level = timer.elements.namedItem('level') as HTMLSelectElement;
  const labels = planned.stove.levels.map((l) => String(l.label));
  const before = level.value;
  level.replaceChildren(
    ...labels.map((label) => {
      const option = document.createElement('option');
      option.value = label;
      option.textContent = label;
      return option;
    }),
  );
  const p = planned.plan;
  level.value =
    labels.includes(before) && timer.dataset.touched
      ? before
      : p.refused
        ? labels[0]!
        : String(p.levelLabel);
  if (timer.dataset.touched || p.refused) return;
  const us = units === 'us';
  const set = (name: string, v: string) => {
    const control = timer.elements.namedItem(name) as HTMLInputElement | null;
    if (control) control.value = v;
  };
  set(
    us ? 'fill_floz' : 'fill_ml',
    us ? String(Math.floor(toFlOz(p.fillM3) * 10) / 10) : String(Math.floor(toMl(p.fillM3))),
  );
  set(
    us ? 'start_f' : 'start_c',
    String(Math.round(us ? toFahrenheit(p.startK) : toCelsius(p.startK))),
  );
  set(
    us ? 'room_f' : 'room_c',
    String(Math.round(us ? toFahrenheit(p.ambientK) : toCelsius(p.ambientK))),
  );
}

interface TimerState {
  heatOnMs: number | null;
  firstCoffeeS: number | null;
  endS: number | null;
  end: 'sputter' | 'off-heat' | null;
}

function startTimer(data: PlannerData, currentPlan: () => Planned | null): void {
  const timer = document.getElementById('timer-form') as Form | null;
  if (!timer) return;
  const status = document.getElementById('timer-status')!;
  const output = document.getElementById('timer-output') as HTMLTextAreaElement;
  const units = data.site.units;
  const state: TimerState = { heatOnMs: null, firstCoffeeS: null, endS: null, end: null };
  const seconds = () => (state.heatOnMs === null ? 0 : (Date.now() - state.heatOnMs) / 1000);
  timer.addEventListener('input', () => {
    timer.dataset.touched = '1';
    write();
  });

  function write(): void {
    const planned = currentPlan();
    if (state.heatOnMs === null) return void (status.textContent = words.timer.notStarted);
    if (state.end === null || state.endS === null) {
      status.textContent =
        state.firstCoffeeS === null ? words.timer.needFirst : words.timer.needEnd;
      return;
    }
    if (!planned) return;
    const num = (name: string) => Number(value(timer!, name));
    const toC = (v: number) => (units === 'us' ? toCelsius(fromFahrenheit(v)) : v);
    const cup = value(timer!, 'cup_g').trim();
    const yaml = brewLogYaml(
      { pot: planned.pot.id, coffee: data.coffee.id, stove: planned.stove.id },
      {
        level: value(timer!, 'level'),
        fillMl: units === 'us' ? num('fill_floz') * ML_PER_US_FL_OZ : num('fill_ml'),
        startC: toC(num(units === 'us' ? 'start_f' : 'start_c')),
        roomC: toC(num(units === 'us' ? 'room_f' : 'room_c')),
        cupG: cup === '' ? null : Number(cup),
        firstCoffeeS: state.firstCoffeeS,
        endS: state.endS,
        end: state.end,
      },
      planned.plan.altitudeM,
      words.timer.comment(planned.pot.name, data.coffee.name, planned.stove.name),
    );
    output.value = yaml;
    status.textContent =
      planned.pot.id === OWN_POT_ID ? words.timer.ownPotNote : words.timer.stopped;
  }

  const press = (name: string) => {
    const t = seconds();
    switch (name) {
      case 'heat_on':
        Object.assign(state, { heatOnMs: Date.now(), firstCoffeeS: null, endS: null, end: null });
        output.value = '';
        status.textContent = words.timer.needFirst;
        return;
      case 'first_coffee':
        if (state.heatOnMs === null || state.end !== null) break;
        state.firstCoffeeS = t;
        break;
      case 'sputter':
      case 'off_heat':
        if (state.heatOnMs === null || state.end !== null) break;
        state.endS = t;
        state.end = name === 'sputter' ? 'sputter' : 'off-heat';
        break;
      case 'reset':
        Object.assign(state, { heatOnMs: null, firstCoffeeS: null, endS: null, end: null });
        output.value = '';
        break;
    }
    write();
  };
  for (const button of timer.querySelectorAll<HTMLButtonElement>('button[data-press]'))
    button.addEventListener('click', () => press(button.dataset.press!));
  document.getElementById('timer-copy')?.addEventListener('click', async () => {
    output.select();
    try {
      await navigator.clipboard.writeText(output.value);
    } catch {
      document.execCommand('copy');
    }
    status.textContent = words.timer.copied;
  });
  document.getElementById('timer-download')?.addEventListener('click', () => {
    const link = document.createElement('a');
    link.href = URL.createObjectURL(new Blob([output.value], { type: 'text/yaml' }));
    link.download = `brew-${new Date().toISOString().slice(0, 10)}.yaml`;
    link.click();
    URL.revokeObjectURL(link.href);
  });
  timer.addEventListener('submit', (event) => event.preventDefault());
  write();
}

void start();
