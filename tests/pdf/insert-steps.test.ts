/**
 * The bag insert teaches a stranger: its PDF (read by pdftotext, not by our own code) holds
 * the seven numbered steps in the order a person works (kettle, fill to the line under the
 * valve, level basket without tamping, seal with a cloth, heat at a gentle flame no wider
 * than the base, off at the off-heat time, cool the base), then the table of the rows with
 * a recipe, then the refused combinations in plain words. That order is the one a
 * stovetop pot is used in: common practice, no source (makers' leaflets say the same).
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { InsertCardView } from '../../generator/render/card-view.ts';
import { cardPdf } from '../../generator/render/pdf/card.ts';
import { cardWords } from '../../generator/words/card.ts';
import { NO_EPOCH, demoSite, type DemoSite } from './demo-site.ts';
import { describeWithTools, onPath, runTool } from './poppler.ts';
import { squash } from './read-pdf.ts';

let demo: DemoSite;
let dir: string;
const texts = new Map<string, string>();

beforeAll(async () => {
  demo = await demoSite();
  dir = await mkdtemp(path.join(tmpdir(), 'stovecard-insert-steps-'));
  for (const view of demo.data.insertCards) {
    const file = path.join(dir, `${view.id}.pdf`);
    const pdf = await cardPdf(view, { author: 'Brindlemoss Roastery', env: NO_EPOCH });
    await writeFile(file, pdf.bytes);
    if (onPath('pdftotext')) texts.set(view.id, runTool('pdftotext', ['-raw', file, '-']).stdout);
  }
}, 600_000);

afterAll(async () => {
  await demo.dispose();
  await rm(dir, { recursive: true, force: true });
});

/** Where each of `parts` starts in `text`, searching on from the previous one (-1: missing). */
function positionsInOrder(text: string, parts: readonly string[]): number[] {
  let from = 0;
  return parts.map((part) => {
    const at = text.indexOf(part, from);
    if (at >= 0) from = at + part.length;
    return at;
  });
}

const inserts = (): readonly InsertCardView[] => demo.data.insertCards;

describeWithTools(['pdftotext'], 'an insert PDF (pdftotext)', () => {
  it('has the seven steps in order, each with its number, before the table', () => {
    expect(inserts().length).toBeGreaterThan(0);
    for (const view of inserts()) {
      const text = squash(texts.get(view.id)!);
      expect(view.steps.map((s) => s.code)).toEqual([
        'kettle',
        'fill',
        'basket',
        'seal',
        'heat',
        'time',
        'cool',
      ]);
      const parts = view.steps.map((step) => `${step.n}${squash(step.text)}`);
      const at = positionsInOrder(text, [
        squash(view.stepsHeading),
        ...parts,
        squash(view.columns.firstCoffee),
      ]);
      expect(
        at.every((p) => p >= 0),
        `${view.id}: ${JSON.stringify(at)}\n${text}`,
      ).toBe(true);
    }
  });

  it('prints the numbers of the steps from the same texts as the table (one source)', () => {
    for (const view of inserts()) {
      const rows = view.rows.filter((row) => row.refused === null);
      const starts = new Set(rows.map((row) => row.start));
      const kettle = view.steps.find((s) => s.code === 'kettle')!;
      if (starts.size === 1 && !starts.has(cardWords.insert.roomTemperature))
        expect(kettle.text, view.id).toContain(rows[0]!.start!);
      else expect(kettle.text, view.id).toContain(view.columns.start);
      const offHeat = new Set(rows.map((row) => row.offHeat!.text));
      const time = view.steps.find((s) => s.code === 'time')!;
      if (offHeat.size === 1) expect(time.text).toContain([...offHeat][0]);
      else expect(time.text).toContain(view.columns.offHeat);
      // And the PDF prints each step's text as the view has it.
      const text = squash(texts.get(view.id)!);
      for (const step of view.steps) expect(text, view.id).toContain(squash(step.text));
    }
  });

  it('leaves refused combinations out of the table and says them in plain words', () => {
    const withRefused = inserts().filter((view) => view.rows.some((row) => row.refused));
    expect(withRefused.length).toBeGreaterThan(0);
    for (const view of withRefused) {
      const text = squash(texts.get(view.id)!);
      expect(text).not.toContain(squash(cardWords.insert.notSuitable + ':'));
      for (const item of view.unsuitable!.items) expect(text).toContain(squash(item));
      const tableEnd = text.lastIndexOf(
        squash(view.rows.filter((r) => !r.refused).at(-1)!.offHeat!.text),
      );
      expect(text.indexOf(squash(view.unsuitable!.items[0]!))).toBeGreaterThan(tableEnd);
    }
  });
});
