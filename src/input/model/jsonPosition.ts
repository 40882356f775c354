/**
 * Where a JSON text goes wrong, as line and column, with a message in plain words.
 *
 * JSON.parse does the parsing; when it fails, this small scanner (RFC 8259 grammar) walks the text to the
 * first offending character, because the engine's own message does not always carry a position.
 * Every loop advances through the text, so the scan ends.
 */

export interface JsonSyntaxProblem {
  /** 1-based */
  readonly line: number;
  /** 1-based, in characters */
  readonly column: number;
  readonly message: string;
}

class Stop extends Error {
  constructor(
    readonly offset: number,
    readonly problem: string,
  ) {
    super(problem);
  }
}

export function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lineStart = 0;
  const end = Math.min(offset, text.length);
  for (let i = 0; i < end; i++) {
    if (text[i] === '\n') {
      line++;
      lineStart = i + 1;
    }
  }
  return { line, column: end - lineStart + 1 };
}

/** The first syntax problem of `text`, or undefined when it is valid JSON. */
export function findJsonSyntaxProblem(text: string): JsonSyntaxProblem | undefined {
  let i = 0;
  const describe = (at: number) => (at >= text.length ? 'the end of the file' : JSON.stringify(text[at]));
  const space = () => {
    while (i < text.length && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  // the usual slips from JavaScript and spreadsheets, told with their fix
  const hint = (at: number): string =>
    /^-?(?:NaN|Infinity)/.test(text.slice(at, at + 9))
      ? ' (NaN and Infinity are not numbers in JSON: give a finite number)'
      : text[at] === '/'
        ? ' (JSON has no comments: put notes in "description")'
        : '';
  const fail = (what: string): never => {
    throw new Stop(i, `expected ${what}, found ${describe(i)}${hint(i)}`);
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) i += word.length;
    else fail('a value (a number, text in double quotes, true, false, null, [ or {)');
  };
  const string = () => {
    i++; // opening quote
    while (i < text.length) {
      const c = text[i]!;
      if (c === '"') {
        i++;
        return;
      }
      if (c === '\\') {
        const e = text[i + 1];
        if (e !== undefined && '"\\/bfnrt'.includes(e)) i += 2;
        else if (e === 'u' && /^[0-9a-fA-F]{4}$/.test(text.slice(i + 2, i + 6))) i += 6;
        else {
          i++;
          fail('an escape (\\" \\\\ \\/ \\b \\f \\n \\r \\t or \\uXXXX)');
        }
        continue;
      }
      if (c < ' ') throw new Stop(i, 'a line break or control character inside text; close the quote or escape it');
      i++;
    }
    throw new Stop(i, 'the file ends inside text; a closing double quote is missing');
  };
  const number = () => {
    const match = /^-?(0|[1-9][0-9]*)(\.[0-9]+)?([eE][+-]?[0-9]+)?/.exec(text.slice(i, i + 400));
    if (match === null || match[0].length === 0 || match[0] === '-') fail('a number');
    i += match![0].length;
  };
  const value = (depth: number): void => {
    if (depth > 512) throw new Stop(i, 'nesting deeper than 512 levels');
    space();
    const c = text[i];
    if (c === '{') {
      i++;
      space();
      if (text[i] === '}') {
        i++;
        return;
      }
      for (;;) {
        space();
        if (text[i] !== '"') fail('a key in double quotes');
        string();
        space();
        if (text[i] !== ':') fail('":" after the key');
        i++;
        value(depth + 1);
        space();
        if (text[i] === ',') {
          i++;
          space();
          if (text[i] === '}') fail('another key after "," (a trailing comma is not allowed)');
          continue;
        }
        if (text[i] === '}') {
          i++;
          return;
        }
        fail('"," or "}"');
      }
    }
    if (c === '[') {
      i++;
      space();
      if (text[i] === ']') {
        i++;
        return;
      }
      for (;;) {
        value(depth + 1);
        space();
        if (text[i] === ',') {
          i++;
          space();
          if (text[i] === ']') fail('another value after "," (a trailing comma is not allowed)');
          continue;
        }
        if (text[i] === ']') {
          i++;
          return;
        }
        fail('"," or "]"');
      }
    }
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    if (c === '-' || (c !== undefined && c >= '0' && c <= '9')) return number();
    fail('a value (a number, text in double quotes, true, false, null, [ or {)');
  };
  try {
    value(0);
    space();
    if (i < text.length) fail('the end of the file after the value');
    return undefined;
  } catch (error) {
    if (!(error instanceof Stop)) throw error;
    return { ...lineColumn(text, error.offset), message: error.problem };
  }
}
