/**
 * The build's worker pool: plans made on worker threads are the plans made in this thread,
 * byte for byte as the cache stores them (planToJson), for every card of the demo; views
 * too; a task that throws rejects with its error; a failure stops the queue. The whole
 * site made on the pool is compared with a one-thread build in incremental.test.ts.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runTask } from '../../generator/pipeline/build-worker.ts';
import { expandCards, type CardJobs } from '../../generator/pipeline/cards.ts';
import { allSettledOrThrow, mapConcurrent } from '../../generator/pipeline/concurrent.ts';
import { planRequestOf } from '../../generator/pipeline/plan-all.ts';
import { planToJson } from '../../generator/pipeline/plan-cache.ts';
import { WorkerPool } from '../../generator/pipeline/pool.ts';
import { cardCatalogue } from '../../generator/pipeline/site-data.ts';
import { loadCatalogue } from '../../generator/content/index.ts';
import type { Catalogue } from '../../generator/content/types.ts';
import { planCard } from '../../generator/planning/plan.ts';

let catalogue: Catalogue;
let jobs: CardJobs;
let pool: WorkerPool;

beforeAll(async () => {
  catalogue = await loadCatalogue('content');
  jobs = expandCards(catalogue);
  pool = new WorkerPool({ size: 2 });
});

afterAll(async () => {
  await pool?.close();
});

describe('WorkerPool', () => {
  it('pool.run({ kind: "plan" }) gives planCard’s plan for every demo card, byte for byte', async () => {
    const requests = jobs.stations.map((job) => planRequestOf(catalogue, job.request));
    const pooled = await Promise.all(
      requests.map((request) => pool.run({ kind: 'plan', request })),
    );
    expect(pool.spawned).toBe(2);
    requests.forEach((request, i) => {
      const inline = planCard(request);
      expect(pooled[i]!.result.json, jobs.stations[i]!.slug).toBe(planToJson(inline));
      expect(pooled[i]!.result.simulations).toBe('simulations' in inline ? inline.simulations : 0);
    });
  });

  it('pool.run({ kind: "station-view" }) gives the view this thread renders', async () => {
    const job = jobs.stations.find((j) => j.request.coffeeId === 'house-blend')!;
    const planJson = planToJson(planCard(planRequestOf(catalogue, job.request)));
    const task = {
      kind: 'station-view' as const,
      planJson,
      catalogue: cardCatalogue(catalogue, [job.request]),
      options: { builtOn: '2024-05-01', fingerprint: 'abcd1234' },
    };
    const pooled = await pool.run(task);
    expect(pooled.result.json).toBe(((await runTask(task)) as { json: string }).json);
    expect(pooled.ms).toBeGreaterThan(0);
  });

  it('a task that throws in a worker rejects with its error name and message', async () => {
    const failing = pool.run({
      kind: 'card-pdf',
      viewJson: '{"cut off',
      context: { author: 'x', env: {} },
    });
    await expect(failing).rejects.toMatchObject({ name: 'SyntaxError' });
    // The worker survives its task's error and takes the next one.
    const request = planRequestOf(catalogue, jobs.stations[0]!.request);
    await expect(pool.run({ kind: 'plan', request })).resolves.toBeTruthy();
  });

  it('clearQueue() rejects the tasks not yet started; close() stops the workers', async () => {
    const own = new WorkerPool({ size: 1 });
    const request = planRequestOf(catalogue, jobs.stations[0]!.request);
    const first = own.run({ kind: 'plan', request });
    const queued = own.run({ kind: 'plan', request });
    own.clearQueue(new Error('stop'));
    await expect(queued).rejects.toThrow('stop');
    await expect(first).resolves.toBeTruthy();
    await own.close();
    await expect(own.run({ kind: 'plan', request })).rejects.toThrow(/closed/);
  });
});

describe('mapConcurrent and allSettledOrThrow', () => {
  it('mapConcurrent keeps the order and never runs more than the limit at once', async () => {
    let running = 0;
    let most = 0;
    const out = await mapConcurrent([5, 1, 4, 2, 3], 2, async (n) => {
      running += 1;
      most = Math.max(most, running);
      await new Promise((resolve) => setTimeout(resolve, n));
      running -= 1;
      return n * 10;
    });
    expect(out).toEqual([50, 10, 40, 20, 30]);
    expect(most).toBe(2);
  });

  it('mapConcurrent rejects only once the calls in flight have settled, and starts no more', async () => {
    const finished: number[] = [];
    const started: number[] = [];
    const run = mapConcurrent([0, 1, 2, 3, 4, 5], 2, async (n) => {
      started.push(n);
      if (n === 0) throw new Error('first fails');
      await new Promise((resolve) => setTimeout(resolve, 20));
      finished.push(n);
    });
    await expect(run).rejects.toThrow('first fails');
    expect(finished).toEqual([1]); // in flight when 0 failed, awaited before the rejection
    expect(started).toEqual([0, 1]);
  });

  it('allSettledOrThrow waits for every promise before rejecting with the first failure', async () => {
    let slowDone = false;
    const slow = new Promise<number>((resolve) =>
      setTimeout(() => {
        slowDone = true;
        resolve(1);
      }, 20),
    );
    await expect(allSettledOrThrow([Promise.reject(new Error('no')), slow])).rejects.toThrow('no');
    expect(slowDone).toBe(true);
  });
});
