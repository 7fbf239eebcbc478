import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createLineSplitter } from "../../../core/las/text-line-splitter.js";

const linesOf = (...chunks: string[]): [string, number][] => {
  const lines: [string, number][] = [];
  const splitter = createLineSplitter((text, line) => lines.push([text, line]));
  for (const chunk of chunks) splitter.push(chunk);
  splitter.end();
  return lines;
};

describe("createLineSplitter", () => {
  it("ends a line at LF, CRLF or a lone CR and numbers lines from 1, empty ones included (common practice for DOS, Unix and old Mac text)", () => {
    expect(linesOf("a\nb\r\nc\rd\n\ne")).toEqual([
      ["a", 1],
      ["b", 2],
      ["c", 3],
      ["d", 4],
      ["", 5],
      ["e", 6],
    ]);
  });

  it("counts CRLF once when a chunk ends between CR and LF", () => {
    expect(linesOf("a\r", "\nb\r", "", "\n")).toEqual([
      ["a", 1],
      ["b", 2],
    ]);
  });

  it("ends the last line at a final lone CR, or at the end of the text", () => {
    expect(linesOf("a\r")).toEqual([["a", 1]]);
    expect(linesOf("a\nb")).toEqual([
      ["a", 1],
      ["b", 2],
    ]);
    expect(linesOf("")).toEqual([]);
  });

  it("drops a UTF-8 byte-order mark at the start only, also when it arrives alone (Unicode Standard, ch. 23.8 Specials: U+FEFF at the start is a signature; from memory)", () => {
    expect(linesOf("", "\uFEFF", "a\n\uFEFFb")).toEqual([
      ["a", 1],
      ["\uFEFFb", 2],
    ]);
  });

  it("gives the same lines however the text is cut into chunks (property)", () => {
    const text = fc.array(fc.constantFrom("a", "1", " ", "\r", "\n", "\r\n", "~"), { maxLength: 60 }).map((parts) => parts.join(""));
    fc.assert(
      fc.property(text, fc.array(fc.nat(), { maxLength: 8 }), (whole, cuts) => {
        const points = [...new Set(cuts.map((cut) => cut % (whole.length + 1)))].sort((a, b) => a - b);
        const chunks = [0, ...points].map((from, i) => whole.slice(from, [...points, whole.length][i]));
        expect(linesOf(...chunks)).toEqual(linesOf(whole));
      }),
    );
  });
});
