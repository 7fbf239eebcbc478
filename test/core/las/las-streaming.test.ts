import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createLasReader, parseLas } from "../../../core/las/las-reader.js";
import type { LasDocument } from "../../../core/las/las-document.js";
import { WellFileError } from "../../../core/well-file-error.js";
import { lasFixture } from "../../fixtures/las/read-fixture.js";

const readInChunks = (chunks: readonly string[]): LasDocument => {
  const reader = createLasReader();
  for (const chunk of chunks) reader.push(chunk);
  return reader.end();
};

const cutEvery = (text: string, size: number): string[] => {
  const chunks: string[] = [];
  for (let i = 0; i < text.length; i += size) chunks.push(text.slice(i, i + size));
  return chunks;
};

const FIXTURES = [
  "unwrapped-metric.las",
  "wrapped.las",
  "las12-swapped.las",
  "decreasing-depth.las",
  "irregular-step.las",
  "step-mismatch.las",
  "duplicate-mnemonics.las",
  "wrap-no-but-wrapped.las",
  "replacement-character.las",
];

describe("createLasReader fed in chunks", () => {
  it.each(FIXTURES)("reads %s in chunks of 1, 2, 3, 7 and 64 characters as it reads the whole text", (name) => {
    const text = lasFixture(name).replaceAll("\n", "\r\n");
    const whole = parseLas(text);
    for (const size of [1, 2, 3, 7, 64]) expect(readInChunks(cutEvery(text, size))).toEqual(whole);
  });

  it("gives the same document for every split point of a small CRLF file: inside numbers, header lines and between CR and LF", () => {
    const text = `\uFEFF${lasFixture("wrapped.las").replaceAll("\n", "\r\n")}`;
    const whole = parseLas(text);
    for (let at = 0; at <= text.length; at++) {
      expect(readInChunks([text.slice(0, at), text.slice(at)])).toEqual(whole);
    }
  });

  it("gives the same document for random cuts into many chunks (property)", () => {
    const text = lasFixture("unwrapped-metric.las").replaceAll("\n", "\r\n");
    const whole = parseLas(text);
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: text.length - 1 }), { maxLength: 40 }), (cuts) => {
        const points = [0, ...cuts.sort((a, b) => a - b), text.length];
        const chunks = points.slice(1).map((end, i) => text.slice(points[i], end));
        expect(readInChunks(chunks)).toEqual(whole);
      }),
    );
  });

  it("names the same line in an error whatever the chunks", () => {
    const text = lasFixture("irregular-step.las").replace("101.1 55", "101.1 5x5").replaceAll("\n", "\r\n");
    for (const size of [1, 5, 1000]) {
      const reader = createLasReader();
      const failure = (() => {
        try {
          for (const chunk of cutEvery(text, size)) reader.push(chunk);
          reader.end();
        } catch (error) {
          return error;
        }
      })();
      expect(failure).toBeInstanceOf(WellFileError);
      expect(failure).toMatchObject({ code: "las_invalid_number", line: 15 });
    }
  });
});

/** Rows taken after every chunk, then those left at the end, joined per curve. */
const takenInChunks = (chunks: readonly string[]) => {
  const reader = createLasReader();
  const taken: number[][] = [];
  const take = (columns: Float64Array[]) => columns.forEach((column, c) => (taken[c] ??= []).push(...column));
  for (const chunk of chunks) {
    reader.push(chunk);
    take(reader.takeRows());
  }
  const document = reader.end();
  take(document.table.columns);
  return { document, taken, header: reader.header() };
};

describe("createLasReader handing out rows as they are read (takeRows)", () => {
  it.each(FIXTURES)("%s: the rows taken after each chunk, then those left, are the rows of the whole text, whole samples only", (name) => {
    const text = lasFixture(name).replaceAll("\n", "\r\n");
    const whole = parseLas(text);
    for (const size of [1, 7, 64]) {
      const { document, taken, header } = takenInChunks(cutEvery(text, size));
      expect(taken.map((column) => Float64Array.from(column))).toEqual(whole.table.columns);
      expect(document.warnings).toEqual(whole.warnings);
      expect(header?.curves).toEqual(whole.table.curves);
      expect(header?.nullValue).toEqual(whole.well.nullValue);
    }
  });

  it("takes nothing before ~A, and never part of a wrapped sample (property: any split points)", () => {
    const text = lasFixture("wrapped.las").replaceAll("\n", "\r\n");
    const whole = parseLas(text);
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 1, max: text.length - 1 }), { maxLength: 12 }), (cuts) => {
        const points = [0, ...cuts.sort((a, b) => a - b), text.length];
        const chunks = points.slice(1).map((end, i) => text.slice(points[i], end));
        const reader = createLasReader();
        for (const chunk of chunks) {
          reader.push(chunk);
          const rows = reader.takeRows();
          if (reader.header() === undefined) expect(rows).toEqual([]);
          else expect(new Set(rows.map((column) => column.length)).size).toBeLessThanOrEqual(1);
        }
        const { taken } = takenInChunks(chunks);
        expect(taken.map((column) => Float64Array.from(column))).toEqual(whole.table.columns);
      }),
    );
  });
});
