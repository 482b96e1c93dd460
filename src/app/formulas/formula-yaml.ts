import { Document, isMap, isScalar, isSeq, parse, parseDocument, visit, type YAMLSeq } from 'yaml';
import type { Formula } from './formula-api-types';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

// lineWidth 0: never fold a long step onto two lines.
const WRITE_OPTIONS = { lineWidth: 0 } as const;

/**
 * Reads formula YAML into a plain object for the form, or null when it is not a YAML map. The
 * server decides whether it is a usable formula; this only gives the form something to show.
 */
export function parseFormulaYaml(text: string): Formula | null {
  try {
    const value: unknown = parse(text);
    return value !== null && typeof value === 'object' && !Array.isArray(value)
      ? (value as Formula)
      : null;
  } catch {
    // The text is being typed: a YAML syntax error is expected, and validation reports it.
    return null;
  }
}

/**
 * Writes `formula` into the YAML text it was edited from, so the YAML view follows the form
 * without losing the author's comments, key order or the one-line `{ name, pct }` rows: maps keep
 * their keys in place, lists are updated item by item, and a scalar changes only when its value
 * did. The server does the same when a form is saved; this is only what the editor shows.
 */
export function writeFormulaYaml(text: string, formula: Formula): string {
  const doc = parseDocument(text);
  if (doc.errors.length > 0 || !isMap(doc.contents)) {
    return new Document(formula).toString(WRITE_OPTIONS);
  }
  // The top is a map and the formula an object: the map is updated in place.
  place(doc, doc.contents, formula as unknown as Json);
  visit(doc, { Seq: (_key, node) => void (node.flow && unpad(node)) });
  return doc.toString(WRITE_OPTIONS);
}

/**
 * Writes a one-line list as `[milk]`, not `[ milk ]`. The yaml library pads every one-line
 * collection alike; Prettier, which formats the formula files, pads `{ maps }` and not `[lists]`.
 */
function unpad(node: YAMLSeq): void {
  const write = node.toString.bind(node);
  node.toString = ((ctx, onComment, onChompKeep) =>
    write(ctx && { ...ctx, flowCollectionPadding: '' }, onComment, onChompKeep)) as typeof write;
}

/** The node that holds `value`, reusing `node` when it has the same shape. */
function place(doc: Document, node: unknown, value: Json): unknown {
  if (Array.isArray(value)) {
    if (!isSeq(node)) return doc.createNode(value);
    const flow = node.items.some((item) => (isMap(item) || isSeq(item)) && item.flow);
    node.items = value.map((item, index) => {
      const placed = place(doc, node.items[index], item);
      if (flow && (isMap(placed) || isSeq(placed)) && index >= node.items.length) {
        placed.flow = true;
      }
      return placed;
    });
    return node;
  }
  if (value !== null && typeof value === 'object') {
    if (!isMap(node)) return doc.createNode(value);
    const keys = Object.keys(value);
    node.items = node.items.filter((pair) => keys.includes(keyText(pair.key)));
    for (const key of keys) {
      const pair = node.items.find((candidate) => keyText(candidate.key) === key);
      if (pair) pair.value = place(doc, pair.value, value[key]);
      else node.items.push(doc.createPair(key, value[key]));
    }
    return node;
  }
  if (isScalar(node)) {
    if (node.value !== value) node.value = value;
    return node;
  }
  return doc.createNode(value);
}

function keyText(key: unknown): string {
  return isScalar(key) ? String(key.value) : String(key);
}
