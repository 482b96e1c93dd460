import { readdirSync } from 'node:fs';
import path from 'node:path';
import { REPO_ROOT } from './run-larder.ts';

/** Folders that hold none of our documentation: packages, builds, the demo's data, test output. */
const NOT_OURS = new Set(['node_modules', 'dist', 'data', 'out-tsc', 'test-artifacts', 'coverage']);

/**
 * Every Markdown file of the repository, as paths from its root with `/`, sorted. Dot folders
 * (.git, .angular) and the folders in NOT_OURS are left out.
 */
export function markdownFiles(folder = ''): string[] {
  const found: string[] = [];
  for (const entry of readdirSync(path.join(REPO_ROOT, folder), { withFileTypes: true })) {
    const relative = folder === '' ? entry.name : `${folder}/${entry.name}`;
    if (entry.isDirectory()) {
      if (!entry.name.startsWith('.') && !NOT_OURS.has(entry.name)) {
        found.push(...markdownFiles(relative));
      }
    } else if (entry.name.endsWith('.md')) {
      found.push(relative);
    }
  }
  return found.sort();
}

const FENCE = /^ {0,3}(`{3,}|~{3,})/;

/** The text with every fenced code block blanked out (lines kept, so line numbers still hold). */
export function withoutCodeBlocks(text: string): string {
  let fence: string | undefined;
  return text
    .split('\n')
    .map((line) => {
      const opening = FENCE.exec(line)?.[1];
      if (fence === undefined) {
        if (opening === undefined) return line;
        fence = opening;
        return '';
      }
      if (opening !== undefined && opening[0] === fence[0] && opening.length >= fence.length) {
        fence = undefined;
      }
      return '';
    })
    .join('\n');
}

/**
 * The anchor GitHub gives a heading: its text as rendered (markup dropped), lower-cased, every
 * character but letters, digits, `_`, `-` and spaces dropped, each space a dash.
 * source: github-slugger, the rule GitHub renders heading anchors with
 */
export function headingAnchor(heading: string): string {
  return heading
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/<[^>]+>/g, '')
    .replace(/[`*]/g, '')
    .trim()
    .toLowerCase()
    .replace(/[^\p{L}\p{M}\p{N}\p{Pc} -]/gu, '')
    .replace(/ /g, '-');
}

/** Every anchor a Markdown file has: its headings' (repeats numbered -1, -2 …) and HTML ids. */
export function anchorsOf(text: string): Set<string> {
  const anchors = new Set<string>();
  const seen = new Map<string, number>();
  const prose = withoutCodeBlocks(text);
  for (const [, heading] of prose.matchAll(/^ {0,3}#{1,6}[ \t]+(.*?)(?:[ \t]+#+)?[ \t]*$/gm)) {
    const anchor = headingAnchor(heading);
    const repeats = seen.get(anchor) ?? 0;
    seen.set(anchor, repeats + 1);
    anchors.add(repeats === 0 ? anchor : `${anchor}-${repeats}`);
  }
  for (const [, id] of prose.matchAll(/<[a-z]+\s[^>]*\b(?:id|name)="([^"]+)"/g)) anchors.add(id);
  return anchors;
}

/** A link as written in a Markdown file, with the line it starts on. */
export interface MarkdownLink {
  readonly target: string;
  readonly line: number;
}

const INLINE_LINK = /\[(?:[^[\]]|\[[^\]]*\])*\]\(\s*<?([^)\s>]*)>?(?:\s+"[^"]*")?\s*\)/g;
const REFERENCE_DEFINITION = /^ {0,3}\[[^\]]+\]:[ \t]*<?([^\s>]+)>?/gm;
const HTML_LINK = /<(?:a|img)\s[^>]*\b(?:href|src)="([^"]*)"/g;

/**
 * Every link target of a Markdown file outside code: inline links and images, reference
 * definitions and HTML `href`/`src`. Code spans are blanked first (their brackets are not links).
 */
export function linksOf(text: string): MarkdownLink[] {
  const prose = withoutCodeBlocks(text).replace(/(`+)[^`]*?\1/g, (span) =>
    span.replace(/[^\n]/g, 'x'),
  );
  const lineAt = (index: number): number => prose.slice(0, index).split('\n').length;
  return [INLINE_LINK, REFERENCE_DEFINITION, HTML_LINK]
    .flatMap((pattern) => [...prose.matchAll(pattern)])
    .map((match) => ({ target: match[1], line: lineAt(match.index) }))
    .sort((a, b) => a.line - b.line);
}
