import { beforeAll, describe, expect, it } from 'vitest';
import { renderReport, REPORT_CSP, CAUTIONS, escapeHtml } from '../../src/report/index.ts';
import { buildInput, hostileInput, HOSTILE_SCRIPT, RLO } from './fixture.ts';
import { figureSvgs, startTags } from './page-scan.ts';

// Attributes through which a page can load or navigate somewhere (HTML Living Standard, SVG 2).
const URL_ATTRIBUTES = new Set(['src', 'href', 'xlink:href', 'srcset', 'action', 'formaction', 'poster', 'data', 'background', 'ping']);
const EXPECTED_FIGURES = [
  'grid-score', 'effect-sizes', 'plane-0', 'plane-1', 'plane-2',
  'distribution-0', 'distribution-1', 'distribution-2', 'distribution-3', 'distribution-4', 'distribution-5',
  'roc', 'permutation-null', 'pca', 'importance',
];

let page = '';
let hostile = '';

beforeAll(async () => {
  page = await renderReport(buildInput());
  hostile = await renderReport(hostileInput());
});

describe('renderReport: one self-contained page', () => {
  it('is an HTML5 document with a Content-Security-Policy that forbids network loads', () => {
    expect(page.startsWith('<!DOCTYPE html>')).toBe(true);
    const meta = startTags(page).filter((t) => t.name === 'meta' && t.attrs.get('http-equiv')?.toLowerCase() === 'content-security-policy');
    expect(meta).toHaveLength(1);
    const csp = meta[0].attrs.get('content') ?? '';
    expect(csp).toBe(REPORT_CSP);
    expect(csp).toMatch(/(^|;)\s*default-src 'none'/);
    expect(csp).not.toMatch(/script-src|connect-src|https?:/);
  });

  it('has no attribute or CSS that loads from http(s) — the SVG xmlns declarations are not loads', () => {
    for (const html of [page, hostile]) {
      for (const tag of startTags(html)) {
        for (const [name, value] of tag.attrs) {
          if (URL_ATTRIBUTES.has(name)) expect(value, `${tag.name} ${name}`).not.toMatch(/^\s*(https?:)?\/\//i);
          if (name.startsWith('on')) throw new Error(`event handler attribute ${name} on <${tag.name}>`);
        }
      }
      expect(html).not.toMatch(/url\(\s*['"]?\s*(https?:)?\/\//i);
      expect(html).not.toMatch(/@import/i);
    }
    // the only http(s) text left is in xmlns attributes
    const xmlns = [...page.matchAll(/\s([a-z:]+)="https?:\/\/[^"]*"/g)].map((m) => m[1]);
    expect(new Set(xmlns)).toEqual(new Set(['xmlns', 'xmlns:xlink']));
  });

  it('holds every figure as inline SVG with a positive size', () => {
    const svgs = figureSvgs(page);
    expect(svgs.map((s) => s.figure)).toEqual(EXPECTED_FIGURES);
    for (const s of svgs) {
      expect(s.width, s.figure).toBeGreaterThan(50);
      expect(s.height, s.figure).toBeGreaterThan(50);
    }
    expect(page).not.toContain('No figure:');
  });

  it('has no script element and no link or external resource', () => {
    const names = new Set(startTags(page).map((t) => t.name));
    for (const bad of ['script', 'link', 'iframe', 'object', 'embed', 'img', 'foreignobject']) expect(names.has(bad), bad).toBe(false);
  });

  it('puts the answer first and the cautions beside it', () => {
    const answer = page.indexOf('<section id="answer">');
    const cohort = page.indexOf('<section id="cohort">');
    expect(answer).toBeGreaterThan(0);
    expect(answer).toBeLessThan(cohort);
    for (const c of CAUTIONS) {
      const at = page.indexOf(escapeHtml(c));
      expect(at).toBeGreaterThan(answer);
      expect(at).toBeLessThan(cohort);
    }
    const answerText = page.slice(answer, cohort);
    expect(answerText).toContain('0.78');
    expect(answerText).toContain('p = 0.004');
    expect(answerText).toContain('999');
    expect(answerText).toContain('95% interval 0.65 to 0.89');
  });

  it('carries the study file verbatim and the input fingerprints', () => {
    const input = buildInput();
    expect(page).toContain(`<pre class="study">${escapeHtml(input.reproduction.studyText)}</pre>`);
    for (const f of input.reproduction.inputFiles) expect(page).toContain(escapeHtml(f.path));
    expect(page).toContain(escapeHtml("'reports/it'\\''s here'"));
  });

  it('stays under 3 MB for 40 subjects (issue 5); measured ≈ 0.54 MB', () => {
    expect(Buffer.byteLength(page, 'utf8')).toBeLessThan(3 * 1024 * 1024);
  });

  it('is deterministic: the same input renders the same bytes', async () => {
    const again = await renderReport(buildInput());
    expect(again === page, 'second rendering differs').toBe(true);
  });
});

describe('renderReport: hostile names', () => {

  it('contains no script element, whatever the names', () => {
    expect(startTags(hostile).some((t) => t.name === 'script')).toBe(false);
    expect(hostile).not.toMatch(/<script/i);
    expect(hostile).not.toMatch(/<img/i);
  });

  it('shows the names as escaped text in HTML and inside the SVG figures', () => {
    expect(hostile).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    // in the figures' legends and axis labels (vega's own escaping)
    const svgText = [...hostile.matchAll(/<svg[\s\S]*?<\/svg>/g)].map((m) => m[0]).join('');
    expect(svgText).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(svgText).toMatch(/&amp;/);
    expect(hostile).toContain('&quot;&#39;&amp;[U+202E]b'); // group 1 in HTML
  });

  it('never lets a raw right-to-left override through', () => {
    expect(hostile).not.toContain(RLO);
    expect(hostile).toContain('[U+202E]');
  });

  it('adds no element and no attribute: the hostile page has the same tag structure as the plain one', () => {
    const shape = (html: string) => startTags(html).map((t) => `${t.name}(${[...t.attrs.keys()].join(',')})`);
    const plain = shape(page);
    const evil = shape(hostile);
    expect(evil.length).toBe(plain.length);
    expect(evil.join(' ') === plain.join(' '), 'tag structure differs').toBe(true);
  });

  it('keeps the hostile text inside text and attribute values only', () => {
    const decodedValues = startTags(hostile).flatMap((t) => [...t.attrs.values()]);
    expect(decodedValues.some((v) => v.includes(HOSTILE_SCRIPT))).toBe(true);
  });
});

describe('renderReport: missing pieces are said, not hidden', () => {
  it('replaces a figure with nothing to draw by a sentence', async () => {
    const input = { ...buildInput(), roc: [], nullScores: [], projection: null, importance: null, distributions: [], plane: [] };
    const html = await renderReport(input);
    expect(html).toContain('No figure: no out-of-fold predictions were given.');
    expect(html).toContain('No figure: no permutation scores were given.');
    expect(html).toContain('No figure: no feature matrix was given.');
    expect(html).toContain('No feature distributions were given.');
    expect(figureSvgs(html).map((s) => s.figure)).toEqual(['grid-score', 'effect-sizes']);
  });

  it('says the comparison could not be scored when the headline is missing', async () => {
    const input = buildInput();
    input.headline = { ...input.headline, auc: null, permutationP: null, missingReason: 'every fold lacked one of the groups' };
    const html = await renderReport(input);
    expect(html).toContain('The comparison could not be scored: every fold lacked one of the groups.');
    expect(html).not.toContain('differ in their ordinal-pattern\n      dynamics more than chance');
  });

  it('words a non-significant result as no clear evidence, not as sameness', async () => {
    const input = buildInput();
    input.headline = { ...input.headline, auc: 0.55, permutationP: 0.31 };
    const html = await renderReport(input);
    expect(html).toContain('These data give no clear evidence');
  });

  it('rejects equal group names and bad group indices, naming the field', async () => {
    await expect(renderReport({ ...buildInput(), groupNames: ['a', 'a'] })).rejects.toThrow('report input groupNames: must differ');
    const input = buildInput();
    (input.cohort[0] as { group: number }).group = 2;
    await expect(renderReport(input)).rejects.toThrow('report input cohort[0].group: must be 0 or 1, got 2');
  });
});

describe('renderReport: notes apart from quality warnings', () => {
  it('lists notes about the study under their own heading, after the quality warnings, escaped', () => {
    const warningsAt = page.indexOf('<h3>Quality warnings</h3>');
    const notesAt = page.indexOf('<h3>Notes</h3>');
    expect(warningsAt).toBeGreaterThan(0);
    expect(notesAt).toBeGreaterThan(warningsAt);
    expect(page.slice(notesAt)).toMatch(/lie outside the study file&#39;s folder/);
    const hostileNotes = hostile.slice(hostile.indexOf('<h3>Notes</h3>'), hostile.indexOf('</ul>', hostile.indexOf('<h3>Notes</h3>')));
    expect(hostileNotes).not.toContain('<script>');
    expect(hostileNotes).toContain(`../${escapeHtml('<script>alert(3)</script>')}`);
  });

  it('shows no Notes heading when there are none', async () => {
    expect(await renderReport({ ...buildInput(), notes: [] })).not.toContain('<h3>Notes</h3>');
  });
});
