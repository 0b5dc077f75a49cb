/**
 * renderReport: one self-contained HTML document from a ReportInput.
 */
import type { Markup } from './html.ts';
import type { ReportInput } from './types.ts';
import { renderDocument } from './document.ts';
import { validateReportInput } from './validate-input.ts';
import { answerSection } from './sections/answer.ts';
import { cohortSection } from './sections/cohort.ts';
import { gridSection } from './sections/grid.ts';
import { planeSection } from './sections/plane.ts';
import { distributionsSection } from './sections/distributions.ts';
import { separationSection } from './sections/separation.ts';
import { overviewSection } from './sections/overview.ts';
import { univariateSection } from './sections/univariate.ts';
import { reproductionSection } from './sections/reproduction.ts';

/** Section ids and their headings, in page order. */
export const SECTIONS = [
  { id: 'answer', label: 'The answer' },
  { id: 'cohort', label: 'Who was compared' },
  { id: 'grid', label: 'Where in the grid' },
  { id: 'plane', label: 'Complexity against entropy' },
  { id: 'distributions', label: 'The most different features' },
  { id: 'separation', label: 'How well the groups separate' },
  { id: 'overview', label: 'All subjects at a glance' },
  { id: 'univariate', label: 'Feature by feature' },
  { id: 'reproduction', label: 'How to reproduce this' },
] as const;

/**
 * Renders the whole report: an HTML5 document with inline CSS, a Content-Security-Policy that
 * forbids network loads, and static SVG figures drawn now by vega-lite and vega, so the page
 * needs no script and opens offline. Every user-supplied string is escaped (escapeHtml in the
 * page; vega escapes the text it draws), after bidirectional and control characters are
 * tagged or removed (displayText). Missing values print as "—"; a figure with nothing to draw
 * is replaced by a sentence saying why.
 *
 * Throws an Error naming the field when the input breaks an invariant (validateReportInput).
 * Cost: dominated by vega's rendering, roughly linear in the number of points drawn.
 *
 * @example const page = await renderReport(input); page.startsWith('<!DOCTYPE html>') // true
 */
export async function renderReport(input: ReportInput): Promise<string> {
  validateReportInput(input);
  const body: Markup[] = [
    answerSection(input),
    cohortSection(input),
    await gridSection(input),
    await planeSection(input),
    await distributionsSection(input),
    await separationSection(input),
    await overviewSection(input),
    univariateSection(input),
    reproductionSection(input),
  ];
  const [a, b] = input.groupNames;
  return renderDocument({
    title: input.studyName,
    subtitle: `${a} compared with ${b} by ordinal-pattern dynamics · started ${input.reproduction.startedAt}`,
    toc: [...SECTIONS],
    body,
    footer: `Written by patternfold ${input.reproduction.toolVersion}. This page loads nothing from the network and runs no script.`,
  });
}
