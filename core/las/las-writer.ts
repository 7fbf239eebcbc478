import { isItemSection, type LasDocument, type LasSection } from "./las-document.js";
import { writeLasHeader, type LasItemToWrite } from "./las-header-writer.js";
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

const readable = (value: number): string => String(Number(value.toPrecision(10)));

/** The curves of a document as read, ready to be written back unchanged (original mnemonics, shortest numbers). */
export const lasCurvesOf = (document: LasDocument): LasCurveToWrite[] => {
  const items = document.sections.flatMap((section) =>
    isItemSection(section) && section.kind === "curve" ? section.items : [],
  );
  return document.table.curves.map((curve, c) => ({
    mnemonic: items[c].mnemonic,
    unit: curve.unit,
    description: curve.description,
    value: items[c].value,
    values: document.table.columns[c],
  }));
};

/** STRT, STOP and STEP of a new file: STEP is the regular spacing of the index, or 0 when it is irregular. */
const indexItems = (index: LasCurveToWrite, format: (value: number) => string): LasItemToWrite[] => {
  const values = index.values;
  const first = values[0];
  const last = values[values.length - 1];
  let step = values.length > 1 ? (last - first) / (values.length - 1) : 0;
  const tolerance = Math.abs(step) * 1e-3;
  for (let i = 1; i < values.length && step !== 0; i++) {
    if (!(Math.abs(values[i] - values[i - 1] - step) <= tolerance)) step = 0;
  }
  return [
    { mnemonic: "STRT", unit: index.unit, value: values.length > 0 ? format(first) : "0", description: "START DEPTH" },
    { mnemonic: "STOP", unit: index.unit, value: values.length > 0 ? format(last) : "0", description: "STOP DEPTH" },
    { mnemonic: "STEP", unit: index.unit, value: readable(step), description: "STEP" },
  ];
};

const checkInput = (input: LasWriteInput): void => {
  if (input.curves.length === 0) throw new RangeError("a LAS file needs at least one curve (the index)");
  if (!Number.isFinite(input.nullValue)) throw new RangeError(`the null value must be a finite number, not ${input.nullValue}`);
  const length = input.curves[0].values.length;
  for (const curve of input.curves) {
    if (curve.values.length !== length) {
      throw new RangeError(`curve ${curve.mnemonic} has ${curve.values.length} values but ${input.curves[0].mnemonic} has ${length}`);
    }
  }
};

/**
 * Writes a LAS 2.0 file (WRAP NO, one sample per line, CRLF line ends as the CWLS standard's line
 * lengths assume) as text chunks of about `LAS_CHUNK_CHARACTERS`, so that a server can stream it.
 * The input is checked, and the header built, before the first chunk is asked for: a `RangeError`
 * names what cannot be written.
 */
export const writeLas = (input: LasWriteInput): Generator<string> => {
  checkInput(input);
  const nullText = String(input.nullValue);
  const formatters = input.curves.map((curve) => {
    const format = curve.format ?? SHORTEST;
    return (value: number): string => (Number.isFinite(value) ? formatLasNumber(value, format) : nullText);
  });
  const header = writeLasHeader({
    sections: input.header ?? [],
    curves: input.curves.map(({ mnemonic, unit, value, description }) => ({ mnemonic, unit, value, description })),
    indexItems: indexItems(input.curves[0], formatters[0]),
    nullValue: nullText,
    wellItems: input.wellItems ?? [],
    parameters: input.parameters ?? [],
    otherLines: input.otherLines ?? [],
  });
  return chunks(input.curves, formatters, header);
};

/** Widths that line the columns up for typical values; a longer value still stands apart by one blank. */
const columnWidths = (curves: readonly LasCurveToWrite[], formatters: ((value: number) => string)[]): number[] =>
  curves.map((curve, c) => {
    let width = curve.mnemonic.length;
    let min = Infinity;
    let max = -Infinity;
    for (const value of curve.values) {
      if (value < min) min = value;
      if (value > max) max = value;
    }
    const candidates = [min, max, NaN, ...curve.values.subarray(0, WIDTH_SAMPLE_ROWS)];
    for (const value of candidates) width = Math.max(width, formatters[c](value).length);
    return width;
  });

function* chunks(
  curves: readonly LasCurveToWrite[],
  formatters: ((value: number) => string)[],
  header: string[],
): Generator<string> {
  const widths = columnWidths(curves, formatters);
  const names = curves.map((curve, c) => curve.mnemonic.padStart(widths[c])).join(" ");
  let parts: string[] = [header.join(LINE_END), LINE_END, "#", names, LINE_END, "~A", LINE_END];
  let size = parts.reduce((sum, part) => sum + part.length, 0);
  const rows = curves[0].values.length;
  for (let i = 0; i < rows; i++) {
    let row = "";
    for (let c = 0; c < curves.length; c++) row += " " + formatters[c](curves[c].values[i]).padStart(widths[c]);
    parts.push(row, LINE_END);
    size += row.length + LINE_END.length;
    if (size >= LAS_CHUNK_CHARACTERS) {
      yield parts.join("");
      parts = [];
      size = 0;
    }
  }
  if (parts.length > 0) yield parts.join("");
}
