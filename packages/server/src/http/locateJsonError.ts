/** Where a JSON text first breaks: 0-based character offset, 1-based line and column. */
export interface JsonErrorLocation {
  position: number;
  line: number;
  column: number;
}

/**
 * Finds the first syntax error of a JSON text (RFC 8259 grammar), or null when it parses.
 * The built-in parser's message names a position for some errors only ("Unexpected token 'x',
 * "…" is not valid JSON" names none), and a client fixing a request needs the place.
 */
export function locateJsonError(text: string): JsonErrorLocation | null {
  let i = 0;
  const ws = (): void => {
    while (i < text.length && ' \t\n\r'.includes(text[i]!)) i++;
  };
  const fail = (): never => {
    throw i;
  };
  const literal = (word: string): void => {
    for (const ch of word) {
      if (text[i] !== ch) fail();
      i++;
    }
  };
  const string = (): void => {
    i++; // opening quote
    while (i < text.length) {
      const ch = text[i]!;
      if (ch === '"') return void i++;
      if (ch < ' ') fail();
      if (ch === '\\') {
        i++;
        const e = text[i];
        if (e === 'u') {
          for (let k = 1; k <= 4; k++) {
            if (!/[0-9a-fA-F]/.test(text[i + k] ?? '')) {
              i += k;
              fail();
            }
          }
          i += 5;
        } else if (e !== undefined && '"\\/bfnrt'.includes(e)) i++;
        else fail();
      } else i++;
    }
    fail();
  };
  const number = (): void => {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i));
    if (!m || m[0] === '-' || m[0] === '') fail();
    i += m![0].length;
  };
  const value = (depth: number): void => {
    if (depth > 2_000) fail(); // deeper than any real request; keeps the scan off the stack limit
    ws();
    const ch = text[i];
    if (ch === '{') {
      i++;
      ws();
      if (text[i] === '}') return void i++;
      for (;;) {
        ws();
        if (text[i] !== '"') fail();
        string();
        ws();
        if (text[i] !== ':') fail();
        i++;
        value(depth + 1);
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === '}') return void i++;
        else fail();
      }
    } else if (ch === '[') {
      i++;
      ws();
      if (text[i] === ']') return void i++;
      for (;;) {
        value(depth + 1);
        ws();
        if (text[i] === ',') i++;
        else if (text[i] === ']') return void i++;
        else fail();
      }
    } else if (ch === '"') string();
    else if (ch === 't') literal('true');
    else if (ch === 'f') literal('false');
    else if (ch === 'n') literal('null');
    else if (ch === '-' || (ch !== undefined && ch >= '0' && ch <= '9')) number();
    else fail();
  };
  try {
    value(0);
    ws();
    if (i < text.length) fail();
    return null;
  } catch (at) {
    if (at instanceof RangeError) return null; // call stack exhausted: no position to report
    if (typeof at !== 'number') throw at;
    const before = text.slice(0, at);
    const line = before.split('\n').length;
    return { position: at, line, column: at - before.lastIndexOf('\n') };
  }
}
