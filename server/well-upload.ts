import type { Readable } from "node:stream";
import {
  createCsvReader,
  createLasReader,
  type CsvDocument,
  type LasDocument,
  type WellTable,
} from "../core/index.js";
import { ProblemError } from "./problems.js";

export type WellFile = { format: "las"; las: LasDocument; table: WellTable } | { format: "csv"; csv: CsvDocument; table: WellTable };

interface TextReader {
  push(chunk: string): void;
  end(): { table: WellTable };
}

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
 * Reads a well file from a byte stream without holding its text: bytes are decoded as UTF-8
 * (invalid bytes become U+FFFD and reading goes on) and pushed to the LAS or CSV reader, which keep
 * only header lines and numeric columns.
 */
export const readWellFile = async (stream: Readable): Promise<WellFile> => {
  const decoder = new TextDecoder("utf-8");
  let pending = "";
  let format: "las" | "csv" | undefined;
  let reader: TextReader | undefined;
  const feed = (text: string) => {
    if (reader !== undefined) {
      reader.push(text);
      return;
    }
    pending += text;
    format = sniffFormat(pending);
    if (format === undefined) return;
    reader = format === "las" ? createLasReader() : createCsvReader();
    reader.push(pending);
    pending = "";
  };
  for await (const chunk of stream) feed(decoder.decode(chunk as Buffer, { stream: true }));
  feed(decoder.decode());
  if (reader === undefined) {
    if (pending.trim() === "" || /^(\s*#[^\n]*\n?)*\s*$/.test(pending)) {
      throw new ProblemError("unreadable-file", "The body holds no well data: send a LAS 2.0 or CSV file as the request body.");
    }
    format = "csv";
    reader = createCsvReader();
    reader.push(pending);
  }
  if (format === "las") {
    const las = (reader as ReturnType<typeof createLasReader>).end();
    return { format, las, table: las.table };
  }
  const csv = (reader as ReturnType<typeof createCsvReader>).end();
  return { format: "csv", csv, table: csv.table };
};
