import { isMap, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import type { FormulaPath } from './formula-problem.ts';

/** A 1-based line and column in a file. */
export interface Position {
  readonly line: number;
  readonly column: number;
}

function positionOf(
  node: { range?: [number, number, number] | null } | null | undefined,
  lineCounter: LineCounter,
): Position | undefined {
  if (!node?.range) return undefined;
  const { line, col } = lineCounter.linePos(node.range[0]);
  return { line, column: col };
}

/**
 * Finds where a path points in the YAML source: the key of a map entry, or the start of a list
 * item. When the path goes further than the document (a missing key), the deepest part that
 * exists is returned, which is where the missing key belongs.
 */
export function locate(doc: Document, lineCounter: LineCounter, path: FormulaPath): Position {
  let node: unknown = doc.contents;
  let found = positionOf(doc.contents as Node | null, lineCounter) ?? { line: 1, column: 1 };
  for (const part of path) {
    if (isMap(node)) {
      const pair = node.items.find(
        (item) => isScalar(item.key) && String(item.key.value) === String(part),
      );
      if (!pair) break;
      found = positionOf(pair.key as Node, lineCounter) ?? found;
      node = pair.value;
    } else if (isSeq(node) && typeof part === 'number' && part < node.items.length) {
      const item = node.items[part] as Node;
      found = positionOf(item, lineCounter) ?? found;
      node = item;
    } else {
      break;
    }
  }
  return found;
}
