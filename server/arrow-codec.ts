import {
  Field,
  Float64,
  makeData,
  MessageHeader,
  Precision,
  RecordBatch,
  RecordBatchStreamWriter,
  AsyncByteQueue,
  Schema,
  Struct,
  Table,
  tableFromIPC,
  Type,
  Uint32,
  util,
  DataType,
  type Data,
} from "apache-arrow";
import {
  FLAG_CODES,
  InputIssues,
  MAX_LISTED_ISSUES,
  severityOf,
  summariseFlags,
  type DepthUnit,
  type ElasticLog,
  type ElasticLogRequest,
  type FlagSummary,
  type InputIssue,
} from "../core/index.js";
import type { UnitsChosen } from "./elastic-answer.js";
import { OUTPUT_PROPERTIES } from "./output-properties.js";
import { elasticColumnFields } from "./schemas/elastic.js";
import { fromPlausibilityLimits } from "./schemas/limits.js";
import { SERVICE_VERSION } from "./version.js";

/** IANA media type of the Arrow IPC streaming format. */
export const ARROW_STREAM_MEDIA_TYPE = "application/vnd.apache.arrow.stream";

/** Columns an Arrow body may carry: the column fields of the JSON body of `POST /v1/elastic`, from its schema. */
export const ARROW_INPUT_COLUMNS: readonly string[] = [...elasticColumnFields];

export interface ArrowColumns {
  /** Rows of every column. */
  samples: number;
  /**
   * The columns present, as float64 with NaN where Arrow held a null. A float64 column of a single
   * record batch without nulls is a view on the decoded bytes (zero copy): do not reuse those bytes meanwhile.
   */
  columns: Partial<Record<string, Float64Array>>;
}

const ACCEPTED_TYPES = "float64 (or float32, float16, a signed or unsigned integer, or null)";
const MAX_EXACT_INTEGER = 2 ** 53;

const hasPrecision = (type: DataType, precision: Precision): boolean => DataType.isFloat(type) && type.precision === precision;

const isAccepted = (type: DataType): boolean =>
  type.typeId === Type.Float || type.typeId === Type.Int || type.typeId === Type.Null;


/** Every issue with the column names and types; an empty list when all can be read. */
const schemaIssues = (fields: readonly Field[]): InputIssue[] => {
  const issues: InputIssue[] = [];
  const seen = new Set<string>();
  for (const field of fields) {
    if (!elasticColumnFields.has(field.name)) {
      issues.push({ field: field.name, message: `is not a column of this request; the columns are ${ARROW_INPUT_COLUMNS.join(", ")}` });
    } else if (seen.has(field.name)) {
      issues.push({ field: field.name, message: "is given twice; give each column once" });
    } else if (!isAccepted(field.type)) {
      issues.push({ field: field.name, message: `has the Arrow type ${String(field.type)}; expected ${ACCEPTED_TYPES}` });
    }
    seen.add(field.name);
  }
  return issues;
};

/** 64-bit integers are read only when a double holds them exactly (|v| < 2^53 always does). */
const copyWideIntegers = (values: BigInt64Array | BigUint64Array, target: Float64Array, at: number, name: string, issues: InputIssue[]) => {
  for (let i = 0; i < values.length; i++) {
    const value = Number(values[i]);
    target[at + i] = value;
    if (Math.abs(value) >= MAX_EXACT_INTEGER && BigInt(value) !== values[i] && issues.length < MAX_LISTED_ISSUES) {
      issues.push({ field: name, index: at + i, message: `the integer ${values[i]} has no exact 64-bit float; send it as float64` });
    }
  }
};

/** Writes one record batch's chunk of a column into `target` from row `at`, exactly, nulls as NaN. */
const copyChunk = (chunk: Data, target: Float64Array, at: number, name: string, issues: InputIssue[]) => {
  const end = at + chunk.length;
  if (chunk.type.typeId === Type.Null) {
    target.fill(NaN, at, end);
    return;
  }
  const values = chunk.values.subarray(chunk.offset, chunk.offset + chunk.length);
  if (values instanceof BigInt64Array || values instanceof BigUint64Array) copyWideIntegers(values, target, at, name, issues);
  else if (hasPrecision(chunk.type, Precision.HALF)) {
    for (let i = 0; i < values.length; i++) target[at + i] = util.uint16ToFloat64(values[i]);
  } else target.set(values, at);
  if (chunk.nullCount > 0) {
    const bitmap = chunk.nullBitmap as Uint8Array;
    for (let i = 0; i < chunk.length; i++) {
      const bit = chunk.offset + i;
      if ((bitmap[bit >> 3] & (1 << (bit & 7))) === 0) target[at + i] = NaN;
    }
  }
};

const isPlainFloat64 = (chunk: Data): boolean => hasPrecision(chunk.type, Precision.DOUBLE) && chunk.nullCount === 0;

const readColumn = (chunks: readonly Data[], samples: number, name: string, issues: InputIssue[]): Float64Array => {
  if (chunks.length === 1 && isPlainFloat64(chunks[0])) {
    const only = chunks[0];
    return (only.values as Float64Array).subarray(only.offset, only.offset + only.length);
  }
  const column = new Float64Array(samples);
  let at = 0;
  for (const chunk of chunks) {
    copyChunk(chunk, column, at, name, issues);
    at += chunk.length;
  }
  return column;
};

const malformed = (message: string) => new InputIssues([{ field: "body", message }]);

const WHAT_TO_SEND = `send the columns as one Arrow IPC stream (${ARROW_STREAM_MEDIA_TYPE}) and nothing after it`;

/** "ARROW1", the first and last bytes of the Arrow IPC file format (Apache Arrow columnar format, "IPC File Format"). */
const FILE_MAGIC = [0x41, 0x52, 0x52, 0x4f, 0x57, 0x31];
const hasMagicAt = (bytes: Uint8Array, at: number) => at >= 0 && FILE_MAGIC.every((byte, i) => bytes[at + i] === byte);

/** Up to eight bytes from `at` in hex, to say what was found. */
const bytesAt = (bytes: Uint8Array, at: number): string => {
  const shown = Array.from(bytes.subarray(at, at + 8), (byte) => byte.toString(16).padStart(2, "0")).join(" ");
  return bytes.length - at > 8 ? `${shown} …` : shown;
};

/**
 * The header type and body length of a flatbuffer `Message` (Arrow's Message.fbs: field 1 header_type, ubyte;
 * field 3 bodyLength, long) in `length` bytes from `start`, every read bounds-checked; undefined when the bytes
 * are not such a table. Read here, not by the library's decoder, which also walks the custom metadata: this check
 * reads bytes after the stream too, where a forged metadata count would keep that decoder looping.
 */
const messageFields = (view: DataView, start: number, length: number): { header: number; body: number } | undefined => {
  const end = start + length;
  const fits = (at: number, size: number) => at >= start && at + size <= end;
  if (!fits(start, 4)) return undefined;
  const table = start + view.getUint32(start, true);
  if (!fits(table, 4)) return undefined;
  const vtable = table - view.getInt32(table, true);
  if (!fits(vtable, 4)) return undefined;
  const vtableSize = view.getUint16(vtable, true);
  if (!fits(vtable, vtableSize)) return undefined;
  const field = (id: number, size: number): number | undefined => {
    const slot = 4 + 2 * id;
    const offset = slot + 2 <= vtableSize ? view.getUint16(vtable + slot, true) : 0;
    if (offset === 0) return -1;
    return fits(table + offset, size) ? table + offset : undefined;
  };
  const headerAt = field(1, 1);
  const bodyAt = field(3, 8);
  if (headerAt === undefined || bodyAt === undefined) return undefined;
  return { header: headerAt < 0 ? MessageHeader.NONE : view.getUint8(headerAt), body: bodyAt < 0 ? 0 : Number(view.getBigInt64(bodyAt, true)) };
};

/** One encapsulated message at a position: its end, the end-of-stream marker, a cut-short message or foreign bytes. */
type Framed =
  | { kind: "message"; next: number; header: MessageHeader }
  | { kind: "end"; next: number }
  | { kind: "short"; needed: number }
  | { kind: "foreign" };

/**
 * Reads the frame of the message at `at` (Apache Arrow columnar format, "Encapsulated message format"): the
 * continuation 0xFFFFFFFF, an int32 metadata length, the flatbuffer Message, then its body of bodyLength bytes.
 * Streams older than format 1.0 start a message with the length itself. A length of 0 is the end-of-stream marker.
 */
const frameAt = (bytes: Uint8Array, view: DataView, at: number): Framed => {
  const left = bytes.length - at;
  if (left < 4) return { kind: "short", needed: 4 };
  const continued = view.getInt32(at, true) === -1;
  if (continued && left < 8) return { kind: "short", needed: 8 };
  const prefix = continued ? 8 : 4;
  const length = view.getInt32(at + prefix - 4, true);
  if (length === 0) return { kind: "end", next: at + prefix };
  if (length < 0 || (!continued && length > left - prefix)) return { kind: "foreign" };
  if (length > left - prefix) return { kind: "short", needed: prefix + length };
  const fields = messageFields(view, at + prefix, length);
  if (fields === undefined || !Number.isSafeInteger(fields.body) || fields.body < 0) return { kind: "foreign" };
  const { header, body } = fields;
  if (header !== MessageHeader.Schema && header !== MessageHeader.RecordBatch && header !== MessageHeader.DictionaryBatch) return { kind: "foreign" };
  if (body > left - prefix - length) return { kind: "short", needed: prefix + length + body };
  return { kind: "message", next: at + prefix + length + body, header };
};

/**
 * Checks that the body is exactly one IPC stream (Apache Arrow columnar format, "IPC Streaming Format": a schema
 * message, then dictionary and record batch messages, optionally ended by the end-of-stream marker), and says
 * plainly what else it found: not Arrow at all, a stream cut short, a second stream, or bytes after the stream.
 */
const checkStreamFrame = (bytes: Uint8Array): void => {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let at = 0;
  for (let messages = 0; at < bytes.length; messages++) {
    const frame = frameAt(bytes, view, at);
    if (frame.kind === "end") {
      at = frame.next;
      break;
    }
    // A body that does not begin with a schema message is not Arrow, unless it began as one (0xFFFFFFFF) and was cut short.
    const schemaFirst = frame.kind === "message" ? frame.header === MessageHeader.Schema : frame.kind === "short" && bytes.length >= 4 && view.getInt32(0, true) === -1;
    if (messages === 0 && !schemaFirst) {
      const first = bytes.find((byte) => byte !== 0x20 && byte !== 0x0a && byte !== 0x0d && byte !== 0x09);
      const looks = first === 0x7b || first === 0x5b ? "it looks like JSON text (send JSON with Content-Type: application/json)" : `it begins with the bytes ${bytesAt(bytes, 0)}`;
      throw malformed(`the body is not an Arrow IPC stream: it does not begin with an Arrow schema message, ${looks}; ${WHAT_TO_SEND}`);
    }
    if (frame.kind === "short") {
      throw malformed(
        `the body is not a whole Arrow IPC stream: it ends inside message ${messages + 1}, which starts at byte ${at} and needs ${frame.needed} bytes where ${bytes.length - at} remain; it was cut short: send the whole stream`,
      );
    }
    if (frame.kind === "foreign") {
      throw malformed(
        `the body is not a readable Arrow IPC stream: after ${messages} message${messages === 1 ? "" : "s"}, the bytes from byte ${at} (${bytesAt(bytes, at)}) are not an Arrow IPC message; ${WHAT_TO_SEND}`,
      );
    }
    if (messages > 0 && frame.header === MessageHeader.Schema) break;
    at = frame.next;
  }
  if (at === bytes.length) return;
  const second = frameAt(bytes, view, at);
  if (second.kind === "message" && second.header === MessageHeader.Schema) {
    throw malformed(
      `the body holds a second Arrow IPC stream from byte ${at}, after the end of the first; only one stream is read per request: write all record batches into one stream under one schema, and send it alone`,
    );
  }
  throw malformed(`the body has ${bytes.length - at} bytes after the end of its Arrow IPC stream, from byte ${at} (${bytesAt(bytes, at)}); ${WHAT_TO_SEND}`);
};

/** The library's own words, short, as a technical detail after the plain statement. */
const libraryDetail = (error: unknown): string => {
  const text = error instanceof Error ? error.message : String(error);
  return text.length > 120 ? `${text.slice(0, 117)}…` : text;
};

const readTable = (bytes: Uint8Array): Table => {
  if (bytes.length === 0) throw malformed(`the body is empty; send an Arrow IPC stream (${ARROW_STREAM_MEDIA_TYPE})`);
  if (hasMagicAt(bytes, 0)) {
    // The IPC file format ends with its footer and "ARROW1"; anything after it would leave the footer unfound.
    if (!hasMagicAt(bytes, bytes.length - FILE_MAGIC.length)) {
      throw malformed(`the body begins as an Arrow IPC file but does not end with one: it was cut short or has bytes after it; ${WHAT_TO_SEND}`);
    }
  } else checkStreamFrame(bytes);
  let table: Table;
  try {
    table = tableFromIPC(bytes);
  } catch (error) {
    throw malformed(
      `the body is not a readable Arrow IPC stream: its messages are framed as Arrow's, but their contents could not be decoded; send one uncompressed Arrow IPC stream (${ARROW_STREAM_MEDIA_TYPE}) as an Arrow library writes it (detail: ${libraryDetail(error)})`,
    );
  }
  // The reader answers an empty stream (a schema of no columns) with an empty table rather than an error.
  if (table.schema.fields.length === 0) {
    throw malformed(`the body holds no Arrow IPC stream with columns; send one whose columns are named ${ARROW_INPUT_COLUMNS.join(", ")}`);
  }
  return table;
};

/**
 * Reads an Arrow IPC stream (or file) of several record batches into float64 columns: every integer and
 * float type is converted exactly, nulls become NaN. Unknown names, other types, unreadable bytes and bytes after
 * the stream are `InputIssues`.
 */
export const decodeArrowColumns = (bytes: Uint8Array): ArrowColumns => {
  const table = readTable(bytes);
  const fields = table.schema.fields;
  const nameIssues = schemaIssues(fields);
  if (nameIssues.length > 0) throw new InputIssues(nameIssues.slice(0, MAX_LISTED_ISSUES));
  const issues: InputIssue[] = [];
  const columns: ArrowColumns["columns"] = {};
  fields.forEach((field, index) => {
    const chunks = table.getChildAt(index)?.data ?? [];
    columns[field.name] = readColumn(chunks, table.numRows, field.name, issues);
  });
  if (issues.length > 0) throw new InputIssues(issues);
  return { samples: table.numRows, columns };
};

const FLOAT64 = new Float64();
const FLAG_MASK_TYPE = new Uint32();

/** Set bits of each byte value, for counting the values present eight at a time. */
const BITS_SET = Uint8Array.from({ length: 256 }, (_, byte) => {
  let count = 0;
  for (let rest = byte; rest !== 0; rest >>= 1) count += rest & 1;
  return count;
});

/** A float64 column whose NaNs are Arrow nulls; the values are shared, not copied. */
const nullableFloat64 = (values: Float64Array): Data<Float64> => {
  // Validity bitmap (bit set: the value is there; v === v is false for NaN only), eight values per byte without
  // a branch per value: the null pattern of a real log is irregular, and a mispredicted branch per value cost
  // twice the time of the whole pass.
  const length = values.length;
  const whole = length >> 3;
  const nullBitmap = new Uint8Array((length + 7) >> 3);
  let present = 0;
  for (let byte = 0; byte < whole; byte++) {
    const i = byte << 3;
    const bits =
      (values[i] === values[i] ? 1 : 0) |
      (values[i + 1] === values[i + 1] ? 2 : 0) |
      (values[i + 2] === values[i + 2] ? 4 : 0) |
      (values[i + 3] === values[i + 3] ? 8 : 0) |
      (values[i + 4] === values[i + 4] ? 16 : 0) |
      (values[i + 5] === values[i + 5] ? 32 : 0) |
      (values[i + 6] === values[i + 6] ? 64 : 0) |
      (values[i + 7] === values[i + 7] ? 128 : 0);
    nullBitmap[byte] = bits;
    present += BITS_SET[bits];
  }
  if (whole < nullBitmap.length) {
    let bits = 0;
    for (let i = whole << 3, bit = 0; i < length; i++, bit++) if (values[i] === values[i]) bits |= 1 << bit;
    nullBitmap[whole] = bits;
    present += BITS_SET[bits];
  }
  const nullCount = length - present;
  if (nullCount === 0) return makeData({ type: FLOAT64, length, nullCount, data: values });
  return makeData({ type: FLOAT64, length, nullCount, nullBitmap, data: values });
};

const unitMetadata = (unit: string) => new Map(unit === "" ? [] : [["elastilog.unit", unit]]);

/**
 * The answer of `POST /v1/elastic` as an Arrow IPC stream: the echoed depth, top and base, every property of
 * `OUTPUT_PROPERTIES` in order as float64 (NaN as null, unit in the field metadata `elastilog.unit`), and `flags`,
 * the uint32 QC bit mask of each sample. The schema metadata holds the bits, severities, units, limits, summary and
 * service version as JSON text, in pieces to send one after the other. Same arguments as `columnsAnswer`.
 */
export const encodeArrowAnswer = (
  log: ElasticLog,
  request: ElasticLogRequest,
  units: UnitsChosen & { depth: DepthUnit },
  echo: { depth?: Float64Array; top?: Float64Array; base?: Float64Array },
  summary: FlagSummary = summariseFlags(log.flags, log.invalidMask),
): Uint8Array[] => {
  const columns: { field: Field; data: Data }[] = [];
  for (const name of ["depth", "top", "base"] as const) {
    const values = echo[name];
    if (values !== undefined) columns.push({ field: new Field(name, FLOAT64, true, unitMetadata(units.depth)), data: nullableFloat64(values) });
  }
  for (const property of OUTPUT_PROPERTIES) {
    columns.push({
      field: new Field(property.key, FLOAT64, true, unitMetadata(property.unit(units))),
      data: nullableFloat64(property.column(log)),
    });
  }
  columns.push({
    field: new Field("flags", FLAG_MASK_TYPE, false),
    data: makeData({ type: FLAG_MASK_TYPE, length: log.length, nullCount: 0, data: log.flags }),
  });
  const lambdaRho = OUTPUT_PROPERTIES.find((property) => property.key === "lambda_rho");
  const metadata = new Map([
    ["elastilog.version", SERVICE_VERSION],
    ["elastilog.flag_bits", JSON.stringify(Object.fromEntries(FLAG_CODES.map((code, bit) => [String(bit), code])))],
    ["elastilog.flag_severity", JSON.stringify(Object.fromEntries(FLAG_CODES.map((code) => [code, severityOf(code, log.invalidMask)])))],
    ["elastilog.units", JSON.stringify({ ...units, lambda_rho: lambdaRho?.unit(units) })],
    ["elastilog.limits", JSON.stringify(fromPlausibilityLimits(request.limits))],
    ["elastilog.summary", JSON.stringify(summary)],
  ]);
  const fields = columns.map((column) => column.field);
  const batch = new RecordBatch(
    new Schema(fields, metadata),
    makeData({ type: new Struct(fields), length: log.length, nullCount: 0, children: columns.map((column) => column.data) }),
  );
  const sink = new PieceCollector();
  new RecordBatchStreamWriter().reset(sink).writeAll(new Table(batch)).finish();
  return sink.pieces();
};

/** Pieces below this size are joined into one; larger ones (the columns) are kept as views of their memory. */
const JOINED_PIECE_BYTES = 64 * 1024;

/**
 * Takes the IPC writer's output as it comes (a writer's sink must be an AsyncByteQueue), without joining it:
 * the columns' buffers are sent as they are instead of being copied into one stream-sized buffer.
 */
class PieceCollector extends AsyncByteQueue {
  private readonly written: Uint8Array[] = [];

  override write(value: Uint8Array): void {
    this.written.push(value);
  }

  /** The stream in order: small pieces joined, large ones as written. */
  pieces(): Uint8Array[] {
    const result: Uint8Array[] = [];
    let small: Uint8Array[] = [];
    const flush = () => {
      if (small.length === 0) return;
      const joined = new Uint8Array(small.reduce((sum, piece) => sum + piece.byteLength, 0));
      let at = 0;
      for (const piece of small) {
        joined.set(piece, at);
        at += piece.byteLength;
      }
      result.push(joined);
      small = [];
    };
    for (const piece of this.written) {
      if (piece.byteLength < JOINED_PIECE_BYTES) small.push(piece);
      else {
        flush();
        result.push(piece);
      }
    }
    flush();
    return result;
  }
}
