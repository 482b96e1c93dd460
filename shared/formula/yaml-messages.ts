import type { YAMLError } from 'yaml';

/** Plain words for the YAML syntax errors a hand-edited formula file is most likely to have. */
const MESSAGES: Partial<Record<string, string>> = {
  DUPLICATE_KEY: 'this key is given twice; keep one',
  MULTIPLE_DOCS:
    'one formula per file: remove the second "---" and what follows, or move it to its own file',
  TAB_AS_INDENT: 'indent with spaces, not tabs',
  BAD_INDENT: 'the indentation is off, or a bracket is not closed',
  BLOCK_AS_IMPLICIT_KEY: 'the indentation is off, or a ": " is missing after a key',
  MULTILINE_IMPLICIT_KEY: 'the indentation is off, or a ": " is missing after a key',
  MISSING_CHAR: 'something is missing here',
  UNEXPECTED_TOKEN: 'unexpected text here',
};

/** A YAML parser error in words a cook can act on, keeping the parser's own text for detail. */
export function yamlErrorMessage(error: YAMLError): string {
  const detail = error.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
  const plain = MESSAGES[error.code];
  return plain && plain !== detail ? `YAML: ${plain} (${detail})` : `YAML: ${detail}`;
}
