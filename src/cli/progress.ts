/**
 * Progress on standard error. On a terminal: one line per stage redrawn in place, a bar with
 * counts, elapsed time and an estimate of the time left (elapsed / done x remaining). Not on
 * a terminal (a log file, a batch job): plain lines, one at the end of each stage and, within
 * a stage, one when the count reaches 10, 100, 1000, ... and one every PLAIN_LINE_SECONDS,
 * with the time left.
 * Colour only on a terminal and only when NO_COLOR is unset or empty (no-color.org [M]).
 */
import { safeText } from './terminal.ts';

export interface ProgressSink {
  /** Writes raw text (no newline added). */
  write(text: string): void;
  isTTY: boolean;
  /** Terminal width in columns (default 80). */
  columns?: number;
}

/** Seconds between plain progress lines within one stage. */
export const PLAIN_LINE_SECONDS = 10;

export type ProgressCallback = (stage: string, done: number, total: number) => void;

/** "1:05", "12:00:03" for seconds; "-" when unknown. */
export function formatClock(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return '-';
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const r = String(s % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${r}` : `${m}:${r}`;
}

/**
 * The bar line of a stage, e.g. progressLine('features', 5, 20, 10, 30, false) ->
 * "features       [#######---------------------] 5/20  0:10 elapsed, 0:30 left".
 */
export function progressLine(stage: string, done: number, total: number, elapsedSeconds: number, width: number, color: boolean): string {
  const share = total > 0 ? Math.min(1, done / total) : 1;
  const filled = Math.round(share * width);
  const left = done > 0 && done < total ? formatClock((elapsedSeconds / done) * (total - done)) : done >= total ? '0:00' : '-';
  const bar = '#'.repeat(filled) + '-'.repeat(width - filled);
  const shown = color ? `\u001b[32m${bar.slice(0, filled)}\u001b[2m${bar.slice(filled)}\u001b[0m` : bar;
  return `${safeText(stage).padEnd(16)} [${shown}] ${done}/${total}  ${formatClock(elapsedSeconds)} elapsed, ${left} left`;
}

/**
 * A progress callback writing to `sink`. `now` returns milliseconds (injectable for tests).
 * Call the returned `end()` once at the end so a terminal line is finished with a newline.
 */
export function createProgress(sink: ProgressSink, env: Record<string, string | undefined> = process.env, now: () => number = Date.now): { onProgress: ProgressCallback; end: () => void } {
  const color = sink.isTTY && !env.NO_COLOR;
  const starts = new Map<string, number>();
  let current: string | null = null;
  let lastDraw = -Infinity;
  let lastLine = 0;
  const end = (): void => {
    if (sink.isTTY && current !== null) sink.write('\n');
    current = null;
  };
  const onProgress: ProgressCallback = (stage, done, total) => {
    const t = now();
    if (!starts.has(stage)) starts.set(stage, t);
    const elapsed = (t - starts.get(stage)!) / 1000;
    if (stage !== current) {
      end();
      current = stage;
      lastDraw = -Infinity;
      lastLine = t;
    }
    if (sink.isTTY) {
      // redraw at most ten times a second, and always at the end of a stage
      if (done < total && t - lastDraw < 100) return;
      lastDraw = t;
      const width = Math.max(10, Math.min(40, (sink.columns ?? 80) - 60));
      sink.write(`\r${progressLine(stage, done, total, elapsed, width, color)}\u001b[K`);
      if (done >= total) end();
      return;
    }
    if (done < total && !isPowerOfTen(done) && t - lastLine < PLAIN_LINE_SECONDS * 1000) return;
    lastLine = t;
    const left = done > 0 && done < total ? `, about ${formatClock((elapsed / done) * (total - done))} left` : '';
    sink.write(`${safeText(stage)}: ${done}/${total} (${formatClock(elapsed)} elapsed${left})\n`);
    if (done >= total) current = null;
  };
  return { onProgress, end };
}

/** True for 10, 100, 1000, ... */
function isPowerOfTen(n: number): boolean {
  if (n < 10) return false;
  while (n % 10 === 0) n /= 10;
  return n === 1;
}
