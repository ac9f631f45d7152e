import {
  Composer,
  isAlias,
  isCollection,
  isMap,
  isScalar,
  Lexer,
  LineCounter,
  Parser,
  YAMLParseError,
  type CST,
  type Document,
  type YAMLError,
} from 'yaml';
import { MAX_ALIAS_COUNT, MAX_NESTING_DEPTH, MAX_TEXT_BYTES } from './limits';
import { findDeepNesting, type DeepNesting } from './nesting-depth';
import { utf8Length } from './utf8-length';

/** A reason the text could not be read as a setup at all (reported as `syntax`). */
export interface TextProblem {
  message: string;
  hint: string;
  line: number;
  column: number;
}

export interface ParsedText {
  /** False when the text is not YAML we accept or its root is not a mapping. */
  readable: boolean;
  /** The plain value of the document, unknown keys included; null when unreadable. */
  data: unknown;
  document: Document.Parsed | null;
  lineCounter: LineCounter;
  problems: TextProblem[];
}

function unreadable(
  lineCounter: LineCounter,
  problems: TextProblem[],
  document: Document.Parsed | null = null,
): ParsedText {
  return { readable: false, data: null, document, lineCounter, problems };
}

function firstLine(message: string): string {
  return message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
}

function describeYamlError(error: YAMLError, text: string): Pick<TextProblem, 'message' | 'hint'> {
  if (error.code === 'DUPLICATE_KEY') {
    const key =
      /^("(?:[^"\\\n]|\\.)*"|'(?:[^'\n]|'')*'|[^:\n,{}[\]]+?)\s*:/.exec(
        text.slice(error.pos[0], error.pos[0] + 200),
      )?.[1] ?? '';
    const named = key && key.length <= 60 ? `The key "${key}"` : 'A key';
    return {
      message: `${named} appears twice in the same mapping; YAML keys must be unique, so the document is ambiguous.`,
      hint: 'Remove one of the two entries or merge them into one.',
    };
  }
  if (error.code === 'TAB_AS_INDENT') {
    return { message: 'A tab is used for indentation; YAML allows only spaces there.', hint: 'Indent with spaces.' };
  }
  const plain = plainWords(error);
  if (plain) return plain;
  return {
    message: `The text is not valid YAML: ${firstLine(error.message)}.`.replace(/\.\.$/, '.'),
    hint: 'Fix the YAML near this position; check indentation, colons and brackets.',
  };
}

// The yaml package's messages are written for programmers ("Implicit map keys need to
// be followed by map values"); the common ones are said here in a pilot's words. The
// line and column stay with the finding. Rarer messages keep the package's own text.
function plainWords(error: YAMLError): Pick<TextProblem, 'message' | 'hint'> | null {
  const original = error.message;
  if (/Implicit map keys need to be followed by map values/.test(original))
    return {
      message: 'A name here has no colon after it, so YAML cannot tell it is a key with a value.',
      hint: 'Write the key with a colon and its value, like "airframe: airplane", or remove the stray word.',
    };
  if (error.code === 'MULTILINE_IMPLICIT_KEY')
    return {
      message: 'A key seems to run onto the next line: a colon is probably missing on the line before.',
      hint: 'Each setting is "key: value" on one line, like "name: Tern 1800".',
    };
  if (/All mapping items must start at the same column/.test(original))
    return {
      message: 'This line is indented differently from the lines beside it.',
      hint: 'Line it up with the other keys of the same block, using spaces.',
    };
  if (/Flow (sequence|map) in block collection must be sufficiently indented and end with a/.test(original)) {
    const bracket = /end with a ([\]}])/.exec(original)?.[1] ?? ']';
    return {
      message: `A list or mapping opened with ${bracket === '}' ? '{' : '['} is not closed with ${bracket} before this line.`,
      hint: `Add the closing ${bracket} at the end of the entry.`,
    };
  }
  if (/Missing closing "?quote/.test(original))
    return {
      message: 'A quoted text is not closed: its closing quote mark is missing.',
      hint: 'Add the closing quote at the end of the text.',
    };
  if (error.code === 'BLOCK_AS_IMPLICIT_KEY')
    return {
      message: 'Two colons on one line: YAML reads it as a mapping inside a key.',
      hint: 'Put the inner key on its own line, indented, or quote the value if it contains a colon.',
    };
  if (error.code === 'MULTIPLE_DOCS')
    return {
      message: 'The text holds more than one document (a line with --- splits them); a setup is one document.',
      hint: 'Remove the --- line and keep one setup per file.',
    };
  return null;
}

function describeRoot(contents: unknown): string {
  if (contents === null || contents === undefined) return 'it is empty';
  if (isScalar(contents) && (contents.value === null || contents.value === undefined)) return 'it is empty';
  if (isAlias(contents)) return 'it is an alias';
  if (isCollection(contents)) return 'it is a list';
  return 'it is a single value';
}

/** The finding for text over the size limit, or null when the text may be read. */
export function sizeProblem(text: string): TextProblem | null {
  // A UTF-16 unit takes one to three UTF-8 bytes, so short texts need no counting.
  const bytes = text.length * 3 <= MAX_TEXT_BYTES ? 0 : utf8Length(text);
  if (bytes <= MAX_TEXT_BYTES) return null;
  return {
    message: `The text is ${Math.ceil(bytes / 1024)} KB; setups larger than ${MAX_TEXT_BYTES / 1024} KB are not read.`,
    hint: 'A setup is normally a few kilobytes: check that this is the right file.',
    line: 1,
    column: 1,
  };
}

/** Parses setup text into a document with positions, never throwing. */
export function parseYaml(text: string): ParsedText {
  const lineCounter = new LineCounter();
  const at = (offset: number) => {
    const { line, col } = lineCounter.linePos(offset);
    return { line, column: col };
  };

  const tooLarge = sizeProblem(text);
  if (tooLarge) return unreadable(lineCounter, [tooLarge]);

  try {
    // What parseDocument does, in steps: lexer and parser token by token, watching the
    // nesting depth, then the composer. The parser fills the line counter as it goes.
    const parser = new Parser(lineCounter.addNewLine);
    const tokens: CST.Token[] = [];
    let deep: DeepNesting | null = null;
    lineCounter.addNewLine(0);
    for (const lexeme of new Lexer().lex(text)) {
      for (const token of parser.next(lexeme)) tokens.push(token);
      deep = findDeepNesting(parser.stack, MAX_NESTING_DEPTH);
      if (deep) break;
    }
    if (!deep) for (const token of parser.end()) tokens.push(token);
    if (deep) {
      return unreadable(lineCounter, [
        {
          message: `The document nests more than ${MAX_NESTING_DEPTH} levels deep; setups are not read past that depth.`,
          hint: 'A setup nests only a few levels: check for runaway brackets, dashes or indentation.',
          ...at(deep.offset),
        },
      ]);
    }

    const composer = new Composer({
      uniqueKeys: true,
      // Keeps the value plain JSON: YAML 1.1 extras such as !!binary stay strings.
      resolveKnownTags: false,
    });
    let document: Document.Parsed | null = null;
    for (const composed of composer.compose(tokens, true, text.length)) {
      if (!document) document = composed;
      else {
        document.errors.push(
          new YAMLParseError(
            [composed.range[0], composed.range[1]],
            'MULTIPLE_DOCS',
            'a file holds one setup, but this one has several documents',
          ),
        );
        break;
      }
    }
    if (!document) throw new Error('the YAML composer returned no document');
    if (document.errors.length > 0) {
      return unreadable(
        lineCounter,
        document.errors.map((error) => ({ ...describeYamlError(error, text), ...at(error.pos[0]) })),
        document,
      );
    }

    if (!isMap(document.contents)) {
      const contents = document.contents as unknown;
      const start = contents && isCollection(contents) && contents.range ? contents.range[0] : 0;
      return unreadable(
        lineCounter,
        [
          {
            message: `A setup must be a mapping of keys such as format, model and channels, but ${describeRoot(contents)}.`,
            hint: 'Start the document with "format: bindery-setup/1" and the other top-level keys.',
            ...at(start),
          },
        ],
        document,
      );
    }

    let data: unknown;
    try {
      data = document.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
    } catch (error) {
      const aliasBomb = /excessive alias/i.test(String((error as Error)?.message));
      return unreadable(
        lineCounter,
        [
          {
            message: aliasBomb
              ? `The document's aliases expand to too many copies (more than ${MAX_ALIAS_COUNT}); it is not read.`
              : `The document could not be read: ${firstLine(String((error as Error)?.message ?? error))}.`,
            hint: aliasBomb
              ? 'Write the values out instead of repeating aliases.'
              : 'Check the YAML near the start of the document.',
            line: 1,
            column: 1,
          },
        ],
        document,
      );
    }
    if (containsItself(data)) {
      return unreadable(
        lineCounter,
        [
          {
            message:
              'An alias (*name) sits inside the very node its anchor (&name) marks, so the setup would never end; it is not read.',
            hint: 'Point the alias at a node outside itself, or write the values out.',
            line: 1,
            column: 1,
          },
        ],
        document,
      );
    }
    return { readable: true, data, document, lineCounter, problems: [] };
  } catch (error) {
    // The yaml package reports problems as errors on the document; anything thrown is
    // an input it could not cope with (e.g. a stack overflow), still a syntax finding.
    return unreadable(lineCounter, [
      {
        message: `The document could not be read: ${firstLine(String((error as Error)?.message ?? error))}.`,
        hint: 'Check that the text is a YAML setup document.',
        line: 1,
        column: 1,
      },
    ]);
  }
}

/** True when a value reaches itself: what an alias inside its own anchor turns into. */
function containsItself(value: unknown, open = new Set<object>()): boolean {
  if (value === null || typeof value !== 'object') return false;
  if (open.has(value)) return true;
  open.add(value);
  const children = value instanceof Map ? [...value.values()] : Object.values(value);
  const circular = children.some((child) => containsItself(child, open));
  open.delete(value);
  return circular;
}
