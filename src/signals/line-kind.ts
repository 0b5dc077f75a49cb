/** What one line of a text table is, judged by its first non-blank character. */
export type LineKind = 'blank' | 'comment' | 'content';

/**
 * Classifies the line `text[from, to)` by its first character that is not a space, tab,
 * vertical tab, form feed, no-break space or byte-order mark: `#` makes a comment, any other
 * character content; a line of blanks only (or an empty one) is blank. Rule (ours), shared by
 * the general reader and the fast reader so both skip exactly the same lines.
 *
 * Complexity O(characters up to the first non-blank one); no allocation.
 *
 * @returns 'blank' for an empty range.
 * @example lineKind('  # note', 0, 8) // 'comment'
 */
export function lineKind(text: string, from: number, to: number): LineKind {
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x23) return 'comment';
    if (c !== 0x20 && c !== 0x09 && c !== 0x0b && c !== 0x0c && c !== 0xa0 && c !== 0xfeff) return 'content';
  }
  return 'blank';
}
