/**
 * HTML escaping: the one place where text becomes markup-safe.
 */
import escape from 'escape-html';
import { displayText } from './display-text.ts';

/**
 * Escapes a string for HTML text and for double- or single-quoted attribute values: `&`, `<`,
 * `>`, `"` and `'` become character references (the escape-html package), after displayText has
 * tagged bidirectional and invisible formatting characters and removed control characters.
 * Line breaks and tabs are kept (they matter inside `<pre>`).
 *
 * Linear in the length of the string. The empty string gives the empty string.
 *
 * @example escapeHtml(`<b class="x">&'`) // '&lt;b class=&quot;x&quot;&gt;&amp;&#39;'
 */
export function escapeHtml(s: string): string {
  return escape(displayText(s, true));
}
