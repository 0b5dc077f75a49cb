/**
 * Display of strings that came from data (ids, file names, cell contents): control
 * characters and bidirectional marks are replaced by a visible `\uXXXX` form, so that no
 * escape sequence or direction override from a file reaches a terminal or a message.
 */

// C0/C1 controls except tab and newline, DEL, and the bidi marks, embeddings, overrides and isolates.
// eslint-disable-next-line no-control-regex
const UNSAFE = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/g;

/** Example: visibleText('a\u001b[31m') === 'a\\u001b[31m'. */
export function visibleText(text: string): string {
  return text.replace(UNSAFE, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** A value shown in a message: strings quoted and cut to `max` characters, others as JSON. */
export function quoteFound(value: unknown, max = 40): string {
  if (typeof value === 'string') {
    const clean = visibleText(value).replace(/\n/g, '\\n');
    return `'${clean.length > max ? clean.slice(0, max) + '…' : clean}'`;
  }
  if (value === undefined) return 'nothing';
  const json = JSON.stringify(value) ?? String(value);
  return json.length > max ? json.slice(0, max) + '…' : json;
}
