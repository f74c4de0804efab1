/**
 * A pool of worker threads for the build's heavy, independent items (plans, card views,
 * PDFs): `os.availableParallelism()` workers running build-worker.ts, started on the first
 * task, each taking the next task from one queue in the order they were submitted.
 *
 *   build ─ run(task) ─▶ queue ─▶ idle worker ─ runTask ─▶ { result, ms } ─▶ resolves
 *
 * Workers start from compiled JavaScript whenever there is some that is up to date: the
 * compiled build-worker.js beside this file (dist/), or, when this code runs from the
 * TypeScript sources (tsx, vitest, the bench), dist/generator/pipeline/build-worker.js
 * when no source under generator/ is newer than it (the test bin/stovecard.js makes), so
 * a worker does not pay for tsx (its loader thread, compiling every module) on each
 * start. Otherwise from build-worker.mjs, which registers tsx and loads build-worker.ts
 * (Node 20 ignores a loader given as a Worker's `execArgv: ['--import', 'tsx']`,
 * nodejs/node #47747), so this works under the tsx CLI, bin/stovecard.js and vitest
 * alike, from any working folder. Tasks and results are structured-cloned; plans and views
 * travel as JSON text (plan-cache.ts), PDFs as bytes. A task that throws in a worker
 * rejects with an Error of the same name and message. A worker that dies fails the task it
 * held and is replaced on the next one; one that dies before finishing any task (it could
 * not start) fails every queued task with its error, and the pool takes no more.
 */
import { readdirSync, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { COMPILED, PROJECT_ROOT } from '../project-root.ts';
import {
  WORKER_ROLE,
  type TaskRequest,
  type TaskResult,
  type WorkerReply,
} from './build-worker.ts';

export type { TaskRequest, TaskResult } from './build-worker.ts';

/** Newest modification time of the .ts files under `dir`, ms (0 when there are none). */
function newestSource(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(full));
    else if (entry.name.endsWith('.ts')) newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}

/**
 * The compiled worker of dist/ when it is at least as new as every source under
 * generator/ (so it is the same code), else null.
 */
export function freshCompiledWorker(root: string = PROJECT_ROOT): URL | null {
  const compiled = path.join(root, 'dist', 'generator', 'pipeline', 'build-worker.js');
  try {
    const compiledTime = statSync(compiled).mtimeMs;
    return newestSource(path.join(root, 'generator')) <= compiledTime
      ? pathToFileURL(compiled)
      : null;
  } catch {
    return null;
  }
}

let workerUrl: URL | null = null;

/** Where the workers start (decided once per process, at the first worker). */
export function workerEntry(): URL {
  workerUrl ??= COMPILED
    ? new URL('./build-worker.js', import.meta.url)
    : (freshCompiledWorker() ?? new URL('./build-worker.mjs', import.meta.url));
  return workerUrl;
}

/** Profiling flags of this process passed on, so `node --cpu-prof` also profiles workers. */
function inheritedFlags(): string[] {
  return process.execArgv.filter((flag) => /^--cpu-prof(-dir|-name|-interval)?(=|$)/.test(flag));
}

/** A task's result and how long the worker spent on it (ms, timed in the worker). */
export interface Timed<K extends TaskRequest['kind']> {
  readonly result: TaskResult<K>;
  readonly ms: number;
}

interface Pending {
  readonly request: TaskRequest;
  resolve(value: { result: unknown; ms: number }): void;
  reject(error: Error): void;
}

interface Slot {
  readonly worker: Worker;
  task: (Pending & { id: number }) | null;
  finished: number;
  dead: boolean;
}

export interface PoolOptions {
  /** Default os.availableParallelism(). */
  readonly size?: number;
}

export class WorkerPool {
  readonly size: number;
  private readonly slots: Slot[] = [];
  private readonly queue: Pending[] = [];
  private nextId = 0;
  private closed = false;
  /** Why no worker could start, once one could not. */
  private broken: Error | null = null;
  /** Workers started so far (on demand, up to `size`, and in place of one that died). */
  spawned = 0;

  constructor(options: PoolOptions = {}) {
    this.size = Math.max(1, options.size ?? availableParallelism());
  }

  /** Queues one task; resolves with its result once a worker has run it. */
  run<K extends TaskRequest['kind']>(request: TaskRequest & { kind: K }): Promise<Timed<K>> {
    if (this.closed) return Promise.reject(new Error('worker pool: closed'));
    if (this.broken) return Promise.reject(this.broken);
    return new Promise((resolve, reject) => {
      this.queue.push({
        request,
        resolve: resolve as Pending['resolve'],
        reject,
      });
      this.dispatch();
    });
  }

  /** Rejects every task not yet started (after a failure, so the rest is not rendered). */
  clearQueue(reason: Error = new Error('worker pool: cancelled')): void {
    for (const pending of this.queue.splice(0)) pending.reject(reason);
  }

  /** Stops every worker; queued tasks are rejected. */
  async close(): Promise<void> {
    this.closed = true;
    for (const pending of this.queue.splice(0)) pending.reject(new Error('worker pool: closed'));
    await Promise.all(this.slots.map((slot) => slot.worker.terminate()));
    this.slots.length = 0;
  }

  private dispatch(): void {
    while (this.queue.length > 0) {
      let slot = this.slots.find((s) => !s.dead && s.task === null);
      if (!slot) {
        if (this.slots.filter((s) => !s.dead).length >= this.size) return;
        slot = this.spawn();
      }
      const pending = this.queue.shift()!;
      const id = this.nextId++;
      slot.task = { ...pending, id };
      slot.worker.postMessage({ id, request: pending.request });
    }
  }

  private spawn(): Slot {
    const worker = new Worker(workerEntry(), {
      execArgv: inheritedFlags(),
      workerData: { role: WORKER_ROLE },
    });
    this.spawned += 1;
    const slot: Slot = { worker, task: null, finished: 0, dead: false };
    worker.on('message', (reply: WorkerReply) => {
      const task = slot.task;
      if (!task || task.id !== reply.id) return;
      slot.task = null;
      slot.finished += 1;
      if (reply.ok) {
        task.resolve({ result: reply.result, ms: reply.ms });
      } else {
        const error = new Error(reply.error.message);
        error.name = reply.error.name;
        if (reply.error.stack) error.stack = reply.error.stack;
        task.reject(error);
      }
      this.dispatch();
    });
    const fail = (error: Error) => {
      if (slot.dead) return;
      slot.dead = true;
      this.slots.splice(this.slots.indexOf(slot), 1);
      slot.task?.reject(error);
      slot.task = null;
      if (slot.finished === 0) {
        this.broken = error;
        this.clearQueue(error);
      }
      if (!this.closed) this.dispatch();
    };
    worker.on('error', fail);
    worker.on('exit', (code) => {
      if (!this.closed) fail(new Error(`worker pool: a worker stopped (exit code ${code})`));
    });
    this.slots.push(slot);
    return slot;
  }
}
