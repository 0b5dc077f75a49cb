import { InputError } from '../shared/errors.ts';
import { fieldAt } from './delimiter.ts';
import { lineKind } from './line-kind.ts';
import { scanPlainDecimal, type DecimalScan } from './plain-decimal.ts';
import { readSampleCell } from './sample-cell.ts';
import type { ChannelSamples } from './selection.ts';
import { SNIFF_LINES, tableLayout, type TableLayout } from './table-layout.ts';

const LF = 0x0a;
const CR = 0x0d;
const TAB = 0x09;
const SPACE = 0x20;
const POINT = 0x2e;
const COMMA = 0x2c;

/** A text table being read: the text, its layout in flat fields, and the reusable number slot. */
interface TableScan {
  text: string;
  layout: TableLayout;
  /** 0-based index of the chosen field. */
  fieldIndex: number;
  /** The delimiter character for tab, semicolon and comma tables, else ''. */
  delimiter: string;
  /** Its char code, or -1 for whitespace runs and one value per line. */
  delimiterCode: number;
  /** True when runs of spaces and tabs delimit. */
  blankRuns: boolean;
  /** True when `,` may be a decimal mark (semicolon and tab delimiters). */
  commaMark: boolean;
  /** Blanks trimmed around a cell besides the delimiter: space, and tab unless tab delimits. */
  tabIsBlank: boolean;
  /** True when the text holds no CR, so a line ends at the next LF (found by indexOf). */
  lfOnly: boolean;
  /** Index of the next double quote at or after the current line (text length when none). */
  nextQuote: number;
  number: DecimalScan;
}

/**
 * Reads the chosen column of a text table (a decoded string without byte-order mark, no
 * I/O) by the same rules as the general reader (parseDelimitedGeneral), in one pass without
 * line or cell strings: lines and delimiters are found with indexOf, numbers converted from
 * char codes by {@link scanPlainDecimal} (Clinger 1990 exact fast path). A line the scan
 * cannot decide exactly (a double quote in it, blanks other than space and tab around the
 * cell, missing-value words, significands of 2^53 or more, powers of ten beyond 10^±22,
 * text) is read with the general functions (fieldAt, readSampleCell) instead, so every value
 * is the one the general reader gives.
 *
 * Complexity O(characters); memory O(rows) for the samples.
 *
 * @returns the channel before the start/length selection, or null when the file is one the
 *   general reader rejects (no data rows, a bad column choice, a short row, a cell that is
 *   not a number, an infinite value, mixed decimal marks): the caller then runs the general
 *   reader, which throws the InputError naming file, line and column.
 * @example readColumnFast('t,v\n0,1.5\n1,\n', 'v', 'a.csv')
 *   // { samples: [1.5, NaN], format: 'text', channel: 'v', sampleRate: null }
 */
export function readColumnFast(text: string, wanted: number | string, fileLabel: string): ChannelSamples | null {
  const lfOnly = text.indexOf('\r') < 0;
  const head = firstContentLines(text, lfOnly);
  if (head.lines.length === 0) return null;
  const layout = layoutOrNull(head.lines, wanted, fileLabel);
  if (layout === null) return null;
  const dataStart = layout.header ? head.starts[1] : head.starts[0];
  if (dataStart === undefined) return null;
  const rowsSeen = head.lines.length - (layout.header ? 1 : 0);
  const expectedRows = Math.ceil(((rowsSeen * (text.length - dataStart)) / Math.max(1, head.end - dataStart)) * 1.05) + 16;
  const delimiter = layout.delimiter === 'whitespace' || layout.delimiter === 'none' ? '' : layout.delimiter;
  const scan: TableScan = {
    text,
    layout,
    fieldIndex: layout.column.index,
    delimiter,
    delimiterCode: delimiter === '' ? -1 : delimiter.charCodeAt(0),
    blankRuns: layout.delimiter === 'whitespace',
    commaMark: layout.allowDecimalComma,
    tabIsBlank: delimiter !== '\t',
    lfOnly,
    nextQuote: -1,
    number: { value: 0.5, mark: 0 }, // a fractional start keeps the field a double from the first store on
  };
  const samples = readRows(scan, dataStart, expectedRows);
  return samples && { samples, format: 'text', channel: layout.column.name, sampleRate: null };
}

/** The layout, or null where the general reader would throw (it throws the same message itself). */
function layoutOrNull(lines: readonly string[], wanted: number | string, fileLabel: string): TableLayout | null {
  try {
    return tableLayout(lines, wanted, fileLabel);
  } catch (error) {
    if (error instanceof InputError) return null;
    throw error;
  }
}

/** Index of the end of the line holding `from`: its CR or LF, or the text length. */
function lineEnd(text: string, from: number, lfOnly: boolean): number {
  if (lfOnly) {
    const at = text.indexOf('\n', from);
    return at < 0 ? text.length : at;
  }
  let p = from;
  while (!atLineEnd(text.charCodeAt(p))) p++;
  return p;
}

/** Index where the next line starts after a line ending at `end` (CRLF, CR or LF). */
function nextLineStart(text: string, end: number): number {
  return text.charCodeAt(end) === CR && text.charCodeAt(end + 1) === LF ? end + 2 : end + 1;
}

/** True at the end of a line: LF, CR or past the text (charCodeAt gives NaN). One comparison for most characters. */
function atLineEnd(c: number): boolean {
  return !(c > CR) && (c === LF || c === CR || c !== c);
}

/** The first content lines (up to SNIFF_LINES), their start indices, and where the line after the last one starts. */
function firstContentLines(text: string, lfOnly: boolean): { lines: string[]; starts: number[]; end: number } {
  const lines: string[] = [];
  const starts: number[] = [];
  let pos = 0;
  while (pos < text.length && lines.length < SNIFF_LINES) {
    const end = lineEnd(text, pos, lfOnly);
    if (lineKind(text, pos, end) === 'content') {
      lines.push(text.slice(pos, end));
      starts.push(pos);
    }
    pos = nextLineStart(text, end);
  }
  return { lines, starts, end: Math.min(pos, text.length) };
}

/**
 * Reads the chosen cell of every line from `from` on: comments skipped, a blank line between
 * data rows is NaN, blank lines after the last row ignored. Null when a row is rejected or
 * the column mixes decimal marks.
 */
function readRows(scan: TableScan, from: number, expectedRows: number): Float64Array | null {
  const text = scan.text;
  let samples: Float64Array = new Float64Array(expectedRows);
  let count = 0;
  let blanks = 0;
  let sawPoint = false;
  let sawComma = false;
  for (let pos = from; pos < text.length; ) {
    let end = -1;
    if (mayStartBlankOrComment(text.charCodeAt(pos))) {
      end = lineEnd(text, pos, scan.lfOnly);
      const kind = lineKind(text, pos, end);
      if (kind !== 'content') {
        if (kind === 'blank') blanks++;
        pos = nextLineStart(text, end);
        continue;
      }
    }
    if (count + blanks >= samples.length) samples = grown(samples, count + blanks + 1);
    for (; blanks > 0; blanks--) samples[count++] = NaN;
    const fastEnd = readCellFast(scan, pos, end);
    if (fastEnd >= 0) end = fastEnd;
    else {
      if (end < 0) end = lineEnd(text, pos, scan.lfOnly);
      if (!readCellGeneral(scan, pos, end)) return null;
    }
    samples[count++] = scan.number.value;
    sawPoint ||= scan.number.mark === POINT;
    sawComma ||= scan.number.mark === COMMA;
    if (sawPoint && sawComma) return null;
    pos = nextLineStart(text, end);
  }
  return samples.subarray(0, count);
}

/** True for a first character after which the line may still be blank or a comment (see lineKind). */
function mayStartBlankOrComment(c: number): boolean {
  return c <= 0x23 || c === 0xa0 || c === 0xfeff; // tab, LF, VT, FF, CR, space, '#' (and '!', '"': merely sent the long way)
}

/** A copy of `samples` with room for at least `needed` values (twice the length or more). */
function grown(samples: Float64Array, needed: number): Float64Array {
  const out = new Float64Array(Math.max(needed, samples.length * 2));
  out.set(samples);
  return out;
}

/**
 * Reads the chosen cell of the content line starting at `start` into scan.number (NaN for
 * an empty cell, mark 0). `knownEnd` is the line's end when already found, else -1.
 * Returns the index of the line's end, or -1 when the general rules must read this line.
 */
function readCellFast(scan: TableScan, start: number, knownEnd: number): number {
  const text = scan.text;
  let end = knownEnd;
  let p = start;
  if (scan.fieldIndex > 0) {
    if (scan.delimiterCode < 0) p = blankFieldStart(scan, start);
    else {
      if (end < 0) end = lineEnd(text, start, scan.lfOnly);
      p = delimitedFieldStart(scan, start, end);
    }
    if (p < 0) return -1;
    p = skipBlanks(scan, p);
  } else if (knownEnd >= 0) {
    // The line starts with a character that may be a blank (readRows looked at it); a line
    // starting otherwise has its first field right at the start.
    p = skipBlanks(scan, start);
  }
  let c = text.charCodeAt(p);
  if (c === scan.delimiterCode || atLineEnd(c)) {
    scan.number.value = NaN;
    scan.number.mark = 0;
    return end >= 0 ? end : atLineEnd(c) ? p : lineEnd(text, p, scan.lfOnly);
  }
  p = scanPlainDecimal(text, p, scan.commaMark, scan.number);
  if (p < 0) return -1;
  c = text.charCodeAt(p);
  if (atLineEnd(c)) return p;
  if (scan.blankRuns) return c === SPACE || c === TAB ? (end >= 0 ? end : lineEnd(text, p, scan.lfOnly)) : -1;
  p = skipBlanks(scan, p);
  c = text.charCodeAt(p);
  if (atLineEnd(c)) return p;
  if (c !== scan.delimiterCode) return -1;
  return end >= 0 ? end : lineEnd(text, p, scan.lfOnly);
}

/** Skips spaces (and tabs unless they delimit) from `from`; returns the first other index. */
function skipBlanks(scan: TableScan, from: number): number {
  const text = scan.text;
  let p = from;
  for (let c = text.charCodeAt(p); c === SPACE || (c === TAB && scan.tabIsBlank); c = text.charCodeAt(++p));
  return p;
}

/**
 * Start of the chosen field (index > 0) of the tab/semicolon/comma line `[start, end)`, or
 * -1 for a short row or a line holding a double quote (quoted fields may hide delimiters).
 */
function delimitedFieldStart(scan: TableScan, start: number, end: number): number {
  const text = scan.text;
  if (scan.nextQuote < start) {
    const at = text.indexOf('"', start);
    scan.nextQuote = at < 0 ? text.length : at;
  }
  if (scan.nextQuote < end) return -1;
  let p = start;
  for (let k = scan.fieldIndex; k > 0; k--) {
    const at = text.indexOf(scan.delimiter, p);
    if (at < 0 || at >= end) return -1;
    p = at + 1;
  }
  return p;
}

/**
 * Start of the chosen field when runs of spaces and tabs delimit (or the line is one value),
 * or -1 when a character the general rules trim differently (not printable ASCII) comes first
 * or the row is short.
 */
function blankFieldStart(scan: TableScan, start: number): number {
  const text = scan.text;
  let p = start;
  for (let k = scan.fieldIndex; ; k--) {
    let c = text.charCodeAt(p);
    for (; c === SPACE || c === TAB; c = text.charCodeAt(++p));
    if (atLineEnd(c)) return -1;
    if (k === 0) return p;
    for (; !atLineEnd(c) && c !== SPACE && c !== TAB; c = text.charCodeAt(++p)) {
      if (c < 0x21 || c > 0x7e) return -1;
    }
  }
}

/**
 * Reads the chosen cell of the line `[start, end)` with the general functions into
 * scan.number (NaN for a missing sample). False when the general rules reject the row.
 */
function readCellGeneral(scan: TableScan, start: number, end: number): boolean {
  const { delimiter, allowDecimalComma, column } = scan.layout;
  const cell = fieldAt(scan.text.slice(start, end), delimiter, column.index);
  if (cell === undefined) return false;
  const reading = readSampleCell(cell, allowDecimalComma);
  if (reading.kind === 'missing') {
    scan.number.value = NaN;
    scan.number.mark = 0;
    return true;
  }
  if (reading.kind !== 'number') return false;
  scan.number.value = reading.value;
  scan.number.mark = reading.decimalMark === '.' ? POINT : reading.decimalMark === ',' ? COMMA : 0;
  return true;
}
