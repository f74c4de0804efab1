/**
 * Words of the training binder's own pages (a set with `layout: binder`): the cover, each
 * step with its reason, cleaning and upkeep, the glossary, the blank brew-log sheet and
 * the sign-off page. The contents, the method and the troubleshooting pages have their
 * words in card.ts and pdf.ts.
 *
 * The brew-log sheet's fields are the keys of generator/content/schemas/log.schema.json
 * (render/pdf/binder-pages.ts reads them from there); `logFields` gives each its label, and
 * a key without a label fails the build, so the sheet cannot drift from the log files.
 *
 * The exercises (render/exercises.ts) are functions of the formatted strings of this
 * binder's own cards and of the troubleshooting table: they quote a number only as the
 * card or the table prints it.
 *
 * In the language catalogue as `binder` (en.ts); the Spanish is in es.ts.
 */

/** One exercise's text: what it is for, what to do, what to note, what good looks like. */
export interface ExerciseText {
  readonly heading: string;
  readonly goal: string;
  readonly steps: readonly string[];
  readonly record: readonly string[];
  readonly good: string;
  readonly safety: string;
}

/** A card's recipe as the card prints it (render/card-view.ts formatted strings). */
export interface ExerciseCardFacts {
  /** The card as the contents names it: "<coffee>, in the <pot> · on the <stove>". */
  readonly card: string;
  readonly pot: string;
  readonly temperature: string;
  readonly fill: string;
  /** "(150 g on a scale)" */
  readonly fillMass: string;
  readonly dose: string;
  /** The setting, as written on the knob. */
  readonly level: string;
  readonly firstCoffee: string;
  readonly offHeat: string;
  /** "Coffee in the cup" value. */
  readonly yield: string;
}

/** One row of the troubleshooting table "Which input moves what", as printed. */
export interface ExerciseMoveFacts {
  readonly change: string;
  readonly firstCoffee: string;
  readonly peak: string;
}

const MAKER = 'Follow the pot maker’s instructions; where they differ from this page, they win.';

export const binderWords = {
  cover: {
    kind: 'Training binder',
    from: (business: string): string => `From ${business}`,
    built: (date: string): string => `Cards computed on ${date}.`,
    intro:
      'How a stovetop pot brews, how to brew with the cards, how to look after the pot, and a log sheet for the brews you time. Keep it by the bar.',
  },
  steps: {
    title: 'Each step, and why',
    intro:
      'The cards give these steps with the numbers for one pot, coffee and stove. This is why each step is there.',
    items: [
      {
        step: 'Heat water in a kettle to the card’s temperature.',
        why: 'Hot water seals in less air, so the coffee starts to flow near brewing temperature instead of early and cool. The card’s temperature is the one that brewed the most of the cup in the coffee’s band.',
      },
      {
        step: 'Fill the base to the line just under the valve, never above.',
        why: 'Water expands as it heats. The card’s fill leaves room below the valve for that, and enough water to finish the brew before the base runs dry.',
      },
      {
        step: 'Fill the basket level with the rim; do not tamp.',
        why: 'A level, loose bed lets the water through at the pace the card was computed for. A pressed or heaped bed is tighter: the brew slows and the pressure in the base climbs.',
      },
      {
        step: 'Screw the top on firmly, holding the hot base with a cloth.',
        why: 'A loose joint leaks steam and coffee and the pot never builds the push the card expects. The base is already hot from the kettle water.',
      },
      {
        step: 'Heat at the card’s setting, with a flame no wider than the base.',
        why: 'The setting sets how fast the pressure rises. A flame wider than the base heats the handle and the upper part, not the water.',
      },
      {
        step: 'Take it off at the card’s time, or sooner at the first gurgle.',
        why: 'Near the end the last water comes up hottest and steam follows it: that part of the cup tastes harsh.',
      },
      {
        step: 'Cool the base under the cold tap, holding only the handle, then pour.',
        why: 'Cooling drops the pressure in the base at once, so the brew stops and the pot can be opened safely.',
      },
    ],
  },
  cleaning: {
    title: 'Cleaning and upkeep',
    intro:
      'Follow the maker’s instructions for your pot; where they differ from this page, the maker’s instructions win. Let the pot cool fully before you take it apart.',
    items: [
      {
        part: 'After each brew',
        care: 'Knock out the grounds, rinse every part in warm water and let them dry apart. Soap and the dishwasher dull aluminium; many makers advise against both.',
      },
      {
        part: 'Gasket',
        care: 'The rubber ring under the upper part seals the pot. Look at it each week: when it is cracked, hard or flattened, or when coffee or steam escapes at the join, fit a new one of the maker’s size.',
      },
      {
        part: 'Filter plate',
        care: 'The perforated disc held by the gasket. Rinse it and hold it up to the light: clear blocked holes with a soft brush, never a pin, which widens them.',
      },
      {
        part: 'Safety valve',
        care: 'Keep it clean and never fill above it, cover it or block it. If the maker says it may be moved, check that its pin moves freely. A valve that leaks, sticks or has let off steam in a brew: stop using the pot and ask the maker for a new valve or a new base.',
      },
      {
        part: 'Scale',
        care: 'Hard water leaves a white crust in the base. Remove it as the maker advises, then brew once and pour that coffee away.',
      },
    ],
  },
  glossary: {
    title: 'Words used on the cards',
    items: [
      { term: 'Base', meaning: 'The lower part that holds the water.' },
      {
        term: 'Funnel and basket',
        meaning:
          'The basket holds the ground coffee; its tube reaches down into the water of the base.',
      },
      { term: 'Upper chamber', meaning: 'The top part, where the coffee arrives.' },
      {
        term: 'Safety valve',
        meaning:
          'The small valve on the side of the base. It lets steam out if the pressure climbs too high. Water must stay below it.',
      },
      { term: 'Fill line', meaning: 'The water level the card gives, just under the valve.' },
      { term: 'Gasket', meaning: 'The rubber ring that seals the upper part to the base.' },
      { term: 'Filter plate', meaning: 'The perforated disc under the gasket.' },
      {
        term: 'First coffee',
        meaning: 'The moment coffee first shows at the spout, timed from heat on.',
      },
      {
        term: 'Gurgle, sputter',
        meaning:
          'The noise when the water in the base is low and steam breaks through: the end of the brew.',
      },
      { term: 'Off-heat time', meaning: 'When to take the pot off the heat, timed from heat on.' },
      {
        term: 'Target band',
        meaning:
          'The range of water temperature the coffee is best brewed in; the cards aim to brew most of the cup inside it.',
      },
      {
        term: 'Setting',
        meaning: 'A position of the stove’s knob, written as on the knob.',
      },
      {
        term: 'Brew log',
        meaning:
          'A record of brews timed with a stopwatch; it lets the cards be recomputed for your own pot, coffee and stove.',
      },
    ],
  },
  logSheet: {
    title: 'Brew log sheet',
    intro:
      'One sheet per pot, coffee and stove. Time from the moment the pot goes on the heat. Leave blank what you did not measure; each brew needs at least one of the times, the yield or the readings.',
    brewColumn: 'Brew',
    readingsIntro: (label: string): string =>
      `${label}: a time and a reading per pair, in time order.`,
    /** Under the sheet of a site in US units: the log files take metric values. */
    usNote:
      'The log files take metric values: convert these readings when you type them in (content/README.md, brew logs).',
    time: 'Time, s',
    brewRows: 6,
    readingPairs: 4,
    /** Label of each key of a log file (log.schema.json), as the sheet prints it. */
    logFields: {
      pot: 'Pot',
      coffee: 'Coffee',
      stove: 'Stove',
      altitude_m: 'Altitude, m',
      level: 'Setting',
      fill_ml: 'Water in, mL',
      start_c: 'Water at sealing, °C',
      room_c: 'Room, °C',
      first_coffee_s: 'First coffee, s',
      sputter_s: 'Gurgle, s',
      off_heat_s: 'Off heat, s',
      yield_ml: 'Coffee out, mL',
      cup_g: 'Cup on the scale, g',
      water_c: 'Water in the base, °C',
    } as Record<string, string>,
    /** The same labels for a site in US units (convert when typing into the log). */
    logFieldsUs: {
      pot: 'Pot',
      coffee: 'Coffee',
      stove: 'Stove',
      altitude_m: 'Altitude, ft',
      level: 'Setting',
      fill_ml: 'Water in, fl oz',
      start_c: 'Water at sealing, °F',
      room_c: 'Room, °F',
      first_coffee_s: 'First coffee, s',
      sputter_s: 'Gurgle, s',
      off_heat_s: 'Off heat, s',
      yield_ml: 'Coffee out, fl oz',
      cup_g: 'Cup on the scale, oz',
      water_c: 'Water in the base, °F',
    } as Record<string, string>,
    /** The value column of a readings pair ("g", "°C"): the label's unit. */
    readingUnit: (label: string): string => label.split(', ').pop() ?? label,
    filledBy: 'Timed by',
    date: 'Date',
  },
  exercises: {
    title: 'Exercises',
    intro:
      'Practical tasks on this binder’s own cards, one at a time, with the trainer beside you. Each says what to write down and what a good result looks like; bring your notes to the sign-off.',
    /** When no card of the binder has a recipe: nothing to brew. */
    none: 'No card of this binder has a recipe, so there is nothing to practise on yet: ask whoever keeps the cards for a binder with a card that brews.',
    cardLabel: 'Card',
    goalLabel: 'Goal',
    stepsLabel: 'Steps',
    recordLabel: 'Write down',
    goodLabel: 'A good result',
    safetyLabel: 'Safety',
    /** The troubleshooting table's card when the binder does not hold it. */
    tableCard: (coffee: string, pot: string, stove: string): string =>
      `${coffee} in the ${pot} on the ${stove}`,
    hotCold: (
      f: ExerciseCardFacts,
      /** The card's in-band line, label and value as printed. */
      inBand: { readonly label: string; readonly value: string },
    ): ExerciseText => ({
      heading: 'Cold water against the card’s hot water',
      goal: `See why the card starts from water at ${f.temperature}: brew its recipe once from cold tap water, then as the card says, and compare.`,
      steps: [
        `Cold: fill the base with ${f.fill} ${f.fillMass} of cold tap water, the basket with ${f.dose} of coffee, level and not tamped; seal the pot and put it on setting ${f.level}. Start the stopwatch as it goes on the heat.`,
        'Take it off at the first gurgle, cool the base under the cold tap and pour.',
        `Hot: once the pot has cooled, rinse it and brew again as the card says: water at ${f.temperature}, ${f.fill}, ${f.dose}, setting ${f.level}, off the heat at ${f.offHeat} or at the first gurgle.`,
      ],
      record: [
        'For each brew: the time of the first coffee, the time of the first gurgle, and the coffee in the cup (a measuring jug, or a scale with the cup tared: a gram is about a millilitre).',
        'How each cup tastes, in a few words.',
      ],
      good: `The hot brew’s first coffee comes within the card’s ${f.firstCoffee} and its cup holds about ${f.yield}. The cold brew’s first coffee comes later and tastes flatter or harsher; the card’s line “${inBand.label}” reads: ${inBand.value}.`,
      safety: `The water, the base and the coffee are hot: hold the base with a cloth, never open a pot on the heat, and keep the flame no wider than the base. ${MAKER}`,
    }),
    finer: (
      f: ExerciseCardFacts,
      card: ExerciseMoveFacts,
      finer: ExerciseMoveFacts,
      /** The table's own card ("<coffee> in the <pot> on the <stove>"), null when it is this one. */
      tableCard: string | null,
    ): ExerciseText => ({
      heading: 'One step finer',
      goal: 'Check the troubleshooting table “Which input moves what” on a real pot: grind one step finer and see whether the brew moves the way the table says.',
      steps: [
        `Brew the card as it says (water at ${f.temperature}, ${f.fill}, ${f.dose}, setting ${f.level}) and time the first coffee.`,
        'Set the grinder one step finer, change nothing else, and brew again. Fill the basket level as always; do not tamp.',
        `Take each brew off at ${f.offHeat} or at the first gurgle.`,
      ],
      record: [
        'For each brew: the time of the first coffee and of the first gurgle, the coffee in the cup, and how it tastes.',
        'What the table predicts beside what you saw, and whether the valve hissed.',
      ],
      good: `${tableCard === null ? 'The table, computed for this card' : `The table, computed for ${tableCard} (expect the same direction here, not the same times)`}, says: ${card.change}, first coffee ${card.firstCoffee}, highest pressure ${card.peak}; ${finer.change}, first coffee ${finer.firstCoffee}, highest pressure ${finer.peak}. Your finer brew moves the same way, and you can say by how much your times differ from the table’s.`,
      safety: `A finer grind slows the water and raises the pressure in the base. If the valve lets off steam or the coffee stops coming, take the pot off the heat, cool the base under the cold tap and grind no finer. Never tamp. ${MAKER}`,
    }),
    fillLine: (
      f: ExerciseCardFacts,
      /** The card's fill-line sentence: "Up to 27 mm above the floor: 4 mm below the valve." */
      fillLine: string,
    ): ExerciseText => ({
      heading: 'The fill line and the valve',
      goal: `Know where the water must stop in the ${f.pot}, and where its safety valve is, on a cold, empty pot that is never brewed.`,
      steps: [
        `Take a cold, empty ${f.pot}, away from the stove. Unscrew it and take out the basket.`,
        'Find the safety valve on the side of the base, from outside and from inside. Do not take it apart.',
        `Pour in ${f.fill} of cold water and measure the level with a ruler. The card says: ${fillLine}`,
        'Pour in more water, slowly, past the line until it reaches the underside of the valve, and note how much more it took. Then pour all the water away.',
      ],
      record: [
        'The height of the card’s fill, the water it took to reach the valve, and where the valve sits.',
      ],
      good: `The card’s ${f.fill} stands where the card says, and you can show the line and the valve without the card. Only a little more water reaches the valve: that is why the line is never passed.`,
      safety: `Never heat this base: a base filled past the line is poured out, never brewed. Water over the valve stops it from letting off steam. ${MAKER}`,
    }),
    logThree: (f: ExerciseCardFacts, sheet: string): ExerciseText => ({
      heading: 'Three brews on the log sheet',
      goal: 'Time three brews of one card and write them on the brew log sheet, so the cards can be fitted to your own pot, coffee and stove.',
      steps: [
        `Copy the blank page “${sheet}” and write the card’s pot, coffee and stove at its head.`,
        `Brew the card three times as it says (water at ${f.temperature}, ${f.fill}, ${f.dose}, setting ${f.level}). Start the stopwatch as the pot goes on the heat; write one line per brew.`,
        'Hand the sheet to whoever keeps the cards: they type it into a brew log and refit the cards with stovecard fit.',
      ],
      record: [
        'Three lines of the sheet: the setting, the water in and its temperature at sealing, the room, the times of the first coffee, the first gurgle and off the heat, and the coffee out.',
        'Your name and the date at the head of the sheet.',
      ],
      good: `Three lines with the times in order (first coffee, then gurgle, then off the heat), the first coffee within the card’s ${f.firstCoffee} and off the heat at the first gurgle or within its ${f.offHeat}; typed in, the log is read without an error.`,
      safety: `Three brews in a row: let the pot cool, or cool it under the cold tap, before you open and refill it, and check the gasket between brews. ${MAKER}`,
    }),
  },
  signOff: {
    title: 'Sign-off',
    intro: 'The trainer ticks each point once the trainee has shown it on a real brew.',
    checks: [
      'Reads a card: finds the pot, the coffee and the stove, and the numbers for each step.',
      'Heats the water to the card’s temperature and fills the base to the line under the valve.',
      'Fills the basket level, without tamping, and seals the pot holding the base with a cloth.',
      'Sets the stove as the card says, with a flame no wider than the base.',
      'Takes the pot off at the card’s time or the first gurgle, and cools the base.',
      'Cleans the pot and checks the gasket, the filter plate and the valve.',
      'Knows when a pot must not be used, and that the maker’s instructions come first.',
      'Times a brew and fills in a line of the brew log sheet.',
    ],
    trainee: 'Trainee',
    trainer: 'Trainer',
    date: 'Date',
    signature: 'Signature',
  },
} as const;
