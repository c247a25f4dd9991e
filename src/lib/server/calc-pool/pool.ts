/**
 * A bounded pool of worker threads for the heavy calculations, so that a year of hourly rows for
 * several surfaces never holds up the event loop (health checks, sign-ins, other pages).
 *
 * Each worker runs one calculation at a time; further calls wait in a queue of at most
 * `queueLimit` entries, and a call that finds the queue full is refused at once (QueueFullError)
 * instead of piling up memory. A worker that dies (out of memory, a crash) fails only the call it
 * was running and is replaced.
 */
import { Worker } from "node:worker_threads";
import type { CalcTaskName, CalcTasks } from "./tasks";
import type { WorkerError, WorkerReply, WorkerRequest } from "./protocol";

export interface CalcPoolOptions {
  /** Worker threads (≥ 1). */
  workers: number;
  /** Calls that may wait for a free worker (≥ 0). */
  queueLimit: number;
  /** The worker's entry module. */
  workerFile: URL;
}

/** Every worker is busy and the queue is full; `retryAfterS` is a fair guess of when to try again. */
export class QueueFullError extends Error {
  constructor(readonly retryAfterS: number) {
    super("The calculation queue is full");
    this.name = "QueueFullError";
  }
}

interface Job {
  id: number;
  task: CalcTaskName;
  input: unknown;
  resolve: (bytes: Uint8Array) => void;
  reject: (err: Error) => void;
}

interface Slot {
  worker: Worker;
  job: Job | null;
  startedAt: number;
  /** The entry module loaded and said so; a worker that never gets that far is not replaced. */
  online: boolean;
}

/**
 * Rebuilds the worker's error on this side: the engine's RangeErrors (and subclasses) stay RangeErrors
 * with the same message (the endpoints answer them 400 naming the field); anything else is a plain Error.
 */
function errorFromWorker(e: WorkerError): Error {
  const err = e.range ? new RangeError(e.message) : new Error(`${e.name}: ${e.message}`);
  if (e.stack) err.stack = `${err.name}: ${err.message}\n    (in calculation worker)\n${e.stack.split("\n").slice(1).join("\n")}`;
  return err;
}

export class CalcPool {
  private readonly slots: Slot[] = [];
  private readonly queue: Job[] = [];
  private nextId = 1;
  private closed = false;
  /** Why no worker is left, once every one failed to start. */
  private broken: Error | null = null;
  /** Smoothed duration of one calculation [ms], for Retry-After. */
  private meanMs = 500;

  constructor(private readonly options: CalcPoolOptions) {
    if (!(options.workers >= 1)) throw new RangeError("CalcPool: workers must be at least 1");
    for (let i = 0; i < options.workers; i++) this.slots.push(this.spawn());
  }

  /** Worker threads (fewer than asked for only when some could not start). */
  get size(): number {
    return this.slots.length;
  }
  /** Calls waiting for a worker. */
  get queued(): number {
    return this.queue.length;
  }
  /** Calls being computed. */
  get running(): number {
    return this.slots.filter((s) => s.job).length;
  }

  /** Runs a calculation in a worker; resolves with the response body (UTF-8 JSON). */
  run<K extends CalcTaskName>(task: K, input: CalcTasks[K]): Promise<Uint8Array> {
    if (this.closed) return Promise.reject(new Error("CalcPool: closed"));
    if (this.broken) return Promise.reject(this.broken);
    const free = this.slots.find((s) => !s.job);
    if (!free && this.queue.length >= this.options.queueLimit) {
      const waves = (this.queue.length + this.slots.length) / this.slots.length;
      return Promise.reject(new QueueFullError(Math.max(1, Math.ceil((waves * this.meanMs) / 1000))));
    }
    return new Promise<Uint8Array>((resolve, reject) => {
      const job: Job = { id: this.nextId++, task, input, resolve, reject };
      if (free) this.start(free, job);
      else this.queue.push(job);
    });
  }

  /** Stops every worker; calls still waiting or running fail. */
  async close(): Promise<void> {
    this.closed = true;
    const failure = new Error("CalcPool: closed");
    for (const job of this.queue.splice(0)) job.reject(failure);
    await Promise.all(
      this.slots.map(async (s) => {
        s.job?.reject(failure);
        s.job = null;
        await s.worker.terminate();
      }),
    );
  }

  private spawn(): Slot {
    const worker = new Worker(this.options.workerFile, { name: "paneray-calc" });
    const slot: Slot = { worker, job: null, startedAt: 0, online: false };
    worker.unref(); // an idle pool does not keep the process alive
    worker.on("message", (reply: WorkerReply) => {
      if ("ready" in reply) {
        slot.online = true;
        return;
      }
      const job = slot.job;
      if (!job || job.id !== reply.id) return;
      this.finished(slot);
      if (reply.ok) job.resolve(reply.bytes);
      else job.reject(errorFromWorker(reply.error));
    });
    worker.on("error", (err) => this.lost(slot, err));
    worker.on("exit", (code) => this.lost(slot, new Error(`calculation worker stopped (exit code ${code})`)));
    return slot;
  }

  private start(slot: Slot, job: Job): void {
    slot.job = job;
    slot.startedAt = performance.now();
    slot.worker.ref(); // a running calculation keeps the process alive until it answers
    const msg: WorkerRequest = { id: job.id, task: job.task, input: job.input };
    try {
      slot.worker.postMessage(msg);
    } catch (err) {
      // Input that cannot be copied to the worker (never the case for validated requests).
      this.finished(slot);
      job.reject(err instanceof Error ? err : new Error(String(err)));
    }
  }

  private finished(slot: Slot): void {
    this.meanMs = 0.8 * this.meanMs + 0.2 * (performance.now() - slot.startedAt);
    slot.job = null;
    slot.worker.unref();
    const next = this.queue.shift();
    if (next) this.start(slot, next);
  }

  /** A worker failed or exited: fail its call and put a fresh worker in its place. */
  private lost(slot: Slot, err: Error): void {
    const i = this.slots.indexOf(slot);
    if (i < 0) return; // already replaced (error is followed by exit)
    const job = slot.job;
    slot.job = null;
    job?.reject(err);
    if (this.closed) return;
    slot.worker.removeAllListeners();
    void slot.worker.terminate();
    if (!slot.online) {
      // The entry module cannot start (a missing or broken file): replacing it would only fail again.
      this.slots.splice(i, 1);
      console.error("[calc] a calculation worker could not start:", err);
      if (this.slots.length === 0) {
        this.broken = new Error(`no calculation worker could start: ${err.message}`);
        for (const waiting of this.queue.splice(0)) waiting.reject(this.broken);
      }
      return;
    }
    const fresh = this.spawn();
    this.slots[i] = fresh;
    const next = this.queue.shift();
    if (next) this.start(fresh, next);
  }
}
