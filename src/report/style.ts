/**
 * The page's only style sheet, inlined into the document. System fonts only (no font files),
 * a print layout that keeps figures and table rows whole.
 */
export const REPORT_CSS = `
:root { color-scheme: light; --ink: #1d1d1f; --muted: #5a5a5f; --rule: #d9d9de; --accent: #0072B2; --warn: #fff4d6; }
* { box-sizing: border-box; }
html { font-family: Helvetica, Arial, sans-serif; font-size: 15px; line-height: 1.45; color: var(--ink); background: #fff; }
body { margin: 0 auto; max-width: 1100px; padding: 1.5rem 1.5rem 4rem; }
header.page { border-bottom: 2px solid var(--ink); margin-bottom: 1rem; }
header.page h1 { font-size: 1.6rem; margin: 0 0 .25rem; overflow-wrap: anywhere; }
header.page p { margin: 0 0 .6rem; color: var(--muted); }
nav.toc ol { display: flex; flex-wrap: wrap; gap: .25rem 1.25rem; padding: 0; margin: 0 0 1rem; list-style: none; font-size: .9rem; }
nav.toc a { color: var(--accent); text-decoration: none; }
h2 { font-size: 1.3rem; margin: 2.2rem 0 .6rem; padding-top: .6rem; border-top: 1px solid var(--rule); }
h3 { font-size: 1.02rem; margin: 1.2rem 0 .4rem; }
p.lead { font-size: 1.1rem; margin: .2rem 0; }
p.verdict { font-size: 1.15rem; font-weight: bold; margin: .4rem 0 .8rem; }
.answer-grid { display: grid; grid-template-columns: minmax(0, 2fr) minmax(0, 1fr); gap: 1.5rem; align-items: start; }
.meaning { display: grid; grid-template-columns: 1fr 1fr; gap: 1rem; }
.meaning ul, aside.cautions ul { padding-left: 1.1rem; margin: .2rem 0; }
aside.cautions { border: 2px solid #b35c00; background: var(--warn); padding: .6rem .9rem; border-radius: 4px; }
aside.cautions h3 { margin-top: .2rem; }
.num { font-variant-numeric: tabular-nums; white-space: nowrap; }
td.num, th.num { text-align: right; }
table { border-collapse: collapse; margin: .4rem 0 .8rem; font-size: .88rem; }
th, td { border-bottom: 1px solid var(--rule); padding: .25rem .5rem; vertical-align: top; text-align: left; overflow-wrap: break-word; }
thead th { border-bottom: 2px solid var(--ink); font-weight: bold; }
tr.warn td { background: var(--warn); }
ul.plain { list-style: none; padding: 0; margin: 0; }
ul.warnings li { margin: .15rem 0; }
.who { font-weight: bold; }
p.note, figcaption, p.missing { color: var(--muted); font-size: .88rem; }
p.missing { font-style: italic; }
.plot-row { display: flex; flex-wrap: wrap; gap: 1rem 1.5rem; align-items: flex-start; }
figure.plot { display: table; margin: .5rem 0 1rem; max-width: 100%; }
figure.plot svg { display: block; max-width: 100%; height: auto; }
figcaption { display: table-caption; caption-side: bottom; margin-top: .3rem; }
.scroll { overflow-x: auto; }
pre.study { background: #f6f6f8; border: 1px solid var(--rule); padding: .7rem; font-size: .82rem; white-space: pre-wrap; overflow-wrap: anywhere; }
code { font-family: ui-monospace, Menlo, Consolas, monospace; font-size: .85em; }
code.hash { word-break: break-all; }
footer.page { margin-top: 3rem; color: var(--muted); font-size: .8rem; border-top: 1px solid var(--rule); padding-top: .5rem; }
@media (max-width: 760px) { .answer-grid, .meaning { grid-template-columns: 1fr; } }
@media print {
  @page { margin: 14mm 12mm; }
  html { font-size: 10.5pt; }
  body { max-width: none; padding: 0; }
  nav.toc { display: none; }
  h2 { break-after: avoid; page-break-after: avoid; }
  h3 { break-after: avoid; }
  figure.plot, aside.cautions, tr, pre.study { break-inside: avoid; page-break-inside: avoid; }
  .scroll { overflow: visible; }
  a { color: inherit; text-decoration: none; }
  aside.cautions, tr.warn td { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
`;
