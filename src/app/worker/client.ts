/**
 * The page's side of a worker: run a job, get its progress and result; cancel by ending the worker (a fresh
 * one starts on the next job). One job at a time per worker: a new job cancels the running one, so the view
 * always shows the answer to the latest question.
 */
import type { JobMessage, JobRequest } from './protocol.ts';

/** A job that was cancelled before it ended (not an error to show). */
export class Cancelled extends Error {
  override readonly name = 'Cancelled';
}

/** A job's error, carrying the field of a ValidationError when there was one. */
export class JobError extends Error {
  constructor(message: string, readonly field?: string) {
    super(message);
  }
}

interface Pending {
  id: number;
  resolve: (value: unknown) => void;
  reject: (error: Error) => void;
  onProgress?: (done: number, total: number, what: string) => void;
}

export class WorkerLane {
  private worker: Worker | undefined;
  private pending: Pending | undefined;
  private nextId = 1;
  /** Jobs posted since the lane started (the browser test reads it to see that no diagonalisation ran). */
  jobsPosted: string[] = [];

  constructor(private readonly create: () => Worker, readonly name: string) {}

  get busy(): boolean {
    return this.pending !== undefined;
  }

  run<T>(job: string, input: unknown, onProgress?: (done: number, total: number, what: string) => void): Promise<T> {
    this.cancel();
    const worker = (this.worker ??= this.spawn());
    const id = this.nextId++;
    this.jobsPosted.push(job);
    return new Promise<T>((resolve, reject) => {
      this.pending = { id, resolve: resolve as (value: unknown) => void, reject, onProgress };
      worker.postMessage({ id, job, input } satisfies JobRequest);
    });
  }

  /** Ends the running job, if any (its promise rejects with Cancelled). */
  cancel(): void {
    if (!this.pending) return;
    const pending = this.pending;
    this.pending = undefined;
    this.worker?.terminate();
    this.worker = undefined;
    pending.reject(new Cancelled(`${this.name}: cancelled`));
  }

  private spawn(): Worker {
    const worker = this.create();
    worker.onmessage = (event: MessageEvent<JobMessage>) => {
      const message = event.data;
      const pending = this.pending;
      if (!pending || pending.id !== message.id) return;
      if (message.kind === 'progress') {
        pending.onProgress?.(message.done, message.total, message.what);
        return;
      }
      this.pending = undefined;
      if (message.kind === 'result') pending.resolve(message.value);
      else pending.reject(new JobError(message.message, message.field));
    };
    worker.onerror = (event) => {
      const pending = this.pending;
      this.pending = undefined;
      this.worker = undefined;
      pending?.reject(new JobError(`${this.name} worker failed: ${event.message}`));
    };
    return worker;
  }
}
