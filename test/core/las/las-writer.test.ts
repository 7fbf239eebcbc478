import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findHeaderItem, type LasDocument } from "../../../core/las/las-document.js";
import { parseLas } from "../../../core/las/las-reader.js";
import { AsciiText } from "../../../core/ascii-numbers.js";
import { createLasTextWriter, LAS_CHUNK_CHARACTERS, lasCurvesOf, writeLas, type LasCurveToWrite, type LasWriteInput } from "../../../core/las/las-writer.js";
import { lasFixture } from "../../fixtures/las/read-fixture.js";

const written = (input: LasWriteInput): string => [...writeLas(input)].join("");

const rewrite = (document: LasDocument, extra: Partial<LasWriteInput> = {}): string =>
  written({
    header: document.sections,
    curves: lasCurvesOf(document),
    nullValue: document.table.nullValue ?? -999.25,
    ...extra,
  });

const youngsModulus: LasCurveToWrite = {
  mnemonic: "YME",
  unit: "GPA",
  description: "YOUNGS MODULUS",
  values: new Float64Array([12.3456789, NaN, 31.0000004, Infinity]),
  format: { kind: "significant", digits: 6 },
};

describe("writeLas after parseLas (round trip)", () => {
  const FIXTURES = [
    "unwrapped-metric.las",
    "wrapped.las",
    "las12-swapped.las",
    "decreasing-depth.las",
    "irregular-step.las",
    "duplicate-mnemonics.las",
    "wrap-no-but-wrapped.las",
  ];

  it.each(FIXTURES)("writes %s back with the same curves, samples and header items (shortest round-trip numbers, ours)", (name) => {
    const original = parseLas(lasFixture(name));
    const back = parseLas(rewrite(original));
    expect(back.table).toEqual(original.table);
    expect(back.well).toEqual(original.well);
    for (const kind of ["well", "parameter"] as const) {
      const items = (document: LasDocument) =>
        document.sections.flatMap((section) => ("items" in section && section.kind === kind ? section.items : []))
          .map(({ mnemonic, unit, value, description }) => ({ mnemonic, unit, value, description }));
      expect(items(back)).toEqual(items(original));
    }
  });

  it("writes VERS 2.0 and WRAP NO whatever was read, so a LAS 1.2 or wrapped file comes back as plain LAS 2.0 (CWLS LAS 2.0, Appendix 1 Part 4, ~V)", () => {
    for (const name of ["wrapped.las", "las12-swapped.las"]) {
      const back = parseLas(rewrite(parseLas(lasFixture(name))));
      expect(back.version).toBe("2.0");
      expect(back.wrapped).toBe(false);
      expect(back.warnings).toEqual([]);
    }
  });

  it("appends computed curves at their own precision, NaN and infinities as the NULL value, with the same row count", () => {
    const original = parseLas(lasFixture("unwrapped-metric.las"));
    const back = parseLas(rewrite(original, { curves: [...lasCurvesOf(original), youngsModulus] }));
    expect(back.table.curves.at(-1)).toEqual({ mnemonic: "YME", unit: "GPA", description: "YOUNGS MODULUS" });
    expect(Array.from(back.table.columns.at(-1)!)).toEqual([12.3457, -999.25, 31, -999.25]);
    expect(back.table.columns.slice(0, -1)).toEqual(original.table.columns);
    expect(back.table.columns[0].length).toBe(4);
  });

  it("keeps the original sections in order, ~Other lines included, and appends extra ~Parameter items and ~Other lines to them", () => {
    const original = parseLas(lasFixture("unwrapped-metric.las"));
    const text = rewrite(original, {
      parameters: [{ mnemonic: "QCVER", value: "0.1.0", description: "PROGRAM VERSION" }],
      otherLines: ["QC flag bit 0 = an input is missing"],
    });
    const back = parseLas(text);
    expect(back.sections.map((section) => section.title)).toEqual(original.sections.map((section) => section.title).slice(0, -1).concat("~A"));
    expect(findHeaderItem(back, "parameter", "QCVER")?.value).toBe("0.1.0");
    expect(findHeaderItem(back, "parameter", "BS")?.value).toBe("215.9000");
    const other = back.sections.find((section) => section.kind === "other");
    expect(other !== undefined && "lines" in other ? other.lines.map((line) => line.text) : []).toEqual([
      "   Sampled every quarter metre over a short test interval.",
      "   Second remark line: values with colons are fine.",
      "QC flag bit 0 = an input is missing",
    ]);
  });

  it("adds ~Parameter and ~Other sections when the original has none", () => {
    const original = parseLas(lasFixture("irregular-step.las"));
    const back = parseLas(rewrite(original, { parameters: [{ mnemonic: "QCVER", value: "1" }], otherLines: ["note"] }));
    expect(back.sections.map((section) => section.kind)).toEqual(["version", "well", "curve", "parameter", "other", "data"]);
  });

  it("writes the NULL value asked for into ~Well, replacing the file's own", () => {
    const original = parseLas(lasFixture("decreasing-depth.las"));
    const back = parseLas(rewrite(original, { nullValue: -999.25 }));
    expect(back.well.nullValue).toBe(-999.25);
    expect(findHeaderItem(back, "well", "NULL")?.value).toBe("-999.25");
  });

  it("writes original curves at fixed decimals when asked, equal to the values at that precision", () => {
    const original = parseLas(lasFixture("unwrapped-metric.las"));
    const curves = lasCurvesOf(original).map((curve) => ({ ...curve, format: { kind: "decimals", decimals: 1 } as const }));
    const back = parseLas(rewrite(original, { curves }));
    back.table.columns.forEach((values, c) => {
      expect(Array.from(values)).toEqual(Array.from(original.table.columns[c], (value) => Number(value.toFixed(1))));
    });
  });
});

describe("writeLas for a new file", () => {
  const depth: LasCurveToWrite = {
    mnemonic: "DEPT",
    unit: "M",
    description: "DEPTH",
    values: new Float64Array([1200, 1200.1524, 1200.3048, 1200.4572]),
    format: { kind: "decimals", decimals: 4 },
  };

  it("writes the minimal valid header ~V ~W ~C ~A with STRT, STOP, the regular STEP, NULL and the other required ~Well items (CWLS LAS 2.0, Appendix 1 Part 4)", () => {
    const text = written({ curves: [depth, youngsModulus], nullValue: -999.25, wellItems: [{ mnemonic: "WELL", value: "KESTREL FLATS 3" }] });
    const back = parseLas(text);
    expect(back.sections.map((section) => section.kind)).toEqual(["version", "well", "curve", "data"]);
    expect(back.well).toMatchObject({ startIndex: 1200, stopIndex: 1200.4572, step: 0.1524, nullValue: -999.25, indexUnit: "M", wellName: "KESTREL FLATS 3" });
    for (const mnemonic of ["COMP", "FLD", "LOC", "PROV", "SRVC", "DATE", "UWI"]) expect(findHeaderItem(back, "well", mnemonic)).toBeDefined();
    expect(back.warnings).toEqual([]);
    expect(text.split("\r\n").find((line) => line.includes("STRT"))).toMatch(/^ STRT\.M +1200\.0000 +: START DEPTH$/);
  });

  it("writes STEP 0 for an irregular index and for a single sample (CWLS LAS 2.0, Appendix 1 Part 4, ~W STEP)", () => {
    const irregular = { ...depth, values: new Float64Array([10, 10.5, 11.5]) };
    expect(parseLas(written({ curves: [irregular], nullValue: -999.25 })).well.step).toBe(0);
    const single = { ...depth, values: new Float64Array([10]) };
    expect(parseLas(written({ curves: [single], nullValue: -999.25 })).well).toMatchObject({ startIndex: 10, stopIndex: 10, step: 0 });
  });

  it("takes STRT and STOP from the first and last depths present, and writes STEP 0 when a depth is absent (CWLS LAS 2.0, ~W: STRT and STOP are the first and last index values)", () => {
    const leading = { ...depth, values: new Float64Array([NaN, 10, 10.5, 11]) };
    expect(parseLas(written({ curves: [leading], nullValue: -999.25 })).well).toMatchObject({ startIndex: 10, stopIndex: 11, step: 0 });
    const trailing = { ...depth, values: new Float64Array([10, 10.5, 11, NaN]) };
    expect(parseLas(written({ curves: [trailing], nullValue: -999.25 })).well).toMatchObject({ startIndex: 10, stopIndex: 11, step: 0 });
    const inside = { ...depth, values: new Float64Array([10, NaN, 11]) };
    expect(parseLas(written({ curves: [inside], nullValue: -999.25 })).well).toMatchObject({ startIndex: 10, stopIndex: 11, step: 0 });
  });

  it("writes one sample per line with CRLF line ends and the columns lined up", () => {
    const text = written({ curves: [depth, youngsModulus], nullValue: -999.25 });
    const data = text.split("\r\n").slice(-5, -1);
    expect(data).toEqual([" 1200.0000 12.3457", " 1200.1524 -999.25", " 1200.3048      31", " 1200.4572 -999.25"]);
    expect(text.endsWith("\r\n")).toBe(true);
    expect(text.replaceAll("\r\n", "")).not.toMatch(/[\r\n]/);
  });

  it("hands the text out in chunks of about 64 KiB that join into the whole file", () => {
    const rows = 20_000;
    const index = Float64Array.from({ length: rows }, (_, i) => 1000 + i * 0.5);
    const values = Float64Array.from({ length: rows }, (_, i) => Math.sin(i));
    const chunks = [...writeLas({ curves: [{ ...depth, values: index }, { ...youngsModulus, values }], nullValue: -999.25 })];
    expect(chunks.length).toBeGreaterThan(3);
    for (const chunk of chunks.slice(0, -1)) {
      expect(chunk.length).toBeGreaterThanOrEqual(LAS_CHUNK_CHARACTERS);
      expect(chunk.length).toBeLessThan(LAS_CHUNK_CHARACTERS + 200);
    }
    expect(parseLas(chunks.join("")).table.columns[0]).toEqual(index);
  });
});

describe("writeLas refuses what LAS cannot carry", () => {
  const index: LasCurveToWrite = { mnemonic: "DEPT", unit: "M", description: "DEPTH", values: new Float64Array([1, 2]) };

  it("throws a RangeError before any text is asked for", () => {
    expect(() => writeLas({ curves: [], nullValue: -999.25 })).toThrow(RangeError);
    expect(() => writeLas({ curves: [index], nullValue: NaN })).toThrow(/null value must be a finite number/);
    expect(() => writeLas({ curves: [index, { ...index, mnemonic: "GR", values: new Float64Array(3) }], nullValue: -1 })).toThrow(
      "curve GR has 3 values but DEPT has 2",
    );
  });

  it("refuses a header item the line grammar would read back differently (CWLS LAS 2.0, Appendix 1 Part 3)", () => {
    const bad = [
      { mnemonic: "QC", description: "flags: see below" },
      { mnemonic: "Q C", value: "1" },
      { mnemonic: "QC.X", value: "1" },
      { mnemonic: "QC", unit: "G CC", value: "1" },
    ];
    for (const item of bad) expect(() => writeLas({ curves: [index], nullValue: -1, parameters: [item] })).toThrow(RangeError);
  });

  it("refuses an ~Other line that would start a section or hold a line break (CWLS LAS 2.0, Appendix 1 Part 3, ~)", () => {
    expect(() => writeLas({ curves: [index], nullValue: -1, otherLines: ["  ~A not data"] })).toThrow(RangeError);
    expect(() => writeLas({ curves: [index], nullValue: -1, otherLines: ["two\nlines"] })).toThrow(RangeError);
  });
});

describe("writeLas then parseLas on random well tables (property)", () => {
  const NULL_VALUE = -999.25;
  const table = fc.integer({ min: 1, max: 6 }).chain((curveCount) =>
    fc.array(fc.array(fc.oneof(fc.double({ noDefaultInfinity: true }), fc.constant(NaN)), { minLength: curveCount, maxLength: curveCount }), {
      // At least one row: an ~A without data rows is refused on reading (README: a header-only file is a 422).
      minLength: 1,
      maxLength: 40,
    }).map((rows) => Array.from({ length: curveCount }, (_, c) => Float64Array.from(rows, (row) => row[c]))),
  );
  const curvesOf = (columns: Float64Array[]): LasCurveToWrite[] =>
    columns.map((values, c) => ({ mnemonic: c === 0 ? "DEPT" : `C${c}`, unit: "U", description: `CURVE ${c}`, values }));
  const expected = (columns: Float64Array[]) =>
    columns.map((values) => Array.from(values, (value) => (Number.isNaN(value) ? NULL_VALUE : value === 0 ? 0 : value)));

  /** The same file with WRAP YES: the index alone on its line, then at most four values a line (CWLS LAS 2.0, Appendix 1 Part 4, ~A). */
  const wrap = (text: string): string => {
    const lines = text.split("\r\n");
    const dataStart = lines.indexOf("~A") + 1;
    const data = lines.slice(dataStart).filter((line) => line !== "").flatMap((line) => {
      const [index, ...values] = line.trim().split(/ +/);
      const wrapped = [index];
      for (let i = 0; i < values.length; i += 4) wrapped.push("  " + values.slice(i, i + 4).join(" "));
      return wrapped;
    });
    return [...lines.slice(0, dataStart), ...data].join("\n").replace(/WRAP\.(\s+)NO /, "WRAP.$1YES");
  };

  it("reads back the numbers written, NaN as the NULL value, unwrapped and wrapped", () => {
    fc.assert(
      fc.property(table, (columns) => {
        const text = written({ curves: curvesOf(columns), nullValue: NULL_VALUE });
        const unwrapped = parseLas(text);
        expect(unwrapped.table.columns.map((values) => Array.from(values, (value) => (value === 0 ? 0 : value)))).toEqual(expected(columns));
        const wrapped = parseLas(wrap(text));
        expect(wrapped.wrapped).toBe(true);
        expect(wrapped.table.columns).toEqual(unwrapped.table.columns);
      }),
    );
  });
});

describe("createLasTextWriter rows of a range (a streamed answer's batches)", () => {
  it("writes rows from…to of full-precision columns as the whole range does, every value read back exactly", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e9, max: 1e9, noNaN: true }), { minLength: 2, maxLength: 60 }), fc.nat(), (values, cut) => {
        const depth = Float64Array.from(values, (_, i) => 1000 + i * 0.5);
        const computed = Float64Array.from(values);
        const curves = [
          { mnemonic: "DEPT", unit: "M", description: "DEPTH" },
          { mnemonic: "CMP", unit: "GPA", description: "COMPUTED" },
        ];
        const indexItems = [{ mnemonic: "STRT", unit: "M", value: "1000", description: "START" }];
        const whole = createLasTextWriter({ curves, nullValue: -999.25, indexItems });
        const parts = createLasTextWriter({ curves, nullValue: -999.25, indexItems });
        const at = 1 + (cut % (values.length - 1));
        const one = new AsciiText();
        const head = whole.begin([depth, computed]);
        whole.rows(one, [depth, computed]);
        const two = new AsciiText();
        parts.begin([depth, computed]);
        parts.rows(two, [depth, computed], 0, at);
        parts.rows(two, [depth, computed], at);
        const text = Buffer.from(one.take()).toString("latin1");
        expect(Buffer.from(two.take()).toString("latin1")).toBe(text);
        expect(Array.from(parseLas(head + text).table.columns[1])).toEqual(values.map((v) => (v === 0 ? 0 : v)));
      }),
      { numRuns: 500 },
    );
  });
});

describe("writeLas with headers that lack or add sections", () => {
  it("adds NULL to a ~Well that has none, and keeps a section this reader does not know as it was", () => {
    const text = [
      "~Version",
      "VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
      "WRAP. NO : ONE LINE PER DEPTH STEP",
      "~Well",
      "STRT.M 1 : START DEPTH",
      "~Tops of our own",
      "BRACKWATER SHALE 1200.5",
      "~Curve",
      "DEPT.M : DEPTH",
      "~A",
      "1",
    ].join("\n");
    const original = parseLas(text);
    const back = parseLas(rewrite(original, { nullValue: -999.25 }));
    expect(findHeaderItem(back, "well", "NULL")).toMatchObject({ value: "-999.25", description: "NULL VALUE" });
    expect(back.sections[2]).toMatchObject({ kind: "unknown", title: "~Tops of our own", lines: [{ text: "BRACKWATER SHALE 1200.5" }] });
  });

  it("replaces or adds ~Well items given with the original header", () => {
    const original = parseLas(lasFixture("irregular-step.las"));
    const back = parseLas(rewrite(original, { wellItems: [{ mnemonic: "WELL", value: "KESTREL FLATS 3" }, { mnemonic: "STEP", unit: "M", value: "0" }] }));
    expect(back.well.wellName).toBe("KESTREL FLATS 3");
    expect(findHeaderItem(back, "well", "STEP")).toMatchObject({ value: "0", description: "VARIABLE STEP" });
  });
});
