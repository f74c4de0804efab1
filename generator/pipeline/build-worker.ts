/**
 * One worker thread of the build's pool (pool.ts): takes a task, runs the same function
 * the single-threaded build calls, and posts back the result and the time it took.
 * Plans and views come and go as their cache text (plan-cache.ts toTaggedJson), parsed
 * here exactly as the build's own thread parses them.
 *
 *   plan          planCard(request)                  → planToJson text, simulations run
 *   station-view  stationCardView(plan, catalogue)   → toTaggedJson text of the view
 *   card-pdf      cardPdf(view)                      → the PDF's bytes
 *   set-pdf       assembleSet(input, the card PDF files, their cached segments)
 *                                                    → the PDF's bytes, page count, new segments
 *   sheet-pdf     sheetPdf(input, the cell views)    → the PDF's bytes, pages, blocks left out
 *   bare-pdf      barePdf(input)                     → the bench's stricter floor (bare.ts)
 *
 * The renderers are imported on first use, so a worker that only plans never loads
 * vega or pdfkit.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { Catalogue } from '../content/types.ts';
import type { PlanRequest } from '../planning/plan.ts';
import type { CardViewOptions } from '../render/card-view.ts';
import type { BarePdfInput } from '../render/pdf/bare.ts';
import type { SetPdfInput } from '../render/pdf/binder.ts';
import type { SheetPdfInput } from '../render/pdf/sheet.ts';
import type { AssembledSet, SegmentSource } from './set-assembly.ts';
import type { CardView, PdfContext } from '../render/pdf/card.ts';
import { fromTaggedJson, planFromJson, planToJson, toTaggedJson } from './plan-cache.ts';

export type TaskRequest =
  | { readonly kind: 'plan'; readonly request: PlanRequest }
  | {
      readonly kind: 'station-view';
      readonly planJson: string;
      /** The card's own catalogue (site-data.ts cardCatalogue). */
      readonly catalogue: Catalogue;
      readonly options: CardViewOptions;
    }
  | { readonly kind: 'card-pdf'; readonly viewJson: string; readonly context: PdfContext }
  | {
      readonly kind: 'set-pdf';
      readonly input: Omit<SetPdfInput, 'cardPdfs' | 'cardSegments'>;
      /** The set's cards' PDF files, in order (read here rather than sent over). */
      readonly cardFiles: readonly string[];
      /** Where their pages' segments are cached (set-assembly.ts); null: made here. */
      readonly segments: SegmentSource | null;
    }
  | {
      readonly kind: 'sheet-pdf';
      readonly input: Omit<SheetPdfInput, 'cards'>;
      /** The set's cards laid out for the cell (render/sheet.ts onCell), as toTaggedJson text. */
      readonly viewsJson: readonly string[];
    }
  | { readonly kind: 'bare-pdf'; readonly input: BarePdfInput };

interface Results {
  plan: { readonly json: string; readonly simulations: number };
  'station-view': { readonly json: string };
  'card-pdf': { readonly bytes: Uint8Array; readonly dropped: readonly string[] };
  'set-pdf': AssembledSet;
  'sheet-pdf': {
    readonly bytes: Uint8Array;
    readonly pages: number;
    readonly dropped: readonly { readonly card: string; readonly blocks: readonly string[] }[];
  };
  'bare-pdf': { readonly bytes: Uint8Array };
}

export type TaskResult<K extends TaskRequest['kind']> = Results[K];

export type WorkerReply =
  | { readonly id: number; readonly ok: true; readonly result: unknown; readonly ms: number }
  | {
      readonly id: number;
      readonly ok: false;
      readonly error: { readonly name: string; readonly message: string; readonly stack?: string };
    };

/** Runs one task in this thread; the pool's workers and tests call it. */
export async function runTask(task: TaskRequest): Promise<TaskResult<TaskRequest['kind']>> {
  switch (task.kind) {
    case 'plan': {
      const { planCard } = await import('../planning/plan.ts');
      const plan = planCard(task.request);
      return {
        json: planToJson(plan),
        simulations: 'simulations' in plan ? plan.simulations : 0,
      };
    }
    case 'station-view': {
      const { stationCardView } = await import('../render/card-view.ts');
      const plan = planFromJson(task.planJson);
      return { json: toTaggedJson(await stationCardView(plan, task.catalogue, task.options)) };
    }
    case 'card-pdf': {
      const { cardPdf } = await import('../render/pdf/card.ts');
      const pdf = await cardPdf(fromTaggedJson<CardView>(task.viewJson), task.context);
      return { bytes: pdf.bytes, dropped: pdf.fit.dropped ?? [] };
    }
    case 'set-pdf': {
      const { assembleSet } = await import('./set-assembly.ts');
      return assembleSet(task.input, task.cardFiles, task.segments);
    }
    case 'sheet-pdf': {
      const { sheetPdf } = await import('../render/pdf/sheet.ts');
      const cards = task.viewsJson.map((json) => fromTaggedJson<CardView>(json));
      const pdf = await sheetPdf({ ...task.input, cards });
      return { bytes: pdf.bytes, pages: pdf.pages, dropped: pdf.dropped };
    }
    case 'bare-pdf': {
      const { barePdf } = await import('../render/pdf/bare.ts');
      return { bytes: await barePdf(task.input) };
    }
  }
}

function transferList(result: unknown): ArrayBuffer[] {
  const bytes = (result as { bytes?: Uint8Array }).bytes;
  // A Buffer may share a pooled ArrayBuffer; only an exclusively owned one is transferred.
  return bytes && bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength
    ? [bytes.buffer as ArrayBuffer]
    : [];
}

/** workerData of the pool's workers (a test runner's own threads have other data). */
export const WORKER_ROLE = 'stovecard-build-worker';

if (parentPort && (workerData as { role?: string } | null)?.role === WORKER_ROLE) {
  const port = parentPort;
  port.on('message', async ({ id, request }: { id: number; request: TaskRequest }) => {
    const started = performance.now();
    try {
      const result = await runTask(request);
      const reply: WorkerReply = { id, ok: true, result, ms: performance.now() - started };
      port.postMessage(reply, transferList(result));
    } catch (error) {
      const e = error instanceof Error ? error : new Error(String(error));
      const reply: WorkerReply = {
        id,
        ok: false,
        error: { name: e.name, message: e.message, ...(e.stack ? { stack: e.stack } : {}) },
      };
      port.postMessage(reply);
    }
  });
}
