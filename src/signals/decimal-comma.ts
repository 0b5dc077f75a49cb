/** Content lines looked at (the same number the delimiter is chosen from). */
const LOOKED_AT = 100;
/** A line of two comma-separated whole numbers, e.g. `1,5` or ` -12,250 `. */
const TWO_WHOLE_NUMBERS = /^[ \t]*([+-]?\d+),\d+[ \t]*$/;

/**
 * A caution for a text table that may be one column written with decimal commas (`1,5`,
 * `2,25`, ...): such a file cannot be told from a two-column table of whole numbers, so it is
 * read as two columns and the selected one holds only the whole parts. Our rule (a heuristic,
 * not a proof): the first 100 content lines (at least 3) all hold exactly two comma-separated
 * whole numbers, and the first numbers do not step by a constant non-zero amount (a column that
 * does is most likely an index or a time stamp beside its values, as in `0,512`, `1,515`, ...).
 *
 * Complexity O(characters of the first 100 content lines).
 *
 * @returns the caution in plain words, or null when the table does not look like that.
 * @example decimalCommaCaution('1,5\n2,25\n0,125\n') // 'holds only pairs of whole numbers ...'
 * @example decimalCommaCaution('0,512\n1,515\n2,498\n') // null (the first column steps by 1)
 */
export function decimalCommaCaution(text: string): string | null {
  const wholes: number[] = [];
  let from = 0;
  while (from < text.length && wholes.length < LOOKED_AT) {
    const newline = text.indexOf('\n', from);
    const line = text.slice(from, newline < 0 ? text.length : newline).replace(/\r$/, '');
    from = newline < 0 ? text.length : newline + 1;
    const trimmed = line.trim();
    if (trimmed === '' || trimmed.startsWith('#')) continue;
    const match = TWO_WHOLE_NUMBERS.exec(line);
    if (!match) return null;
    wholes.push(Number(match[1]));
  }
  if (wholes.length < 3 || stepsEvenly(wholes)) return null;
  return 'holds only pairs of whole numbers separated by a comma (like 1,5), read as two columns; if it is one column written with decimal commas, the values read are only their whole parts — save it with decimal points (1.5), or with semicolons between columns';
}

/** True when consecutive values differ by one constant amount other than 0 (an index or a clock). */
function stepsEvenly(values: readonly number[]): boolean {
  const step = values[1] - values[0];
  if (step === 0) return false;
  for (let i = 2; i < values.length; i++) if (values[i] - values[i - 1] !== step) return false;
  return true;
}
