/**
 * Words of `stovecard init [DIR]`: its help, its messages, and the text of every file it
 * writes (a new content folder with one entry of each kind, each key explained in a
 * comment). Each file is a function of the path of its JSON Schema, so the modeline points
 * at the schemas of the stovecard that wrote it. The names are invented: a roaster called
 * "Tallow Lane Coffee" that does not exist.
 */

/** The folders and files init writes, relative to DIR, in the order it writes them. */
export const INIT_FILES = [
  { file: 'site.yaml', schema: 'site' },
  { file: 'pots/three-cup.yaml', schema: 'pot' },
  { file: 'coffees/first-roast.yaml', schema: 'coffee' },
  { file: 'stoves/kitchen-gas.yaml', schema: 'stove' },
  { file: 'logs/first-try.yaml', schema: 'log' },
] as const;

export type InitSchema = (typeof INIT_FILES)[number]['schema'];

const modeline = (schemaPath: string): string => `# yaml-language-server: $schema=${schemaPath}`;

const FILES: Record<InitSchema, (schemaPath: string) => string> = {
  site: (schemaPath) => `${modeline(schemaPath)}
# The site: who the cards are from, how they are printed, the room they are planned for,
# and the sets of cards to build. Every key is explained in the content README of
# stovecard ("The site: site.yaml"). Build with: stovecard build --content <this folder>
business:
  name: Tallow Lane Coffee # printed in each card's footer
  contact: 'hello@tallow-lane.example' # one line of contact details, also in the footer
units: metric # metric (°C, mL, g) or us (°F, fl oz, oz)
paper: A5 # A4, A5, A6, letter or half-letter
kettle_presets_c: [70, 80, 90] # temperatures your kettle can be set to, °C (or kettle_presets_f in °F)
room:
  ambient_c: 20 # room temperature the cards are planned for, °C
  altitude_m: 0 # altitude of the room, m (water boils cooler higher up)
# base_url: https://cards.tallow-lane.example/ # where the site will be published; adds QR codes
# brand: { logo: brand/logo.svg, colour: '#1F5C4A' } # your logo (SVG or PNG, path in this folder) and colour, on every card and page

sets:
  - id: kitchen # names the set's page and PDF: lower-case letters, digits, hyphens
    title: Kitchen station # printed on the set's pages
    layout: station # station: cards to pin by the stove, one per pot × coffee × stove
    cards:
      - { pot: three-cup, coffee: first-roast, stove: kitchen-gas } # ids = file names without .yaml
      # - { stove: kitchen-gas, every_coffee_with_every_pot: true } # every coffee with every pot
    # sheet: { paper: A4, up: 2 } # also the cards 2 (4, 8) to a sheet for a desktop printer, with crop marks

  - id: bags
    title: Bag inserts
    layout: insert # insert: one card per coffee, for the bag
    coffees: [first-roast] # one insert each
    # pots: [three-cup]     # which pots each insert covers (default: every pot)
    # stoves: [kitchen-gas] # which stoves (default: every stove)
`,
  pot: (schemaPath) => `${modeline(schemaPath)}
# One stovetop pot, measured inside from the floor of the base (calipers for lengths, a
# measuring jug for volumes). Replace these example numbers with your own pot's.
name: Three-cup aluminium pot # printed on the cards
cups: 3 # cup size the maker states
base:
  sealed_volume_ml: 260 # fill the closed base, funnel seated, to the brim: that volume, mL
  inner_diameter_mm: 84 # inner diameter of the base, mm
  valve_height_mm: 32 # lowest edge of the safety valve above the floor, mm
  # valve_opening_bar: 1.5 # gauge pressure the valve opens at, if the maker states it
  material: aluminium # aluminium or stainless-steel
  mass_g: 180 # mass of the empty base, g
  # induction_plate: true # an aluminium base with a magnetic plate (works on induction)
funnel:
  basket_diameter_mm: 56 # inside of the basket, mm
  basket_depth_mm: 15
  tube_inner_diameter_mm: 7 # inside of the tube below the basket, mm
  tube_gap_mm: 4 # gap between the tube's lower end and the floor, mm
upper:
  spout_height_mm: 115 # spout outlet above the floor of the base, pot assembled, mm
  capacity_ml: 200 # capacity of the upper chamber, mL
`,
  coffee: (schemaPath) => `${modeline(schemaPath)}
# One coffee at one grind.
name: First roast, stovetop grind # printed on the cards
roast: medium # light, medium-light, medium, medium-dark or dark
grind: medium-fine # fine, medium-fine, medium, medium-coarse or coarse
bulk_density_g_ml: 0.38 # grams of ground coffee per mL of a level, untamped basket
retention_g_per_g: 1.2 # water the spent grounds hold per gram of coffee
# target_c: [90, 96] # extraction band, °C (this is the default)
# permeability_m2: 1e-12 # written by \`stovecard fit\` from a brew log; leave it out until then
notes: Brown sugar, orange peel # tasting notes printed on the cards
`,
  stove: (schemaPath) => `${modeline(schemaPath)}
# One stove or ring. Input powers are often on the maker's plate or in its manual.
name: Kitchen gas hob, small burner # printed on the cards
kind: gas # gas, electric-coil, radiant or induction
# efficiency: 0.36 # share of the input reaching the pot (default by kind)
levels: # the knob's settings, gentlest first; each more powerful than the one before
  - { label: low, power_w: 500 } # label as written on the knob; input power, W
  - { label: medium, power_w: 900 }
  - { label: high, power_w: 1400 }
`,
  log: (schemaPath) => `${modeline(schemaPath)}
# A brew log: brews of one pot, coffee and stove timed with a stopwatch (and a thermometer
# and a scale if you have them). \`stovecard fit logs/first-try.yaml\` calibrates the coffee
# and the stove from it. EXAMPLE NUMBERS, not a measurement: replace them with your own.
pot: three-cup # ids of the entries brewed
coffee: first-roast
stove: kitchen-gas
altitude_m: 0 # altitude of the place, m
brews:
  - level: medium # a level label of that stove
    fill_ml: 150 # water poured into the base, mL
    start_c: 20 # water temperature when the pot was closed, °C
    room_c: 21 # the room, °C
    first_coffee_s: 70 # from heat on to the first coffee at the spout, s
    off_heat_s: 125 # from heat on to taking the pot off the heat, s
    yield_ml: 80 # coffee in the cup at the end, mL
    # sputter_s: 95 # from heat on to the sputter, s
    # cup_g: [[80, 8], [100, 26]] # scale readings [time_s, grams in the cup]
    # water_c: [[30, 32], [60, 45]] # probe readings [time_s, °C in the base]
`,
};

export const initWords = {
  help: [
    'Usage: stovecard init [DIR]',
    '',
    'Writes a new content folder DIR (default: content) with one entry of each kind:',
    'site.yaml, a pot, a coffee, a stove and a brew log, each key explained in a comment',
    'and each file linked to its schema, so an editor with YAML support completes the',
    'keys. It builds at once: stovecard build --content DIR.',
    '',
    'DIR must be new or empty: init never writes over a file.',
    '',
  ].join('\n'),
  fileText: (schema: InitSchema, schemaPath: string): string => FILES[schema](schemaPath),
  notEmpty: (dir: string, entries: number): string =>
    `${dir} is not empty (${entries === 1 ? 'one entry' : `${entries} entries`}); nothing was written. Give a new or empty folder (stovecard init DIR).`,
  notAFolder: (dir: string): string =>
    `${dir} is a file, not a folder; nothing was written. Give a new or empty folder (stovecard init DIR).`,
  tooMany: (extra: string): string =>
    `init takes one folder, got also "${extra}" (stovecard init --help)`,
  written: (dir: string, files: readonly string[]): string =>
    [
      `wrote ${dir}:`,
      ...files.map((file) => `  ${file}`),
      `next: stovecard build --content ${dir}`,
      '',
    ].join('\n'),
} as const;
