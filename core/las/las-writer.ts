import type { CurveInfo } from "../well-table.js";
import { isItemSection, type LasDocument, type LasSection } from "./las-document.js";
import { writeLasHeader, type LasItemToWrite } from "./las-header-writer.js";
import { AsciiText, asciiString, fullDoublesOf, writeColumnValue } from "../ascii-numbers.js";
import { readableNumber } from "../place-notes.js";
import { formatLasNumber, SHORTEST, type LasNumberFormat } from "./las-number-format.js";

export interface LasCurveToWrite {
  readonly mnemonic: string;
  readonly unit: string;
  readonly description: string;
  /** The `~Curve` value field (an API code …); usually empty. */
  readonly value?: string;
  readonly values: Float64Array;
  /** Defaults to `shortest`, which writes back exactly the numbers read. */
  readonly format?: LasNumberFormat;
}

export interface LasWriteInput {
  /** Header sections of the file the curves were read from (`document.sections`); omit to write a new file. */
  readonly header?: readonly LasSection[];
  /** Curves in column order, the index first; all of the same length. */
  readonly curves: readonly LasCurveToWrite[];
  /** Written as `~Well` NULL and for every NaN or infinite sample. */
  readonly nullValue: number;
  /** Replace the `~Well` item of the same mnemonic, or are added (WELL, COMP, FLD … of a new file). */
  readonly wellItems?: readonly LasItemToWrite[];
  /** Added to `~Parameter`. */
  readonly parameters?: readonly LasItemToWrite[];
  /** Added to `~Other`, one line each. */
  readonly otherLines?: readonly string[];
}

/** Size the text chunks handed out by `writeLas` reach before they are handed out. */
export const LAS_CHUNK_CHARACTERS = 64 * 1024;
const LINE_END = "\r\n";
const WIDTH_SAMPLE_ROWS = 256;


/** The curves of a document as read, ready to be written back unchanged (original mnemonics, shortest numbers). */
export const lasCurvesOf = (document: LasDocument): LasCurveToWrite[] =>
  lasCurveLayoutOf({ sections: document.sections, curves: document.table.curves }).map((curve, c) => ({ ...curve, values: document.table.columns[c] }));

/** The curves of a LAS header, ready to be written back unchanged once their samples come (original mnemonics and ~Curve values). */
export const lasCurveLayoutOf = (header: { readonly sections: readonly LasSection[]; readonly curves: readonly CurveInfo[] }): Omit<LasCurveToWrite, "values">[] => {
  const items = header.sections.flatMap((section) => (isItemSection(section) && section.kind === "curve" ? section.items : []));
  return header.curves.map((curve, c) => ({ mnemonic: items[c].mnemonic, unit: curve.unit, description: curve.description, value: items[c].value }));
};

/** STRT, STOP and STEP of a new file from its index curve: STEP is the regular spacing of the index, or 0 when it is irregular. */
export const lasIndexItems = (index: LasCurveToWrite, nullText: string): LasItemToWrite[] => {
  const format = (value: number): string => (Number.isFinite(value) ? formatLasNumber(value, index.format ?? SHORTEST) : nullText);
  const values = index.values;
  // STRT and STOP are the first and last index values present (an absent depth is no depth); a sampling
  // interrupted by an absent depth has no constant step, so STEP is then 0 (CWLS LAS 2.0, ~W section).
  let firstAt = 0;
  while (firstAt < values.length && !Number.isFinite(values[firstAt])) firstAt++;
  let lastAt = values.length - 1;
  while (lastAt > firstAt && !Number.isFinite(values[lastAt])) lastAt--;
  const present = firstAt < values.length;
  const first = values[firstAt];
  const last = values[lastAt];
  const complete = present && firstAt === 0 && lastAt === values.length - 1;
  let step = complete && values.length > 1 ? (last - first) / (values.length - 1) : 0;
  const tolerance = Math.abs(step) * 1e-3;
  for (let i = 1; i < values.length && step !== 0; i++) {
    if (!(Math.abs(values[i] - values[i - 1] - step) <= tolerance)) step = 0;
  }
  return [
    { mnemonic: "STRT", unit: index.unit, value: present ? format(first) : "0", description: "START DEPTH" },
    { mnemonic: "STOP", unit: index.unit, value: present ? format(last) : "0", description: "STOP DEPTH" },
    { mnemonic: "STEP", unit: index.unit, value: readableNumber(step), description: "STEP" },
  ];
};

/** A LAS file described before its samples are known: the curves without values, and the index items of a new file. */
export interface LasLayout extends Omit<LasWriteInput, "curves"> {
  readonly curves: readonly Omit<LasCurveToWrite, "values">[];
  /** STRT, STOP and STEP; needed only for a new file (no `header`), whose index range must be known in advance. */
  readonly indexItems?: readonly LasItemToWrite[];
}

/** Writes a LAS file batch by batch, so that a file of any length is written in bounded memory. */
export interface LasTextWriter {
  /** The header, the curve-name comment line and `~A`; the column widths are set from the first rows of `sample`. */
  begin(sample: readonly Float64Array[]): string;
  /**
   * Appends the data lines of a batch of rows (one array per curve; rows `from` to `to`, all by default) to `text`;
   * consecutive batches give the text of one.
   */
  rows(text: AsciiText, columns: readonly Float64Array[], from?: number, to?: number): void;
}

const SPACE = 32;

/**
 * A LAS 2.0 writer (WRAP NO, one sample per line, CRLF line ends as the CWLS standard's line lengths assume).
 * The header is built at once: a `RangeError` names what cannot be written before any text is handed out.
 */
export const createLasTextWriter = (layout: LasLayout): LasTextWriter => {
  if (layout.curves.length === 0) throw new RangeError("a LAS file needs at least one curve (the index)");
  if (!Number.isFinite(layout.nullValue)) throw new RangeError(`the null value must be a finite number, not ${layout.nullValue}`);
  const nullText = String(layout.nullValue);
  const formats = layout.curves.map((curve) => curve.format ?? SHORTEST);
  const header = writeLasHeader({
    sections: layout.header ?? [],
    curves: layout.curves.map(({ mnemonic, unit, value, description }) => ({ mnemonic, unit, value, description })),
    indexItems: layout.indexItems ?? [],
    nullValue: nullText,
    wellItems: layout.wellItems ?? [],
    parameters: layout.parameters ?? [],
    otherLines: layout.otherLines ?? [],
  });
  let widths: number[] | undefined;
  const checked = (columns: readonly Float64Array[]): number => {
    if (columns.length !== layout.curves.length) throw new RangeError(`${layout.curves.length} curves but ${columns.length} columns`);
    const length = columns[0].length;
    columns.forEach((column, c) => {
      if (column.length !== length) throw new RangeError(`curve ${layout.curves[c].mnemonic} has ${column.length} values but ${layout.curves[0].mnemonic} has ${length}`);
    });
    return length;
  };
  /** A value of curve `c`; `fullDouble` as `fullDoublesOf` judged the curve's batch. */
  const write = (text: AsciiText, value: number, c: number, fullDouble = false): void => {
    if (Number.isFinite(value)) writeColumnValue(text, value, formats[c], fullDouble);
    else text.ascii(nullText);
  };
  const begin = (sample: readonly Float64Array[]): string => {
    checked(sample);
    // Widths that line the columns up for typical values; a longer value still stands apart by one blank.
    const scratch = new AsciiText(64);
    widths = layout.curves.map((curve, c) => {
      let width = curve.mnemonic.length;
      for (const value of [NaN, ...sample[c].subarray(0, WIDTH_SAMPLE_ROWS)]) {
        write(scratch, value, c);
        width = Math.max(width, scratch.take().length);
      }
      return width;
    });
    const fixed = widths;
    const names = layout.curves.map((curve, c) => curve.mnemonic.padStart(fixed[c])).join(" ");
    return [header.join(LINE_END), LINE_END, "#", names, LINE_END, "~A", LINE_END].join("");
  };
  const rows = (text: AsciiText, columns: readonly Float64Array[], from = 0, to?: number): void => {
    if (widths === undefined) throw new Error("begin() comes before the data lines");
    const count = Math.min(checked(columns), to ?? Infinity);
    const fullDoubles = fullDoublesOf(columns.map((column) => column.subarray(from, Math.max(from, count))), formats);
    for (let i = from; i < count; i++) {
      for (let c = 0; c < columns.length; c++) {
        text.byte(SPACE);
        const start = text.length;
        write(text, columns[c][i], c, fullDoubles[c]);
        text.padFrom(start, widths[c] - (text.length - start));
      }
      text.byte(13);
      text.byte(10);
    }
  };
  return { begin, rows };
};

/**
 * Writes a LAS 2.0 file (see `createLasTextWriter`) as text chunks of about `LAS_CHUNK_CHARACTERS`, so that a
 * server can stream it. The input is checked, and the header built, before the first chunk is asked for: a
 * `RangeError` names what cannot be written.
 */
export const writeLas = (input: LasWriteInput): Generator<string> => {
  const index = input.curves[0];
  const writer = createLasTextWriter({ ...input, indexItems: index === undefined ? [] : lasIndexItems(index, String(input.nullValue)) });
  const columns = input.curves.map((curve) => curve.values);
  // begin() checks the columns' lengths, here, before a generator would defer it to the first chunk.
  return chunks(writer, columns, writer.begin(columns));
};

function* chunks(writer: LasTextWriter, columns: Float64Array[], header: string): Generator<string> {
  let head = header;
  const text = new AsciiText();
  const rows = columns[0].length;
  for (let i = 0; i < rows; i++) {
    writer.rows(text, columns, i, i + 1);
    if (head.length + text.length >= LAS_CHUNK_CHARACTERS) {
      yield head + asciiString(text.take());
      head = "";
    }
  }
  if (head !== "" || text.length > 0) yield head + asciiString(text.take());
}
