/**
 * Messages between the page and its workers. The page sends `{ id, job, input }`; a worker answers with
 * progress messages and then exactly one result or error for that id. Cancelling is done by the page: it ends
 * the worker and starts a fresh one (the core is synchronous, so a running job cannot be interrupted inside).
 */
/** The model worker's answer when it holds no spectrum (it was ended by a cancel): the page computes anew. */
export const NO_SPECTRUM = 'the model worker holds no spectrum';

export interface JobRequest<Input = unknown> {
  id: number;
  job: string;
  input: Input;
}

export type JobMessage =
  | { id: number; kind: 'progress'; done: number; total: number; what: string }
  | { id: number; kind: 'result'; value: unknown; seconds: number }
  | { id: number; kind: 'error'; message: string; field?: string };

/** Runs jobs by name inside a worker, turning thrown errors into messages (field kept for ValidationErrors). */
export function serveJobs(
  scope: { onmessage: ((event: MessageEvent) => void) | null; postMessage(message: unknown, transfer?: Transferable[]): void },
  jobs: Record<string, (input: never, progress: (done: number, total: number, what: string) => void) => { value: unknown; transfer?: Transferable[] }>,
): void {
  scope.onmessage = (event: MessageEvent) => {
    const { id, job, input } = event.data as JobRequest;
    const started = performance.now();
    let lastPost = 0;
    const progress = (done: number, total: number, what: string) => {
      const now = performance.now();
      if (now - lastPost < 100 && done < total) return;
      lastPost = now;
      scope.postMessage({ id, kind: 'progress', done, total, what } satisfies JobMessage);
    };
    try {
      const run = jobs[job];
      if (!run) throw new Error(`unknown job ${job}`);
      const { value, transfer } = run(input as never, progress);
      scope.postMessage({ id, kind: 'result', value, seconds: (performance.now() - started) / 1000 } satisfies JobMessage, transfer ?? []);
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      const field = error instanceof Error && 'field' in error ? String((error as { field: unknown }).field) : undefined;
      scope.postMessage({ id, kind: 'error', message, field } satisfies JobMessage);
    }
  };
}
