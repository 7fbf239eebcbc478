import { isDecimalCommaNumber, readCsvNumber } from "./csv/csv-number.js";

/** Fewer characters than this are too short to be a well file that lost its line breaks. */
export const LOST_LINE_BREAKS_MIN_CHARACTERS = 32;
/** Characters kept from the start of a text without line breaks, to look at its cells. */
const KEPT_CHARACTERS = 64 * 1024;
const LINE_BREAK = /[\r\n]/;
const CELL_DELIMITERS = /[,;\t]/;
const LETTER = /[A-Za-z]/;

/** Cells of a CSV text that hold a number (a decimal point or a decimal comma), whichever of comma, semicolon or tab delimits them. */
const numberCells = (text: string): number => {
  let count = 0;
  for (const cell of text.split(CELL_DELIMITERS)) {
    if (cell.trim() === "") continue;
    const value = readCsvNumber(cell);
    if ((value !== undefined && !Number.isNaN(value)) || isDecimalCommaNumber(cell)) count++;
  }
  return count;
};

/**
 * Watches a text arriving in chunks for the sign of a well file whose line breaks were removed on the way (as a
 * client that sends a file as form data may do): no line break at all, yet long enough to be a file and built
 * like one joined into a single line. A LAS file (CWLS LAS 2.0: every section begins a line with `~` and a letter)
 * then holds two or more section marks on its one line; a CSV file (RFC 4180: a header record, then records on
 * their own lines) holds numbers among the cells of what would be its header line, where names belong.
 * Keeps at most the first 64 Ki characters, and nothing once a line break has been seen.
 */
export class LineBreakWatch {
  private sawLineBreak = false;
  private characters = 0;
  private kept = "";
  private sectionMarks = 0;
  private afterTilde = false;

  push(chunk: string): void {
    if (this.sawLineBreak || chunk === "") return;
    if (LINE_BREAK.test(chunk)) {
      this.sawLineBreak = true;
      this.kept = "";
      return;
    }
    this.characters += chunk.length;
    if (this.kept.length < KEPT_CHARACTERS) this.kept += chunk.slice(0, KEPT_CHARACTERS - this.kept.length);
    if (this.afterTilde && LETTER.test(chunk[0])) this.sectionMarks++;
    for (let i = chunk.indexOf("~"); i !== -1 && i + 1 < chunk.length; i = chunk.indexOf("~", i + 1)) {
      if (LETTER.test(chunk[i + 1])) this.sectionMarks++;
    }
    this.afterTilde = chunk.endsWith("~");
  }

  /** Whether the whole text pushed looks like a LAS or CSV file whose line breaks were removed. */
  lostLineBreaks(format: "las" | "csv"): boolean {
    if (this.sawLineBreak || this.characters < LOST_LINE_BREAKS_MIN_CHARACTERS) return false;
    return format === "las" ? this.sectionMarks >= 2 : numberCells(this.kept) >= 2;
  }
}
