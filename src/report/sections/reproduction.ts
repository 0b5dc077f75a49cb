/**
 * Section "How to reproduce this": study file verbatim, command line, input fingerprints,
 * versions, platform, seed and timing.
 */
import { html } from '../html.ts';
import type { Markup } from '../html.ts';
import type { ReportInput } from '../types.ts';
import { formatDuration, shellQuote } from '../format.ts';

/** Renders the reproduction section. */
export function reproductionSection(input: ReportInput): Markup {
  const r = input.reproduction;
  const deps = Object.entries(r.dependencies).sort(([a], [b]) => a.localeCompare(b));
  return html`<section id="reproduction"><h2>How to reproduce this</h2>
    <table class="summary"><tbody>
      <tr><th scope="row">command</th><td><code>${r.commandLine.map(shellQuote).join(' ')}</code></td></tr>
      <tr><th scope="row">patternfold</th><td>${r.toolVersion}</td></tr>
      <tr><th scope="row">Node.js</th><td>${r.nodeVersion}</td></tr>
      <tr><th scope="row">platform</th><td>${r.platform}</td></tr>
      <tr><th scope="row">seed</th><td>${String(r.seed)}</td></tr>
      <tr><th scope="row">started</th><td>${r.startedAt}</td></tr>
      <tr><th scope="row">duration</th><td>${formatDuration(r.durationMs)}</td></tr>
      <tr><th scope="row">libraries</th><td>${deps.map(([n, v], i) => html`${i > 0 ? ', ' : ''}<code>${n}</code> ${v}`)}</td></tr>
    </tbody></table>
    <h3>Study file <code>${r.studyPath}</code>, verbatim</h3><pre class="study">${r.studyText}</pre>
    <h3>Input files (${r.inputFiles.length})</h3>
    <div class="scroll"><table class="files"><thead><tr><th>file</th><th>bytes</th><th>SHA-256</th></tr></thead><tbody>${r.inputFiles.map(
      (f) => html`<tr><td>${f.path}</td><td class="num">${f.bytes === undefined ? '' : String(f.bytes)}</td><td><code class="hash">${f.sha256}</code></td></tr>`,
    )}</tbody></table></div></section>`;
}
