import { WellFileError } from "../well-file-error.js";
import { GrowableColumn } from "../growable-column.js";
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

/**
 * Reads the `~A` section line by line into one growable column per curve (CWLS LAS 2.0, Appendix 1
 * Part 4, ~A): with WRAP NO each line is one sample; with WRAP YES a sample runs over as many lines
 * as it needs, each sample starting on a new line. A WRAP NO file whose first data line is short is
 * read as wrapped, with a warning, as long as its samples then end at line ends.
 */
export const createLasDataReader = (options: LasDataReaderOptions): LasDataReader => {
  const { curveCount, onSample, warn } = options;
  const columns = Array.from({ length: curveCount }, () => new GrowableColumn());
  let wrapped: boolean | undefined = options.wrapped ? true : undefined;
  let lineValues = new Float64Array(Math.max(curveCount, 16));
  let filled = 0;
  let sampleLine = 0;
  let sampleIndex = NaN;

  const readValues = (text: string, lineNumber: number): number => {
    let count = 0;
    let i = 0;
    while (i < text.length) {
      while (i < text.length && text.charCodeAt(i) <= 32) i++;
      if (i === text.length) break;
      const start = i;
      while (i < text.length && text.charCodeAt(i) > 32) i++;
      const token = text.slice(start, i);
      const value = parseLasNumber(token);
      if (value === undefined) {
        throw new WellFileError("las_invalid_number", `${JSON.stringify(token)} in ~A is not a number`, lineNumber);
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

  const readUnwrapped = (count: number, lineNumber: number): void => {
    if (count > curveCount) {
      throw new WellFileError(
        "las_too_many_values",
        `${count} values on a data line but ~Curve describes ${curveCount} curves`,
        lineNumber,
      );
    }
    if (count < curveCount) {
      throw new WellFileError(
        "las_too_few_values",
        `${count} values on a data line but ~Curve describes ${curveCount} curves (the file says WRAP NO)`,
        lineNumber,
      );
    }
    for (let c = 0; c < curveCount; c++) columns[c].push(lineValues[c]);
    onSample(lineValues[0], lineNumber);
  };

  const readWrapped = (count: number, lineNumber: number): void => {
    for (let v = 0; v < count; v++) {
      if (filled === 0) {
        if (v > 0) {
          throw new WellFileError(
            "las_too_many_values",
            `values continue past the end of the sample begun at line ${sampleLine} (${curveCount} curves); ` +
              "in wrapped data each sample starts on a new line",
            lineNumber,
          );
        }
        sampleLine = lineNumber;
        sampleIndex = lineValues[v];
      }
      columns[filled++].push(lineValues[v]);
      if (filled === curveCount) {
        filled = 0;
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
      throw new WellFileError(
        "las_incomplete_sample",
        `the last sample, begun at line ${sampleLine}, has ${filled} of ${curveCount} values`,
        sampleLine,
      );
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
