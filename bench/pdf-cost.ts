/**
 * One-thread cost of drawing card PDFs: reads every view a build left in a cache folder
 * (`<cache>/views/*.json`), draws each card's PDF in this thread and prints the CPU time per
 * file, and a hash of all the bytes (equal hashes: the same PDFs). For comparing two
 * versions of the PDF code on the same views, run it from both checkouts, alternating.
 *
 *   npx tsx bench/pdf-cost.ts <cache folder> [--rounds 3] [--limit N]
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { fromTaggedJson } from '../generator/pipeline/plan-cache.ts';
import type { CardView } from '../generator/render/pdf/card.ts';
import { cardPdf } from '../generator/render/pdf/card.ts';

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { rounds: { type: 'string' }, limit: { type: 'string' } },
});
const cache = positionals[0];
if (!cache) throw new Error('usage: bench/pdf-cost.ts <cache folder> [--rounds N] [--limit N]');
const dir = path.join(cache, 'views');
const files = readdirSync(dir)
  .filter((f) => f.endsWith('.json'))
  .sort()
  .slice(0, Number(values.limit ?? Infinity));
const views = files.map((f) => fromTaggedJson<CardView>(readFileSync(path.join(dir, f), 'utf8')));
const env = { SOURCE_DATE_EPOCH: '1767225600' };

for (let round = 1; round <= Number(values.rounds ?? 3); round += 1) {
  const hash = createHash('sha256');
  const before = process.cpuUsage();
  for (const view of views) {
    const pdf = await cardPdf(view, { author: 'bench', env });
    hash.update(pdf.bytes);
  }
  const used = process.cpuUsage(before);
  const ms = (used.user + used.system) / 1000;
  console.log(
    `round ${round}: ${views.length} card PDFs, ${(ms / views.length).toFixed(1)} ms CPU per file; bytes ${hash.digest('hex').slice(0, 16)}`,
  );
}
