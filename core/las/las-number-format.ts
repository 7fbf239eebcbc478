import { AsciiText, asciiString, SHORTEST, writeNumber, type NumberFormat } from "../ascii-numbers.js";

/** How the samples of one LAS curve are written (see `NumberFormat`). */
export type LasNumberFormat = NumberFormat;
export { SHORTEST };

const scratch = new AsciiText(64);

/** `value` as text in `format`; the caller writes the null value for non-finite samples. */
export const formatLasNumber = (value: number, format: LasNumberFormat): string => {
  writeNumber(scratch, value, format);
  return asciiString(scratch.take());
};
