/**
 * Display cleaning of user-supplied strings: the one rule for characters that must not reach
 * a reader unmarked, applied before HTML escaping and before text goes into a figure.
 */

/** Bidirectional formatting characters (Unicode Standard Annex #9, table 1) and invisible joiners. */
const INVISIBLE_FORMAT = /[\u061C\u200B-\u200F\u202A-\u202E\u2060-\u2069\uFEFF]/gu;
/** C0 controls except tab, line feed and carriage return; DEL; C1 controls. */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/gu;
/** Line and paragraph separators, which some renderers treat as line breaks. */
const LINE_SEPARATORS = /[\u2028\u2029]/gu;

function codePointTag(ch: string): string {
  return `[U+${(ch.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}]`;
}

/**
 * Makes a user-supplied string safe to show as text: bidirectional overrides, isolates, marks
 * and zero-width characters become a visible tag such as `[U+202E]` (so a name cannot reorder
 * the text around it, the "Trojan Source" problem of Boucher & Anderson 2023, USENIX Security),
 * other control characters are removed, tabs, line breaks and U+2028/2029 are kept only when
 * `multiline` is true and otherwise become spaces. It does not escape HTML: see escapeHtml.
 *
 * Linear in the length of the string. The empty string gives the empty string.
 *
 * @example displayText('a\u202Eb\u0007c') // 'a[U+202E]bc'
 */
export function displayText(s: string, multiline = false): string {
  let out = s.replace(INVISIBLE_FORMAT, codePointTag).replace(CONTROL, '');
  out = out.replace(LINE_SEPARATORS, multiline ? '\n' : ' ');
  if (!multiline) out = out.replace(/[\t\r\n]/g, ' ');
  return out;
}
