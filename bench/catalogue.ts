/**
 * A synthetic roaster's content folder for the benchmark, made from a seed: the same seed
 * gives the same files. Sizes and ranges follow the demo (content/):
 *
 *   pots      1- to 9-cup, the demo's geometry scaled by cup size (volume ≈ 30 + 75 mL per
 *             cup, diameter ∝ cups^0.29, valve at 0.68 of the base's height, basket 0.66 of
 *             the base's diameter, upper chamber 0.7 of the base), each dimension ±4 %;
 *             aluminium, aluminium with an induction plate, or stainless steel
 *   coffees   permeability 0.5e-12–2e-12 m², bulk density 0.34–0.44 g/mL, retention
 *             1.0–1.8 g/g, a roast and a grind, some with their own target band
 *   stoves    gas, electric-coil, radiant and induction in turn, gentle to strong levels
 *             like the demo's (gas 4 levels 250–1500 W, induction 9 levels 100–2000 W, …)
 *   site.yaml station sets `by-stove` (default: one per stove, every coffee with every
 *             pot, like the demo's bar set) or `by-coffee` (one per coffee, its every pot
 *             on every stove), a training binder of four coffees in the first pot on the
 *             first stove, and bag inserts for every coffee over three pots
 *
 * Station cards: pots × coffees × stoves (10 × 20 × 5 = 1,000 by default).
 */
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';

export interface CatalogueSize {
  readonly pots: number;
  readonly coffees: number;
  readonly stoves: number;
}

export const DEFAULT_SIZE: CatalogueSize = { pots: 10, coffees: 20, stoves: 5 };

/**
 * The size for about `cards` station cards: 20 coffees and 5 stoves whenever there are at
 * least 100 cards (so one coffee stays a twentieth of the site), and as many pots as make
 * up the rest (1–10); below 100 cards, fewer coffees.
 */
export function sizeForCards(cards: number): CatalogueSize {
  if (cards >= 100) {
    return { pots: Math.min(10, Math.max(1, Math.round(cards / 100))), coffees: 20, stoves: 5 };
  }
  return { pots: 1, coffees: Math.max(2, Math.round(cards / 5)), stoves: 5 };
}

export function stationCount(size: CatalogueSize): number {
  return size.pots * size.coffees * size.stoves;
}

/** mulberry32: a small seeded generator, uniform on [0, 1). */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Random = () => number;

const between = (random: Random, lo: number, hi: number): number => lo + (hi - lo) * random();
const pick = <T>(random: Random, items: readonly T[]): T =>
  items[Math.floor(random() * items.length)]!;
const round = (v: number, step = 1): number => Math.round(v / step) * step;
const pad = (n: number): string => String(n).padStart(2, '0');

/** Cup sizes of `n` pots, spread over 1–9 cups (repeats when n > 9). */
function cupSizes(n: number): number[] {
  if (n === 1) return [3];
  return Array.from({ length: n }, (_, i) => 1 + Math.round((i * 8) / (n - 1)));
}

export function potYaml(cups: number, index: number, random: Random): string {
  const jitter = () => between(random, 0.96, 1.04);
  const material = index % 3 === 2 ? 'stainless-steel' : 'aluminium';
  const plate = index % 3 === 1;
  const volumeMl = round((30 + 75 * cups) * jitter());
  const diameterMm = round(60 * cups ** 0.29 * jitter());
  const baseHeightMm = ((volumeMl * 1e-6) / ((Math.PI * (diameterMm / 1000) ** 2) / 4)) * 1000;
  const valveMm = round(baseHeightMm * 0.68, 0.5);
  const basketMm = round(diameterMm * 0.66 * jitter());
  const depthMm = round(11 * cups ** 0.3 * jitter(), 0.5);
  const tubeMm = round(5 * cups ** 0.27 * jitter(), 0.5);
  const gapMm = round(3 + cups / 3);
  const spoutMm = round(85 * cups ** 0.32 * jitter() + 10);
  const massG = round(90 * cups ** 0.67 * (material === 'stainless-steel' ? 2.3 : 1) * jitter());
  const capacityMl = round(volumeMl * 0.7);
  return [
    '# yaml-language-server: $schema=../../generator/content/schemas/pot.schema.json',
    '# Synthetic benchmark pot (bench/catalogue.ts).',
    `name: Bench ${cups}-cup ${material === 'stainless-steel' ? 'steel' : 'aluminium'} pot ${pad(index + 1)}`,
    `cups: ${cups}`,
    'base:',
    `  sealed_volume_ml: ${volumeMl}`,
    `  inner_diameter_mm: ${diameterMm}`,
    `  valve_height_mm: ${valveMm}`,
    `  material: ${material}`,
    `  mass_g: ${massG}`,
    ...(plate ? ['  induction_plate: true'] : []),
    'funnel:',
    `  basket_diameter_mm: ${basketMm}`,
    `  basket_depth_mm: ${depthMm}`,
    `  tube_inner_diameter_mm: ${tubeMm}`,
    `  tube_gap_mm: ${gapMm}`,
    'upper:',
    `  spout_height_mm: ${spoutMm}`,
    `  capacity_ml: ${capacityMl}`,
    '',
  ].join('\n');
}

const ROASTS = ['light', 'medium-light', 'medium', 'medium-dark', 'dark'] as const;
const GRINDS = ['fine', 'medium-fine', 'medium', 'medium-coarse'] as const;
const NOTES = ['Cocoa, hazelnut', 'Bergamot, apricot', 'Molasses, cedar', 'Brown sugar, walnut'];

export function coffeeYaml(index: number, random: Random): string {
  const permeability = between(random, 0.5e-12, 2e-12);
  const roast = pick(random, ROASTS);
  const band = index % 4 === 1 ? '[88, 94]' : index % 4 === 3 ? '[91, 97]' : null; // others: the default
  return [
    '# yaml-language-server: $schema=../../generator/content/schemas/coffee.schema.json',
    '# Synthetic benchmark coffee (bench/catalogue.ts).',
    `name: Bench coffee ${pad(index + 1)}, ${roast} roast`,
    `roast: ${roast}`,
    `grind: ${pick(random, GRINDS)}`,
    `permeability_m2: ${permeability.toPrecision(3)}`,
    `bulk_density_g_ml: ${between(random, 0.34, 0.44).toFixed(2)}`,
    `retention_g_per_g: ${between(random, 1.0, 1.8).toFixed(2)}`,
    ...(band ? [`target_c: ${band}`] : []),
    `notes: ${pick(random, NOTES)}`,
    '',
  ].join('\n');
}

/** Levels of each kind, gentlest first, as the demo's stoves (scaled ±10 % per stove). */
const LEVELS: Record<string, { labels: readonly string[]; powersW: readonly number[] }> = {
  gas: { labels: ['simmer', 'low', 'medium', 'high'], powersW: [250, 600, 1000, 1500] },
  'electric-coil': {
    labels: ['1', '2', '3', '4', '5', '6'],
    powersW: [150, 300, 500, 800, 1200, 1600],
  },
  radiant: {
    labels: ['1', '2', '3', '4', '5', '6', '7'],
    powersW: [120, 180, 350, 550, 800, 1100, 1450],
  },
  induction: {
    labels: ['1', '2', '3', '4', '5', '6', '7', '8', '9'],
    powersW: [100, 200, 350, 500, 750, 1000, 1300, 1600, 2000],
  },
};
const KINDS = ['gas', 'electric-coil', 'radiant', 'induction'] as const;

export function stoveYaml(index: number, random: Random): string {
  const kind = KINDS[index % KINDS.length]!;
  const { labels, powersW } = LEVELS[kind]!;
  const scale = between(random, 0.9, 1.1);
  return [
    '# yaml-language-server: $schema=../../generator/content/schemas/stove.schema.json',
    '# Synthetic benchmark stove (bench/catalogue.ts).',
    `name: Bench ${kind} stove ${pad(index + 1)}`,
    `kind: ${kind}`,
    'levels: # gentlest first',
    ...labels.map(
      (label, i) => `  - { label: '${label}', power_w: ${round(powersW[i]! * scale, 10)} }`,
    ),
    '',
  ].join('\n');
}

/** How the station cards are grouped into sets (each set is also one PDF). */
export type SetLayout = 'by-stove' | 'by-coffee';

function stationSets(ids: CatalogueIds, layout: SetLayout): string[] {
  if (layout === 'by-stove') {
    return ids.stoves.flatMap((stove) => [
      `  - id: station-${stove}`,
      `    title: Station ${stove}`,
      '    layout: station',
      '    cards:',
      `      - { stove: ${stove}, every_coffee_with_every_pot: true }`,
    ]);
  }
  return ids.coffees.flatMap((coffee) => [
    `  - id: binder-${coffee}`,
    `    title: Every pot and stove for ${coffee}`,
    '    layout: station',
    '    cards:',
    ...ids.pots.flatMap((pot) =>
      ids.stoves.map((stove) => `      - { pot: ${pot}, coffee: ${coffee}, stove: ${stove} }`),
    ),
  ]);
}

export interface CatalogueIds {
  readonly pots: string[];
  readonly coffees: string[];
  readonly stoves: string[];
}

export function siteYaml(ids: CatalogueIds, layout: SetLayout = 'by-stove'): string {
  const insertPots = [
    ...new Set([ids.pots[0]!, ids.pots[Math.floor(ids.pots.length / 2)]!, ids.pots.at(-1)!]),
  ];
  const training = ids.coffees
    .slice(0, 4)
    .map((coffee) => `      - { pot: ${ids.pots[0]}, coffee: ${coffee}, stove: ${ids.stoves[0]} }`);
  return [
    '# yaml-language-server: $schema=../generator/content/schemas/site.schema.json',
    '# Synthetic benchmark site (bench/catalogue.ts).',
    'business:',
    '  name: Bench Roastery',
    "  contact: 'cards@bench.example'",
    'units: metric',
    'paper: A5',
    'kettle_presets_c: [70, 80, 90]',
    'room: { ambient_c: 20, altitude_m: 0 }',
    'base_url: https://cards.bench.example/',
    '',
    'sets:',
    ...stationSets(ids, layout),
    '  - id: barista-training',
    '    title: Barista training',
    '    layout: station',
    '    cards:',
    ...training,
    '  - id: shipping-inserts',
    '    title: Shipping inserts',
    '    layout: insert',
    `    coffees: [${ids.coffees.join(', ')}]`,
    `    pots: [${insertPots.join(', ')}]`,
    '',
  ].join('\n');
}

/** Writes the catalogue into `dir` (created); returns the ids it wrote. */
export async function writeCatalogue(
  dir: string,
  size: CatalogueSize = DEFAULT_SIZE,
  seed = 1,
  layout: SetLayout = 'by-stove',
): Promise<CatalogueIds> {
  const random = seeded(seed);
  for (const folder of ['pots', 'coffees', 'stoves']) {
    await mkdir(path.join(dir, folder), { recursive: true });
  }
  const ids: CatalogueIds = { pots: [], coffees: [], stoves: [] };
  const cups = cupSizes(size.pots);
  for (let i = 0; i < size.pots; i++) {
    const id = `pot-${pad(i + 1)}-${cups[i]}cup`;
    ids.pots.push(id);
    await writeFile(path.join(dir, 'pots', `${id}.yaml`), potYaml(cups[i]!, i, random));
  }
  for (let i = 0; i < size.coffees; i++) {
    const id = `coffee-${pad(i + 1)}`;
    ids.coffees.push(id);
    await writeFile(path.join(dir, 'coffees', `${id}.yaml`), coffeeYaml(i, random));
  }
  for (let i = 0; i < size.stoves; i++) {
    const id = `stove-${pad(i + 1)}-${KINDS[i % KINDS.length]}`;
    ids.stoves.push(id);
    await writeFile(path.join(dir, 'stoves', `${id}.yaml`), stoveYaml(i, random));
  }
  await writeFile(path.join(dir, 'site.yaml'), siteYaml(ids, layout));
  return ids;
}
