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
  isWellFileError,
  LineBreakWatch,
  WellFileError,
} from "../core/index.js";
import { ProblemError, unreadableFile } from "./problems.js";

/** What the reader noticed about the bytes themselves (their encoding), for the answer's warnings. */
export type ReadingNote = { line?: number; message: string };

export type WellFile = ({ format: "las"; las: LasDocument; table: WellTable } | { format: "csv"; csv: CsvDocument; table: WellTable }) & {
  notes: readonly ReadingNote[];
};

/** The text encodings a well file is read in: UTF-8 (which US-ASCII is part of), or Windows-1252, the superset of ISO-8859-1. */
export type FileEncoding = "utf-8" | "windows-1252";

/** Charset labels a request may declare (RFC 9110 §8.3.2), case-insensitive; the WHATWG Encoding standard reads ISO-8859-1 as Windows-1252. */
const CHARSETS: Readonly<Record<string, FileEncoding>> = {
  "utf-8": "utf-8",
  utf8: "utf-8",
  "us-ascii": "utf-8",
  ascii: "utf-8",
  "iso-8859-1": "windows-1252",
  "iso_8859-1": "windows-1252",
  latin1: "windows-1252",
  "l1": "windows-1252",
  "windows-1252": "windows-1252",
  cp1252: "windows-1252",
};

/**
 * The encoding a Content-Type declares with `charset=`, or undefined when it declares none (the reader then
 * takes UTF-8, or Windows-1252 when the first bytes are not UTF-8). An encoding it cannot read is a 415.
 */
export const declaredEncoding = (contentType: string | undefined): FileEncoding | undefined => {
  // A parameter value is a token or a quoted string (RFC 9110 §5.6.6); an unterminated quote is neither.
  const values = [...(contentType ?? "").matchAll(/;\s*charset\s*=\s*("[^"]*"|[^;\s]*)/gi)].map((match) => match[1]);
  if (values.length === 0) return undefined;
  const refuse = (why: string) =>
    new ProblemError("unsupported-media-type", `${why}: declare one charset, UTF-8 (or US-ASCII), ISO-8859-1 or Windows-1252, e.g. text/csv; charset=utf-8, or none for UTF-8.`);
  if (values.length > 1) throw refuse(`The Content-Type declares charset ${values.length} times (${values.join(", ")})`);
  const quoted = values[0].startsWith('"');
  if (quoted && !(values[0].length >= 2 && values[0].endsWith('"'))) throw refuse(`The charset ${values[0]} opens a quote it does not close`);
  const label = quoted ? values[0].slice(1, -1) : values[0];
  if (label.trim() === "") throw refuse("The Content-Type has an empty charset=");
  const encoding = CHARSETS[label.toLowerCase()];
  if (encoding === undefined) throw refuse(`charset=${label} is not read here`);
  return encoding;
};

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

/**
 * Added to the problem of a file that cannot be read when its body has no line break at all, yet looks like a
 * file: `curl -d @file` (also `--data`) strips carriage returns and newlines from the file it sends, where
 * `--data-binary @file` sends it as it is (curl's manual; from memory).
 */
export const lostLineBreaksHint = (format: "las" | "csv"): string =>
  `The body has no line breaks: if it was sent with curl -d, send it with --data-binary instead (curl -d removes line breaks; --data-binary @well.${format} sends the file as it is).`;

/** The header of a well file as far as converting its rows needs: what a streaming reader knows before the samples. */
export type WellHeader = (
  | { format: "las"; header: LasHeaderView; curves: CurveInfo[]; nullValue: number | undefined }
  | { format: "csv"; curves: CurveInfo[]; nullValue: undefined }
) & {
  /** What reading the bytes and the header noticed, known before the first sample (a LAS answer lists them in ~Other). */
  warnings: readonly ReadingNote[];
};

/**
 * Reads a well file from bytes handed over in pieces, without holding its text: bytes are decoded as UTF-8
 * (invalid bytes become U+FFFD and reading goes on) and pushed to the LAS or CSV reader, which keep only header
 * lines and numeric columns. The format is judged from the first lines (`sniffFormat`).
 */
export class WellFileReader {
  private decoder: InstanceType<typeof TextDecoder>;
  private pending = "";
  private las: LasReader | undefined;
  private csv: CsvReader | undefined;
  private started = false;
  /** Whether the text has lost its line breaks (see `LineBreakWatch`), for the hint of a file that cannot be read. */
  private readonly lineBreaks = new LineBreakWatch();
  /** What was noticed about the bytes (the encoding taken when none was declared). */
  readonly notes: ReadingNote[] = [];

  private readonly encoding: FileEncoding | undefined;
  private readonly nullValue: number | undefined;

  /**
   * `encoding` as declared by the request (undefined: UTF-8, or Windows-1252 when the first bytes are not UTF-8);
   * `nullValue` as the request gives it (undefined: the file's own NULL, else the usual -999.25).
   */
  constructor(options: { encoding?: FileEncoding; nullValue?: number } = {}) {
    this.encoding = options.encoding;
    this.nullValue = options.nullValue;
    this.decoder = new TextDecoder(options.encoding ?? "utf-8");
  }

  push(bytes: Uint8Array): void {
    if (!this.started) {
      this.started = true;
      refuseNonText(bytes);
      if (this.encoding === undefined) this.chooseEncoding(bytes);
    }
    this.feed(this.decoder.decode(bytes, { stream: true }));
  }

  /**
   * Older files are often in Windows-1252 or ISO-8859-1 (a µ in a unit, a degree sign in a comment), whose bytes
   * above 0x7F are not UTF-8. When the first bytes are not UTF-8 and no charset was declared, the file is read as
   * Windows-1252, and the answer's warnings say so.
   */
  private chooseEncoding(first: Uint8Array): void {
    try {
      new TextDecoder("utf-8", { fatal: true }).decode(first, { stream: true });
    } catch {
      this.decoder = new TextDecoder("windows-1252");
      this.notes.push({
        message: "the file is not UTF-8 text; it was read as Windows-1252 (ISO-8859-1), the usual encoding of older files. Declare the encoding with charset= in Content-Type if it is another.",
      });
    }
  }

  /** The header once the samples begin (LAS `~A`, the CSV header line read); undefined before. */
  header(): WellHeader | undefined {
    const las = this.las?.header();
    if (las !== undefined) return { format: "las", header: las, curves: las.curves, nullValue: las.nullValue, warnings: [...this.notes, ...las.warnings] };
    const curves = this.csv?.curves();
    return curves === undefined ? undefined : { format: "csv", curves, nullValue: undefined, warnings: this.notes };
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
        // A file with comment lines above its header, sent without line breaks, is one long comment line.
        const lost = (["las", "csv"] as const).find((format) => this.lineBreaks.lostLineBreaks(format));
        throw new ProblemError("unreadable-file", `The body holds no well data: send a LAS 2.0 or CSV file as the request body.${lost === undefined ? "" : ` ${lostLineBreaksHint(lost)}`}`);
      }
      this.csv = createCsvReader();
      this.csv.push(this.pending);
    }
    try {
      if (this.las !== undefined) {
        const las = this.las.end();
        return { format: "las", las, table: las.table, notes: this.notes };
      }
      const csv = (this.csv as CsvReader).end();
      return { format: "csv", csv, table: csv.table, notes: this.notes };
    } catch (error) {
      const format = this.las === undefined ? "csv" : "las";
      if (isWellFileError(error) && this.lineBreaks.lostLineBreaks(format)) throw unreadableFile(error, lostLineBreaksHint(format));
      throw error;
    }
  }

  private feed(text: string): void {
    this.lineBreaks.push(text);
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
    if (format === "las") this.las = createLasReader(this.nullValue === undefined ? {} : { nullValue: this.nullValue });
    else this.csv = createCsvReader();
    (this.las ?? this.csv)?.push(this.pending);
    this.pending = "";
  }
}

/** Reads a whole well file from a byte stream (see `WellFileReader`). */
export const readWellFile = async (
  stream: AsyncIterable<Uint8Array> | Iterable<Uint8Array>,
  options: { encoding?: FileEncoding; nullValue?: number } = {},
): Promise<WellFile> => {
  const reader = new WellFileReader(options);
  for await (const chunk of stream) reader.push(chunk);
  return reader.end();
};
