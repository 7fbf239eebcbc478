import { AsciiText, asciiString, fullDoublesOf, SHORTEST, writeColumnValue, type NumberFormat } from "../ascii-numbers.js";

export interface CsvTable {
  curves: readonly { name: string; unit: string }[];
  /** One column per curve, all of the same length. */
  columns: readonly Float64Array[];
}

const CHUNK_CHARACTERS = 64 * 1024;
/** Semicolon and tab too: the reader judges the delimiter from the header line. */
const NEEDS_QUOTES = /[",;\t\r\n]/;

/** RFC 4180 §2 rules 6–7: a field holding a delimiter, a quote or a line break is quoted, its quotes doubled. */
const field = (text: string): string => (NEEDS_QUOTES.test(text) ? `"${text.replaceAll('"', '""')}"` : text);

const headerCell = (curve: { name: string; unit: string }, column: number): string => {
  const cell = field(curve.unit === "" ? curve.name : `${curve.name}[${curve.unit}]`);
  return column === 0 && cell.startsWith("#") ? `"${cell}"` : cell;
};

/** The header record, CRLF included: `NAME[unit]` cells (RFC 4180 §2 rule 3). */
export const csvHeaderRecord = (curves: CsvTable["curves"]): string => `${curves.map(headerCell).join(",")}\r\n`;

const COMMA = 44;
const QUOTE = 34;

/** Row `row` of `columns` as one record with its CRLF: a NaN is an empty cell; a record that would be an empty line (one column holding NaN) is `""`, because readers skip blank lines. */
const writeRecord = (
  text: AsciiText,
  columns: readonly Float64Array[],
  formats: readonly NumberFormat[],
  row: number,
  fullDoubles: readonly boolean[],
): void => {
  const start = text.length;
  for (let column = 0; column < columns.length; column++) {
    if (column > 0) text.byte(COMMA);
    const value = columns[column][row];
    if (Number.isFinite(value)) writeColumnValue(text, value, formats[column], fullDoubles[column]);
    else if (!Number.isNaN(value)) text.ascii(String(value));
  }
  if (text.length === start) {
    text.byte(QUOTE);
    text.byte(QUOTE);
  }
  text.byte(13);
  text.byte(10);
};

const checkColumns = (columns: readonly Float64Array[], formats: readonly NumberFormat[]): number => {
  if (formats.length !== columns.length) throw new RangeError(`${columns.length} columns but ${formats.length} number formats`);
  const rows = columns.length === 0 ? 0 : columns[0].length;
  if (columns.some((column) => column.length !== rows)) throw new RangeError("columns differ in length");
  return rows;
};

/**
 * The rows of `columns` as CSV records appended to `text`, each column in its number format (`shortest` writes
 * back exactly the double read). Calls on consecutive batches of rows give the text of one call on all of them.
 */
export const writeCsvRecords = (text: AsciiText, columns: readonly Float64Array[], formats: readonly NumberFormat[]): void => {
  const rows = checkColumns(columns, formats);
  const fullDoubles = fullDoublesOf(columns, formats);
  for (let row = 0; row < rows; row++) writeRecord(text, columns, formats, row, fullDoubles);
};

/**
 * A table as CSV text (RFC 4180: comma, CRLF after every record, header `NAME[unit]`, every number the shortest
 * text that reads back as the same double), in chunks of about 64 KiB; a first header cell starting with `#`
 * is quoted so that it is not taken for a comment.
 */
export function* writeCsv(table: CsvTable): Generator<string> {
  const { curves, columns } = table;
  if (columns.length !== curves.length) {
    throw new RangeError(`${curves.length} curves but ${columns.length} columns`);
  }
  const formats = columns.map(() => SHORTEST);
  const rows = checkColumns(columns, formats);
  let header = csvHeaderRecord(curves);
  const text = new AsciiText();
  const fullDoubles = fullDoublesOf(columns, formats);
  for (let row = 0; row < rows; row++) {
    writeRecord(text, columns, formats, row, fullDoubles);
    if (header.length + text.length >= CHUNK_CHARACTERS) {
      yield header + asciiString(text.take());
      header = "";
    }
  }
  if (header !== "" || text.length > 0) yield header + asciiString(text.take());
}
