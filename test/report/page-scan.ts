/**
 * Minimal scanning of the report's HTML for tests: start tags with their attributes. The page is
 * generated with every attribute value quoted and every '<' in text escaped, so a start-tag scan
 * is exact for it; the browser test checks the same things with Chromium's own parser.
 */
export interface Tag {
  name: string;
  attrs: Map<string, string>;
}

const TAG = /<([a-zA-Z][a-zA-Z0-9:-]*)((?:\s+[^\s=/>]+(?:\s*=\s*(?:"[^"]*"|'[^']*'|[^\s"'=<>`]+))?)*)\s*\/?>/g;
const ATTR = /([^\s=/>]+)(?:\s*=\s*(?:"([^"]*)"|'([^']*)'|([^\s"'=<>`]+)))?/g;

/** Decodes the character references escapeHtml and vega produce (named ones for & < > " and numeric ones). */
export function decodeEntities(s: string): string {
  return s
    .replace(/&#(\d+);/g, (_, d: string) => String.fromCodePoint(Number(d)))
    .replace(/&#x([0-9a-f]+);/gi, (_, h: string) => String.fromCodePoint(parseInt(h, 16)))
    .replace(/&quot;/g, '"').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');
}

export function startTags(page: string): Tag[] {
  const tags: Tag[] = [];
  for (const m of page.matchAll(TAG)) {
    const attrs = new Map<string, string>();
    for (const a of m[2].matchAll(ATTR)) attrs.set(a[1].toLowerCase(), decodeEntities(a[2] ?? a[3] ?? a[4] ?? ''));
    tags.push({ name: m[1].toLowerCase(), attrs });
  }
  return tags;
}

/** The <svg ...> start tags that open a figure (not nested ones). */
export function figureSvgs(page: string): { figure: string; width: number; height: number }[] {
  const out: { figure: string; width: number; height: number }[] = [];
  for (const m of page.matchAll(/<figure class="plot" data-figure="([^"]+)"><svg([^>]*)>/g)) {
    const w = /\swidth="([\d.]+)"/.exec(m[2]);
    const h = /\sheight="([\d.]+)"/.exec(m[2]);
    out.push({ figure: m[1], width: w ? Number(w[1]) : 0, height: h ? Number(h[1]) : 0 });
  }
  return out;
}
