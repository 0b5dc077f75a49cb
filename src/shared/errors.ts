/**
 * The two kinds of failure patternfold distinguishes.
 *
 * An {@link InputError} is the user's to fix (a bad study file, an unreadable recording, a
 * wrong flag): the command line prints its one-line message and exits with code 2, never a
 * stack trace. Anything else that escapes is an internal error (exit code 1).
 *
 * Message convention: `<where>: <what is wrong> — <how to fix it>`, where `<where>` names the
 * file and, when known, the line, column and key path (`study.yaml:9:3 grid.scales`).
 */
export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(message: string) {
    super(message);
  }
}

/** Builds the `<file>:<line>:<column> <keyPath>` prefix used by every located message. */
export function locate(file: string, line?: number, column?: number, keyPath?: string): string {
  let where = file;
  if (line !== undefined) where += `:${line}`;
  if (line !== undefined && column !== undefined) where += `:${column}`;
  if (keyPath) where += ` ${keyPath}`;
  return where;
}
