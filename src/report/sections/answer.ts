/**
 * Section "The answer": the headline in plain words, what it means and what it does not,
 * with the research cautions beside it.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { formatInterval, formatNumber, formatP, isPresent } from '../format.ts';

/**
 * The fixed cautions, in the report module's own words (shared/DESIGN.md, "Cautions").
 */
export const CAUTIONS: readonly string[] = [
  'patternfold is a research tool. It is not a medical device and has not been validated for any clinical or safety-critical use.',
  'A difference between groups in the dynamics of their signals is a research finding about these groups, not a diagnosis of any person in them.',
  'Decisions about people need methods validated for that purpose, ethics approval where human data are involved, and licensed practitioners.',
];

/** The cautions box. */
export function cautionsBlock(): Markup {
  return html`<aside class="cautions" aria-label="Cautions"><h3>Before you use this answer</h3><ul>${CAUTIONS.map((c) => html`<li>${c}</li>`)}</ul></aside>`;
}

function scoreSentence(input: ReportInput): Markup {
  const h = input.headline;
  const [a, b] = input.groupNames;
  const pct = isPresent(h.auc) ? Math.round(h.auc * 100) : null;
  return html`<p>The whole pipeline — features over the grid, the choice of grid cell, and a
    <strong>${h.classifier}</strong> classifier — was scored by ${h.repeats} × ${h.folds}-fold cross-validation
    on subjects it had not seen. Its out-of-fold ROC AUC is <strong class="num">${formatNumber(h.auc, 2)}</strong>
    (${formatInterval(h.interval)}; ${h.interval.method}).
    ${pct === null ? '' : html`In about ${pct} of 100 pairs made of one ${b} subject and one ${a} subject, the ${b} subject got the higher score; 50 of 100 is chance.`}</p>`;
}

function permutationSentence(input: ReportInput): Markup {
  const h = input.headline;
  const floor = h.permutations > 0 ? 1 / (h.permutations + 1) : null;
  const atFloor = isPresent(h.permutationP) && floor !== null && Math.abs(h.permutationP - floor) < 1e-12;
  return html`<p>Rerunning the same pipeline with the group labels shuffled ${h.permutations} times gave a score at least
    as good as the real one with permutation <strong class="num">p = ${formatP(h.permutationP)}</strong>
    (Monte-Carlo standard error ${formatP(h.permutationPSe)})${atFloor ? html`, the smallest p that ${h.permutations} permutations can give` : ''}.</p>`;
}

function verdict(input: ReportInput): Markup {
  const h = input.headline;
  const [a, b] = input.groupNames;
  if (!isPresent(h.auc) || !isPresent(h.permutationP)) {
    return html`<p class="verdict">The comparison could not be scored${h.missingReason ? html`: ${h.missingReason}` : ''}.</p>`;
  }
  if (h.permutationP <= input.alpha && h.auc > 0.5) {
    return html`<p class="verdict">The recordings of <strong>${a}</strong> and <strong>${b}</strong> differ in their ordinal-pattern
      dynamics more than chance relabelling explains, at the study's level α = ${String(input.alpha)}.</p>`;
  }
  return html`<p class="verdict">These data give no clear evidence that <strong>${a}</strong> and <strong>${b}</strong> differ in
    their ordinal-pattern dynamics: the score is within what shuffled labels reach (α = ${String(input.alpha)}).</p>`;
}

function meaningList(input: ReportInput): Markup {
  const [a, b] = input.groupNames;
  return html`<div class="meaning"><div><h3>What this means</h3><ul>
      <li>The AUC is measured on subjects held out of training, and the permutation test reruns every step, grid search included, so the search over the grid cannot by itself produce a good score.</li>
      <li>It describes these ${input.subjectsPerGroup[0]} ${a} and ${input.subjectsPerGroup[1]} ${b} subjects, recorded as they were; the interval says how far the score could move with another sample like this one.</li>
    </ul></div><div><h3>What it does not mean</h3><ul>
      <li>It does not say why the groups differ: a difference in recording equipment, length, noise or data quality between the groups changes ordinal patterns too (see "Who was compared").</li>
      <li>It does not classify any single person reliably, and a p-value above α does not show that the groups are alike.</li>
    </ul></div></div>`;
}

/** Renders the opening section. */
export function answerSection(input: ReportInput): Markup {
  const [a, b] = input.groupNames;
  const [n0, n1] = input.subjectsPerGroup;
  return html`<section id="answer"><h2>The answer</h2>
    <p class="lead">Compared: <strong>${a}</strong> (${n0} subjects) with <strong>${b}</strong> (${n1} subjects).</p>
    ${verdict(input)}
    <div class="answer-grid"><div>${scoreSentence(input)}${permutationSentence(input)}${meaningList(input)}</div>${cautionsBlock()}</div>
  </section>`;
}
