import { InputError } from '../shared/errors.ts';
import { detectDelimiter, splitFields, type Delimiter } from './delimiter.ts';
import { quoteFound } from './quote-found.ts';
import { readSampleCell } from './sample-cell.ts';

/** Data lines looked at to choose the delimiter. */
export const SNIFF_LINES = 100;
/** Columns named in an error message before the list is cut. */
const LISTED_COLUMNS = 20;

/** One table column chosen by the selection: 0-based index and the name shown to users. */
export interface ChosenColumn {
  index: number;
  name: string;
}

/** How a text table is laid out, decided from its first content lines. */
export interface TableLayout {
  delimiter: Delimiter;
  /** True for semicolon and tab delimiters, where `1,5` may mean 1.5. */
  allowDecimalComma: boolean;
  /** The header row's cells, or null when the first content line is data. */
  header: string[] | null;
  column: ChosenColumn;
}

/**
 * Decides the layout of a text table from its first content lines (no comments, no blank
 * lines; at most {@link SNIFF_LINES} are looked at): the delimiter ({@link detectDelimiter}),
 * whether the first line is a header (any cell that is not a number, a missing-value token
 * or an infinite value), and the wanted column by 1-based number or header name (exact
 * match first, then a unique case-insensitive match). Rules are ours; see parseDelimited.
 *
 * Complexity O(characters of the sample lines).
 *
 * @throws InputError naming the file when the column number is not a whole number >= 1,
 *   is past the row width, or the name is unknown or the file has no header row; the
 *   available columns are listed. `contentLines` must hold at least one line.
 * @example tableLayout(['t;x', '0;1,5'], 'x', 'a.csv')
 *   // { delimiter: ';', allowDecimalComma: true, header: ['t', 'x'], column: { index: 1, name: 'x' } }
 */
export function tableLayout(contentLines: readonly string[], wanted: number | string, fileLabel: string): TableLayout {
  const delimiter = detectDelimiter(contentLines.slice(0, SNIFF_LINES));
  const allowDecimalComma = delimiter === ';' || delimiter === '\t';
  const firstFields = splitFields(contentLines[0], delimiter);
  const header = isHeaderRow(firstFields, allowDecimalComma) ? firstFields : null;
  const column = chooseColumn(wanted, header, firstFields.length, delimiter, fileLabel);
  return { delimiter, allowDecimalComma, header, column };
}

/**
 * How the reader splits lines, in words for error messages.
 *
 * @example describeDelimiter(';') // 'fields split on semicolon'
 */
export function describeDelimiter(delimiter: Delimiter): string {
  const names: Record<Delimiter, string> = {
    '\t': 'tab',
    ';': 'semicolon',
    ',': 'comma',
    whitespace: 'whitespace',
    none: 'one value per line',
  };
  return delimiter === 'none' ? 'read as one value per line' : `fields split on ${names[delimiter]}`;
}

function isHeaderRow(fields: readonly string[], allowDecimalComma: boolean): boolean {
  return fields.some((cell) => readSampleCell(cell, allowDecimalComma).kind === 'text');
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
