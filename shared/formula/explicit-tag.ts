import { isCollection, isScalar, visit, type Document } from 'yaml';

const CORE_PREFIX = 'tag:yaml.org,2002:';

/**
 * The first value written with an explicit YAML tag (`!!set`, `!!timestamp`, `!!binary`, `!x`),
 * with where its value starts. A formula is plain keys, text, numbers and lists: a tag would turn
 * a value into a set, a date or bytes that the schema cannot tell from an empty object.
 */
export function explicitTag(doc: Document): { tag: string; offset: number } | undefined {
  let found: { tag: string; offset: number } | undefined;
  visit(doc, (_key, node) => {
    if ((isScalar(node) || isCollection(node)) && node.tag) {
      const tag = node.tag.startsWith(CORE_PREFIX)
        ? `!!${node.tag.slice(CORE_PREFIX.length)}`
        : node.tag;
      found = { tag, offset: node.range?.[0] ?? 0 };
      return visit.BREAK;
    }
    return undefined;
  });
  return found;
}
