/** Messages between the pool (main thread) and a calculation worker. */
export interface WorkerRequest {
  id: number;
  task: string;
  input: unknown;
}

export type WorkerReply = { ready: true } | { id: number; ok: true; bytes: Uint8Array } | { id: number; ok: false; error: WorkerError };

/** An error thrown in the worker; `range` keeps `instanceof RangeError` (subclasses included) across the thread boundary. */
export interface WorkerError {
  name: string;
  message: string;
  range: boolean;
  stack?: string;
}
