import { splitQuotedFields } from '../shared/quoted-fields.ts';

/**
 * Field delimiters of a text table. `whitespace` means runs of spaces and tabs, with
 * leading and trailing blanks ignored; `none` means one value per line.
 */
export type Delimiter = '\t' | ';' | ',' | 'whitespace' | 'none';

/** Candidates in order of preference when more than one fits. */
const CANDIDATES: readonly Delimiter[] = ['\t', ';', ',', 'whitespace'];

/**
 * Splits one line into trimmed fields. For tab, semicolon and comma, a field may be quoted
 * with double quotes (a doubled quote inside stands for one quote), so a quoted header
 * name may hold the delimiter (RFC 4180, Shafranovich 2005); quotes do not span lines.
 *
 * @returns at least one field; `['']` for an empty line.
 * @example splitFields('"a,b", 2 ,3', ',') // ['a,b', '2', '3']
 */
export function splitFields(line: string, delimiter: Delimiter): string[] {
  if (delimiter === 'none') return [line.trim()];
  if (delimiter === 'whitespace') {
    const trimmed = line.trim();
    return trimmed === '' ? [''] : trimmed.split(/[ \t]+/);
  }
  if (!line.includes('"')) return line.split(delimiter).map((f) => f.trim());
  return splitQuotedFields(line, delimiter);
}

/**
 * The trimmed field at 0-based `index` of a line, or undefined when the line has fewer
 * fields; the same result as `splitFields(line, delimiter)[index]` without building the
 * array (the hot path when a large table is read one column at a time).
 *
 * Complexity O(characters up to the end of the field).
 *
 * @example fieldAt('0, 1.5 ,9', ',', 1) // '1.5'
 */
export function fieldAt(line: string, delimiter: Delimiter, index: number): string | undefined {
  if (delimiter === 'none') return index === 0 ? line.trim() : undefined;
  if (delimiter === 'whitespace' || line.includes('"')) return splitFields(line, delimiter)[index];
  let from = 0;
  for (let k = 0; k < index; k++) {
    const at = line.indexOf(delimiter, from);
    if (at < 0) return undefined;
    from = at + 1;
  }
  const end = line.indexOf(delimiter, from);
  return (end < 0 ? line.slice(from) : line.slice(from, end)).trim();
}

/**
 * Chooses the delimiter of a table from sample lines (data and header lines, no comments
 * or blank lines). Rule (ours): a candidate fits when it splits every sample line into the
 * same number (> 1) of fields; the first fitting candidate in the order tab, semicolon,
 * comma, whitespace wins. So `1,5;2,25` is semicolon-delimited (semicolon comes before
 * comma). When none fits, the first candidate that gives every line more than one field
 * wins (ragged rows); otherwise the file has one value per line (`none`).
 *
 * Complexity O(total characters of the sample lines) per candidate.
 *
 * @returns `none` for no lines.
 * @example detectDelimiter(['t;x', '0;1,5']) // ';'
 */
export function detectDelimiter(lines: readonly string[]): Delimiter {
  if (lines.length === 0) return 'none';
  const widths = CANDIDATES.map((d) => lines.map((line) => splitFields(line, d).length));
  const even = CANDIDATES.findIndex((_, c) => widths[c][0] > 1 && widths[c].every((w) => w === widths[c][0]));
  if (even >= 0) return CANDIDATES[even];
  const ragged = CANDIDATES.findIndex((_, c) => widths[c].every((w) => w > 1));
  return ragged >= 0 ? CANDIDATES[ragged] : 'none';
}
