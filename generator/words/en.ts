/**
 * The English catalogue: every sentence a customer reads on a card, an insert, a set page,
 * the binder and the PDFs. Its shape is the `Messages` type (catalogue.ts): another
 * language's catalogue must have every key, or tsc fails.
 */
import { binderWords } from './binder.ts';
import { cardWords, methodWords, troubleshootingWords } from './card.ts';
import { pdfWords } from './pdf.ts';
import { planWords } from './plan.ts';
import { plannerWords } from './planner.ts';
import { setPrintWords } from './print.ts';

export const en = {
  /** BCP 47 tag of this catalogue's text: HTML `lang` and the PDFs' `/Lang` and dc:language. */
  langTag: 'en-GB',
  /** How numbers and dates are written (render/voice.ts): decimal mark; the footer's date from YYYY-MM-DD. */
  format: {
    decimal: '.',
    date: (iso: string): string => iso,
  },
  card: cardWords,
  method: methodWords,
  troubleshooting: troubleshootingWords,
  plan: planWords,
  pdf: pdfWords,
  /** A set page's and the index's words about a set: the binder's label, the cards left out. */
  print: setPrintWords,
  /** The training binder's own pages (render/pdf/binder-pages.ts). */
  binder: binderWords,
  /** The customer's page of a coffee (render/planner-view.ts, browser/planner.ts). */
  planner: plannerWords,
} as const;
