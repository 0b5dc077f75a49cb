/** Where {@link scanPlainDecimal} puts what it read; reused across calls so a hot loop allocates nothing. */
export interface DecimalScan {
  /** The number, correctly rounded to the nearest double; -0 for a negative zero. */
  value: number;
  /** Char code of the decimal mark written: 0x2e (point), 0x2c (comma) or 0 (none). */
  mark: number;
}

/** Largest k with 10^k exact in a double (5^22 < 2^53). */
const MAX_EXACT_POWER = 22;
/** 10^0 .. 10^22, each an exact double. */
const POWERS_OF_TEN = Float64Array.from({ length: MAX_EXACT_POWER + 1 }, (_, k) => Number(`1e${k}`));

/**
 * Reads a plain decimal number starting at `text[from]`, by char codes, and converts it
 * exactly when Clinger's fast path applies (Clinger 1990, "How to read floating point
 * numbers accurately", PLDI '90, the case of an exact significand and an exact power of ten
 * [M]): when the digits, read as one integer s, stay below 2^53, s is an exact double, and
 * 10^k is exact for k <= 22, so the one IEEE 754 operation s * 10^k or s / 10^k is correctly
 * rounded: the same double as `Number()` gives for the text (ECMA-262 StringToNumber, which
 * must round correctly up to 20 significant digits [M]; tested against Number()). Any
 * 15-digit significand qualifies (10^15 < 2^53) [D].
 *
 * Grammar (the same as readSampleCell's): optional `+`/`-`, then digits with an optional
 * decimal mark and more digits, or a mark and at least one digit; then optionally `e`/`E`,
 * optional sign, at least one digit. The mark is `.`, or also `,` when `commaMark` is true.
 * A zero significand gives 0, or -0 after `-`, whatever the exponent (as Number() does).
 *
 * Complexity O(characters of the number); no allocation.
 *
 * @returns the index just past the number (the caller checks what follows), with the value
 *   and mark in `out`; -1 when the text does not start with such a number, or when its
 *   significand reaches 2^53 or the power of ten lies beyond 10^±22 (then read the cell with
 *   Number() instead).
 * @example scanPlainDecimal('-1.25;7', 0, false, out) // 5, out = { value: -1.25, mark: 0x2e }
 */
export function scanPlainDecimal(text: string, from: number, commaMark: boolean, out: DecimalScan): number {
  let p = from;
  let c = text.charCodeAt(p);
  const negative = c === 0x2d;
  if (negative || c === 0x2b) c = text.charCodeAt(++p);
  const integerStart = p;
  let significand = 0;
  for (let d = c - 0x30; d >= 0 && d <= 9; d = (c = text.charCodeAt(++p)) - 0x30) significand = significand * 10 + d;
  let digits = p - integerStart;
  let fractionDigits = 0;
  let mark = 0;
  if (c === 0x2e || (commaMark && c === 0x2c)) {
    mark = c;
    const fractionStart = ++p;
    c = text.charCodeAt(p);
    for (let d = c - 0x30; d >= 0 && d <= 9; d = (c = text.charCodeAt(++p)) - 0x30) significand = significand * 10 + d;
    fractionDigits = p - fractionStart;
    digits += fractionDigits;
  }
  if (digits === 0) return -1;
  let exponent = 0;
  if (c === 0x65 || c === 0x45) {
    p = scanExponent(text, p + 1, out);
    if (p < 0) return -1;
    exponent = out.value;
  }
  out.mark = mark;
  if (significand === 0) {
    out.value = negative ? -0 : 0;
    return p;
  }
  // Rounding is monotonic, so the accumulated significand is below 2^53 exactly when the
  // true one is, and then every partial sum was exact.
  const power = exponent - fractionDigits;
  if (significand > Number.MAX_SAFE_INTEGER || power > MAX_EXACT_POWER || power < -MAX_EXACT_POWER) return -1;
  const magnitude = power < 0 ? significand / POWERS_OF_TEN[-power] : significand * POWERS_OF_TEN[power];
  out.value = negative ? -magnitude : magnitude;
  return p;
}

/** Reads `[+-]?digits` at `text[from]` into out.value; returns the index past it, or -1 without digits. */
function scanExponent(text: string, from: number, out: DecimalScan): number {
  let p = from;
  let c = text.charCodeAt(p);
  const negative = c === 0x2d;
  if (negative || c === 0x2b) c = text.charCodeAt(++p);
  const start = p;
  let exponent = 0;
  for (; c >= 0x30 && c <= 0x39; c = text.charCodeAt(++p)) exponent = exponent * 10 + (c - 0x30);
  if (p === start) return -1;
  out.value = negative ? -exponent : exponent;
  return p;
}
