/**
 * Progress bookkeeping shared by the listing and counting drivers: completed searches plus the live one.
 */
import type { EnumerateProgress } from './types.ts';

export class ProgressMeter {
  /** Structures found so far. */
  found = 0;
  private examinedBefore = 0;
  private weightBefore = 0;
  private lastFraction = 0;

  constructor(
    private readonly callback: ((progress: EnumerateProgress) => void) | undefined,
    /** Total estimated weight of the run (see plan.ts `branchWeights`). */
    private readonly total: number,
  ) {}

  /** Reports the run's examined labelings and the live search's done weight on top of the finished searches'. */
  report(examined: number, weight: number): void {
    if (!this.callback) return;
    const share = this.total > 0 ? (this.weightBefore + weight) / this.total : 0;
    this.lastFraction = Math.max(this.lastFraction, Math.min(1, share));
    this.callback({ examined, found: this.found, fraction: this.lastFraction });
  }

  /** Books a finished search: the run's examined count after it and the search's weight. */
  complete(examined: number, weight: number): void {
    this.examinedBefore = examined;
    this.weightBefore += weight;
  }

  /** Labelings examined by the finished searches (start of the next search's count). */
  get examined(): number {
    return this.examinedBefore;
  }

  /** Final report, fraction 1. */
  end(): void {
    this.lastFraction = 1;
    this.callback?.({ examined: this.examinedBefore, found: this.found, fraction: 1 });
  }
}
