/**
 * Notes about places in a file (a line, a data row): how their numbers are written, and how a rule broken in many
 * places is told once.
 */

/** A number as a note writes it: ten significant digits, trailing zeros dropped. */
export const readableNumber = (value: number): string => String(Number(value.toPrecision(10)));

/** Tracks the first place where a rule is broken and how many times it is; `notes()` tells it once, with the count. */
export const firstPlaceTally = () => {
  let first: { line: number; message: string } | undefined;
  let count = 0;
  return {
    /** Counts one more place; the message is made only for the first. */
    add(line: number, message: () => string) {
      if (count++ === 0) first = { line, message: message() };
    },
    notes(): { line: number; message: string }[] {
      if (first === undefined) return [];
      const more = count > 1 ? ` (and ${count - 1} more place${count > 2 ? "s" : ""})` : "";
      return [{ line: first.line, message: first.message + more }];
    },
  };
};
