import {
  createCsvReader,
  createLasReader,
  type CsvDocument,
  type CsvReader,
  type CurveInfo,
  type LasDocument,
  type LasHeaderView,
  type LasReader,
  type WellTable,
  WellFileError,
} from "../core/index.js";
import { ProblemError } from "./problems.js";

export type WellFile = { format: "las"; las: LasDocument; table: WellTable } | { format: "csv"; csv: CsvDocument; table: WellTable };

/**
 * A LAS file begins with a `~` section line (after optional `#` comments and blank lines, CWLS LAS 2.0);
 * anything else is read as CSV. Returns undefined while the text seen so far cannot tell.
 */
export const sniffFormat = (start: string): "las" | "csv" | undefined => {
  const lines = start.replace(/^\uFEFF/, "").split(/\r\n|\r|\n/);
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    const complete = i < lines.length - 1;
    if (line === "" || (line.startsWith("#") && complete)) continue;
    if (line.startsWith("#")) return undefined;
    if (line.startsWith("~")) return "las";
    return complete || line.length > 2 ? "csv" : undefined;
  }
  return undefined;
};

/**
 * Refuses a body whose first bytes show it is not ASCII/UTF-8 text: a UTF-16 byte-order mark (FF FE or FE FF), or a
 * NUL byte, which no LAS or CSV text holds (UTF-16 text has one in every ASCII character; a binary file, many).
 */
const refuseNonText = (first: Uint8Array): void => {
  if ((first[0] === 0xff && first[1] === 0xfe) || (first[0] === 0xfe && first[1] === 0xff)) {
    throw new WellFileError("utf16_text", "the file is UTF-16 text (it begins with a UTF-16 byte-order mark): save it as ASCII or UTF-8 and send it again", 1);
  }
  if (first.subarray(0, 4096).includes(0)) {
    throw new WellFileError("not_text", "the file holds NUL bytes, so it is not ASCII or UTF-8 text (UTF-16 text, or a binary file): save it as ASCII or UTF-8 text and send it again", 1);
  }
};

/** The header of a well file as far as converting its rows needs: what a streaming reader knows before the samples. */
export type WellHeader =
  | { format: "las"; header: LasHeaderView; curves: CurveInfo[]; nullValue: number | undefined }
  | { format: "csv"; curves: CurveInfo[]; nullValue: undefined };

/**
 * Reads a well file from bytes handed over in pieces, without holding its text: bytes are decoded as UTF-8
 * (invalid bytes become U+FFFD and reading goes on) and pushed to the LAS or CSV reader, which keep only header
 * lines and numeric columns. The format is judged from the first lines (`sniffFormat`).
 */
export class WellFileReader {
  private readonly decoder = new TextDecoder("utf-8");
  private pending = "";
  private las: LasReader | undefined;
  private csv: CsvReader | undefined;

  push(bytes: Uint8Array): void {
    if (this.las === undefined && this.csv === undefined && this.pending === "") refuseNonText(bytes);
    this.feed(this.decoder.decode(bytes, { stream: true }));
  }

  /** The header once the samples begin (LAS `~A`, the CSV header line read); undefined before. */
  header(): WellHeader | undefined {
    const las = this.las?.header();
    if (las !== undefined) return { format: "las", header: las, curves: las.curves, nullValue: las.nullValue };
    const curves = this.csv?.curves();
    return curves === undefined ? undefined : { format: "csv", curves, nullValue: undefined };
  }

  /** Removes and returns the complete rows read so far (see `LasReader.takeRows`). */
  takeRows(): Float64Array[] {
    return this.las?.takeRows() ?? this.csv?.takeRows() ?? [];
  }

  /** Ends the text: the file with the rows not taken; a ProblemError or WellFileError says why it cannot be read. */
  end(): WellFile {
    this.feed(this.decoder.decode());
    if (this.las === undefined && this.csv === undefined) {
      if (this.pending.trim() === "" || /^(\s*#[^\n]*\n?)*\s*$/.test(this.pending)) {
        throw new ProblemError("unreadable-file", "The body holds no well data: send a LAS 2.0 or CSV file as the request body.");
      }
      this.csv = createCsvReader();
      this.csv.push(this.pending);
    }
    if (this.las !== undefined) {
      const las = this.las.end();
      return { format: "las", las, table: las.table };
    }
    const csv = (this.csv as CsvReader).end();
    return { format: "csv", csv, table: csv.table };
  }

  private feed(text: string): void {
    const reader = this.las ?? this.csv;
    if (reader !== undefined) {
      reader.push(text);
      return;
    }
    this.pending += text;
    if (/^\uFEFF?\s*[{[]/.test(this.pending)) {
      throw new WellFileError("json_body", "the body is JSON, not a LAS or CSV file: send the well file itself here, or JSON columns to POST /v1/elastic", 1);
    }
    const format = sniffFormat(this.pending);
    if (format === undefined) return;
    if (format === "las") this.las = createLasReader();
    else this.csv = createCsvReader();
    (this.las ?? this.csv)?.push(this.pending);
    this.pending = "";
  }
}

/** Reads a whole well file from a byte stream (see `WellFileReader`). */
export const readWellFile = async (stream: AsyncIterable<Uint8Array> | Iterable<Uint8Array>): Promise<WellFile> => {
  const reader = new WellFileReader();
  for await (const chunk of stream) reader.push(chunk);
  return reader.end();
};
