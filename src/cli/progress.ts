/**
 * A progress line on stderr: count, rate and a bar. Drawn only when stderr is a terminal and the job has run
 * longer than half a second, so scripted and piped runs stay silent.
 */
export interface ProgressSink {
  isTTY: boolean;
  write(text: string): void;
}

const DELAY_MS = 500;
const REDRAW_MS = 100;
const BAR_WIDTH = 28;

export class ProgressLine {
  private readonly started = performance.now();
  private lastDraw = 0;
  private drawn = false;

  constructor(
    private readonly sink: ProgressSink,
    /** What is counted, e.g. "labelings" or "k-points". */
    private readonly unit: string,
  ) {}

  /** Reports `count` items done and the share of the job done (0…1, or NaN when unknown). */
  update(count: number, fraction: number, extra = ''): void {
    if (!this.sink.isTTY) return;
    const now = performance.now();
    if (now - this.started < DELAY_MS || now - this.lastDraw < REDRAW_MS) return;
    this.lastDraw = now;
    const seconds = (now - this.started) / 1000;
    const rate = count / seconds;
    const share = Math.min(1, Math.max(0, Number.isFinite(fraction) ? fraction : 0));
    const filled = Math.round(share * BAR_WIDTH);
    const bar = `[${'#'.repeat(filled)}${'.'.repeat(BAR_WIDTH - filled)}]`;
    const percent = Number.isFinite(fraction) ? `${(100 * share).toFixed(0).padStart(3)}%` : '   ?';
    this.sink.write(`\r${bar} ${percent}  ${formatCount(count)} ${this.unit}  ${formatCount(rate)}/s${extra ? `  ${extra}` : ''}\x1b[K`);
    this.drawn = true;
  }

  /** Clears the line if anything was drawn. */
  done(): void {
    if (this.drawn) this.sink.write('\r\x1b[K');
  }
}

function formatCount(value: number): string {
  if (!Number.isFinite(value)) return '0';
  if (value >= 1e9) return `${(value / 1e9).toFixed(2)}G`;
  if (value >= 1e6) return `${(value / 1e6).toFixed(2)}M`;
  if (value >= 1e4) return `${(value / 1e3).toFixed(1)}k`;
  return value.toFixed(0);
}
