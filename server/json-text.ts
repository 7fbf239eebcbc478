import secureJson from "secure-json-parse";
import { duplicateNameIssues, InputIssues, jsonSyntaxErrorAt, readJsonColumns } from "../core/index.js";
import { ProblemError } from "./problems.js";

/**
 * Line and column (1-based) of a character offset, so a script author can find the mistake. A line ends at LF, CR
 * LF or a lone CR (RFC 8259 §2 allows each as whitespace; an editor counts a lone CR as a line break too).
 */
const lineAndColumn = (text: string, offset: number): string => {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code === 10 || (code === 13 && text.charCodeAt(i + 1) !== 10)) {
      line++;
      lineStart = i + 1;
    }
  }
  return `line ${line}, column ${offset - lineStart + 1}`;
};

/**
 * Parses a JSON body like Fastify's own parser (secure-json-parse, refusing `__proto__` and `constructor`
 * keys) but keeps the reason as a problem: Fastify's default parser replaces every syntax error with one
 * generic message.
 */
/** True when some object in the value has an own key `constructor` (secure-json-parse refuses only `constructor.prototype`). */
const hasConstructorKey = (value: unknown): boolean => {
  if (value === null || typeof value !== "object") return false;
  if (Array.isArray(value)) return value.some(hasConstructorKey);
  return Object.hasOwn(value, "constructor") || Object.values(value).some(hasConstructorKey);
};

/** A bare NaN or Infinity where a value stands (after `[`, `,` or `:`), which JSON does not have. */
const NON_NUMBER = /([[,:]\s*)(-?(?:NaN|Infinity))(?=\s*[,\]}])/;

const FORBIDDEN_KEY = "The JSON body contains a key named __proto__ or constructor, which is refused; remove it.";

export const parseJsonText = (text: string): unknown => {
  if (text.length === 0) throw new ProblemError("malformed-body", "The body is empty; send a JSON object (see /openapi.yaml).");
  let value: unknown;
  try {
    value = secureJson.parse(text, undefined, { protoAction: "error", constructorAction: "error" });
  } catch (error) {
    const message = (error as Error).message;
    if (/forbidden prototype property/i.test(message)) throw new ProblemError("forbidden-key", FORBIDDEN_KEY);
    // NaN and Infinity are what Python's json.dumps and some other writers put for missing or huge values.
    const nonNumber = NON_NUMBER.exec(text);
    // V8 gives the offset in some messages only ("Unexpected token ']', …" has none): the scanner finds it then.
    const given = /position (\d+)/.exec(message)?.[1];
    const position = given === undefined ? jsonSyntaxErrorAt(text) : Number(given);
    const where = position === undefined ? "" : ` (at ${lineAndColumn(text, position)})`;
    const hint = nonNumber === null ? "" : ` ${nonNumber[2]} is not a JSON number (RFC 8259 §6): write null for an absent value.`;
    throw new ProblemError("malformed-body", `The body is not valid JSON${where}: ${message}.${hint}`);
  }
  // The walk runs only when the text names the key at all, so column bodies of numbers pay one substring search.
  if (text.includes('"constructor"') && hasConstructorKey(value)) throw new ProblemError("forbidden-key", FORBIDDEN_KEY);
  // The parsed value has lost any name given twice (the last one won): the text itself is scanned, as core's reader does.
  const duplicates = duplicateNameIssues(text);
  if (duplicates.length > 0) throw new InputIssues(duplicates);
  return value;
};

/**
 * A JSON body given as bytes, with the arrays of numbers and nulls under `columnKeys` of the top-level object
 * read straight into Float64Arrays (null as NaN): core's reader (core/json-columns.ts) for what it reads, and
 * parseJsonText for what it declines, so an error or a refused key is worded exactly as before. A name given
 * twice in one object is `InputIssues` on both paths.
 */
export const parseJsonBody = (bytes: Uint8Array, columnKeys: ReadonlySet<string>): unknown =>
  readJsonColumns(bytes, columnKeys) ?? parseJsonText(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("utf8"));
