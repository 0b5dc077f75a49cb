/** Cell texts read as a missing sample (exact match after trimming). */
export const MISSING_TOKENS: readonly string[] = ['', 'NaN', 'nan', 'NA', 'na', 'null'];

/** What one trimmed table cell holds. `decimalMark` says which mark a fractional number used. */
export type CellReading =
  | { kind: 'number'; value: number; decimalMark: '.' | ',' | null }
  | { kind: 'missing' }
  | { kind: 'infinite' }
  | { kind: 'text' };

const DECIMAL_POINT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?(?:\d+,\d*|,\d+)(?:[eE][+-]?\d+)?$/;
const INFINITE = /^[+-]?(?:inf|infinity)$/i;

/**
 * Reads one trimmed table cell as a sample.
 *
 * Numbers: plain decimal notation with optional sign, fraction and exponent (`-1.5`, `.5`,
 * `2e-3`); hexadecimal, thousands separators and spaces inside the number are not numbers.
 * With `allowDecimalComma` a comma may stand for the decimal point (`1,5`); the caller
 * checks that one file does not mix the two marks.
 * Missing: the cell is one of {@link MISSING_TOKENS} (empty, NaN, nan, NA, na, null).
 * Infinite: `inf`/`infinity` in any case, with optional sign, or a number beyond the double
 * range (`1e400`) — never a valid sample.
 *
 * @returns the reading; `{ kind: 'missing' }` for an empty cell.
 * @example readSampleCell('2,25', true) // { kind: 'number', value: 2.25, decimalMark: ',' }
 */
export function readSampleCell(cell: string, allowDecimalComma: boolean): CellReading {
  if (DECIMAL_POINT.test(cell)) return finiteNumber(Number(cell), cell.includes('.') ? '.' : null);
  if (MISSING_TOKENS.includes(cell)) return { kind: 'missing' };
  if (allowDecimalComma && DECIMAL_COMMA.test(cell)) return finiteNumber(Number(cell.replace(',', '.')), ',');
  if (INFINITE.test(cell)) return { kind: 'infinite' };
  return { kind: 'text' };
}

/** A number too large for a double (`1e400`) reads as infinite, like `inf`. */
function finiteNumber(value: number, decimalMark: '.' | ',' | null): CellReading {
  return Number.isFinite(value) ? { kind: 'number', value, decimalMark } : { kind: 'infinite' };
}
