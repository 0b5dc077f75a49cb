/**
 * Schema-backed validation of a study file, with messages that name the file, line, column
 * and key path, say what was expected and what was found, and suggest the fix.
 */
import { Ajv2020, type ErrorObject } from 'ajv/dist/2020.js';
import { LineCounter, parseDocument, type Document } from 'yaml';
import { InputError, locate } from '../shared/errors.ts';
import { quoteFound } from '../shared/text.ts';
import { applyOverrides, type Override } from './overrides.ts';
import { closest } from './suggest.ts';
import { formatKeyPath, positionOf, type KeyPath } from './locate-yaml.ts';
import { STUDY_SCHEMA } from './schema.ts';

const ajv = new Ajv2020({ allErrors: false, useDefaults: true, strict: false, verbose: true });
const validateAgainstSchema = ajv.compile(STUDY_SCHEMA);

/** The parsed and validated study settings (defaults filled in), before paths are resolved. */
export type RawStudy = Record<string, unknown>;

/** Shows a found value briefly (see quoteFound). */
export const showValue = (value: unknown): string => quoteFound(value);

function valueAt(root: unknown, path: KeyPath): unknown {
  let node = root;
  for (const part of path) node = (node as Record<string | number, unknown> | undefined)?.[part];
  return node;
}

function pathOf(error: ErrorObject): KeyPath {
  return error.instancePath
    .split('/')
    .slice(1)
    .map((p) => p.replace(/~1/g, '/').replace(/~0/g, '~'))
    .map((p) => (/^\d+$/.test(p) ? Number(p) : p));
}

/**
 * Picks the error to report: the deepest one; at equal depth a violated constraint on a value
 * of the right type beats a type mismatch, which beats an anyOf summary.
 */
function pickError(errors: ErrorObject[]): ErrorObject {
  const inAlternative = (e: ErrorObject) => e.schemaPath.includes('/anyOf/');
  const weight = (e: ErrorObject) => (e.keyword === 'anyOf' ? 1 : e.keyword === 'type' ? (inAlternative(e) ? 0 : 2) : 3);
  const rank = (e: ErrorObject) => pathOf(e).length * 10 + weight(e);
  return errors.reduce((best, e) => (rank(e) > rank(best) ? e : best));
}

function describeError(error: ErrorObject, found: unknown, key: string): { text: string; keyPathSuffix?: string } {
  const p = error.params as Record<string, unknown>;
  const schema = error.parentSchema as { description?: string; enum?: unknown[] } | undefined;
  switch (error.keyword) {
    case 'additionalProperties': {
      const unknown = String(p.additionalProperty);
      const allowed = Object.keys((error.parentSchema as { properties?: object }).properties ?? {});
      const guess = closest(unknown, allowed);
      const home = guess ? undefined : sectionHolding(unknown);
      const fix = guess
        ? ` — did you mean '${guess}'?`
        : home
          ? ` — it belongs in the section '${home}': move it there (${home}.${unknown})`
          : ` — remove it, or use one of the allowed keys here: ${allowed.join(', ')}`;
      return { text: `unknown key '${unknown}'${fix}`, keyPathSuffix: unknown };
    }
    case 'required':
      return { text: `missing key '${String(p.missingProperty)}' — add it (see 'patternfold init' for a template)` };
    case 'type':
      return { text: `${key} must be ${article(String(p.type))}, found ${showValue(found)} — ${TYPE_FIXES[String(p.type)] ?? 'correct the value'}` };
    case 'enum': {
      const allowed = (p.allowedValues as unknown[]).map(String);
      const guess = typeof found === 'string' ? closest(found, allowed) : undefined;
      return { text: `${key} must be one of ${allowed.join(', ')}, found ${showValue(found)}` + (guess ? ` — did you mean '${guess}'?` : '') };
    }
    case 'minimum':
    case 'maximum':
    case 'exclusiveMinimum':
    case 'exclusiveMaximum': {
      const op = { minimum: '>=', maximum: '<=', exclusiveMinimum: '>', exclusiveMaximum: '<' }[error.keyword];
      return { text: `${key} must be ${op} ${String(p.limit)}, found ${showValue(found)} — use a value in range` };
    }
    case 'minItems':
      return { text: `${key} needs at least ${String(p.limit)} item(s), found ${Array.isArray(found) ? found.length : 0}` };
    case 'maxItems':
      return { text: `${key} takes at most ${String(p.limit)} item(s), found ${Array.isArray(found) ? found.length : 0}` };
    case 'minProperties':
    case 'maxProperties':
      if (key !== 'groups') return { text: `${key} has the wrong number of entries` };
      return {
        text:
          `groups must name exactly two groups, found ${Object.keys(found as object).length} — patternfold compares two groups; ` +
          (error.keyword === 'minProperties' ? 'add the second group' : 'remove the extra groups (one study per pair of groups)'),
      };
    case 'uniqueItems':
      return { text: `${key} lists the same value twice (items ${String(p.j)} and ${String(p.i)}) — remove the duplicate` };
    case 'minLength':
      return { text: `${key} must not be empty` };
    case 'maxLength':
      return { text: `${key} is longer than ${String(p.limit)} characters` };
    case 'anyOf':
      return { text: `${key}: expected ${lowerFirst(schema?.description ?? 'another kind of value')}, found ${showValue(found)}` };
    default:
      return { text: `${key} ${error.message ?? 'is not valid'}, found ${showValue(found)}` };
  }
}

/** The fix for a value of the wrong JSON type, by the type the schema expects. */
const TYPE_FIXES: Record<string, string> = {
  integer: 'write a whole number',
  number: 'write a number (with a decimal point)',
  array: 'write a list in brackets, e.g. [3, 4]',
  string: 'write text (in quotes if it looks like a number or true/false)',
  boolean: 'write true or false',
  object: 'write a section of indented key: value lines',
  null: 'write null or leave the key out',
};

/** The top-level section whose keys include `key` (e.g. 'permutations' -> 'evaluation'), if exactly one does. */
function sectionHolding(key: string): string | undefined {
  const sections = Object.entries(STUDY_SCHEMA.properties as Record<string, { properties?: Record<string, unknown> }>);
  const homes = sections.filter(([, node]) => node.properties && key in node.properties).map(([name]) => name);
  return homes.length === 1 ? homes[0] : undefined;
}

/** What is wrong and the fix, for a YAML syntax error, by the parser's error code (yaml's YAMLError.code). */
function yamlProblem(code: string, reason: string, text: string, offset: number): string {
  if (code === 'TAB_AS_INDENT') return `${reason} — indent with spaces, not tabs`;
  if (code === 'DUPLICATE_KEY') {
    const key = /^\s*["']?([^"':\n]+)/.exec(text.slice(offset))?.[1]?.trim();
    return `the key ${key ? quoteFound(key) + ' ' : ''}appears twice in one section — remove one of them or merge the two`;
  }
  return `${reason} — check indentation, colons, brackets and quotes on that line`;
}

function article(type: string): string {
  return /^[aeiou]/.test(type) ? `an ${type}` : `a ${type}`;
}

function lowerFirst(s: string): string {
  return s.charAt(0).toLowerCase() + s.slice(1);
}

/**
 * Parses and validates the text of a study file. `label` names the file in messages.
 * Returns the settings with schema defaults filled in. Throws InputError on the first problem.
 */
export function validateStudyText(text: string, label: string, overrides: Override[] = []): RawStudy {
  const counter = new LineCounter();
  const doc: Document = parseDocument(text, { lineCounter: counter, prettyErrors: false, uniqueKeys: true });
  if (doc.errors.length > 0) {
    const err = doc.errors[0];
    const { line, col } = counter.linePos(err.pos[0]);
    const reason = err.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
    throw new InputError(`${locate(label, line, col)}: the study file is not valid YAML: ${yamlProblem(err.code, reason, text, err.pos[0])}`);
  }
  const data: unknown = doc.toJS() ?? {};
  if (typeof data !== 'object' || data === null || Array.isArray(data))
    throw new InputError(`${label}: a study file must be a mapping of keys (name, groups, grid, ...), found ${showValue(data)} — start from 'patternfold init'`);
  applyOverrides(data as RawStudy, overrides);
  if (!validateAgainstSchema(data)) {
    const error = pickError(validateAgainstSchema.errors ?? []);
    const path = pathOf(error);
    const found = valueAt(data, path);
    const key = formatKeyPath(path);
    const { text: what, keyPathSuffix } = describeError(error, found, key);
    const fullPath = keyPathSuffix ? [...path, keyPathSuffix] : path;
    const override = overrides.find((o) => formatKeyPath(o.path) === formatKeyPath(fullPath.slice(0, o.path.length)));
    if (override) throw new InputError(`--set ${override.source}: ${what}`);
    const pos = positionOf(doc, counter, fullPath, keyPathSuffix !== undefined);
    const where = keyPathSuffix ? `${what.replace(/^unknown key '([^']*)'/, `unknown key '$1' at ${formatKeyPath(fullPath)}`)}` : what;
    throw new InputError(`${locate(label, pos?.line, pos?.column)}: ${where}`);
  }
  return data as unknown as RawStudy;
}

/** Position of a key path in the study text, for messages raised after validation. */
export function studyPosition(text: string, path: KeyPath): { line: number; column: number } | undefined {
  const counter = new LineCounter();
  const doc = parseDocument(text, { lineCounter: counter });
  return positionOf(doc, counter, path);
}
