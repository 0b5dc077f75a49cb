/** Characters of a found cell shown in an error message before it is cut. */
const SHOWN_CHARS = 40;

/**
 * Shows text found in a file inside an error message: in double quotes, cut to 40
 * characters (with "…" after a cut), control characters written as escapes (`\t`, `\r`,
 * `\n`, otherwise `\xHH` or `\u{HHHH}`), and `"`/`\` escaped so the quotes stay unambiguous.
 *
 * @returns the quoted text; `""` for an empty string.
 * @example quoteFound('a\tb"') // '"a\\tb\\""' (printed: "a\tb\"")
 */
export function quoteFound(text: string): string {
  const chars = Array.from(text);
  const cut = chars.length > SHOWN_CHARS;
  const shown = chars.slice(0, SHOWN_CHARS).map(escapeChar).join('');
  return `"${shown}${cut ? '…' : ''}"`;
}

function escapeChar(ch: string): string {
  if (ch === '\t') return '\\t';
  if (ch === '\r') return '\\r';
  if (ch === '\n') return '\\n';
  if (ch === '"' || ch === '\\') return `\\${ch}`;
  const code = ch.codePointAt(0) ?? 0;
  if (code < 0x20 || code === 0x7f) return `\\x${code.toString(16).padStart(2, '0')}`;
  if ((code >= 0x80 && code < 0xa0) || code === 0xfeff || code === 0xfffd) return `\\u{${code.toString(16)}}`;
  return ch;
}
