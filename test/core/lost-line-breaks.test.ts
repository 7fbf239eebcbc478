/**
 * A well file whose line breaks were removed on the way (curl -d @file strips carriage returns and newlines from
 * the file it sends; curl's manual, from memory) arrives as one line: LAS 2.0 sections (CWLS: each begins a line
 * with ~ and a letter) run together, and a CSV's rows (RFC 4180 §2: one record per line) run onto its header line.
 * Data from our own fictional well, Marram Bank 7.
 */
import { describe, expect, it } from "vitest";
import { LineBreakWatch, LOST_LINE_BREAKS_MIN_CHARACTERS } from "../../core/lost-line-breaks.js";
import { marramBankLas } from "../helpers/marram-bank-las.js";

const LAS = marramBankLas({ start: "1", stop: "2", step: "1" }, "1 90 160 2.4", "2 91 161 2.41");
const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1,90,160,2.4\r\n2,91,161,2.41\r\n";
const withoutLineBreaks = (text: string) => text.replace(/[\r\n]/g, "");

const watch = (format: "las" | "csv", ...chunks: string[]): boolean => {
  const lines = new LineBreakWatch();
  for (const chunk of chunks) lines.push(chunk);
  return lines.lostLineBreaks(format);
};

/** The text cut into pieces of `size` characters, as a body may arrive. */
const pieces = (text: string, size: number): string[] => Array.from({ length: Math.ceil(text.length / size) }, (_, i) => text.slice(i * size, (i + 1) * size));

describe("LineBreakWatch", () => {
  it("sees a LAS file without line breaks: two or more ~ section marks on one line, in chunks of any size", () => {
    const flat = withoutLineBreaks(LAS);
    for (const size of [1, 2, 7, flat.length]) expect(watch("las", ...pieces(flat, size)), `chunks of ${size}`).toBe(true);
  });

  it("sees a CSV file without line breaks: numbers among the cells of its one line (decimal points or commas, any delimiter)", () => {
    for (const size of [1, 5, 1000]) expect(watch("csv", ...pieces(withoutLineBreaks(CSV), size))).toBe(true);
    expect(watch("csv", withoutLineBreaks("DEPT[m];DTC[us/ft];DTS[us/ft];RHOB[g/cm3]\n100,0;90,5;160,2;2,40\n100,2;90,6;160,1;2,41"))).toBe(true);
    expect(watch("csv", withoutLineBreaks("DEPT\tDTC\tDTS\tRHOB\n1\t90\t160\t2.4\n2\t91\t161\t2.41"))).toBe(true);
  });

  it("sees nothing in a text with a line break anywhere, LF, CRLF or a lone CR, even in the last chunk", () => {
    for (const text of [LAS, CSV, CSV.replace(/\r\n/g, "\r")]) expect(watch(text.startsWith("~") ? "las" : "csv", ...pieces(text, 3))).toBe(false);
    expect(watch("csv", withoutLineBreaks(CSV), "\n")).toBe(false);
  });

  it("sees nothing in a text too short to be a file, nor in a lone header line of names", () => {
    const short = "DEPT,DTC1,902,91";
    expect(short.length).toBeLessThan(LOST_LINE_BREAKS_MIN_CHARACTERS);
    expect(watch("csv", short)).toBe(false);
    expect(watch("csv", "DEPTH[m],SONIC_COMPRESSIONAL[us/ft],SONIC_SHEAR[us/ft],BULK_DENSITY[g/cm3]")).toBe(false);
    expect(watch("las", "~Version VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0")).toBe(false);
    expect(watch("csv", "")).toBe(false);
  });
});
