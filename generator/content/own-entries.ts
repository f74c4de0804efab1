/**
 * The customer's own pot and stove as content YAML, from the page's form fields: the page
 * then checks and builds them with the content layer's own code (entry-text.ts, pot.ts,
 * stove.ts), so a wrong value gets the message the build gives, and the same text saved
 * as a file gives `stovecard plan` the same recipe (tests/browser/planner.test.ts).
 * Pure: no DOM, so tests and the command line can call it.
 */
import type { StoveKind } from './types.ts';

/** How strong the customer's own stove feels at full (the page's `stove_power` choice). */
export type StovePower = 'gentle' | 'usual' | 'strong';

/** The pot keys the form asks for, by section of a pot entry; `_in` twins replace `_mm` on a US page. */
export const OWN_POT_FIELDS = {
  base: ['sealed_volume_ml', 'inner_diameter_mm', 'valve_height_mm', 'material', 'mass_g'],
  funnel: ['basket_diameter_mm', 'basket_depth_mm', 'tube_inner_diameter_mm', 'tube_gap_mm'],
  upper: ['spout_height_mm', 'capacity_ml'],
} as const;

export type OwnPotField = (typeof OWN_POT_FIELDS)[keyof typeof OWN_POT_FIELDS][number];

/**
 * A field's name on a page in `units`: on a US page lengths are the entry's `_in` keys and
 * volumes are asked in US fluid ounces (`_floz`, converted to the entry's `_ml` keys here).
 */
export function fieldKey(field: OwnPotField, units: 'metric' | 'us'): string {
  return units === 'us' ? field.replace(/_mm$/, '_in').replace(/_ml$/, '_floz') : field;
}

/** 1 US fluid ounce = 29.5735295625 mL (NIST Handbook 44, Appendix C). */
const ML_PER_FLOZ = 29.5735295625;

/** The entry's key and value of a page's field: fl oz become whole mL, the rest as typed. */
function entryKeyValue(key: string, raw: string): [string, string] {
  if (!key.endsWith('_floz')) return [key, scalar(raw)];
  const floz = Number(raw.trim());
  return [
    key.replace(/_floz$/, '_ml'),
    Number.isFinite(floz) && raw.trim() !== ''
      ? String(Math.round(floz * ML_PER_FLOZ))
      : scalar(raw),
  ];
}

/** A YAML scalar as the form gave it: numbers as typed, anything else quoted. */
function scalar(raw: string): string {
  const text = raw.trim();
  return /^-?(\d+\.?\d*|\.\d+)(e-?\d+)?$/i.test(text) ? text : JSON.stringify(text);
}

/**
 * The pot entry's text. Empty optional fields are left out (the content layer's defaults
 * apply, as in a file); an empty required field stays out too, so the schema names it.
 */
export function ownPotYaml(
  name: string,
  cups: string,
  values: Readonly<Record<string, string>>,
  units: 'metric' | 'us',
): string {
  const lines = [`name: ${JSON.stringify(name)}`, `cups: ${scalar(cups)}`];
  for (const [section, fields] of Object.entries(OWN_POT_FIELDS)) {
    lines.push(`${section}:`);
    const written = fields
      .map((field) => fieldKey(field, units))
      .filter((key) => (values[key] ?? '').trim() !== '');
    if (written.length === 0) {
      lines[lines.length - 1] += ' {}';
      continue;
    }
    for (const key of written) {
      const [entryKey, text] = entryKeyValue(key, values[key]!);
      lines.push(`  ${entryKey}: ${text}`);
    }
  }
  return lines.join('\n') + '\n';
}

/**
 * Full-setting input power of a home ring, W, by how strong it feels. Common practice, no
 * source (from memory: household gas burners are rated about 1 kW small, 1.75 kW standard,
 * 3 kW wok; electric and glass-top rings 1.2 / 1.8 / 2.4 kW; induction zones 1.4 / 2.1 / 3 kW).
 */
export const OWN_STOVE_FULL_W: Record<StoveKind, Record<StovePower, number>> = {
  gas: { gentle: 1000, usual: 1750, strong: 3000 },
  'electric-coil': { gentle: 1200, usual: 1800, strong: 2400 },
  radiant: { gentle: 1200, usual: 1800, strong: 2400 },
  induction: { gentle: 1400, usual: 2100, strong: 3000 },
};

/**
 * Share of full power at knob marks 1 to 6. A gas flame turns down to about a fifth of
 * full before it goes out; an electric or induction ring cycles down to about a tenth.
 * Common practice, no source.
 */
export const OWN_STOVE_STEPS: Record<StoveKind, readonly number[]> = {
  gas: [0.22, 0.35, 0.5, 0.65, 0.82, 1],
  'electric-coil': [0.1, 0.2, 0.35, 0.5, 0.75, 1],
  radiant: [0.1, 0.2, 0.35, 0.5, 0.75, 1],
  induction: [0.1, 0.2, 0.35, 0.5, 0.75, 1],
};

export const STOVE_KINDS: readonly StoveKind[] = ['gas', 'electric-coil', 'radiant', 'induction'];
export const STOVE_POWERS: readonly StovePower[] = ['gentle', 'usual', 'strong'];

/** The stove entry's text: six knob marks, 1 (gentlest) to 6 (full). */
export function ownStoveYaml(name: string, kind: StoveKind, power: StovePower): string {
  const full = OWN_STOVE_FULL_W[kind][power];
  const levels = OWN_STOVE_STEPS[kind].map(
    (share, i) => `  - { label: ${i + 1}, power_w: ${Math.round(full * share)} }`,
  );
  return [`name: ${JSON.stringify(name)}`, `kind: ${kind}`, 'levels:', ...levels].join('\n') + '\n';
}

/** One timed brew, as the timer records it: SI-free plain numbers in the log's own units. */
export interface TimedBrew {
  readonly level: string;
  readonly fillMl: number;
  readonly startC: number;
  readonly roomC: number;
  /** The cup on the scale at the end, g; null when not weighed. */
  readonly cupG: number | null;
  readonly firstCoffeeS: number | null;
  readonly endS: number;
  readonly end: 'sputter' | 'off-heat';
}

const r1 = (v: number): number => Math.round(v * 10) / 10;

/**
 * A log file (content/logs/*.yaml) of one brew: what `stovecard fit` reads. A log is
 * written in °C and mL whatever the site's units (log.schema.json); the page converts. The
 * cup's weight is written as its volume: brewed coffee weighs 1.0 g per mL to within 1 %
 * (common practice, no source), inside a scale's reading.
 */
export function brewLogYaml(
  ids: { readonly pot: string; readonly coffee: string; readonly stove: string },
  brew: TimedBrew,
  altitudeM: number,
  comment: string,
): string {
  const lines = [
    `# ${comment.replace(/[\r\n]+/g, ' ')}`,
    `pot: ${ids.pot}`,
    `coffee: ${ids.coffee}`,
    `stove: ${ids.stove}`,
    `altitude_m: ${Math.round(altitudeM)}`,
    'brews:',
    `  - level: ${scalar(brew.level)}`,
    `    fill_ml: ${r1(brew.fillMl)}`,
    `    start_c: ${r1(brew.startC)}`,
    `    room_c: ${r1(brew.roomC)}`,
  ];
  if (brew.firstCoffeeS !== null)
    lines.push(`    first_coffee_s: ${Math.round(brew.firstCoffeeS)}`);
  lines.push(
    `    ${brew.end === 'sputter' ? 'sputter_s' : 'off_heat_s'}: ${Math.round(brew.endS)}`,
  );
  if (brew.cupG !== null) lines.push(`    yield_ml: ${Math.round(brew.cupG)}`);
  return lines.join('\n') + '\n';
}
