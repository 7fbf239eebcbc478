import { WellFileError } from "../well-file-error.js";
import type { CurveInfo, WellTable } from "../well-table.js";
import { detectDelimiter, type CsvDelimiter } from "./csv-delimiter.js";
import { curvesFromHeader } from "./csv-header.js";
import { isDecimalCommaNumber, readCsvNumber } from "./csv-number.js";
import { CsvTokenizer, type CsvRecordSink } from "./csv-tokenizer.js";
import { GrowableColumn } from "../growable-column.js";

export interface CsvReaderOptions {
  /** A value that marks an absent sample in this file; kept in the columns as read. */
  nullValue?: number;
}

export interface CsvDocument {
  table: WellTable;
  delimiter: CsvDelimiter;
}

export interface CsvReader {
  /** Reads the next piece of text; chunks may split the text anywhere. */
  push(chunk: string): void;
  /** The curves named by the header line, once it has been read; undefined before. */
  curves(): CurveInfo[] | undefined;
  /**
   * Removes and returns the complete rows read so far, one array per curve (empty before the header), so that a
   * caller can convert a file of any length batch by batch; `end` then holds only the rows not yet taken.
   */
  takeRows(): Float64Array[];
  /** Ends the text and returns what was read; throws `WellFileError` when it cannot be used. */
  end(): CsvDocument;
}

const BYTE_ORDER_MARK = "\uFEFF";
const LINE_BREAK = /[\r\n]/;

/** Where the first line of `text` ends (index of its CR or LF), or -1; quotes matter only when `quoteAware`. */
const lineEnd = (text: string, from: number, quoteAware: boolean): number => {
  let inQuotes = false;
  for (let i = from; i < text.length; i++) {
    const c = text[i];
    if (quoteAware && c === '"') inQuotes = !inQuotes;
    else if (!inQuotes && (c === "\r" || c === "\n")) return i;
  }
  return -1;
};

const shorten = (value: string): string => (value.length > 40 ? `${value.slice(0, 40)}…` : value);
const quote = (value: string): string => JSON.stringify(shorten(value));

/** Fills growable columns from data records, one value per field, checking each row's width. */
class ColumnSink implements CsvRecordSink {
  readonly columns: GrowableColumn[];
  /** Complete rows read, taken or not. */
  rows = 0;
  private untaken = 0;
  private column = 0;
  /** The first row's cells, kept while it is read: a row without a number may be a row of units, and is told so. */
  private firstRow: { cells: string[]; numbers: number; bad: { text: string; column: number; line: number } | undefined } | undefined = {
    cells: [],
    numbers: 0,
    bad: undefined,
  };

  constructor(readonly curves: CurveInfo[]) {
    this.columns = curves.map(() => new GrowableColumn());
  }

  field(text: string, _quoted: boolean, line: number): void {
    const column = this.column++;
    if (column >= this.columns.length) return;
    const value = readCsvNumber(text);
    // Checked first: a row of decimal commas holds no number as read, and would be taken for a row of units.
    if (value === undefined && isDecimalCommaNumber(text)) throw this.decimalComma(text, column, line);
    if (this.firstRow !== undefined) {
      this.firstRow.cells.push(text);
      if (value === undefined) this.firstRow.bad ??= { text, column, line };
      else if (!Number.isNaN(value)) this.firstRow.numbers++;
      this.columns[column].push(value ?? NaN);
      return;
    }
    if (value === undefined) throw this.notANumber(text, column, line);
    this.columns[column].push(value);
  }

  private notANumber(text: string, column: number, line: number): WellFileError {
    return new WellFileError(
      "csv_not_a_number",
      `the value ${quote(text)} in column ${this.curves[column].mnemonic} is not a number ` +
        "(write an empty cell, NA or NaN for a missing value)",
      line,
    );
  }

  private decimalComma(text: string, column: number, line: number): WellFileError {
    const cell = text.trim();
    return new WellFileError(
      "csv_decimal_comma",
      `the file uses decimal commas (the value ${quote(cell)} in column ${this.curves[column].mnemonic}), which are not read here: ` +
        `write numbers with a decimal point (${shorten(cell.replace(",", "."))}), e.g. export the file with the point as decimal separator; the delimiter may stay as it is`,
      line,
    );
  }

  /**
   * A first data row with a cell that is not a number and no number in any cell, such as `m,us/ft,us/ft,g/cm3`, is
   * taken for a row of units (a common export layout) and refused with the header that would carry them.
   */
  private checkFirstRow(): void {
    const first = this.firstRow;
    this.firstRow = undefined;
    if (first?.bad === undefined) return;
    if (first.numbers > 0) throw this.notANumber(first.bad.text, first.bad.column, first.bad.line);
    const shown = Math.min(this.curves.length, 6);
    const header = this.curves
      .slice(0, shown)
      .map((curve, c) => {
        const unit = (first.cells[c] ?? "").trim();
        return unit === "" || readCsvNumber(unit) !== undefined ? curve.mnemonic : `${curve.mnemonic}[${shorten(unit)}]`;
      })
      .join(",");
    throw new WellFileError(
      "csv_units_row",
      `the first data row (${first.cells.slice(0, shown).map(quote).join(", ")}${this.curves.length > shown ? ", …" : ""}) holds no number: ` +
        `it looks like a row of units. Put the units in the header line instead, e.g. ${header}${this.curves.length > shown ? ",…" : ""} ` +
        "(also NAME [unit] or NAME (unit)), and delete this row",
      first.bad.line,
    );
  }

  endRecord(line: number): void {
    if (this.firstRow !== undefined) this.checkFirstRow();
    if (this.column !== this.columns.length) {
      throw new WellFileError(
        "csv_ragged_row",
        `this row has ${this.column} fields but the header has ${this.columns.length}`,
        line,
      );
    }
    this.column = 0;
    this.rows++;
    this.untaken++;
  }

  /** The complete rows not yet taken; a row still being read stays. */
  take(): Float64Array[] {
    const rows = this.untaken;
    this.untaken = 0;
    return this.columns.map((column) => column.take(rows));
  }
}

/** Collects the header record's cells, then hands the following records to a `ColumnSink`. */
class DocumentSink implements CsvRecordSink {
  private headerCells: string[] = [];
  data: ColumnSink | undefined;

  field(text: string, quoted: boolean, line: number): void {
    if (this.data === undefined) this.headerCells.push(text);
    else this.data.field(text, quoted, line);
  }

  endRecord(line: number): void {
    if (this.data === undefined) this.data = new ColumnSink(curvesFromHeader(this.headerCells));
    else this.data.endRecord(line);
  }
}

/**
 * A CSV reader (RFC 4180) fed text in chunks, which keeps only the numbers it has read.
 * The first line that is neither blank nor a `#` comment is the header; its cells name the
 * curves and may carry units (`DTC[us/ft]`, `DTC (us/ft)`). The delimiter is judged from the
 * header line (see `detectDelimiter`). Every later record is a row of numbers.
 */
export const createCsvReader = (options: CsvReaderOptions = {}): CsvReader => {
  const sink = new DocumentSink();
  let tokenizer: CsvTokenizer | undefined;
  let delimiter: CsvDelimiter = ",";
  let preamble = "";
  let line = 1;
  let started = false;
  let afterCr = false;

  /** Drops blank and comment lines before the header; starts the tokenizer once the header line is whole. */
  const readPreamble = (final: boolean): void => {
    for (;;) {
      if (afterCr && preamble.startsWith("\n")) preamble = preamble.slice(1);
      if (preamble === "") return;
      afterCr = false;
      const first = preamble.search(/[^ \t]/);
      if (first === -1) return;
      const c = preamble[first];
      if (c === "\r" || c === "\n" || c === "#") {
        const end = c === "#" ? lineEnd(preamble, first, false) : first;
        if (end === -1) return;
        afterCr = preamble[end] === "\r";
        preamble = preamble.slice(end + 1);
        line++;
        continue;
      }
      const end = lineEnd(preamble, first, true);
      if (end === -1 && !final) return;
      delimiter = detectDelimiter(end === -1 ? preamble.slice(first) : preamble.slice(first, end));
      tokenizer = new CsvTokenizer(delimiter.charCodeAt(0), sink, line);
      tokenizer.push(preamble.slice(first));
      preamble = "";
      return;
    }
  };

  const push = (chunk: string): void => {
    let text = chunk;
    if (!started && text !== "") {
      started = true;
      if (text.startsWith(BYTE_ORDER_MARK)) text = text.slice(1);
    }
    if (tokenizer !== undefined) {
      tokenizer.push(text);
      return;
    }
    preamble += text;
    if (LINE_BREAK.test(text)) readPreamble(false);
  };

  const end = (): CsvDocument => {
    if (tokenizer === undefined) readPreamble(true);
    if (tokenizer === undefined) {
      throw new WellFileError("csv_no_header", "no header line: the text is empty or holds only blank or # comment lines");
    }
    tokenizer.end();
    const data = sink.data;
    if (data === undefined || data.rows === 0) {
      throw new WellFileError("csv_no_rows", "the header line is followed by no data rows");
    }
    return {
      table: {
        curves: data.curves,
        columns: data.columns.map((column) => column.toFloat64Array()),
        nullValue: options.nullValue,
      },
      delimiter,
    };
  };

  return { push, curves: () => sink.data?.curves, takeRows: () => sink.data?.take() ?? [], end };
};

/** Reads a whole CSV text at once (see `createCsvReader`). */
export const parseCsv = (text: string, options?: CsvReaderOptions): CsvDocument => {
  const reader = createCsvReader(options);
  reader.push(text);
  return reader.end();
};
