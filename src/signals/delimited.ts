import { InputError } from '../shared/errors.ts';
import { fieldAt, splitFields } from './delimiter.ts';
import { decimalCommaCaution } from './decimal-comma.ts';
import { readColumnFast } from './fast-column.ts';
import { lineKind } from './line-kind.ts';
import { quoteFound } from './quote-found.ts';
import { readSampleCell } from './sample-cell.ts';
import { selectSeries, type ChannelSamples } from './selection.ts';
import { describeDelimiter, SNIFF_LINES, tableLayout, type TableLayout } from './table-layout.ts';
import type { Series, SignalSelection } from './types.ts';

/**
 * Reads one column of a text table (a decoded string, no I/O) as a series.
 *
 * Layout rules (ours, written down in docs and tests):
 * - Lines end in LF, CRLF or CR; a leading UTF-8 byte-order mark is ignored. Line numbers
 *   in messages are 1-based and count every line (comments and blank lines too), as an
 *   editor shows them.
 * - A line whose first non-blank character is `#` is a comment and is skipped anywhere.
 * - The delimiter (tab, semicolon, comma or runs of whitespace; none for one value per
 *   line) is chosen from the first 100 data lines by detectDelimiter.
 * - The first non-comment, non-blank line is a header when any of its cells is not a
 *   number, a missing-value token or an infinite value; otherwise it is data.
 * - Missing samples: an empty cell, `NaN`, `nan`, `NA`, `na` or `null` gives NaN (counted,
 *   never dropped). A blank line between the first and the last data row is a missing row
 *   (NaN); blank lines before or after the data are ignored.
 * - Decimal commas: accepted when the delimiter is semicolon or tab (`1,5;2,25`), provided
 *   the chosen column uses one decimal mark throughout; a column mixing `1.5` and `2,5` is
 *   an InputError. With comma or whitespace delimiters a comma is never a decimal mark.
 *   Caution: a one-column file written with decimal commas (`1,5` per line) is read as two
 *   comma-separated columns; save it with semicolons or decimal points. Such a file gets a
 *   `caution` on its series (see decimalCommaCaution).
 *
 * The rows are read by {@link readColumnFast} (one pass over char codes, Clinger's exact
 * fast path for numbers); any file it cannot decide, every rejected file included, is read
 * by {@link parseDelimitedGeneral}, so values and messages are those of the general rules.
 *
 * Complexity O(characters) time; O(rows) memory.
 *
 * @throws InputError, naming the file, the 1-based line and the column, for: no data rows;
 *   a cell that is not a number (its text quoted, cut to 40 characters, control characters
 *   escaped); an infinite value; a column past the row width or an unknown header name
 *   (the available columns listed); mixed decimal marks; a selection out of range.
 * @example parseDelimited('# run 1\ntime,value\n0,1.5\n1,\n2,2.5\n', { column: 'value', start: 0,
 *   length: null }, 'a.csv') // values [1.5, NaN, 2.5], missing 1, channel 'value'
 */
export function parseDelimited(text: string, selection: SignalSelection, fileLabel: string): Series {
  const body = withoutByteOrderMark(text);
  const channel = readColumnFast(body, selection.column, fileLabel) ?? readColumnGeneral(body, selection.column, fileLabel);
  return selectSeries({ ...channel, caution: decimalCommaCaution(body) }, selection, fileLabel);
}

/**
 * The general reader: the same result as {@link parseDelimited} by the same rules, built on
 * line strings and cell strings (split, trim, a regular expression per cell, Number()). It
 * decides every file the fast reader leaves, and is the reference the fast reader is tested
 * against. 5 to 10 times slower on plain numeric tables (bench/parse.ts).
 *
 * Complexity O(characters) time; O(lines) memory for the line array.
 *
 * @throws InputError as {@link parseDelimited}.
 * @example parseDelimitedGeneral('v\n1\n\n3\n', { column: 1, start: 0, length: null }, 'a.txt')
 *   // values [1, NaN, 3], missing 1, channel 'v'
 */
export function parseDelimitedGeneral(text: string, selection: SignalSelection, fileLabel: string): Series {
  const body = withoutByteOrderMark(text);
  return selectSeries({ ...readColumnGeneral(body, selection.column, fileLabel), caution: decimalCommaCaution(body) }, selection, fileLabel);
}

function withoutByteOrderMark(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** The general reader's work before the start/length selection. */
function readColumnGeneral(text: string, wanted: number | string, fileLabel: string): ChannelSamples {
  const lines = text.split(/\r\n|\r|\n/);
  const dataLines = contentLineIndices(lines);
  if (dataLines.length === 0) {
    throw new InputError(`${fileLabel}: no samples — the file is empty or holds only comments and blank lines; give a table of numbers`);
  }
  const layout = tableLayout(dataLines.slice(0, SNIFF_LINES).map((i) => lines[i]), wanted, fileLabel);
  const rows = layout.header ? dataLines.slice(1) : dataLines;
  if (rows.length === 0) {
    throw new InputError(`${fileLabel}: no samples — the file has a header row (line ${dataLines[0] + 1}) but no data rows; add the data below it`);
  }
  const samples = readColumn(lines, rows[0], rows[rows.length - 1], layout, fileLabel);
  return { samples, format: 'text', channel: layout.column.name, sampleRate: null };
}

/** 0-based indices of the lines that are neither comments nor blank. */
function contentLineIndices(lines: readonly string[]): number[] {
  const out: number[] = [];
  for (let i = 0; i < lines.length; i++) if (lineKind(lines[i], 0, lines[i].length) === 'content') out.push(i);
  return out;
}

function readColumn(lines: readonly string[], first: number, last: number, layout: TableLayout, fileLabel: string): Float64Array {
  const { delimiter, allowDecimalComma, column } = layout;
  const samples = new Float64Array(last - first + 1);
  let n = 0;
  let commaLine = 0;
  let pointLine = 0;
  const columnText = `column ${column.index + 1}${column.name === `column ${column.index + 1}` ? '' : ` (${quoteFound(column.name)})`}`;
  for (let i = first; i <= last; i++) {
    const line = lines[i];
    const kind = lineKind(line, 0, line.length);
    if (kind === 'comment') continue;
    if (kind === 'blank') {
      samples[n++] = NaN;
      continue;
    }
    const cell = fieldAt(line, delimiter, column.index);
    const at = `${fileLabel}:${i + 1}`;
    if (cell === undefined) {
      const width = splitFields(line, delimiter).length;
      throw new InputError(`${at}: the row has ${width} field${width === 1 ? '' : 's'}, so ${columnText} is missing — complete the row (an empty field marks a missing sample)`);
    }
    const reading = readSampleCell(cell, allowDecimalComma);
    if (reading.kind === 'text') {
      if (!allowDecimalComma && readSampleCell(cell, true).kind === 'number') {
        throw new InputError(
          `${at}: ${columnText} holds ${quoteFound(cell)}, a number written with a decimal comma, but the file's ${describeDelimiter(delimiter).replace(/^fields split/, 'fields are split').replace(/^read as /, 'lines are read as ')} and there a comma is never a decimal mark — save the table with semicolons (or tabs) between fields, or with decimal points`,
        );
      }
      throw new InputError(`${at}: ${columnText} holds ${quoteFound(cell)}, which is not a number — correct it, or write an empty cell, NaN, NA or null to mark a missing sample`);
    }
    if (reading.kind === 'infinite') {
      throw new InputError(`${at}: ${columnText} holds ${quoteFound(cell)}, an infinite value, which is not a valid sample — replace it with the measured value or mark it missing (empty, NaN, NA or null)`);
    }
    if (reading.kind === 'missing') {
      samples[n++] = NaN;
      continue;
    }
    if (reading.decimalMark === ',' && commaLine === 0) commaLine = i + 1;
    if (reading.decimalMark === '.' && pointLine === 0) pointLine = i + 1;
    if (commaLine > 0 && pointLine > 0) {
      throw new InputError(`${at}: ${columnText} mixes decimal marks (a decimal point on line ${pointLine}, a decimal comma on line ${commaLine}) — use one decimal mark throughout the file`);
    }
    samples[n++] = reading.value;
  }
  return samples.slice(0, n);
}
