/**
 * Where a JSON text goes wrong, for an error message that names the place: V8's JSON.parse gives the offset in
 * some of its messages and not in others ("Unexpected token ']', …"). The grammar is RFC 8259's (sections 2 to 7),
 * which JSON.parse follows (ECMA-262, JSON.parse); like JSON.parse, a string may hold a lone surrogate.
 */

const TAB = 0x09;
const LF = 0x0a;
const CR = 0x0d;
const SPACE = 0x20;
const QUOTE = 0x22;
const PLUS = 0x2b;
const COMMA = 0x2c;
const MINUS = 0x2d;
const DOT = 0x2e;
const ZERO = 0x30;
const NINE = 0x39;
const COLON = 0x3a;
const OPEN_ARRAY = 0x5b;
const BACKSLASH = 0x5c;
const CLOSE_ARRAY = 0x5d;
const OPEN_OBJECT = 0x7b;
const CLOSE_OBJECT = 0x7d;

/** What may come next. */
const VALUE = 0;
/** A value, or `]` right after `[`. */
const VALUE_OR_CLOSE_ARRAY = 1;
/** A member name, or `}` right after `{`. */
const NAME_OR_CLOSE_OBJECT = 2;
const NAME = 3;
const NAME_SEPARATOR = 4;
/** `,` or the close of the open container; the end of the text when none is open. */
const AFTER_VALUE = 5;

const IN_OBJECT = 0;
const IN_ARRAY = 1;

/** The characters a backslash may escape besides `u` (RFC 8259 section 7): `"` `\` `/` b f n r t. */
const SIMPLE_ESCAPES = new Set([QUOTE, BACKSLASH, 0x2f, 0x62, 0x66, 0x6e, 0x72, 0x74]);

const isDigit = (code: number): boolean => code >= ZERO && code <= NINE;
const isHexDigit = (code: number): boolean => isDigit(code) || (code >= 0x41 && code <= 0x46) || (code >= 0x61 && code <= 0x66);
/** Space, tab, line feed and carriage return, and nothing else (RFC 8259 section 2). */
const isSpace = (code: number): boolean => code === SPACE || code === LF || code === CR || code === TAB;

/**
 * A scan's result: the offset just after what was read when it was read whole, or the offset of the offending
 * character encoded as `-1 - offset` (the text's length when the text ended inside it).
 */
type Scan = number;
const failAt = (offset: number): Scan => -1 - offset;

/** A string from its opening quote at `start` (RFC 8259 section 7). */
const scanString = (text: string, start: number): Scan => {
  const end = text.length;
  let i = start + 1;
  for (;;) {
    if (i === end) return failAt(end);
    const code = text.charCodeAt(i);
    if (code === QUOTE) return i + 1;
    if (code < SPACE) return failAt(i);
    i++;
    if (code !== BACKSLASH) continue;
    if (i === end) return failAt(end);
    const escaped = text.charCodeAt(i++);
    if (SIMPLE_ESCAPES.has(escaped)) continue;
    if (escaped !== 0x75) return failAt(i - 1);
    for (let k = 0; k < 4; k++, i++) {
      if (i === end) return failAt(end);
      if (!isHexDigit(text.charCodeAt(i))) return failAt(i);
    }
  }
};

/** Digits from `i`, at least one (the place of the first non-digit is the error otherwise). */
const scanDigits = (text: string, i: number): Scan => {
  if (i === text.length) return failAt(i);
  if (!isDigit(text.charCodeAt(i))) return failAt(i);
  let j = i + 1;
  while (j < text.length && isDigit(text.charCodeAt(j))) j++;
  return j;
};

/** A number from its first character at `start` (RFC 8259 section 6): `-`? int frac? exp?, no leading zero. */
const scanNumber = (text: string, start: number): Scan => {
  let i = start;
  if (text.charCodeAt(i) === MINUS) i++;
  if (i === text.length) return failAt(i);
  if (text.charCodeAt(i) === ZERO) i++;
  else {
    i = scanDigits(text, i);
    if (i < 0) return i;
  }
  if (text.charCodeAt(i) === DOT) {
    i = scanDigits(text, i + 1);
    if (i < 0) return i;
  }
  const code = text.charCodeAt(i);
  if (code === 0x65 || code === 0x45) {
    i++;
    const sign = text.charCodeAt(i);
    if (sign === PLUS || sign === MINUS) i++;
    i = scanDigits(text, i);
  }
  return i;
};

/** `true`, `false` or `null` from `start`, whose first letter has chosen `word`. */
const scanWord = (text: string, start: number, word: string): Scan => {
  for (let k = 0; k < word.length; k++) {
    const i = start + k;
    if (i === text.length) return failAt(i);
    if (text.charCodeAt(i) !== word.charCodeAt(k)) return failAt(i);
  }
  return start + word.length;
};

/** A string, number or literal from `i`; undefined when none of them can begin there. */
const scanValueStart = (text: string, i: number, code: number): Scan | undefined => {
  if (code === QUOTE) return scanString(text, i);
  if (code === MINUS || isDigit(code)) return scanNumber(text, i);
  if (code === 0x74) return scanWord(text, i, "true");
  if (code === 0x66) return scanWord(text, i, "false");
  if (code === 0x6e) return scanWord(text, i, "null");
  return undefined;
};

/**
 * The offset of the first character of `text` that no JSON text could have at that place, or `text.length` when
 * the text ends before its value does; undefined when the whole text is one JSON value (with white space around
 * it), which is exactly when JSON.parse accepts it. One pass, no recursion (any depth of nesting), linear time.
 */
export const jsonSyntaxErrorAt = (text: string): number | undefined => {
  const end = text.length;
  /** The open containers, innermost last. */
  const open: number[] = [];
  let expecting = VALUE;
  let i = 0;
  for (;;) {
    while (i < end && isSpace(text.charCodeAt(i))) i++;
    if (expecting === AFTER_VALUE && open.length === 0) return i === end ? undefined : i;
    if (i === end) return end;
    const code = text.charCodeAt(i);
    switch (expecting) {
      case VALUE_OR_CLOSE_ARRAY:
      case VALUE: {
        if (code === CLOSE_ARRAY && expecting === VALUE_OR_CLOSE_ARRAY) {
          open.pop();
          i++;
          expecting = AFTER_VALUE;
        } else if (code === OPEN_ARRAY) {
          open.push(IN_ARRAY);
          i++;
          expecting = VALUE_OR_CLOSE_ARRAY;
        } else if (code === OPEN_OBJECT) {
          open.push(IN_OBJECT);
          i++;
          expecting = NAME_OR_CLOSE_OBJECT;
        } else {
          const next = scanValueStart(text, i, code);
          if (next === undefined) return i;
          if (next < 0) return -1 - next;
          i = next;
          expecting = AFTER_VALUE;
        }
        break;
      }
      case NAME_OR_CLOSE_OBJECT:
      case NAME: {
        if (code === CLOSE_OBJECT && expecting === NAME_OR_CLOSE_OBJECT) {
          open.pop();
          i++;
          expecting = AFTER_VALUE;
          break;
        }
        if (code !== QUOTE) return i;
        const next = scanString(text, i);
        if (next < 0) return -1 - next;
        i = next;
        expecting = NAME_SEPARATOR;
        break;
      }
      case NAME_SEPARATOR: {
        if (code !== COLON) return i;
        i++;
        expecting = VALUE;
        break;
      }
      default: {
        const inArray = open[open.length - 1] === IN_ARRAY;
        if (code === COMMA) expecting = inArray ? VALUE : NAME;
        else if (code === (inArray ? CLOSE_ARRAY : CLOSE_OBJECT)) open.pop();
        else return i;
        i++;
      }
    }
  }
};
