/**
 * Length limit for the names a study gives its groups and subjects. They appear in every table
 * on the terminal, in file names of the report folder and in the report, so a name of
 * thousands of characters (a pasted paragraph, a hostile file) is refused with a message.
 */
import { InputError } from '../shared/errors.ts';
import { quoteFound } from '../shared/text.ts';

/** Longest group name or subject id accepted, in characters (our choice). */
export const MAX_NAME_LENGTH = 100;

/**
 * Throws InputError when `name` is longer than {@link MAX_NAME_LENGTH} characters; `where`
 * starts the message (file, line), `what` names the kind ("group name", "subject id").
 * Example: checkNameLength('x'.repeat(101), 'group name', 'study.yaml:3') throws
 * "study.yaml:3: group name 'xxx…' is 101 characters long — use a name of at most 100 characters".
 */
export function checkNameLength(name: string, what: string, where: string): void {
  const length = [...name].length;
  if (length > MAX_NAME_LENGTH) {
    throw new InputError(`${where}: ${what} ${quoteFound(name)} is ${length} characters long — use a name of at most ${MAX_NAME_LENGTH} characters`);
  }
}
