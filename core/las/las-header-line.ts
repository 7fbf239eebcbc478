import type { LasHeaderItem } from "./las-document.js";

const isBlank = (char: string | undefined): boolean => char === " " || char === "\t";
const isDigit = (char: string | undefined): boolean => char !== undefined && char >= "0" && char <= "9";

/**
 * The colon that starts the description: the last colon of the line (CWLS LAS 2.0 update, delimiters
 * clarification), skipping colons between two digits so that a time like `13:45` in a value or a
 * description without its own colon is not taken for the delimiter.
 */
const descriptionColon = (text: string, from: number): number => {
  for (let i = text.length - 1; i >= from; i--) {
    if (text[i] === ":" && !(isDigit(text[i - 1]) && isDigit(text[i + 1]))) return i;
  }
  return -1;
};

/**
 * Reads a `MNEM.UNIT VALUE : DESCRIPTION` line (CWLS LAS 2.0, Appendix 1 Part 3): the mnemonic runs
 * to the first dot, the unit from right after the dot to the first blank, the value to the
 * description colon. Returns undefined for a line without a dot or whose mnemonic is empty or has blanks.
 */
export const parseLasHeaderLine = (text: string, line: number): LasHeaderItem | undefined => {
  const dot = text.indexOf(".");
  if (dot < 0) return undefined;
  const mnemonic = text.slice(0, dot).trim();
  if (mnemonic === "" || /\s/.test(mnemonic)) return undefined;
  const colon = descriptionColon(text, dot + 1);
  const valueEnd = colon < 0 ? text.length : colon;
  let unitEnd = dot + 1;
  while (unitEnd < valueEnd && !isBlank(text[unitEnd])) unitEnd++;
  return {
    mnemonic,
    unit: text.slice(dot + 1, unitEnd),
    value: text.slice(unitEnd, valueEnd).trim(),
    description: colon < 0 ? "" : text.slice(colon + 1).trim(),
    line,
  };
};
