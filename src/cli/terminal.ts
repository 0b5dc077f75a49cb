/**
 * Output to the terminal: strings that came from data (ids, file names, group names) are
 * cleaned of control characters and bidirectional overrides so that no escape sequence from
 * a file reaches the terminal.
 */
import { visibleText } from '../shared/text.ts';

/** Terminal-safe form of a string from data (see visibleText). */
export const safeText = (text: string): string => visibleText(text);

/** Formats rows as an aligned plain-text table (first row is the header). */
export function formatTable(rows: string[][]): string {
  const widths = rows[0].map((_, j) => Math.max(...rows.map((r) => [...(r[j] ?? '')].length)));
  return rows
    .map((r) => r.map((cell, j) => (j === 0 ? cell.padEnd(widths[j]) : cell.padStart(widths[j]))).join('  ').trimEnd())
    .join('\n');
}

export interface Io {
  out(text: string): void;
  err(text: string): void;
  /** Writes to stderr as given, no newline added (progress bars); absent: progress uses err(). */
  errRaw?(text: string): void;
  /** Whether stderr is a terminal (progress draws a bar only then). */
  errIsTTY?: boolean;
  /** Width of the terminal on stderr, in columns. */
  errColumns?: number;
}

export const processIo: Io = {
  out: (text) => void process.stdout.write(text.endsWith('\n') ? text : text + '\n'),
  err: (text) => void process.stderr.write(text.endsWith('\n') ? text : text + '\n'),
  errRaw: (text) => void process.stderr.write(text),
  errIsTTY: Boolean(process.stderr.isTTY),
  errColumns: process.stderr.columns,
};
