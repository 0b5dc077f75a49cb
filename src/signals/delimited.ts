import { InputError } from '../shared/errors.ts';
import { detectDelimiter, fieldAt, splitFields, type Delimiter } from './delimiter.ts';
import { quoteFound } from './quote-found.ts';
import { readSampleCell } from './sample-cell.ts';
import { selectSeries } from './selection.ts';
import type { Series, SignalSelection } from './types.ts';

/** Data lines looked at to choose the delimiter. */
const SNIFF_LINES = 100;
/** Columns named in an error message before the list is cut. */
const LISTED_COLUMNS = 20;

/** One table column chosen by the selection: 0-based index and the name shown to users. */
interface ChosenColumn {
  index: number;
  name: string;
}

/**
 * Reads one column of a text table (a decoded string, no I/O) as a series.
 *
 * Layout rules (ours, written down in docs and tests):
 * - Lines end in LF, CRLF or CR; a leading UTF-8 byte-order mark is ignored. Line numbers
 *   in messages are 1-based and count every line (comments and blank lines too), as an
 *   editor shows them.
 * - A line whose first non-blank character is `#` is a comment and is skipped anywhere.
 * - The delimiter (tab, semicolon, comma or runs of whitespace; none for one value per
 *   line) is chosen from the first 100 data lines by {@link detectDelimiter}.
 * - The first non-comment, non-blank line is a header when any of its cells is not a
 *   number, a missing-value token or an infinite value; otherwise it is data.
 * - Missing samples: an empty cell, `NaN`, `nan`, `NA`, `na` or `null` gives NaN (counted,
 *   never dropped). A blank line between the first and the last data row is a missing row
 *   (NaN); blank lines before or after the data are ignored.
 * - Decimal commas: accepted when the delimiter is semicolon or tab (`1,5;2,25`), provided
 *   the chosen column uses one decimal mark throughout; a column mixing `1.5` and `2,5` is
 *   an InputError. With comma or whitespace delimiters a comma is never a decimal mark.
 *   Caution: a one-column file written with decimal commas (`1,5` per line) is read as two
 *   comma-separated columns; save it with semicolons or decimal points.
 *
 * Complexity O(characters) time; O(lines) memory for the line index.
 *
 * @throws InputError, naming the file, the 1-based line and the column, for: no data rows;
 *   a cell that is not a number (its text quoted, cut to 40 characters, control characters
 *   escaped); an infinite value; a column past the row width or an unknown header name
 *   (the available columns listed); mixed decimal marks; a selection out of range.
 * @example parseDelimited('# run 1\ntime,value\n0,1.5\n1,\n2,2.5\n', { column: 'value', start: 0,
 *   length: null }, 'a.csv') // values [1.5, NaN, 2.5], missing 1, channel 'value'
 */
export function parseDelimited(text: string, selection: SignalSelection, fileLabel: string): Series {
  const lines = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).split(/\r\n|\r|\n/);
  const dataLines = contentLineIndices(lines);
  if (dataLines.length === 0) {
    throw new InputError(`${fileLabel}: no samples — the file is empty or holds only comments and blank lines; give a table of numbers`);
  }
  const delimiter = detectDelimiter(dataLines.slice(0, SNIFF_LINES).map((i) => lines[i]));
  const allowDecimalComma = delimiter === ';' || delimiter === '\t';
  const firstFields = splitFields(lines[dataLines[0]], delimiter);
  const header = isHeaderRow(firstFields, allowDecimalComma) ? firstFields : null;
  const column = chooseColumn(selection.column, header, firstFields.length, delimiter, fileLabel);
  const rows = header ? dataLines.slice(1) : dataLines;
  if (rows.length === 0) {
    throw new InputError(`${fileLabel}: no samples — the file has a header row (line ${dataLines[0] + 1}) but no data rows; add the data below it`);
  }
  const samples = readColumn(lines, rows[0], rows[rows.length - 1], column, delimiter, allowDecimalComma, fileLabel);
  return selectSeries({ samples, format: 'text', channel: column.name, sampleRate: null }, selection, fileLabel);
}

type LineKind = 'blank' | 'comment' | 'content';

/** Classifies a line by its first non-blank character, without allocating. */
function lineKind(line: string): LineKind {
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === 0x23) return 'comment';
    if (c !== 0x20 && c !== 0x09 && c !== 0x0b && c !== 0x0c && c !== 0xa0 && c !== 0xfeff) return 'content';
  }
  return 'blank';
}

/** 0-based indices of the lines that are neither comments nor blank. */
function contentLineIndices(lines: readonly string[]): number[] {
  const out: number[] = [];
  for (let i = 0; i < lines.length; i++) if (lineKind(lines[i]) === 'content') out.push(i);
  return out;
}

function isHeaderRow(fields: readonly string[], allowDecimalComma: boolean): boolean {
  return fields.some((cell) => readSampleCell(cell, allowDecimalComma).kind === 'text');
}

function describeDelimiter(delimiter: Delimiter): string {
  const names: Record<Delimiter, string> = {
    '\t': 'tab',
    ';': 'semicolon',
    ',': 'comma',
    whitespace: 'whitespace',
    none: 'one value per line',
  };
  return delimiter === 'none' ? 'read as one value per line' : `fields split on ${names[delimiter]}`;
}

function listColumns(header: readonly string[] | null, width: number, delimiter: Delimiter): string {
  const where = describeDelimiter(delimiter);
  if (!header) return `available columns: 1 to ${width} (no header row; ${where})`;
  const shown = header.slice(0, LISTED_COLUMNS).map((name, i) => `${i + 1} ${quoteFound(name)}`);
  const more = header.length > LISTED_COLUMNS ? `, … (${header.length} in all)` : '';
  return `available columns: ${shown.join(', ')}${more} (${where})`;
}

function chooseColumn(
  wanted: number | string,
  header: readonly string[] | null,
  width: number,
  delimiter: Delimiter,
  fileLabel: string,
): ChosenColumn {
  const nameOf = (index: number): string => (header && header[index] !== '' ? header[index] : `column ${index + 1}`);
  if (typeof wanted === 'number') {
    if (!Number.isSafeInteger(wanted) || wanted < 1) {
      throw new InputError(`${fileLabel}: column must be a whole number >= 1 or a header name, got ${String(wanted)} — ${listColumns(header, width, delimiter)}`);
    }
    if (wanted > width) {
      throw new InputError(`${fileLabel}: column ${wanted} is past the end of the rows, which have ${width} field${width === 1 ? '' : 's'} — ${listColumns(header, width, delimiter)}`);
    }
    return { index: wanted - 1, name: nameOf(wanted - 1) };
  }
  const name = wanted.trim();
  if (!header) {
    throw new InputError(`${fileLabel}: column ${quoteFound(name)} is a name, but the file has no header row — give a column number; ${listColumns(header, width, delimiter)}`);
  }
  const index = findHeaderName(header, name);
  if (index < 0) {
    throw new InputError(`${fileLabel}: no column named ${quoteFound(name)} in the header row — ${listColumns(header, width, delimiter)}`);
  }
  return { index, name: nameOf(index) };
}

/** Exact match first; otherwise a case-insensitive match when exactly one column has it. */
function findHeaderName(header: readonly string[], name: string): number {
  const exact = header.indexOf(name);
  if (exact >= 0) return exact;
  const lower = name.toLowerCase();
  const loose = header.flatMap((h, i) => (h.toLowerCase() === lower ? [i] : []));
  return loose.length === 1 ? loose[0] : -1;
}

function readColumn(
  lines: readonly string[],
  first: number,
  last: number,
  column: ChosenColumn,
  delimiter: Delimiter,
  allowDecimalComma: boolean,
  fileLabel: string,
): Float64Array {
  const samples = new Float64Array(last - first + 1);
  let n = 0;
  let commaLine = 0;
  let pointLine = 0;
  const columnText = `column ${column.index + 1}${column.name === `column ${column.index + 1}` ? '' : ` (${quoteFound(column.name)})`}`;
  for (let i = first; i <= last; i++) {
    const line = lines[i];
    const kind = lineKind(line);
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
