import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { escapeHtml, displayText } from '../../src/report/index.ts';

describe('escapeHtml', () => {
  it('replaces the five characters HTML gives meaning to with character references (WHATWG HTML, "character references"; escape-html)', () => {
    expect(escapeHtml(`<script>alert("x")</script> & 'y'`)).toBe('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;y&#39;');
  });

  it('keeps line breaks and tabs (they matter inside <pre>)', () => {
    expect(escapeHtml('a\n\tb')).toBe('a\n\tb');
  });

  it('tags bidirectional overrides instead of passing them through (Unicode Standard Annex #9)', () => {
    expect(escapeHtml('abc\u202Edef')).toBe('abc[U+202E]def');
    expect(escapeHtml('\u2066x\u2069')).toBe('[U+2066]x[U+2069]');
  });

  it('output never holds a raw <, >, quote or bidi control (property, fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary' }), (s) => {
        const out = escapeHtml(s);
        // eslint-disable-next-line no-control-regex -- the property is about control characters
        return !/[<>"'\u202A-\u202E\u2066-\u2069\u0000-\u0008]/.test(out);
      }),
    );
  });

  it('leaves plain text alone', () => {
    fc.assert(fc.property(fc.stringMatching(/^[A-Za-z0-9 _.,:;-]*$/), (s) => escapeHtml(s) === s));
  });
});

describe('displayText', () => {
  it('removes control characters, tags invisible format characters, folds line breaks on one line', () => {
    expect(displayText('a\u0007b\u200Bc\nd')).toBe('ab[U+200B]c d');
    expect(displayText('a\u2028b', true)).toBe('a\nb');
  });
  it('does not escape HTML (that is escapeHtml\'s job)', () => {
    expect(displayText('<b>&')).toBe('<b>&');
  });
});
