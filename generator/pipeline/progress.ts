/**
 * Build progress. buildSite reports events; the command line shows a live counter on a
 * terminal ("planned 12/30 cards") and stays quiet otherwise, ending with one summary line.
 */
import { buildWords } from '../words/card.ts';

export type BuildPhase = 'load' | 'plan' | 'render' | 'write' | 'steps' | 'swap';

export interface ProgressEvent {
  readonly phase: BuildPhase;
  /** Items finished in this phase, and how many there are (0 when not counted). */
  readonly done: number;
  readonly total: number;
}

export type ProgressListener = (event: ProgressEvent) => void;

interface Stream {
  readonly isTTY?: boolean;
  write(text: string): unknown;
}

/** A listener that redraws one status line on a terminal, and does nothing elsewhere. */
export function terminalProgress(
  stream: Stream = process.stderr,
): ProgressListener & { finish(): void } {
  let shown = false;
  const listener = ((event: ProgressEvent) => {
    if (!stream.isTTY) return;
    stream.write(`\r\x1b[2K${buildWords.progress(event.phase, event.done, event.total)}`);
    shown = true;
  }) as ProgressListener & { finish(): void };
  listener.finish = () => {
    if (shown) stream.write('\r\x1b[2K');
    shown = false;
  };
  return listener;
}
