/** Help text, generated from the command declarations. */
import { COMMANDS, type CommandSpec, type OptionSpec } from './commands.ts';

function optionLabel(o: OptionSpec): string {
  const flag = `${o.short ? `-${o.short}, ` : '    '}--${o.name}${o.type === 'string' ? ` ${o.value ?? 'VALUE'}` : ''}`;
  return flag;
}

/** The help text of one command. */
export function commandHelp(spec: CommandSpec): string {
  const usage = `usage: patternfold ${spec.name}${spec.positionals.map((p) => (p.required ? ` ${p.name}` : ` [${p.name}]`)).join('')} [options]`;
  const labels = spec.options.map(optionLabel);
  const width = Math.max(...labels.map((l) => l.length), ...spec.positionals.map((p) => p.name.length + 4));
  const lines = [usage, '', spec.summary, ''];
  if (spec.positionals.length) {
    lines.push('arguments:');
    for (const p of spec.positionals) lines.push(`  ${p.name.padEnd(width)}  ${p.description}`);
    lines.push('');
  }
  lines.push('options:');
  spec.options.forEach((o, i) => lines.push(`  ${labels[i].padEnd(width)}  ${o.description}${o.default ? ` (default: ${o.default})` : ''}`));
  lines.push('', 'examples:', ...spec.examples.map((e) => `  ${e}`));
  return lines.join('\n');
}

/** The top-level help text. */
export function mainHelp(version: string): string {
  const width = Math.max(...COMMANDS.map((c) => c.name.length));
  return [
    `patternfold ${version} — compare two groups of recordings by their ordinal-pattern dynamics`,
    '',
    'usage: patternfold COMMAND [arguments] [options]',
    '',
    'commands:',
    ...COMMANDS.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`),
    '',
    'options:',
    '  -h, --help     show help (also after a command: patternfold run --help)',
    '  -v, --version  print the version',
    '',
    'exit codes: 0 success, 2 bad input or usage, 1 internal error',
    'Results are research findings, not diagnoses: patternfold is not a medical device.',
  ].join('\n');
}
