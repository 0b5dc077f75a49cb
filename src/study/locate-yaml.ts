/**
 * Maps a key path in a parsed YAML document back to its line and column, so that every
 * message can point at the place in the study file an editor would show.
 */
import { isMap, isSeq, LineCounter, type Document, type Node } from 'yaml';

export type KeyPath = (string | number)[];

export interface Position {
  line: number;
  column: number;
}

/** Formats a key path as `grid.order[1]`. */
export function formatKeyPath(path: KeyPath): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out ? `.${part}` : part;
  }
  return out || '(top level)';
}

/**
 * Line and column (1-based) of the node at `path`, or of its closest existing ancestor.
 * With `keyOnly`, the position of the mapping key rather than of its value.
 */
export function positionOf(doc: Document, counter: LineCounter, path: KeyPath, keyOnly = false): Position | undefined {
  let node: unknown = doc.contents;
  let best: Node | undefined = node as Node | undefined;
  for (const part of path) {
    if (isMap(node)) {
      const pair = node.items.find((item) => (item.key as { value?: unknown } | null)?.value === part);
      if (!pair) break;
      best = (keyOnly && part === path[path.length - 1] ? pair.key : (pair.value ?? pair.key)) as Node;
      node = pair.value;
    } else if (isSeq(node) && typeof part === 'number') {
      const item = node.items[part] as Node | undefined;
      if (!item) break;
      best = item;
      node = item;
    } else break;
  }
  const offset = best?.range?.[0];
  if (offset === undefined) return undefined;
  const { line, col } = counter.linePos(offset);
  return { line, column: col };
}
