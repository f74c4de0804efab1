/** User-facing words of the command line: help texts, summaries, errors. */
import { cardWords } from './card.ts';

export const cliWords = {
  /** The valve line of `stovecard plan`: "opens at 1.50 bar", or the assumed value and why. */
  planValve: (valve: string, assumed: boolean): string =>
    assumed
      ? `taken to open at about ${valve}, assumed because no opening pressure was given (ask the maker for it)`
      : `opens at ${valve}`,
  /** The cautions and the deferral `stovecard plan` prints after every recipe or refusal. */
  planCautions: (): string[] => [
    `${cardWords.cautions.heading}:`,
    ...cardWords.cautions.full.map((line) => `  - ${line}`),
    `  ${cardWords.cautions.deferral}`,
  ],
  mainHelp: (commands: string[]): string =>
    [
      'stovecard — printable stovetop brew cards computed by a physics simulation',
      '',
      'Usage: stovecard <command> [options]   (stovecard help <command>, or <command> --help)',
      '       stovecard --version',
      '',
      'Commands:',
      ...commands.map((c) => `  ${c.padEnd(10)} ${commandSummaries[c] ?? ''}`),
      '',
    ].join('\n'),
  unknownCommand: (name: string, commands: string[], suggestion?: string): string =>
    `stovecard: unknown command "${name}"${suggestion ? `; did you mean "${suggestion}"?` : ''} ` +
    `The commands are ${commands.join(', ')} (stovecard --help)`,
  unknownOption: (option: string, options: string[], suggestion?: string): string =>
    `unknown option ${option}${suggestion ? `; did you mean ${suggestion}?` : ''} ` +
    `The options are ${options.join(', ')} (add --help for what each does)`,
  version: (version: string): string => `stovecard ${version}\n`,
  simulateHelp: [
    'Usage: stovecard simulate --pot FILE --coffee FILE (--stove FILE --level LABEL | --power-w W)',
    '                          [--fill-ml V] [--start-c T] [--ambient-c T] [--altitude-m H]',
    '                          [--heat-off-s S] [--json]',
    '',
    'Runs one brew and prints what happens: first coffee, sputter, yield, extraction',
    'temperatures, peak pressure.',
    '',
    '  --pot, --coffee, --stove  YAML entries (see content/README.md)',
    "  --level LABEL             the stove level to use (one of the stove entry's labels)",
    '  --power-w W               heat reaching the pot, W, instead of a stove and level',
    '  --fill-ml V               water in the base, mL (default: the highest safe fill)',
    '  --start-c T               water temperature when sealed, °C (default: room temperature)',
    '  --ambient-c T             room temperature, °C (default 20)',
    '  --altitude-m H            altitude, m (default 0, sea level)',
    '  --heat-off-s S            take the pot off the heat at S seconds (default: never)',
    '  --json                    print one JSON object instead of the summary',
    '',
  ].join('\n'),
  planHelp: [
    'Usage: stovecard plan --pot FILE --coffee FILE --stove FILE [--ambient-c T]',
    '                      [--altitude-m H] [--presets-c 70,80,90] [--fill-ml V] [--json]',
    '',
    'Chooses the fill, water temperature, heat level and off-heat time for the best share',
    "of the cup inside the coffee's target band, or refuses with the reason and a fix.",
    '',
    '  --presets-c LIST   kettle presets, °C, comma-separated (default: 5 °C steps to 90 °C)',
    "  --fill-ml V        a smaller cup than the pot's safe maximum, mL",
    '  --json             print one JSON object instead of the summary',
    '',
  ].join('\n'),
  missingOption: (option: string, help: string): string => `missing ${option}\n\n${help}`,
  badNumber: (option: string, value: string): string =>
    `${option} expects a number, got "${value}" (write digits only, e.g. ${option} 150)`,
  levelNotFound: (label: string, file: string, labels: string[]): string =>
    `level "${label}" is not in ${file}; its levels are ${labels.join(', ')}`,
  levelOrPower: 'give either --stove FILE with --level LABEL, or --power-w W',
  fillAboveValve: (askedMl: number, maxMl: number): string =>
    `--fill-ml ${askedMl}: the water would reach the safety valve once hot; fill at most ${maxMl} mL`,
};

const commandSummaries: Record<string, string> = {
  simulate: 'run one brew of a pot, coffee and stove level',
  plan: 'choose the recipe a card prints for a pot × coffee × stove',
  fit: 'calibrate a coffee and stove from a brew log',
  build: 'build the site of cards (HTML and PDF) from content/',
  init: 'write a new content folder, one entry of each kind, that builds at once',
};
