import { WellFileError } from "../well-file-error.js";

const QUOTE = 34;
const CR = 13;
const LF = 10;

const FIELD_START = 0;
const UNQUOTED = 1;
const QUOTED = 2;
/** A quote inside a quoted field: the next character tells an escaped `""` from the closing quote. */
const QUOTE_IN_QUOTED = 3;

/** Receives the fields of a CSV text as the tokenizer finds them. */
export interface CsvRecordSink {
  /** `line` is the 1-based line where the field starts; `quoted` when it was written in quotes. */
  field(text: string, quoted: boolean, line: number): void;
  /** Closes the record (row) that started on `line`. */
  endRecord(line: number): void;
}

/**
 * Splits CSV text fed in chunks of any size into fields and records (RFC 4180 §2): quoted fields
 * may hold delimiters, line breaks and `""` escapes; records end at CRLF, LF or a lone CR.
 * Blank lines are skipped. Text after a closing quote is kept as part of the field, as
 * spreadsheet programs do, rather than rejected.
 */
export class CsvTokenizer {
  private state = FIELD_START;
  /** Field text carried over from earlier chunks. */
  private carry = "";
  private quoted = false;
  private previousWasCr = false;
  private atRecordStart = true;
  private fieldsInRecord = 0;
  private line: number;
  private recordLine: number;
  private fieldLine: number;
  private quoteLine: number;

  constructor(
    private readonly delimiter: number,
    private readonly sink: CsvRecordSink,
    firstLine: number,
  ) {
    this.line = firstLine;
    this.recordLine = firstLine;
    this.fieldLine = firstLine;
    this.quoteLine = firstLine;
  }

  push(chunk: string): void {
    let start = 0;
    for (let i = 0; i < chunk.length; i++) {
      const c = chunk.charCodeAt(i);
      const afterCr = this.previousWasCr;
      this.previousWasCr = c === CR;
      if (this.state === QUOTED) {
        if (c === QUOTE) {
          this.carry += chunk.slice(start, i);
          start = i + 1;
          this.state = QUOTE_IN_QUOTED;
        } else if (c === CR || (c === LF && !afterCr)) {
          this.line++;
        }
        continue;
      }
      if (this.state === QUOTE_IN_QUOTED) {
        if (c === QUOTE) {
          start = i;
          this.state = QUOTED;
          continue;
        }
        this.state = UNQUOTED;
      } else if (this.state === FIELD_START) {
        if (c === LF && afterCr) {
          start = i + 1;
          continue;
        }
        this.atRecordStart = false;
        this.fieldLine = this.line;
        if (c === QUOTE) {
          this.quoted = true;
          this.quoteLine = this.line;
          this.state = QUOTED;
          start = i + 1;
          continue;
        }
        this.state = UNQUOTED;
      }
      if (c === this.delimiter) {
        this.emitField(this.carry + chunk.slice(start, i));
        start = i + 1;
      } else if (c === CR || c === LF) {
        this.endRecord(this.carry + chunk.slice(start, i));
        start = i + 1;
      }
    }
    if (start < chunk.length) this.carry += chunk.slice(start);
  }

  /** Closes the last record; throws `csv_unclosed_quote` if a quoted field is still open. */
  end(): void {
    if (this.state === QUOTED) {
      throw new WellFileError("csv_unclosed_quote", "a quoted field opened here is never closed", this.quoteLine);
    }
    if (!this.atRecordStart) this.endRecord(this.carry);
  }

  private emitField(text: string): void {
    this.sink.field(text, this.quoted, this.fieldLine);
    this.fieldsInRecord++;
    this.carry = "";
    this.quoted = false;
    this.state = FIELD_START;
  }

  private endRecord(lastField: string): void {
    const blank = this.fieldsInRecord === 0 && !this.quoted && lastField.trim() === "";
    if (blank) {
      this.carry = "";
      this.state = FIELD_START;
    } else {
      this.emitField(lastField);
      this.sink.endRecord(this.recordLine);
    }
    this.fieldsInRecord = 0;
    this.atRecordStart = true;
    this.line++;
    this.recordLine = this.line;
  }
}
