/**
 * Words of the customer's page (render/planner-view.ts, templates/planner.njk and the
 * script generator/browser/planner.ts): the form, the answer, the brew timer. Numbers
 * arrive formatted; nothing here converts or rounds.
 */
import type { StovePower } from '../content/own-entries.ts';
import type { StoveKind, UnitSystem } from '../content/types.ts';

const stoveKindNames: Record<StoveKind, string> = {
  gas: 'Gas flame',
  'electric-coil': 'Electric coil ring',
  radiant: 'Glass-top (radiant) ring',
  induction: 'Induction ring',
};

export const plannerWords = {
  pageTitle: (coffee: string): string => `Brew ${coffee} in your own pot`,
  intro:
    'Tell us your pot, your stove and your kettle. The page works out the recipe here, in your browser, with the same calculation as our printed cards; nothing is sent anywhere.',
  noScript:
    'This page needs JavaScript to work out a recipe. The printed cards and their PDFs work without it.',
  pot: {
    legend: 'Your pot',
    cups: 'Pot size',
    cupsOption: (cups: number, name: string): string =>
      `${cups} ${cups === 1 ? 'cup' : 'cups'} (like our ${name})`,
    own: 'Another pot: I will measure it',
    ownIntro:
      'Measure with the funnel taken out, inside the pot. A kitchen ruler and a measuring jug are enough; the drawing shows where each measure goes.',
    drawingAlt:
      'Cut-through drawing of a stovetop pot: A inner width of the base, B floor to the lowest edge of the safety valve, C floor to the top of the spout, D width and E depth of the funnel basket, F inner width of the funnel tube, G gap between the tube’s end and the floor.',
    ownCups: 'Cups it is sold as',
    fields: {
      sealed_volume_ml: 'Base full to the brim (with the funnel in), mL',
      sealed_volume_floz: 'Base full to the brim (with the funnel in), fl oz',
      inner_diameter_mm: 'A: inner width of the base, mm',
      inner_diameter_in: 'A: inner width of the base, in',
      valve_height_mm: 'B: floor to the lowest edge of the valve, mm',
      valve_height_in: 'B: floor to the lowest edge of the valve, in',
      spout_height_mm: 'C: floor to the top of the spout, mm',
      spout_height_in: 'C: floor to the top of the spout, in',
      basket_diameter_mm: 'D: inner width of the funnel basket, mm',
      basket_diameter_in: 'D: inner width of the funnel basket, in',
      basket_depth_mm: 'E: depth of the funnel basket, mm',
      basket_depth_in: 'E: depth of the funnel basket, in',
      tube_inner_diameter_mm: 'F: inner width of the funnel tube, mm',
      tube_inner_diameter_in: 'F: inner width of the funnel tube, in',
      tube_gap_mm: 'G: gap from the tube’s end to the floor, funnel seated, mm',
      tube_gap_in: 'G: gap from the tube’s end to the floor, funnel seated, in',
      capacity_ml: 'Top chamber full, mL',
      capacity_floz: 'Top chamber full, fl oz',
      mass_g: 'Base on the kitchen scale, g',
      material: 'Base metal',
    },
    materials: {
      aluminium: 'Aluminium (dull grey, light)',
      'stainless-steel': 'Stainless steel (shiny, heavier, works on induction)',
    },
    ownName: 'Your pot',
  },
  stove: {
    legend: 'Your stove',
    stove: 'Stove',
    own: 'Another stove',
    kind: 'Kind of heat',
    kinds: stoveKindNames,
    power: 'How strong it is at full',
    powers: {
      gentle: 'Gentle: a small ring, slow to boil a kettle',
      usual: 'Usual: a standard home ring',
      strong: 'Strong: a large or wok burner',
    } satisfies Record<StovePower, string>,
    ownName: (kind: StoveKind, power: StovePower): string =>
      `Your ${stoveKindNames[kind].toLowerCase()} (${power === 'usual' ? 'usual' : power} at full), knob 1 to 6`,
  },
  kettle: {
    legend: 'Your kettle',
    presets: (units: UnitSystem): string =>
      `Its temperature settings, ${units === 'us' ? '°F' : '°C'}, separated by commas (leave empty if it only boils)`,
    altitude: (units: UnitSystem): string =>
      `Height above sea level, ${units === 'us' ? 'ft' : 'm'}`,
  },
  form: {
    missing: 'Needed for the recipe: measure it as the drawing shows.',
    fillIn: 'Fill in every measure of your pot to see its recipe.',
    badList: (text: string): string =>
      `“${text}” is not a list of numbers. Write the settings as numbers separated by commas, such as 70, 80, 90, or leave the field empty`,
    badAltitude: (text: string, units: UnitSystem): string =>
      units === 'us'
        ? `“${text}” is not a height this page can plan for. Write a number of feet from -1640 to 16400`
        : `“${text}” is not a height this page can plan for. Write a number of metres from -500 to 5000`,
  },
  answer: {
    heading: 'Your recipe',
    startC: 'Water before sealing',
    fillMl: 'Water in the base',
    doseG: 'Coffee in the basket',
    level: 'Heat setting',
    firstCoffeeS: 'First coffee',
    offHeatS: 'Off the heat',
    yieldMl: 'In the cup',
    refused: 'No recipe',
    working: 'Working out your recipe…',
    print: 'Print this card',
    share: 'This page’s address holds your choices: bookmark it or send it.',
    fixFirst: 'Fix the marked fields to see a recipe.',
  },
  timer: {
    heading: 'Brew timer: send us how your brew went',
    intro:
      'Start the timer when the pot goes on the heat and press each button when it happens. The page writes the brew in the log format our manager fits the cards to; copy it or save it as a file.',
    heatOn: 'Heat on',
    firstCoffee: 'First coffee',
    sputter: 'Sputter',
    offHeat: 'Off the heat',
    reset: 'Start again',
    level: 'Heat setting used',
    fill: (units: UnitSystem): string => `Water in the base, ${units === 'us' ? 'fl oz' : 'mL'}`,
    start: (units: UnitSystem): string =>
      `Water temperature when sealed, ${units === 'us' ? '°F' : '°C'}`,
    room: (units: UnitSystem): string => `Room temperature, ${units === 'us' ? '°F' : '°C'}`,
    cup: 'Coffee in the cup at the end, g',
    output: 'The brew, as a log entry',
    copy: 'Copy',
    download: 'Save as a file',
    copied: 'Copied.',
    notStarted: 'Press “Heat on” first.',
    stopped: 'The brew is over: press “Start again” for a new one.',
    elapsed: (seconds: number): string => `${seconds} s on the heat`,
    mark: (what: string, seconds: number): string => `${what} at ${seconds} s`,
    needEnd: 'Press “Sputter” or “Off the heat” to end the brew.',
    needFirst: 'Press “First coffee” when coffee first appears.',
    ownPotNote:
      'Your own pot is not in our list: the entry names it “your-pot”; send us its measures too.',
    comment: (pot: string, coffee: string, stove: string): string =>
      `Timed on the brew page: ${pot}, ${coffee}, ${stove}.`,
  },
} as const;
