/**
 * `--set key.path=value` overrides: change one study setting for one run without editing the
 * file. The value's type follows the schema: list-valued keys take comma-separated items
 * (`--set grid.scale=1,2,8`), scalars are read as YAML scalars (`--set evaluation.folds=3`,
 * `--set features.ties=jitter`).
 */
import { parse as parseYaml } from 'yaml';
import { InputError } from '../shared/errors.ts';
import { STUDY_SCHEMA } from './schema.ts';

interface SchemaNode {
  type?: string;
  anyOf?: SchemaNode[];
  properties?: Record<string, SchemaNode>;
  additionalProperties?: SchemaNode | boolean;
}

/** The schema node at a dotted path, or undefined when the path is not in the schema. */
function schemaAt(path: string[]): SchemaNode | undefined {
  let node: SchemaNode | undefined = STUDY_SCHEMA as unknown as SchemaNode;
  for (const key of path) {
    if (!node) return undefined;
    const objectBranch: SchemaNode | undefined = node.properties ? node : node.anyOf?.find((branch) => branch.type === 'object');
    if (!objectBranch) return undefined;
    const next: SchemaNode | boolean | undefined = objectBranch.properties?.[key] ?? objectBranch.additionalProperties;
    node = typeof next === 'object' ? next : undefined;
  }
  return node;
}

function takesList(node: SchemaNode | undefined): boolean {
  if (!node) return false;
  if (node.type === 'array') return true;
  return (node.anyOf ?? []).some((branch) => branch.type === 'array') && !(node.anyOf ?? []).some((b) => b.type === 'string');
}

function parseScalar(text: string): unknown {
  try {
    return parseYaml(text);
  } catch {
    return text;
  }
}

/** One parsed override: the key path and the typed value. */
export interface Override {
  path: string[];
  value: unknown;
  source: string;
}

/**
 * Parses `key.path=value`. Throws InputError for a missing `=` or an empty key.
 * Example: parseOverride('grid.scale=1,2,8') -> { path: ['grid','scale'], value: [1,2,8] }.
 */
export function parseOverride(source: string): Override {
  const eq = source.indexOf('=');
  if (eq <= 0) throw new InputError(`--set ${source}: expected key.path=value, e.g. --set grid.scale=1,2,8`);
  const path = source.slice(0, eq).trim().split('.').filter(Boolean);
  const raw = source.slice(eq + 1).trim();
  if (path.length === 0) throw new InputError(`--set ${source}: the key path is empty — e.g. --set grid.scale=1,2,8`);
  const value = takesList(schemaAt(path))
    ? raw === '' ? [] : raw.split(',').map((item) => parseScalar(item.trim()))
    : parseScalar(raw);
  return { path, value, source };
}

/** Applies overrides to a plain study object in place (creating intermediate objects). */
export function applyOverrides(target: Record<string, unknown>, overrides: Override[]): void {
  for (const { path, value, source } of overrides) {
    let node = target;
    for (const key of path.slice(0, -1)) {
      const next = node[key];
      if (next === undefined || next === null) node[key] = {};
      else if (typeof next !== 'object' || Array.isArray(next))
        throw new InputError(`--set ${source}: '${key}' is not a section of the study file, so it has no key '${path[path.length - 1]}'`);
      node = node[key] as Record<string, unknown>;
    }
    node[path[path.length - 1]] = value;
  }
}
