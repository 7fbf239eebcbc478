import { expect } from "vitest";
import { WellFileError } from "../../core/well-file-error.js";

/** The WellFileError that reading a text throws; the test fails when it throws something else or nothing. */
export const wellFileFailure = (read: (text: string) => unknown, text: string): WellFileError => {
  try {
    read(text);
  } catch (error) {
    expect(error).toBeInstanceOf(WellFileError);
    return error as WellFileError;
  }
  throw new Error("the text was read without an error");
};
