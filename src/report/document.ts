/**
 * The HTML document around the sections: doctype, a Content-Security-Policy that forbids every
 * network load, the inline style sheet, title, contents and footer.
 */
import { html, Markup } from './html.ts';
import { REPORT_CSS } from './style.ts';

/**
 * The page's policy (W3C Content Security Policy Level 3): nothing may be fetched, no script
 * may run, styles only inline, images only from data: URLs, no form may submit anywhere.
 */
export const REPORT_CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

export interface DocumentParts {
  title: string;
  subtitle: string;
  toc: { id: string; label: string }[];
  body: Markup[];
  footer: string;
}

/** Assembles the whole document; `title`, `subtitle`, labels and footer are escaped. */
export function renderDocument(parts: DocumentParts): string {
  return html`<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${REPORT_CSP}">
<meta name="referrer" content="no-referrer">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="patternfold">
<title>${parts.title}</title>
<style>${new Markup(REPORT_CSS)}</style>
</head><body>
<header class="page"><h1>${parts.title}</h1><p>${parts.subtitle}</p></header>
<nav class="toc" aria-label="Sections"><ol>${parts.toc.map((t) => html`<li><a href="#${t.id}">${t.label}</a></li>`)}</ol></nav>
<main>${parts.body}</main>
<footer class="page">${parts.footer}</footer>
</body></html>
`.value;
}
