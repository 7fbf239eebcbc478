import { WellFileError } from "../well-file-error.js";
import { GrowableColumn } from "../growable-column.js";
import { plainDecimal } from "../plain-decimal.js";
import { parseLasNumber } from "./las-number.js";

export interface LasDataReader {
  /** Reads one line of `~A` that is neither blank nor a comment. */
  line(text: string, lineNumber: number): void;
  /**
   * The columns read, one per curve, and whether the data were wrapped (declared or found);
   * throws when the last wrapped sample is incomplete.
   */
  finish(): { columns: Float64Array[]; wrapped: boolean };
  /** Removes and returns the complete samples read so far, one array per curve (a wrapped sample still being read stays). */
  take(): Float64Array[];
}

export interface LasDataReaderOptions {
  curveCount: number;
  /** `WRAP YES` in `~Version`. */
  wrapped: boolean;
  /** Called with the index (first) value of each complete sample and the line where the sample begins. */
  onSample: (index: number, line: number) => void;
  warn: (line: number, message: string) => void;
}

/** NaN as some programs write it (`NaN`, `nan`, `-nan`): read as an absent value, with a warning. */
const NOT_A_NUMBER = /^[+-]?nan$/i;

const values = (count: number): string => `${count} value${count === 1 ? "" : "s"}`;

/**
 * Reads the `~A` section line by line into one growable column per curve (CWLS LAS 2.0, Appendix 1
 * Part 4, ~A): with WRAP NO each line is one sample; with WRAP YES a sample runs over as many lines
 * as it needs, each sample starting on a new line. A WRAP NO file whose first data line is short is
 * read as wrapped, with a warning, as long as its samples then end at line ends. `NaN` is read as an
 * absent value (NaN), with one warning for the file, since LAS 2.0 marks absent values with the ~Well NULL.
 */
export const createLasDataReader = (options: LasDataReaderOptions): LasDataReader => {
  const { curveCount, onSample, warn } = options;
  const columns = Array.from({ length: curveCount }, () => new GrowableColumn());
  let wrapped: boolean | undefined = options.wrapped ? true : undefined;
  let lineValues = new Float64Array(Math.max(curveCount, 16));
  let filled = 0;
  let sampleLine = 0;
  let sampleIndex = NaN;
  let samples = 0;
  let firstLine: { line: number; count: number } | undefined;
  const nans = { count: 0, line: 0 };

  const readValues = (text: string, lineNumber: number): number => {
    let count = 0;
    let i = 0;
    while (i < text.length) {
      while (i < text.length && text.charCodeAt(i) <= 32) i++;
      if (i === text.length) break;
      const start = i;
      while (i < text.length && text.charCodeAt(i) > 32) i++;
      // Most tokens are plain decimals, read where they stand; the others are cut out and read in full.
      let value: number | undefined = plainDecimal(text, start, i);
      if (value !== value) {
        const token = text.slice(start, i);
        value = parseLasNumber(token);
        if (value === undefined && NOT_A_NUMBER.test(token)) {
          if (nans.count++ === 0) nans.line = lineNumber;
          value = NaN;
        }
        if (value === undefined) {
          throw new WellFileError("las_invalid_number", `${JSON.stringify(token)} in ~A is not a number`, lineNumber);
        }
      }
      if (count === lineValues.length) {
        const larger = new Float64Array(count * 2);
        larger.set(lineValues);
        lineValues = larger;
      }
      lineValues[count++] = value;
    }
    return count;
  };

  /** A data line of a WRAP NO file whose count of values is not the count of curves. */
  const unwrappedLineError = (count: number, lineNumber: number): WellFileError =>
    count > curveCount
      ? new WellFileError("las_too_many_values", `${values(count)} on a data line but ~Curve describes ${curveCount} curves`, lineNumber)
      : new WellFileError("las_too_few_values", `${values(count)} on a data line but ~Curve describes ${curveCount} curves (the file says WRAP NO)`, lineNumber);

  const readUnwrapped = (count: number, lineNumber: number): void => {
    if (count !== curveCount) throw unwrappedLineError(count, lineNumber);
    for (let c = 0; c < curveCount; c++) columns[c].push(lineValues[c]);
    samples++;
    onSample(lineValues[0], lineNumber);
  };

  /**
   * Values running past the end of a sample. In a file that says WRAP NO and was read as wrapped from its short first
   * line, this is told in the file's own terms: the first line is short when no sample ended before this line.
   */
  const pastSampleEnd = (count: number, lineNumber: number, samplesBefore: number): WellFileError => {
    if (!options.wrapped && firstLine !== undefined) {
      if (samplesBefore === 0) return unwrappedLineError(firstLine.count, firstLine.line);
      return new WellFileError(
        "las_too_many_values",
        `${values(count)} on a data line but ~Curve describes ${curveCount} curves, running past the end of the sample begun at line ${sampleLine}; ` +
          `the file says WRAP NO, but its first data line (line ${firstLine.line}) held only ${values(firstLine.count)}, so it was read as wrapped`,
        lineNumber,
      );
    }
    return new WellFileError(
      "las_too_many_values",
      `values continue past the end of the sample begun at line ${sampleLine} (${curveCount} curves); ` +
        "in wrapped data each sample starts on a new line",
      lineNumber,
    );
  };

  const readWrapped = (count: number, lineNumber: number): void => {
    const samplesBefore = samples;
    for (let v = 0; v < count; v++) {
      if (filled === 0) {
        if (v > 0) throw pastSampleEnd(count, lineNumber, samplesBefore);
        sampleLine = lineNumber;
        sampleIndex = lineValues[v];
      }
      columns[filled++].push(lineValues[v]);
      if (filled === curveCount) {
        filled = 0;
        samples++;
        onSample(sampleIndex, sampleLine);
      }
    }
  };

  const line = (text: string, lineNumber: number): void => {
    const count = readValues(text, lineNumber);
    if (count === 0) return;
    if (wrapped === undefined) {
      wrapped = count < curveCount;
      if (wrapped) {
        firstLine = { line: lineNumber, count };
        warn(
          lineNumber,
          `the file says WRAP NO but its first data line holds ${count} of ${curveCount} values; read as wrapped data`,
        );
      }
    }
    if (wrapped) readWrapped(count, lineNumber);
    else readUnwrapped(count, lineNumber);
  };

  const finish = (): { columns: Float64Array[]; wrapped: boolean } => {
    if (filled > 0) {
      if (!options.wrapped && firstLine !== undefined && samples === 0) throw unwrappedLineError(firstLine.count, firstLine.line);
      throw new WellFileError(
        "las_incomplete_sample",
        `the last sample, begun at line ${sampleLine}, has ${filled} of ${curveCount} values`,
        sampleLine,
      );
    }
    if (nans.count > 0) {
      const more = nans.count > 1 ? ` (and ${nans.count - 1} more)` : "";
      warn(nans.line, `NaN in ~A read as an absent value${more}; LAS 2.0 marks an absent value with the ~Well NULL value instead`);
    }
    return { columns: columns.map((column) => column.toFloat64Array()), wrapped: wrapped ?? false };
  };

  // The last curve's value is the last one of a sample, so its column counts the complete samples.
  const take = (): Float64Array[] => {
    const complete = columns[curveCount - 1].length;
    return columns.map((column) => column.take(complete));
  };

  return { line, finish, take };
};
