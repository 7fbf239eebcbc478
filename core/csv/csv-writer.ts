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

/** Shortest text that reads back as the same double (ECMA-262 Number::toString); a NaN is an empty cell. */
const numberCell = (value: number): string => (Number.isNaN(value) ? "" : String(value));

/**
 * A table as CSV text (RFC 4180: comma, CRLF after every record, header `NAME[unit]`), in
 * chunks of about 64 KiB. A record that would be an empty line (one column holding NaN) is
 * written `""`, because readers skip blank lines; a first header cell starting with `#` is
 * quoted so that it is not taken for a comment.
 */
export function* writeCsv(table: CsvTable): Generator<string> {
  const { curves, columns } = table;
  if (columns.length !== curves.length) {
    throw new RangeError(`${curves.length} curves but ${columns.length} columns`);
  }
  const rows = columns.length === 0 ? 0 : columns[0].length;
  if (columns.some((column) => column.length !== rows)) throw new RangeError("columns differ in length");
  let chunk = `${curves.map(headerCell).join(",")}\r\n`;
  const cells: string[] = new Array<string>(columns.length);
  for (let row = 0; row < rows; row++) {
    for (let column = 0; column < columns.length; column++) cells[column] = numberCell(columns[column][row]);
    const record = cells.join(",");
    chunk += record === "" ? '""\r\n' : `${record}\r\n`;
    if (chunk.length >= CHUNK_CHARACTERS) {
      yield chunk;
      chunk = "";
    }
  }
  if (chunk !== "") yield chunk;
}
