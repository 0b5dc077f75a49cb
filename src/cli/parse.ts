/**
 * Parses the arguments of one command against its declaration (node:util parseArgs).
 * Usage mistakes become InputError with the fix, so they exit with code 2.
 */
import { parseArgs } from 'node:util';
import { InputError } from '../shared/errors.ts';
import { closest } from '../study/index.ts';
import { COMMANDS, type CommandSpec } from './commands.ts';

export interface ParsedCommand {
  spec: CommandSpec;
  positionals: string[];
  values: Record<string, string | boolean | string[] | undefined>;
}

/** Finds a command by name, suggesting the closest one for a typo. */
export function findCommand(name: string): CommandSpec {
  const spec = COMMANDS.find((c) => c.name === name);
  if (spec) return spec;
  const guess = closest(name, COMMANDS.map((c) => c.name));
  throw new InputError(`unknown command '${name}'${guess ? ` — did you mean '${guess}'?` : ''} (commands: ${COMMANDS.map((c) => c.name).join(', ')}; see patternfold --help)`);
}

/** Parses the arguments that follow the command name. */
export function parseCommand(spec: CommandSpec, args: string[]): ParsedCommand {
  const options = Object.fromEntries(
    spec.options.map((o) => [o.name, { type: o.type, multiple: Boolean(o.multiple), ...(o.short ? { short: o.short } : {}) }]),
  );
  let parsed;
  try {
    parsed = parseArgs({ args, options, allowPositionals: true, strict: true });
  } catch (e) {
    const message = (e as Error).message;
    const unknown = /Unknown option '(-{1,2}[^']+)'/.exec(message)?.[1];
    if (unknown) {
      const guess = closest(unknown.replace(/^-+/, ''), spec.options.map((o) => o.name));
      throw new InputError(`${spec.name}: unknown option ${unknown}${guess ? ` — did you mean --${guess}?` : ''} (see patternfold ${spec.name} --help)`);
    }
    throw new InputError(`${spec.name}: ${message.replace(/\. To specify.*$/s, '')} (see patternfold ${spec.name} --help)`);
  }
  const values = parsed.values as ParsedCommand['values'];
  if (!values.help) {
    const required = spec.positionals.filter((p) => p.required);
    if (parsed.positionals.length < required.length)
      throw new InputError(`${spec.name}: missing ${required[parsed.positionals.length].name} — usage: patternfold ${spec.name} ${spec.positionals.map((p) => p.name).join(' ')}`);
    if (parsed.positionals.length > spec.positionals.length)
      throw new InputError(`${spec.name}: unexpected argument '${parsed.positionals[spec.positionals.length]}' (see patternfold ${spec.name} --help)`);
  }
  return { spec, positionals: parsed.positionals, values };
}
