/**
 * User-facing words of the site: station cards, insert cards, the index, the set pages, the
 * method page and the troubleshooting page. Numbers arrive already formatted (strings with
 * their units, from generator/render/format.ts); nothing here converts or rounds.
 * Tests assert through these same factories, so the wording can change here alone.
 */
import type { HeatKind } from '../content/heat-kind.ts';
import type { GrindClass } from '../content/types.ts';
import type { BindingCauseCode, RefusalCode } from '../planning/types.ts';

const grindNames: Record<GrindClass, string> = {
  fine: 'fine',
  'medium-fine': 'medium-fine',
  medium: 'medium',
  'medium-coarse': 'medium-coarse',
  coarse: 'coarse',
};

/** The facts of a binding cause, formatted (render/card-view.ts). */
export interface BindingCauseText {
  readonly share: string;
  readonly band: string;
  readonly mean: string;
  readonly delivery: string;
  readonly window: string;
  readonly cups: string;
  readonly gentlest?: string;
  readonly shareAtHalfHeat?: string;
  readonly shareAtHalfPermeability?: string;
  readonly shareIfAllowed?: string;
  readonly highCorner?: string;
  readonly limit?: string;
}

/** How strong a stove level is, in words any stove owner understands (render/insert-steps.ts). */
export type HeatFeel = 'gentle' | 'medium' | 'strong' | 'full';

const heatKindNames: Record<HeatKind, string> = {
  gas: 'Gas',
  electric: 'Electric',
  induction: 'Induction',
};

export const cardWords = {
  siteTitle: 'Stovetop brew cards',
  /** Station card heading: the coffee, then what it is brewed in and on. */
  stationSubtitle: (potName: string, stoveName: string): string =>
    `in the ${potName} · on the ${stoveName}`,
  insertSubtitle: (roast: string, grind: GrindClass): string =>
    `${roast} roast · ${grindNames[grind]} grind`,

  water: {
    heading: 'Water',
    heated: 'Heat the water to',
    kettlePreset: (preset: string): string => `Use the kettle’s ${preset} setting.`,
    thermometer: (temperature: string): string =>
      `Heat it to ${temperature}; check with a thermometer.`,
    roomTemperature: 'Water at room temperature',
    roomTemperatureNote: (room: string): string =>
      `Water that has stood in the room (about ${room}); no kettle needed.`,
    heatedNote: 'Pour it in hot, seal the pot, and put it straight on the heat.',
    fill: 'Fill the base with',
    fillMass: (mass: string): string => `(${mass} on a scale)`,
    fillLine: (height: string, below: string): string =>
      `Up to ${height} above the floor: ${below} below the valve.`,
  },
  coffee: {
    heading: 'Coffee',
    dose: 'Ground coffee',
    level: 'Basket filled to the rim, levelled off.',
    grind: (grind: GrindClass): string =>
      `${grindNames[grind][0]!.toUpperCase()}${grindNames[grind].slice(1)} grind.`,
    noTamp: 'Do not tamp.',
  },
  heat: {
    heading: 'Heat',
    setting: 'Setting',
    on: (stoveName: string): string => `on the ${stoveName}`,
    fitted: 'Heat measured on this stove from timed brews.',
  },
  timings: {
    heading: 'Times',
    clockNote: 'From the moment the pot goes on the heat.',
    firstCoffee: 'First coffee',
    offHeat: 'Off the heat',
    watchHeading: 'Watch and listen',
    watch: [
      'At first the coffee rises in a steady, dark stream.',
      'Towards the end it turns pale and runs faster.',
      'A gurgle or a hiss means the base is nearly empty: the sputter is close.',
      'Take the pot off the heat then, or at the off-heat time if that comes first, and cool the base under the cold tap to stop the brew.',
    ] as readonly string[],
  },
  chart: {
    heading: 'Temperature of each sip',
    xTitle: (unit: string): string => `Coffee in the cup (${unit})`,
    yTitle: (unit: string): string => `Brewing temperature (${unit})`,
    thisCard: 'This card',
    coldStart: 'Cold start',
    band: (band: string): string => `Target ${band}`,
    caption:
      'Brewing temperature: the water’s as it reaches the grounds (the SCA’s point of contact).',
    alt: (plan: string, cold: string, band: string): string =>
      `Chart: brewing temperature against coffee in the cup. This card: ${plan} of the cup in the target ${band}; from a cold start: ${cold}.`,
  },
  expect: {
    heading: 'What to expect',
    yield: 'Coffee in the cup',
    inBand: (band: string): string => `Brewed at ${band}`,
    inBandValue: (plan: string, cold: string): string => `${plan} of the cup (cold start: ${cold})`,
    peakPressure: 'Highest pressure in the base',
    peakPressureValue: (peak: string, valve: string, highest?: string): string =>
      `${peak}${highest ? ` (up to ${highest})` : ''}; the valve opens at ${valve}`,
    /** The valve's opening pressure when the pot's entry gives none: `valve` is "about 1.5 bar". */
    peakPressureAssumedValue: (peak: string, valve: string, highest?: string): string =>
      `${peak}${highest ? ` (up to ${highest})` : ''}; the valve opens at about ${valve} (assumed: no value was given; ask the maker)`,
    /** Why the cup misses the band (share below 0.3), with the change that fits the cause. */
    bindingCause: (code: BindingCauseCode, f: BindingCauseText): string => {
      const lead = `Only ${f.share} of the cup is brewed at ${f.band}`;
      switch (code) {
        case 'bed-too-open':
          return `${lead}: the coffee bed is too open for this pot, so the water runs through before it is hot (${f.shareAtHalfPermeability ?? '?'} with a bed half as permeable). Grind finer, or use a bigger pot.`;
        case 'bed-too-tight':
          return `${lead}: the coffee bed is so tight that the water is pushed through above the band (about ${f.mean} on average). Grind coarser and never tamp.`;
        case 'gentlest-heat-too-strong':
          return `${lead}: even the stove's gentlest setting (${f.gentlest}) is too strong for this pot (${f.shareAtHalfHeat ?? '?'} at half that heat). Use a heat diffuser or a smaller burner.`;
        case 'pot-too-small-for-window':
          return `${lead}: the pot is too small for this coffee's brew time; its ${f.cups}-cup brew runs ${f.delivery} against ${f.window}. Use a bigger pot or a coarser grind.`;
        case 'pressure-margin-binds':
          return `${lead}: hotter starts would reach ${f.highCorner} if the inputs are off, above the half-valve limit of ${f.limit} (they would give ${f.shareIfAllowed ?? '?'}). Time a brew log to narrow the inputs, or grind coarser.`;
        case 'band-out-of-reach':
          return `${lead} (about ${f.mean} on average): no setting of this stove reaches the band with this pot and coffee. Try a different grind or stove.`;
      }
    },
    boiling: 'Water boils here at',
    boilingValue: (boiling: string, altitude: string): string =>
      `${boiling} (altitude ${altitude})`,
    /** When the coffee's permeability or the stove's efficiency are defaults, not measured. */
    assumed: (grind: GrindClass | null, stove: boolean, tightening = false): string => {
      const parts = [
        ...(grind ? [`a typical ${grindNames[grind]} grind`] : []),
        ...(stove ? ['a typical efficiency for this kind of stove'] : []),
        ...(tightening ? ['the bed tightening as its entry says (not yet weighed)'] : []),
      ];
      return `Times assume ${parts.join(' and ')}; a timed brew log narrows them.`;
    },
    /** Inputs `stovecard fit` measured: which, from which log, when, how closely. */
    measured: (
      items: readonly {
        readonly what: 'grind' | 'heat' | 'tightening';
        readonly percent: string;
        readonly log: string;
        readonly date: string;
      }[],
    ): string =>
      `Measured from timed brews: ${items
        .map(
          (m) =>
            `${m.what === 'grind' ? 'how fast this coffee flows' : m.what === 'tightening' ? 'how much the bed tightens as it brews' : 'this setting’s heat'} (± ${m.percent} %, ${m.log}, ${m.date})`,
        )
        .join('; ')}.`,
  },
  warningsHeading: 'Check',
  refusal: {
    heading: 'No recipe on this card',
    /** Short reasons for the rows of an insert card. */
    short: {
      'fill-above-valve': 'too little room below the valve',
      'pressure-near-valve': 'coffee too tight for this pot',
      'induction-needs-magnetic-base': 'base does not work on induction',
      'no-delivery': 'does not brew through',
      'no-plan-fits': 'brew time out of range',
    } as Record<RefusalCode, string>,
    why: 'Why',
    change: 'What to change',
    note: 'This pot, coffee and stove were not given a recipe because it would not be safe or would not brew well.',
  },
  /**
   * The usual cautions of a stovetop pressure pot, in our own words. `full` and `compact`
   * are parallel lists (the same caution at the same index); `compact` is for pages where
   * space is short (A6 cards, the running foot of the binder's text pages). Every page a
   * customer, barista or trainee reads carries one of them and the deferral.
   */
  cautions: {
    heading: 'Safety',
    full: [
      'Scalding water, steam and hot metal: hold the handle only; use a cloth on the base.',
      'Before closing, check that the gasket and filter plate are whole and in place; wipe the basket rim clean.',
      'Never fill above the valve.',
      'Never tamp the coffee.',
      'Never heat the pot empty.',
      'Keep the flame no wider than the base and the handle away from it.',
      'Never leave the pot unattended on the heat; keep children away.',
      'When it sputters, keep your face and hands away from the spout and the lid.',
      'Never block the safety valve or point it at anyone; keep it clean and free to move. Do not use a pot whose valve or gasket is damaged.',
      'Before opening, let the base cool, or cool it under the cold tap holding only the handle.',
    ] as readonly string[],
    compact: [
      'Hot water, steam and metal: hold the handle only.',
      'Check gasket and filter plate; wipe the basket rim.',
      'Never fill above the valve.',
      'Never tamp.',
      'Never heat it empty.',
      'Flame no wider than the base, handle clear of it.',
      'Never leave it on the heat alone; keep children away.',
      'Face and hands away from spout and lid.',
      'Never block the valve or aim it at anyone; never use a damaged valve or gasket.',
      'Cool the base (under the tap, by the handle) before opening.',
    ] as readonly string[],
    deferral: 'Follow the maker’s instructions and local rules.',
  },
  footer: {
    printedBy: (business: string, contact: string): string => `From ${business} · ${contact}`,
    built: (date: string, fingerprint: string): string => `computed ${date} · card ${fingerprint}`,
    qr: 'On the web:',
    /** Accessible name of the QR code drawing. */
    qrLabel: 'QR code',
    /** An insert's code opens the coffee's page where customers plan their own pot. */
    qrPlanner: 'Your own pot and stove:',
    /** Text alternative of the roaster's logo (site.yaml brand.logo) on cards and pages. */
    logoAlt: (business: string): string => `${business} logo`,
  },
  planner: {
    /** The link from a station card's page to the coffee's page for customers. */
    link: (coffee: string): string => `Plan ${coffee} for your own pot and stove`,
  },
  crossSection: {
    title: (potName: string): string => `Cross-section of the ${potName}`,
    fillLine: 'Fill line',
    valve: 'Valve',
    margin: (gap: string): string => `${gap} below the valve`,
    basket: 'Basket',
    tube: 'Funnel tube',
  },
  insert: {
    heading: 'How to brew it in a stovetop pot',
    intro: 'Find your pot size and your kind of stove in the table, then follow the steps.',
    columns: {
      pot: 'Pot',
      heat: 'Stove',
      fill: 'Water',
      dose: 'Coffee',
      start: 'Water temp.',
      level: 'Setting',
      firstCoffee: 'First coffee',
      offHeat: 'Off heat',
    },
    heatKind: (kind: HeatKind): string => heatKindNames[kind],
    roomTemperature: 'room temp.',
    notSuitable: 'Not suitable',
    web: (url: string): string =>
      `Full cards with the fill drawing and a chart for each row: ${url}`,
    cups: (cups: number): string => `${cups}-cup`,
    rowName: (cups: string, heat: string): string => `${cups} ${heat.toLowerCase()}`,
    rowWarning: (rows: readonly string[], warning: string): string =>
      `${rows.join(', ')}: ${warning}`,
    fullCard: 'full card',
    /** Heat in words any stove owner understands (render/insert-steps.ts heatFeel). */
    heatFeel: {
      gentle: 'gentle heat',
      medium: 'medium heat',
      strong: 'strong heat',
      full: 'full heat',
    } as Record<HeatFeel, string>,
    /** The Setting cell: the knob's own label, then the heat in words. */
    setting: (label: string, feel: string): string => `${label} · ${feel}`,
    /** The numbered steps for a stranger; a value is null when the table's rows differ. */
    steps: {
      heading: 'Step by step',
      kettle: (temperature: string | null, column: string): string =>
        temperature === null
          ? `Heat water in a kettle to the temperature in the “${column}” column (“room temp.”: no kettle needed).`
          : `Heat water in a kettle to ${temperature}.`,
      roomWater: 'Use water that has stood in the room: no kettle needed.',
      fill: (volume: string | null, column: string): string =>
        `Pour it into the base up to the line just under the valve${volume === null ? ` (the “${column}” column)` : `: ${volume}`}. Never above the valve.`,
      basket: (dose: string | null, column: string): string =>
        `Fill the basket with ground coffee (${dose === null ? `as in the “${column}” column` : dose}), level with the rim. Do not tamp.`,
      seal: 'Screw the top on firmly, holding the hot base with a cloth.',
      heat: (setting: string | null, column: string): string =>
        `Put it on the heat at ${setting === null ? `the setting in the “${column}” column` : `setting ${setting}`}, with a flame no wider than the base (on a hob: a ring no bigger than the base).`,
      time: (offHeat: string | null, column: string): string =>
        `Time from when it goes on the heat. Take it off at ${offHeat === null ? `the time in the “${column}” column` : offHeat}, or sooner at the first gurgle.`,
      cool: 'Cool the base under the cold tap, holding only the handle, then pour.',
    },
    /** A pot size × kind of stove that has no recipe, in plain words, under the table. */
    unsuitableHeading: 'Not suitable',
    onHeat: {
      gas: 'on gas',
      electric: 'on an electric hob',
      induction: 'on induction',
    } as Record<HeatKind, string>,
    unsuitable: (cups: string, onHeat: string, reason: string): string =>
      `The ${cups} pot ${onHeat}: ${reason}.`,
  },
  index: {
    title: 'Stovetop brew cards',
    intro: (business: string): string =>
      `Every card ${business} prints, computed from the pot’s measurements, the coffee and the stove. Print each one on a single page.`,
    sets: 'Card sets',
    station: 'Station cards',
    insert: 'Bag inserts',
    page: 'Web page',
    pdf: 'PDF',
    open: 'open',
    download: 'download',
    pot: 'Pot',
    coffee: 'Coffee',
    stove: 'Stove',
    refused: 'no recipe',
    more: 'For the training binder',
    method: 'How the pot brews',
    troubleshooting: 'When a brew goes wrong',
    rowDetails: 'Full card per row',
  },
  nav: {
    home: 'All cards',
    method: 'How the pot brews',
    troubleshooting: 'When a brew goes wrong',
    print: 'Print this card on one page.',
  },
} as const;

/** The method page, for a training binder. */
export const methodWords = {
  title: 'How the pot brews',
  sections: [
    {
      heading: 'A sealed boiler',
      paragraphs: [
        'Once the pot is screwed shut, the base holds water and, above it, a pocket of air and water vapour. The only way out is up the funnel tube, through the coffee and into the upper chamber.',
        'As the base heats, the gas pocket presses harder on the water and pushes it up the tube. Two things press: the air, which expands as it warms, and the vapour, whose pressure climbs steeply as the water nears boiling.',
      ],
    },
    {
      heading: 'Why the cards start with hot water',
      paragraphs: [
        'Fill with cold water and most of the push comes from heating the trapped air. Air pushes as soon as it warms, so coffee starts to flow early in the heating, while the water is still well below brewing temperature. The first part of the cup is brewed cool.',
        'Fill with hot water and less air is sealed in: the space above hot water is already rich in vapour. The push now comes mostly from steam, which only builds once the water is close to boiling, so coffee starts to flow near brewing temperature.',
        'The kettle temperature on each card is the one the model found to brew the largest share of the cup inside the coffee’s target band.',
      ],
    },
    {
      heading: 'What sets the pace',
      paragraphs: [
        'Water flows through the bed of coffee as through any porous bed (Darcy’s law): the flow is the pressure across the bed times its permeability and area, divided by the water’s viscosity and the bed’s depth.',
        'Grind and packing set the permeability. A finer grind or a pressed bed lets less water through at the same pressure, so the brew is slower and the pressure in the base climbs higher. That is why the cards say never to tamp, and why a grind that is too fine can make a card refuse.',
        'The heat setting sets how fast the pressure rises; the fill sets how much water there is before the base runs dry.',
      ],
    },
    {
      heading: 'The end of the brew',
      paragraphs: [
        'When the water in the base drops to the lower end of the funnel tube, gas breaks through: the pot gurgles and sputters. The last water to come up is the hottest, and steam follows it.',
        'Taking the pot off the heat before that, and cooling the base under the cold tap, stops the brew before the harsh end. The off-heat time on each card is chosen for the best share of the cup in the target band.',
      ],
    },
    {
      heading: 'What the model leaves out',
      paragraphs: [
        'The cards come from a simple model: the water is taken as well mixed, the base as a straight-walled cylinder, the bed as rigid, and the stove’s flame or plate width is folded into one efficiency. That is why times are given as ranges. A brew log of real timed brews narrows them.',
      ],
    },
  ],
  exampleHeading: 'An example from these cards',
  example: (a: {
    coffee: string;
    pot: string;
    stove: string;
    start: string;
    planFirst: string;
    planShare: string;
    coldFirst: string;
    coldShare: string;
    band: string;
  }): string =>
    `${a.coffee} in the ${a.pot} on the ${a.stove}: started from cold water, the first coffee reaches the upper chamber at about ${a.coldFirst} and ${a.coldShare} of the cup is brewed at ${a.band}. Started at ${a.start}, as the card says, the first coffee comes at about ${a.planFirst} and ${a.planShare} of the cup is brewed at ${a.band}.`,
} as const;

/** The troubleshooting page: which input moves which symptom, in the model's terms. */
export const troubleshootingWords = {
  title: 'When a brew goes wrong',
  intro:
    'Each problem below is traced to the inputs that move it in the model behind the cards. Change one thing at a time, and start from the card’s own recipe.',
  columns: { symptom: 'What you see', cause: 'What the model says', change: 'What to change' },
  rows: [
    {
      symptom: 'It gurgles and sputters early',
      cause:
        'The base ran down to the end of the funnel tube quickly: the heat is too high for this pot, the bed lets water through too freely (coarse grind), or there was less water than the card says.',
      change:
        'Fill to the card’s line, use the card’s setting or one lower, and check the grind is not coarser than the card says.',
    },
    {
      symptom: 'It is very slow, or nothing comes out',
      cause:
        'The bed is too tight: the grind is too fine or the coffee was pressed down, or the basket was heaped. A tight bed holds the pressure back and it climbs in the base. Too low a setting also slows the rise.',
      change:
        'Grind coarser, fill the basket level without pressing, and use the card’s setting. If it stays slow, take it off the heat and let it cool before opening.',
    },
    {
      symptom: 'It tastes bitter or harsh',
      cause:
        'Too much of the cup was brewed above the target band: the pot stayed on the heat into the sputter, when the hottest water and steam come through.',
      change:
        'Take it off the heat at the card’s time or at the first gurgle, and cool the base under the cold tap at once.',
    },
    {
      symptom: 'It tastes weak, thin or sour',
      cause:
        'Too much of the cup was brewed below the band: the water started cold, so coffee flowed early and cool, or the bed was too open (coarse grind, basket not full).',
      change:
        'Start with water at the card’s temperature, fill the basket to the rim, and grind to the card’s grind class.',
    },
  ],
  movesHeading: 'Which input moves what',
  movesIntro: (pot: string, coffee: string, stove: string): string =>
    `Computed by the model for ${coffee} in the ${pot} on the ${stove}, changing one input of the card’s recipe at a time:`,
  movesColumns: {
    change: 'Change',
    firstCoffee: 'First coffee',
    meanTemperature: 'Average temperature',
    inBand: 'Share in band',
    peak: 'Highest pressure',
  },
  moves: {
    baseline: 'The card’s recipe',
    finer: 'Grind finer (bed 30 % tighter)',
    coarser: 'Grind coarser (bed 30 % more open)',
    lessWater: 'A fifth less water',
    moreHeat: 'One setting higher',
    lessHeat: 'One setting lower',
    coldStart: 'Cold water instead of hot',
  },
  noCoffee: 'none before the off-heat time',
} as const;

/** Words of `stovecard build`: help, progress and the summary (kept with the site's words). */
export const buildWords = {
  help: [
    'Usage: stovecard build [--content DIR] [--out DIR] [--serve] [--port N] [--host ADDR]',
    '',
    'Builds the site of brew cards: plans every pot × coffee × stove the sets name (cached',
    'in .stovecard-cache/ beside the content folder, so only changed entries are planned',
    'again), renders the station cards, the bag inserts, the index, set, method and',
    'troubleshooting pages, and swaps the new site into place only when everything',
    'succeeded.',
    '',
    '  --content DIR   the content folder (default: content)',
    '  --out DIR       the site folder to write (default: site)',
    '  --serve         build, then serve the site with live reload and rebuild when',
    '                  the content or the templates change',
    '  --port N        port of the server (default 8080)',
    '  --host ADDR     address the server listens on (default 127.0.0.1, this machine',
    '                  only; 0.0.0.0 lets other machines of the network in)',
    '',
    'SOURCE_DATE_EPOCH, when set, is the date printed on the cards (reproducible builds).',
    '',
  ].join('\n'),
  progress: (phase: string, done: number, total: number): string => {
    const verbs: Record<string, string> = {
      load: 'loading content',
      plan: 'planned',
      render: 'rendered',
      write: 'writing pages',
      steps: 'finishing',
      swap: 'swapping the new site in',
    };
    const verb = verbs[phase] ?? phase;
    return total > 0 ? `${verb} ${done}/${total} cards` : verb;
  },
  summary: (s: {
    outDir: string;
    pages: number;
    stations: number;
    inserts: number;
    planned: number;
    cached: number;
    refused: number;
    seconds: number;
  }): string =>
    `built ${s.outDir}: ${s.pages} pages (${s.stations} station cards, ${s.inserts} inserts; ${s.refused} without a recipe); planned ${s.planned}, from cache ${s.cached}; ${s.seconds.toFixed(1)} s`,
  failed: (outDir: string): string => `the build failed; ${outDir} was left as it was`,
  /** One line of the build log per warning a station card carries (the card prints it too). */
  cardWarning: (potId: string, coffeeId: string, stoveId: string, warning: string): string =>
    `warning: ${potId} × ${coffeeId} × ${stoveId}: ${warning}`,
  /** site.yaml brand.colour too light to read as text on white (WCAG 2.x contrast below 4.5:1). */
  brandColourLight: (colour: string, ratio: string, minimum: string): string =>
    `note: brand colour ${colour} has a contrast of ${ratio}:1 on white, below the ${minimum}:1 text needs (WCAG 2.x); it colours only the rules, and headings stay black. A darker shade would colour the headings too.`,
  outHoldsContent: (outDir: string): string =>
    `--out ${outDir} is or contains the content folder, and the build replaces the whole --out folder; choose another folder (default: site)`,
  outHoldsWorkingFolder: (outDir: string): string =>
    `--out ${outDir} is or contains the folder you are working in, and the build replaces the whole --out folder; choose a folder of its own (default: site)`,
  outNotAFolder: (outDir: string): string =>
    `--out ${outDir} is a file, not a folder; choose a folder for the site (default: site)`,
  serving: (url: string, contentDir: string): string =>
    `serving ${url} (Ctrl-C to stop); rebuilding when ${contentDir} or the templates change`,
  rebuilt: (summary: string): string => `rebuilt: ${summary}`,
  /** Heading of the browser's overlay when a rebuild failed (the page under it is the last good one). */
  overlayHeading:
    'The last rebuild failed; this page is the last good build. Fix the problem below and save:',
  rebuildFailed: (message: string): string =>
    `rebuild failed, still serving the last good site:\n${message}`,
  badPort: (raw: string): string => `--port expects a whole number from 1 to 65535, got "${raw}"`,
} as const;
