/**
 * The report stage: one self-contained HTML page from plain data. Re-exports only.
 */
export type * from './types.ts';
export { renderReport, SECTIONS } from './render.ts';
export { escapeHtml } from './escape.ts';
export { displayText } from './display-text.ts';
export { projectSubjects } from './projection.ts';
export type { Projection } from './projection.ts';
export { CAUTIONS } from './sections/answer.ts';
export { REPORT_CSP } from './document.ts';
