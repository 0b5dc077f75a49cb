/**
 * Section "Feature by feature": the univariate table, top rows.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput, UnivariateRow } from '../types.ts';
import { formatCell, formatNumber, formatP, isPresent } from '../format.ts';

/** Rows shown in the page; the exports carry all of them. */
export const UNIVARIATE_ROWS_SHOWN = 25;

/** Smallest q first, then largest |g|; missing values last. */
export function rankUnivariate(rows: UnivariateRow[]): UnivariateRow[] {
  const q = (r: UnivariateRow) => (isPresent(r.q) ? r.q : Infinity);
  const absG = (r: UnivariateRow) => (isPresent(r.hedgesG) ? Math.abs(r.hedgesG) : -1);
  return [...rows].sort((a, b) => (q(a) === q(b) ? 0 : q(a) < q(b) ? -1 : 1) || absG(b) - absG(a));
}

function meanSd(mean: number | null, sd: number | null): string {
  return `${formatNumber(mean, 3)} ± ${formatNumber(sd, 3)}`;
}

function row(r: UnivariateRow): Markup {
  return html`<tr><td>${r.feature}</td><td>${formatCell(r)}</td><td class="num">${r.n[0]} / ${r.n[1]}</td>
    <td class="num">${meanSd(r.mean[0], r.sd[0])}</td><td class="num">${meanSd(r.mean[1], r.sd[1])}</td>
    <td class="num">${formatNumber(r.hedgesG, 2)}</td><td class="num">${formatNumber(r.gLow, 2)} to ${formatNumber(r.gHigh, 2)}</td>
    <td class="num">${formatP(r.mannWhitneyP)}</td><td class="num">${formatNumber(r.auc, 2)}</td><td class="num">${formatP(r.q)}</td>
    <td>${r.note ?? ''}</td></tr>`;
}

/** Renders the table of the most different rows. */
export function univariateSection(input: ReportInput): Markup {
  const [a, b] = input.groupNames;
  const ranked = rankUnivariate(input.univariate).slice(0, UNIVARIATE_ROWS_SHOWN);
  return html`<section id="univariate"><h2>Feature by feature</h2>
    <p>Each feature at each grid cell compared on its own: Hedges' g (${b} minus ${a}) with its 95% interval, the two-sided
    Mann–Whitney p, AUC = U / (n₁ n₂), and the Benjamini–Hochberg q over all ${input.univariate.length} comparisons.
    The ${ranked.length} rows with the smallest q are shown; univariate.csv and results.json hold them all.</p>
    <div class="scroll"><table class="univariate"><thead><tr><th>feature</th><th>cell</th><th>n (${a} / ${b})</th>
      <th>${a} mean ± SD</th><th>${b} mean ± SD</th><th>g</th><th>95% interval of g</th><th>MW p</th><th>AUC</th><th>q</th><th>note</th></tr></thead>
      <tbody>${ranked.map(row)}</tbody></table></div></section>`;
}
