/**
 * The plan phase: one plan per distinct pot × coffee × stove, from the plan cache when its
 * key is there, else planned (in the worker pool when there is one; in this thread
 * otherwise) and written to the cache.
 *
 * A plan is ~15 kB of JSON (two runs with their cup curves), so plans stay text until something reads
 * them: a cached plan is not even read unless its view has to be rendered, and workers are
 * sent the text (a string is copied to a thread far faster than the object it encodes).
 */
import type { Catalogue, CardRequest } from '../content/types.ts';
import { planCard, type PlanRequest } from '../planning/plan.ts';
import type { CardPlan } from '../planning/types.ts';
import type { CardJobs } from './cards.ts';
import { planCodeVersion } from './code-version.ts';
import { IO_LIMIT, mapConcurrent } from './concurrent.ts';
import { PlanCache, planFromJson, planKey, planToJson } from './plan-cache.ts';
import type { WorkerPool } from './pool.ts';
import type { ProgressListener } from './progress.ts';
import { emptyStats, type BuildStats } from './stats.ts';

/** One planned card: its request, the cache key and the plan. */
export interface PlannedCard {
  readonly slug: string;
  readonly request: CardRequest;
  readonly key: string;
  /** The plan (parsed, and for a cached one read, the first time this is read). */
  readonly plan: CardPlan;
  readonly fromCache: boolean;
}

export interface PlanOptions {
  /** Plans the misses on these workers; without, in this thread. */
  readonly pool?: WorkerPool | null;
  readonly stats?: BuildStats;
}

/** A plan kept as its cache text, parsed on first use. */
class PlanText implements PlannedCard {
  #text: string | null;
  #plan: CardPlan | null = null;

  constructor(
    readonly slug: string,
    readonly request: CardRequest,
    readonly key: string,
    readonly fromCache: boolean,
    text: string | null,
    private readonly cache: PlanCache,
    private readonly planRequest: PlanRequest,
  ) {
    this.#text = text;
  }

  get plan(): CardPlan {
    if (this.#plan) return this.#plan;
    try {
      this.#plan = planFromJson(this.textSync());
    } catch {
      this.#text = this.replan();
      this.#plan = planFromJson(this.#text);
    }
    return this.#plan;
  }

  /** planToJson of the plan, as the cache holds it. */
  async text(): Promise<string> {
    this.#text ??= whole(await this.cache.getText(this.key)) ?? this.replan();
    return this.#text;
  }

  private textSync(): string {
    this.#text ??= whole(this.cache.getTextSync(this.key)) ?? this.replan();
    return this.#text;
  }

  /** A cache file damaged or removed since the lookup: the same plan, made here. */
  private replan(): string {
    const text = planToJson(planCard(this.planRequest));
    // Back into the cache, so the next build finds it whole (a failed write costs a re-plan).
    void this.cache.putJson(this.key, text).catch(() => {});
    return text;
  }
}

/** The text when it looks like a whole JSON object (a cut-off file is re-planned). */
function whole(text: string | null): string | null {
  return text !== null && text.startsWith('{') && text.endsWith('}') ? text : null;
}

/** The plan's cache text (planToJson), without parsing a plan that is still text. */
export function planTextOf(card: PlannedCard): Promise<string> {
  return card instanceof PlanText ? card.text() : Promise.resolve(planToJson(card.plan));
}

export function planRequestOf(catalogue: Catalogue, request: CardRequest): PlanRequest {
  const site = catalogue.site;
  return {
    pot: catalogue.pots.get(request.potId)!,
    coffee: catalogue.coffees.get(request.coffeeId)!,
    stove: catalogue.stoves.get(request.stoveId)!,
    room: site.room,
    kettlePresetsK: site.kettlePresetsK,
  };
}

/** planToJson of a new plan (in a worker when there is a pool), its simulations and time. */
async function newPlan(
  request: PlanRequest,
  pool: WorkerPool | null,
): Promise<{ json: string; simulations: number; ms: number }> {
  if (pool) {
    const { result, ms } = await pool.run({ kind: 'plan', request }).catch((error: unknown) => {
      pool.clearQueue(); // the build fails: plan nothing more
      throw error;
    });
    return { ...result, ms };
  }
  const started = performance.now();
  const plan = planCard(request);
  const json = planToJson(plan);
  const simulations = 'simulations' in plan ? plan.simulations : 0;
  return { json, simulations, ms: performance.now() - started };
}

/** Plans every distinct request once, from the cache when its key is there. */
export async function planAll(
  catalogue: Catalogue,
  jobs: CardJobs,
  cache: PlanCache,
  onProgress: ProgressListener = () => {},
  options: PlanOptions = {},
): Promise<Map<string, PlannedCard>> {
  const codeVersion = await planCodeVersion();
  const stats = options.stats ?? emptyStats();
  const pool = options.pool ?? null;
  // One plan per pot × coffee × stove: the same card in two languages shares it.
  const unique = [...new Map(jobs.stations.map((job) => [job.slug, job])).values()];
  const total = unique.length;
  let done = 0;
  onProgress({ phase: 'plan', done, total });
  // Many in flight: lookups are quick, and the pool queues the misses.
  const cards = await mapConcurrent(unique, IO_LIMIT * 8, async (job) => {
    const request = planRequestOf(catalogue, job.request);
    const key = planKey({ ...request, site: catalogue.site, codeVersion });
    let card: PlanText;
    if (await cache.has(key)) {
      card = new PlanText(job.slug, job.request, key, true, null, cache, request);
      stats.plans.reused += 1;
    } else {
      const { json, simulations, ms } = await newPlan(request, pool);
      await cache.putJson(key, json);
      // Kept as the cache's text, so a cold and a warm build draw from the same data.
      card = new PlanText(job.slug, job.request, key, false, json, cache, request);
      stats.plans.made += 1;
      stats.plans.ms += ms;
      stats.plans.simulations += simulations;
    }
    onProgress({ phase: 'plan', done: ++done, total });
    return card;
  });
  return new Map(cards.map((card) => [card.slug, card]));
}
