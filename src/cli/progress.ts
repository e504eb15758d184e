/**
 * Feedback on long work, on stderr. For people: a progress line (count, rate, bar), drawn only when stderr is a
 * terminal and the job has run longer than half a second, and the job's estimate first when it is long, so
 * scripted and piped runs stay silent. For batch logs (`--progress`): one JSON object per line, whatever stderr is —
 * `{"job","event":"estimate",…}` first, `{"job","event":"progress","done","fraction","unit","elapsed_s"}` about
 * once a second, `{"job","event":"done","done","elapsed_s"}` last.
 */
export interface ProgressSink {
  isTTY: boolean;
  write(text: string): void;
}

export interface ProgressOptions {
  /** Write machine-readable JSON lines instead of the terminal line. */
  machine?: boolean;
  /** The command's name, the `job` of every JSON line. */
  job?: string;
}

const DELAY_MS = 500;
const REDRAW_MS = 100;
const MACHINE_EVERY_MS = 1000;
const BAR_WIDTH = 28;
/** Estimates shorter than this are not announced on a terminal ("a few seconds"). */
export const ANNOUNCE_SECONDS = 3;

export class ProgressLine {
  private readonly started = performance.now();
  private lastDraw = 0;
  private drawn = false;
  private count = 0;
  private readonly machine: boolean;
  private readonly job: string;

  constructor(
    private readonly sink: ProgressSink,
    /** What is counted, e.g. "labelings" or "k-points". */
    private readonly unit: string,
    options: ProgressOptions = {},
  ) {
    this.machine = options.machine === true;
    this.job = options.job ?? 'lacuna';
  }

  /**
   * States the job's estimate before the work: a line on a terminal when it is ANNOUNCE_SECONDS or more, always
   * as a JSON line in machine mode. `text` says what is estimated for people; `fields` are the same for machines.
   */
  estimate(seconds: number, text: string, fields: Record<string, unknown> = {}): void {
    if (this.machine) {
      this.line({ event: 'estimate', seconds: round(seconds), ...fields });
    } else if (this.sink.isTTY && seconds >= ANNOUNCE_SECONDS) {
      this.sink.write(`${this.job}: ${text}; about ${readableSeconds(seconds)} (an estimate)\n`);
    }
  }

  /** Reports `count` items done and the share of the job done (0…1, or NaN when unknown). */
  update(count: number, fraction: number, extra = ''): void {
    this.count = count;
    if (this.machine) {
      const now = performance.now();
      if (now - this.lastDraw < MACHINE_EVERY_MS) return;
      this.lastDraw = now;
      this.line({ event: 'progress', done: count, fraction: Number.isFinite(fraction) ? round(fraction) : null, unit: this.unit, elapsed_s: round((now - this.started) / 1000) });
      return;
    }
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

  /** Clears the terminal line if anything was drawn; in machine mode writes the closing line. */
  done(): void {
    if (this.machine) this.line({ event: 'done', done: this.count, unit: this.unit, elapsed_s: round((performance.now() - this.started) / 1000) });
    else if (this.drawn) this.sink.write('\r\x1b[K');
  }

  private line(fields: Record<string, unknown>): void {
    this.sink.write(`${JSON.stringify({ job: this.job, ...fields })}\n`);
  }
}

function round(x: number): number {
  return Number(x.toPrecision(4));
}

/** Seconds for people: "40 s", "12 min", "3.0 h", "2 days". */
export function readableSeconds(seconds: number): string {
  if (seconds < 120) return `${Math.max(1, Math.round(seconds))} s`;
  if (seconds < 7200) return `${(seconds / 60).toFixed(0)} min`;
  if (seconds < 48 * 3600) return `${(seconds / 3600).toFixed(1)} h`;
  return `${(seconds / 86400).toFixed(0)} days`;
}

/** Bytes for people: "820 kB", "1.2 GB". */
export function readableBytes(bytes: number): string {
  if (bytes >= 1e9) return `${(bytes / 1e9).toFixed(1)} GB`;
  if (bytes >= 1e6) return `${(bytes / 1e6).toFixed(0)} MB`;
  if (bytes >= 1e3) return `${(bytes / 1e3).toFixed(0)} kB`;
  return `${Math.round(bytes)} B`;
}

function formatCount(value: number): string {
  if (!Number.isFinite(value)) return '0';
  if (value >= 1e9) return `${(value / 1e9).toFixed(2)}G`;
  if (value >= 1e6) return `${(value / 1e6).toFixed(2)}M`;
  if (value >= 1e4) return `${(value / 1e3).toFixed(1)}k`;
  return value.toFixed(0);
}
