/**
 * JSON text (UTF-8 bytes) read as `JSON.parse` reads it (ECMA-262, JSON.parse; grammar of RFC 8259), except
 * that the arrays of numbers and nulls under chosen keys of the top-level object come out as Float64Arrays,
 * null as NaN. A million-sample body then costs no boxed number per value, no garbage to collect and no
 * second pass to build the columns.
 *
 * The reader is a fast path with a way out: it declines (answers undefined) whenever the text is not valid JSON,
 * or holds a key `__proto__` or `constructor`, or nests deeper than the stack allows. The caller then uses the
 * standard parser, which words the error or refuses the key. Whatever the reader does answer equals JSON.parse.
 *
 * A name given twice in one object is refused: RFC 8259 (section 4) leaves duplicates to each parser, and
 * JSON.parse would keep the last value without notice. Valid text with duplicates throws `InputIssues` naming
 * each path; `duplicateNameIssues` finds the same in text the reader declined and the standard parser accepted.
 */
import { InputIssues, MAX_LISTED_ISSUES, type InputIssue } from "./input-issues.js";

const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const COMMA = 0x2c;
const COLON = 0x3a;
const MINUS = 0x2d;
const PLUS = 0x2b;
const DOT = 0x2e;
const ZERO = 0x30;
const NINE = 0x39;
const OPEN_ARRAY = 0x5b;
const CLOSE_ARRAY = 0x5d;
const OPEN_OBJECT = 0x7b;
const CLOSE_OBJECT = 0x7d;
const LOWER_E = 0x65;
const UPPER_E = 0x45;

/** Powers of ten that are exact doubles (10^22 is the last). */
const EXACT_POWERS = Array.from({ length: 23 }, (_, k) => 10 ** k);
/** Significant digits that always form an exact double mantissa (10^15 < 2^53). */
const EXACT_DIGITS = 15;

/** Thrown inside the reader; never leaves it. */
class Decline extends Error {}
const DECLINE = new Decline();

const LATIN1 = new TextDecoder("latin1");
const UTF8 = new TextDecoder("utf-8");

/** Steps of a path kept at each end when it is longer than twice this (deep nesting). */
const PATH_END_STEPS = 8;

/** A path as the request's fields are named: `units.slowness`, `zones[2].top`; other names as JSON strings. */
const pathText = (path: readonly (string | number)[]): string => {
  const step = (part: string | number, i: number) => {
    if (typeof part === "number") return `[${part}]`;
    const name = /^[A-Za-z_][A-Za-z0-9_]*$/.test(part) ? part : JSON.stringify(part);
    return i === 0 ? name : `.${name}`;
  };
  if (path.length <= 2 * PATH_END_STEPS) return path.map(step).join("");
  const head = path.slice(0, PATH_END_STEPS).map(step).join("");
  const tail = path.slice(-PATH_END_STEPS).map((part, i) => step(part, i + 1)).join("");
  return `${head}…(${path.length - 2 * PATH_END_STEPS} levels)…${tail}`;
};

/** The issue of a name given twice, once per object and name, up to MAX_LISTED_ISSUES. */
const addDuplicate = (issues: InputIssue[], path: readonly (string | number)[], name: string): void => {
  const field = pathText([...path, name]);
  if (issues.length >= MAX_LISTED_ISSUES || issues.some((issue) => issue.field === field)) return;
  issues.push({ field, message: `the name ${JSON.stringify(name)} is given more than once in one object; send each name once` });
};

class Reader {
  pos = 0;
  /** Key or index of each open object or array, for the path of a duplicate name. */
  readonly trail: (string | number)[] = [];
  readonly duplicates: InputIssue[] = [];

  constructor(
    private readonly bytes: Uint8Array,
    private readonly columnKeys: ReadonlySet<string>,
  ) {}

  skipSpace(): void {
    const bytes = this.bytes;
    let pos = this.pos;
    for (;;) {
      const byte = bytes[pos];
      // Space, tab, line feed and carriage return only (RFC 8259, section 2).
      if (byte === 0x20 || byte === 0x0a || byte === 0x0d || byte === 0x09) pos++;
      else break;
    }
    this.pos = pos;
  }

  expect(byte: number): void {
    if (this.bytes[this.pos] !== byte) throw DECLINE;
    this.pos++;
  }

  literal(text: string, value: unknown): unknown {
    for (let i = 0; i < text.length; i++) if (this.bytes[this.pos + i] !== text.charCodeAt(i)) throw DECLINE;
    this.pos += text.length;
    return value;
  }

  value(depth: number): unknown {
    this.skipSpace();
    const byte = this.bytes[this.pos];
    switch (byte) {
      case OPEN_OBJECT:
        return this.object(depth);
      case OPEN_ARRAY:
        return this.array(depth);
      case QUOTE:
        return this.string();
      case 0x74:
        return this.literal("true", true);
      case 0x66:
        return this.literal("false", false);
      case 0x6e:
        return this.literal("null", null);
      default:
        if (byte === MINUS || (byte >= ZERO && byte <= NINE)) return this.number();
        throw DECLINE;
    }
  }

  object(depth: number): Record<string, unknown> {
    this.pos++;
    const result: Record<string, unknown> = {};
    this.skipSpace();
    if (this.bytes[this.pos] === CLOSE_OBJECT) {
      this.pos++;
      return result;
    }
    for (;;) {
      this.skipSpace();
      if (this.bytes[this.pos] !== QUOTE) throw DECLINE;
      const key = this.string();
      // JSON.parse makes these own data properties; an assignment would not. The standard parser refuses them.
      if (key === "__proto__" || key === "constructor") throw DECLINE;
      // One check per member, none per array element: a million-sample column pays nothing.
      if (Object.hasOwn(result, key)) addDuplicate(this.duplicates, this.trail.slice(0, depth), key);
      this.trail[depth] = key;
      this.skipSpace();
      this.expect(COLON);
      this.skipSpace();
      const column = depth === 0 && this.bytes[this.pos] === OPEN_ARRAY && this.columnKeys.has(key) ? this.column() : undefined;
      result[key] = column ?? this.value(depth + 1);
      this.skipSpace();
      const next = this.bytes[this.pos++];
      if (next === CLOSE_OBJECT) return result;
      if (next !== COMMA) throw DECLINE;
    }
  }

  array(depth: number): unknown[] {
    this.pos++;
    const result: unknown[] = [];
    this.skipSpace();
    if (this.bytes[this.pos] === CLOSE_ARRAY) {
      this.pos++;
      return result;
    }
    for (;;) {
      this.trail[depth] = result.length;
      result.push(this.value(depth + 1));
      this.skipSpace();
      const next = this.bytes[this.pos++];
      if (next === CLOSE_ARRAY) return result;
      if (next !== COMMA) throw DECLINE;
    }
  }

  /**
   * An array of numbers and nulls as a Float64Array; undefined (the position unmoved) when an element is
   * anything else, so the array is read again as a plain array and the caller names the element.
   */
  column(): Float64Array | undefined {
    const bytes = this.bytes;
    const start = this.pos;
    this.pos++;
    let values = new Float64Array(1024);
    let count = 0;
    this.skipSpace();
    if (bytes[this.pos] === CLOSE_ARRAY) {
      this.pos++;
      return new Float64Array(0);
    }
    for (;;) {
      this.skipSpace();
      const byte = bytes[this.pos];
      let value: number;
      if (byte === MINUS || (byte >= ZERO && byte <= NINE)) value = this.number();
      else if (byte === 0x6e) value = this.literal("null", NaN) as number;
      else {
        this.pos = start;
        return undefined;
      }
      if (count === values.length) {
        const larger = new Float64Array(values.length * 2);
        larger.set(values);
        values = larger;
      }
      values[count++] = value;
      this.skipSpace();
      const next = bytes[this.pos++];
      if (next === CLOSE_ARRAY) return values.slice(0, count);
      if (next !== COMMA) throw DECLINE;
    }
  }

  /**
   * A JSON number. Up to 15 significant digits and a decimal exponent within ±22, the digits and the power of ten
   * are exact doubles, so one multiplication or division rounds correctly (Clinger's fast path, "How to read
   * floating point numbers accurately", PLDI 1990): the value JSON.parse gives. Anything else is read by Number().
   */
  number(): number {
    const bytes = this.bytes;
    const start = this.pos;
    let pos = start;
    const negative = bytes[pos] === MINUS;
    if (negative) pos++;
    let mantissa = 0;
    let digits = 0;
    let scale = 0;
    let byte = bytes[pos];
    if (byte === ZERO) {
      pos++;
    } else if (byte >= ZERO + 1 && byte <= NINE) {
      for (; (byte = bytes[pos]) >= ZERO && byte <= NINE; pos++) {
        mantissa = mantissa * 10 + (byte - ZERO);
        digits++;
      }
    } else throw DECLINE;
    if (bytes[pos] === DOT) {
      pos++;
      const first = pos;
      for (; (byte = bytes[pos]) >= ZERO && byte <= NINE; pos++) {
        // Leading zeros of the fraction (0.00123) are not significant digits.
        if (digits > 0 || byte !== ZERO) digits++;
        mantissa = mantissa * 10 + (byte - ZERO);
        scale++;
      }
      if (pos === first) throw DECLINE;
    }
    let exponent = 0;
    byte = bytes[pos];
    if (byte === LOWER_E || byte === UPPER_E) {
      pos++;
      let sign = 1;
      if (bytes[pos] === MINUS || bytes[pos] === PLUS) sign = bytes[pos++] === MINUS ? -1 : 1;
      const first = pos;
      // Capped: any exponent this large sends the number to Number(), which reads the text itself.
      for (; (byte = bytes[pos]) >= ZERO && byte <= NINE; pos++) if (exponent < 1e6) exponent = exponent * 10 + (byte - ZERO);
      if (pos === first) throw DECLINE;
      exponent *= sign;
    }
    this.pos = pos;
    const power = exponent - scale;
    let magnitude: number;
    if (digits <= EXACT_DIGITS && power >= -22 && power <= 22) {
      magnitude = power < 0 ? mantissa / EXACT_POWERS[-power] : mantissa * EXACT_POWERS[power];
    } else {
      return Number(LATIN1.decode(bytes.subarray(start, pos)));
    }
    return negative ? -magnitude : magnitude;
  }

  /** A string: ASCII without escapes is copied as it is; anything else is decoded and read by JSON.parse. */
  string(): string {
    const bytes = this.bytes;
    const start = this.pos;
    let pos = start + 1;
    let plain = true;
    for (;;) {
      const byte = bytes[pos];
      if (byte === QUOTE) break;
      if (byte === undefined || byte < 0x20) throw DECLINE;
      if (byte === BACKSLASH) {
        plain = false;
        pos += 2;
        continue;
      }
      if (byte >= 0x80) plain = false;
      pos++;
    }
    this.pos = pos + 1;
    if (plain) return LATIN1.decode(bytes.subarray(start + 1, pos));
    // Decoding from quote to quote gives the text that decoding the whole body would (quotes are ASCII, so no
    // UTF-8 sequence spans them); JSON.parse then reads its escapes, or refuses a bad one.
    try {
      return JSON.parse(UTF8.decode(bytes.subarray(start, pos + 1))) as string;
    } catch {
      throw DECLINE;
    }
  }
}

/**
 * `JSON.parse` of the UTF-8 text in `bytes`, with the arrays of numbers and nulls under `columnKeys` of the
 * top-level object as Float64Arrays (NaN for null); undefined when the reader declines (see above). Throws
 * `InputIssues` when the text is valid JSON with a name given twice in one object.
 */
export const readJsonColumns = (bytes: Uint8Array, columnKeys: ReadonlySet<string>): unknown => {
  const reader = new Reader(bytes, columnKeys);
  let value: unknown;
  try {
    value = reader.value(0);
    reader.skipSpace();
  } catch (error) {
    // Declined, or the stack ran out on deep nesting (RangeError): the standard parser takes over.
    if (error instanceof Decline || error instanceof RangeError) return undefined;
    throw error;
  }
  if (reader.pos !== bytes.length) return undefined;
  // Only once the whole text is known valid: a syntax error is reported before a duplicate, on either path.
  if (reader.duplicates.length > 0) throw new InputIssues(reader.duplicates);
  return value;
};

/**
 * Names given twice in one object of `text`, which must be valid JSON (JSON.parse has accepted it), as the issues
 * readJsonColumns throws. One pass without recursion, so any depth the standard parser reads is scanned too.
 */
export const duplicateNameIssues = (text: string): InputIssue[] => {
  const issues: InputIssue[] = [];
  // Per open container: the names seen (an object) or undefined (an array); its path step in `trail`.
  const names: (Set<string> | undefined)[] = [];
  const trail: (string | number)[] = [];
  let expectName = false;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === QUOTE) {
      const start = i;
      let escaped = false;
      for (i++; text.charCodeAt(i) !== QUOTE; i++) {
        if (text.charCodeAt(i) === BACKSLASH) {
          escaped = true;
          i++;
        }
      }
      if (!expectName) continue;
      expectName = false;
      const name = escaped ? (JSON.parse(text.slice(start, i + 1)) as string) : text.slice(start + 1, i);
      const seen = names[names.length - 1] as Set<string>;
      if (seen.has(name)) addDuplicate(issues, trail.slice(0, names.length - 1), name);
      seen.add(name);
      trail[names.length - 1] = name;
    } else if (code === OPEN_OBJECT) {
      names.push(new Set());
      expectName = true;
    } else if (code === OPEN_ARRAY) {
      names.push(undefined);
      trail[names.length - 1] = 0;
    } else if (code === CLOSE_OBJECT || code === CLOSE_ARRAY) {
      names.pop();
      expectName = false;
    } else if (code === COMMA) {
      if (names[names.length - 1] === undefined) (trail[names.length - 1] as number)++;
      else expectName = true;
    }
  }
  return issues;
};
