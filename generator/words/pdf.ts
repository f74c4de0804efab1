/**
 * Words that only the PDFs need: document metadata, text alternatives of drawings the
 * views leave without one, the binder's contents page and page numbers. Everything a card
 * shows comes worded from the card views (generator/words/card.ts); nothing here repeats it.
 */

export const pdfWords = {
  /** Info `Creator` and XMP `CreatorTool`. */
  creator: 'stovecard',
  /** Document title of a station card. */
  stationTitle: (coffee: string, subtitle: string): string => `${coffee} — ${subtitle}`,
  /** Document title of a bag insert. */
  insertTitle: (coffee: string): string => `${coffee} — bag insert`,
  /** Document title of a set of cards, or of a training binder. */
  setTitle: (set: string): string => set,
  /** Document title of a set's sheets (several cards to a sheet). */
  sheetTitle: (set: string, up: number, paper: string): string =>
    `${set} — ${up} per ${paper} sheet`,
  /** Text alternative of the cross-section: the drawing's own title and the fill-line sentence. */
  crossSectionAlt: (title: string, fillLine: string): string => `${title}. ${fillLine}`,
  qrAlt: (url: string): string => `QR code of ${url}`,
  /** Number shown in the disc before a step heading (read as part of the heading). */
  stepNumber: (n: number): string => `${n}`,
  /** Marker of an ordered-list item and of a bullet. */
  listNumber: (n: number): string => `${n}.`,
  bullet: '•',
  contents: {
    heading: 'Contents',
    intro: (count: number): string =>
      count === 1 ? 'One card, each on its own page.' : `${count} cards, each on its own page.`,
    frontMatter: 'Before the cards',
    cards: 'The cards',
    /** A contents line of a station card: "<coffee>, in the <pot> · on the <stove>". */
    station: (title: string, subtitle: string): string => `${title}, ${subtitle}`,
    refused: (line: string, status: string): string => `${line} (${status})`,
  },
  doesNotFit: (card: string, paper: string, usedPt: number, availablePt: number): string =>
    `the card "${card}" does not fit on one ${paper} page with every text at 7 pt or more, even without its optional blocks (${Number.isFinite(usedPt) ? `${Math.ceil(usedPt)} pt of text for ${Math.floor(availablePt)} pt` : `it needs more than the ${Math.floor(availablePt)} pt the page has`}): print it on larger paper (paper: in site.yaml, or on its set), give an insert set fewer pots or stoves (pots:, stoves:), or shorten its longest text in the YAML (a name, the notes).`,
  /** Page number in the bottom margin of a set's or binder's pages. */
  pageNumber: (n: number, total: number): string => `${n} / ${total}`,
} as const;
