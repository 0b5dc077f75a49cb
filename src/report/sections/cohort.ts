/**
 * Section "Who was compared": subjects and recordings per group, lengths, missing and tied
 * samples, and every quality warning.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { CohortRow, ReportInput } from '../types.ts';
import { formatNumber, formatPercent, isPresent, MISSING } from '../format.ts';

function median(values: number[]): number | null {
  const v = values.filter(isPresent).sort((x, y) => x - y);
  if (v.length === 0) return null;
  const mid = v.length >> 1;
  return v.length % 2 === 1 ? v[mid] : (v[mid - 1] + v[mid]) / 2;
}

function rangeText(values: number[]): string {
  const v = values.filter(isPresent);
  if (v.length === 0) return MISSING;
  return `${Math.min(...v)} to ${Math.max(...v)}`;
}

function groupSummaryRow(input: ReportInput, g: 0 | 1): Markup {
  const rows = input.cohort.filter((r) => r.group === g);
  const lengths = rows.map((r) => r.length);
  const withWarnings = rows.filter((r) => r.warnings.length > 0).length;
  return html`<tr><th scope="row">${input.groupNames[g]}</th><td class="num">${input.subjectsPerGroup[g]}</td>
    <td class="num">${rows.length}</td><td class="num">${formatNumber(median(lengths), 0)}</td><td class="num">${rangeText(lengths)}</td>
    <td class="num">${formatPercent(median(rows.map((r) => r.missingShare ?? NaN)), 1)}</td>
    <td class="num">${formatPercent(median(rows.map((r) => r.tiedShare ?? NaN)), 1)}</td><td class="num">${withWarnings}</td></tr>`;
}

function recordingRow(input: ReportInput, r: CohortRow): Markup {
  return html`<tr${r.warnings.length > 0 ? html` class="warn"` : ''}><td>${r.id}</td><td>${r.subject}</td><td>${input.groupNames[r.group]}</td>
    <td class="num">${r.length}</td><td class="num">${formatPercent(r.missingShare, 1)}</td><td class="num">${formatPercent(r.tiedShare, 1)}</td>
    <td>${r.warnings.length === 0 ? '' : html`<ul class="plain">${r.warnings.map((w) => html`<li>${w}</li>`)}</ul>`}</td></tr>`;
}

function warningList(input: ReportInput): Markup {
  if (input.warnings.length === 0) return html`<p>No study-wide quality warnings.</p>`;
  return html`<ul class="warnings">${input.warnings.map(
    (w) => html`<li>${w.subject ? html`<span class="who">${w.subject}</span> ` : ''}${w.file ? html`<code>${w.file}</code> ` : ''}${w.message}</li>`,
  )}</ul>`;
}

function noteList(input: ReportInput): Markup | string {
  if (input.notes.length === 0) return '';
  return html`<h3>Notes</h3><ul class="notes">${input.notes.map((n) => html`<li>${n}</li>`)}</ul>`;
}

/** Renders the cohort section. */
export function cohortSection(input: ReportInput): Markup {
  const rows = [...input.cohort].sort((a, b) => a.group - b.group || a.subject.localeCompare(b.subject) || a.id.localeCompare(b.id));
  return html`<section id="cohort"><h2>Who was compared</h2>
    <table class="summary"><thead><tr><th>group</th><th>subjects</th><th>recordings</th><th>median length (samples)</th>
      <th>length range</th><th>median missing</th><th>median tied windows</th><th>recordings with warnings</th></tr></thead>
      <tbody>${groupSummaryRow(input, 0)}${groupSummaryRow(input, 1)}</tbody></table>
    <p class="note">Groups that differ in recording length, missing samples or ties can differ in ordinal patterns for that
      reason alone: compare the rows above before reading the rest.</p>
    <h3>Quality warnings</h3>${warningList(input)}${noteList(input)}
    <h3>All ${input.cohort.length} recordings</h3>
      <table><thead><tr><th>recording</th><th>subject</th><th>group</th><th>length</th><th>missing</th><th>tied windows</th><th>warnings</th></tr></thead>
      <tbody>${rows.map((r) => recordingRow(input, r))}</tbody></table>
  </section>`;
}
