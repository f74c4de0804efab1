/**
 * Where a measured value came from: `stovecard fit --write` ends the value's line with a
 * note, `fitted ± 3 % from logs/first-morning.yaml, 2026-12-02`, and the loader reads it
 * back, so the plan's ranges use the fitted σ and the card can say which log measured
 * what, and when. The note is a small file format (not translated): one writer
 * (`provenanceNote`), one reader (`provenanceAt`).
 */
import { rangeAt, type YamlPath, type YamlSource } from './yaml-source.ts';

export interface Provenance {
  /** The fit's 1-σ, relative (0.03 for ± 3 %). */
  readonly sigmaRel: number;
  /** The brew log, as written in the note (`logs/<file>.yaml`). */
  readonly log: string;
  /** YYYY-MM-DD the fit was written. */
  readonly date: string;
}

const NOTE = /fitted ± (\d+(?:\.\d+)?) % from (.+?), (\d{4}-\d{2}-\d{2})\b/u;

/** The note `fit --write` puts after a value it wrote; `percent` is the σ as printed. */
export function provenanceNote(percent: string, log: string, date: string): string {
  return `fitted ± ${percent} % from ${log}, ${date}`;
}

/** The note on the line where the value at `path` ends, if that line has one. */
export function provenanceAt(source: YamlSource, path: YamlPath): Provenance | undefined {
  const range = rangeAt(source, path);
  if (!range) return undefined;
  const lineEnd = source.text.indexOf('\n', range[1]);
  const rest = source.text.slice(range[1], lineEnd < 0 ? source.text.length : lineEnd);
  const found = NOTE.exec(rest);
  if (!found) return undefined;
  const sigmaRel = Number(found[1]) / 100;
  return Number.isFinite(sigmaRel) && sigmaRel > 0
    ? { sigmaRel, log: found[2]!, date: found[3]! }
    : undefined;
}
