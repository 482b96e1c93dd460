import {
  Document,
  isMap,
  isScalar,
  isSeq,
  visit,
  type ToStringOptions,
  type YAMLMap,
  type YAMLSeq,
} from 'yaml';
import { parseYamlWithinLimits } from './parse-yaml.ts';
import { MAX_YAML_NODES } from './yaml-limits.ts';

/** Deepest nesting a formula sent as JSON may have; real formulas go four levels deep. */
const MAX_DEPTH = 16;

// lineWidth 0: never fold a long line the file had on one line.
const TO_STRING: ToStringOptions = { lineWidth: 0 };

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

function isRecord(value: unknown): value is Record<string, Json> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function keyOf(key: unknown): string {
  return isScalar(key) ? String(key.value) : String(key);
}

/**
 * Rewrites a formula file to hold `formula` (the formula as JSON) while keeping everything the
 * file's author wrote around the values: comments, blank lines, key order, flow or block style,
 * quoting and number formats of the values that did not change. Maps keep their keys in place
 * (new keys go at the end, dropped keys go), lists are updated item by item and then grown or
 * cut, and a scalar is only touched when its value changed, so its comments stay with it.
 * A file that is not valid YAML, or larger or deeper than a formula can be, cannot be updated
 * in place and is written fresh.
 * @throws RangeError when the formula nests deeper, or holds more values, than any formula does
 */
export function mergeFormulaIntoYaml(text: string, formula: Record<string, unknown>): string {
  checkShape(formula);
  const parsed = parseYamlWithinLimits(text, { uniqueKeys: true });
  const doc = parsed.ok ? parsed.document : undefined;
  if (!doc || doc.errors.length > 0 || !isMap(doc.contents)) {
    return new Document(formula).toString(TO_STRING);
  }
  // The top is a map and the formula an object, so the map is updated in place.
  update(doc, doc.contents, formula as Json);
  keepFlowPadding(doc, text);
  return doc.toString(TO_STRING);
}

/** Refuses a formula no file could hold before any YAML is built from it. */
function checkShape(formula: unknown): void {
  let values = 0;
  const walk = (value: unknown, depth: number): void => {
    if (depth > MAX_DEPTH)
      throw new RangeError(`the formula nests deeper than ${MAX_DEPTH} levels`);
    // Its file would be refused for as many keys and values (yaml-limits.ts).
    if (++values > MAX_YAML_NODES)
      throw new RangeError(`the formula holds more than ${MAX_YAML_NODES} values`);
    if (Array.isArray(value)) for (const item of value) walk(item, depth + 1);
    else if (isRecord(value)) for (const item of Object.values(value)) walk(item, depth + 1);
  };
  walk(formula, 0);
}

/** The node for `value`: `node` itself, updated in place, whenever its shape allows. */
function update(doc: Document, node: unknown, value: Json): unknown {
  if (isRecord(value)) {
    if (!isMap(node)) return doc.createNode(value);
    const keys = new Set(Object.keys(value));
    node.items = node.items.filter((pair) => keys.has(keyOf(pair.key)));
    for (const [key, item] of Object.entries(value)) {
      const pair = node.items.find((candidate) => keyOf(candidate.key) === key);
      if (pair) pair.value = update(doc, pair.value, item);
      else node.items.push(doc.createPair(key, item));
    }
    return node;
  }
  if (Array.isArray(value)) {
    if (!isSeq(node)) return doc.createNode(value);
    const kept = Math.min(node.items.length, value.length);
    for (let i = 0; i < kept; i++) node.items[i] = update(doc, node.items[i], value[i]);
    const last = node.items[node.items.length - 1];
    for (const item of value.slice(kept)) {
      const created = doc.createNode(item);
      // A new list item takes the style of the one before it: { name: …, pct: … } stays flow.
      if ((isMap(created) || isSeq(created)) && (isMap(last) || isSeq(last)) && last.flow)
        created.flow = true;
      node.items.push(created);
    }
    node.items.length = value.length;
    return node;
  }
  if (isScalar(node) && !(node.value !== null && typeof node.value === 'object')) {
    if (!Object.is(node.value, value)) node.value = value;
    return node;
  }
  return doc.createNode(value);
}

/**
 * The yaml library pads every flow collection alike ("[ a ]" or "[a]"); files formatted by
 * Prettier pad maps and not lists. Each flow collection read from the file keeps its own padding,
 * and a new one takes the padding of the file's first collection of its sort.
 */
function keepFlowPadding(doc: Document, text: string): void {
  const sourcePadding = (node: YAMLMap | YAMLSeq): string | undefined => {
    const start = node.range?.[0];
    if (start === undefined || (text[start] !== '[' && text[start] !== '{')) return undefined;
    return text[start + 1] === ' ' ? ' ' : '';
  };
  const style: { map?: string; seq?: string } = {};
  visit(doc, {
    Map: (_key, node) => {
      style.map ??= sourcePadding(node);
    },
    Seq: (_key, node) => {
      style.seq ??= sourcePadding(node);
    },
  });
  const pad = (node: YAMLMap | YAMLSeq, padding: string | undefined): void => {
    if (padding === undefined) return;
    const toString = node.toString.bind(node);
    node.toString = ((ctx, onComment, onChompKeep) =>
      toString(
        ctx && { ...ctx, flowCollectionPadding: padding },
        onComment,
        onChompKeep,
      )) as typeof node.toString;
  };
  visit(doc, {
    Map: (_key, node) => pad(node, node.range ? sourcePadding(node) : style.map),
    Seq: (_key, node) => pad(node, node.range ? sourcePadding(node) : style.seq),
  });
}
