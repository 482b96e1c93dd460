import type { RevisionSource } from '../../../shared/api/formula-api.ts';

/** What a revision-in-words needs: how it came to be and who made it (a history entry). */
export interface RevisionFacts {
  readonly source: RevisionSource | null;
  /** Who made it through the console, or null (found in the files, or before anyone signed in). */
  readonly author: { readonly displayName: string } | string | null;
}

/** A person's name for a sentence: "Rosa Quennick", leaving out a role in brackets. */
export function nameOf(author: RevisionFacts['author']): string | null {
  if (author === null) return null;
  const name = typeof author === 'string' ? author : author.displayName;
  return name.replace(/\s*\([^)]*\)\s*$/, '').trim() || null;
}

/**
 * How a formula's revision came to be, in a cook's words, never a hash: "edited in the console
 * by Rosa Quennick", "changed in the files" (a revision found on disk: a git pull, an editor),
 * "uploaded by Tobin Marrowfeld", "created in the console by …", "removed". Shared by the formula's
 * history and anything that names the revision a batch was made from.
 */
export function revisionInWords(facts: RevisionFacts): string {
  const name = nameOf(facts.author);
  const by = name ? ` by ${name}` : '';
  switch (facts.source) {
    case 'save':
      return `edited in the console${by}`;
    case 'create':
      return `created in the console${by}`;
    case 'upload':
      return `uploaded${by}`;
    case 'disk':
      return 'changed in the files';
    case 'delete':
      return `removed${by}`;
    default:
      return name ? `changed by ${name}` : 'an earlier version';
  }
}
