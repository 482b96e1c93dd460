import {
  Composer,
  Lexer,
  Parser,
  YAMLParseError,
  type Document,
  type DocumentOptions,
  type ParseOptions,
  type SchemaOptions,
} from 'yaml';
import {
  YamlShapeCounter,
  shapeProblem,
  sizeProblem,
  type YamlLimitProblem,
} from './yaml-limits.ts';

/** Formula YAML parsed, or refused because it is larger or deeper than a formula can be. */
export type GuardedYaml =
  | { readonly ok: true; readonly document: Document.Parsed }
  | { readonly ok: false; readonly problem: YamlLimitProblem };

/**
 * The yaml package's options for parseDocument, without prettyErrors: errors keep the parser's
 * own message, and the reader puts the line and column beside it.
 */
export type YamlOptions = Omit<ParseOptions, 'prettyErrors'> & DocumentOptions & SchemaOptions;

/**
 * The one way formula YAML is parsed, in the core, the server, the command and the console. A
 * text larger than a formula may be is refused unread; otherwise each token of the lexer is
 * counted (YamlShapeCounter) before the parser is given it, and the first token past the
 * nesting or node limit ends the reading: the parser never holds more than the limits' worth,
 * and the text is lexed once. The same as the yaml package's parseDocument for any text within
 * the limits. ESLint forbids importing the yaml package's parsers anywhere else.
 */
export function parseYamlWithinLimits(text: string, options: YamlOptions = {}): GuardedYaml {
  const size = sizeProblem(text);
  if (size) return { ok: false, problem: size };
  const counter = new YamlShapeCounter();
  const lineCounter = options.lineCounter;
  // As the package's parseDocument does it, with the lexer's tokens counted on their way in.
  const parser = new Parser(lineCounter?.addNewLine);
  const tokens = function* () {
    lineCounter?.addNewLine(0);
    for (const lexeme of new Lexer().lex(text)) {
      if (!counter.feed(lexeme)) return;
      yield* parser.next(lexeme);
    }
    yield* parser.end();
  };
  let document: Document.Parsed | undefined;
  for (const next of new Composer(options).compose(tokens(), true, text.length)) {
    if (!document) document = next;
    else if (document.options.logLevel !== 'silent') {
      document.errors.push(
        new YAMLParseError(
          [next.range[0], next.range[1]],
          'MULTIPLE_DOCS',
          'Source contains multiple documents; please use YAML.parseAllDocuments()',
        ),
      );
      break;
    }
  }
  const { over } = counter.shape;
  if (over) return { ok: false, problem: shapeProblem(over) };
  // compose() always ends with a document, an empty one for an empty text.
  if (!document) throw new Error('the yaml package composed no document');
  return { ok: true, document };
}
