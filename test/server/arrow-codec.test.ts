import { readFileSync } from "node:fs";
import {
  Field,
  Float16,
  Float32,
  Float64,
  Int8,
  Int16,
  Int32,
  Int64,
  List,
  Null,
  Schema,
  Table,
  Uint8,
  Uint16,
  Uint32,
  Uint64,
  Utf8,
  tableFromArrays,
  tableFromIPC,
  tableToIPC,
  vectorFromArray,
  type DataType,
  type Vector,
} from "apache-arrow";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FLAG_CODES, InputIssues, flagCodesOf, summariseFlags, withDefaultLimits, type ElasticLog, type ElasticLogRequest } from "../../core/index.js";
import { ARROW_INPUT_COLUMNS, decodeArrowColumns, encodeArrowAnswer } from "../../server/arrow-codec.js";
import { OUTPUT_PROPERTIES } from "../../server/output-properties.js";
import { elasticOf } from "../helpers/elastic.js";

const UNITS = { velocity: "m/s", slowness: "us/ft", density: "g/cm3", modulus: "GPa", impedance: "m/s*g/cm3", depth: "m" } as const;

/** The request behind the logs of these tests, for the limits written in the metadata (defaults, README "QC flags"). */
const REQUEST: ElasticLogRequest = {
  compressional: { measure: "velocity", unit: "m/s", values: new Float64Array() },
  shear: { measure: "velocity", unit: "m/s", values: new Float64Array() },
  density: { unit: "g/cm3", values: new Float64Array() },
  nullValue: -999.25,
  keepNegativePoisson: false,
  limits: withDefaultLimits(),
  modulusUnit: "GPa",
  velocityUnit: "m/s",
  impedanceUnit: "m/s*g/cm3",
};

/** The answer's pieces joined, as a client receives them. */
const encode = (log: ElasticLog, echo: { depth?: Float64Array; top?: Float64Array; base?: Float64Array } = {}) =>
  new Uint8Array(Buffer.concat(encodeArrowAnswer(log, REQUEST, UNITS, echo)));

/** Samples of the fictional well Marram Bank 7: sand, shale, a gap, a mispicked shear, swapped curves, a cycle skip in a barite-weighted interval. */
const SAMPLE_LOG = () =>
  elasticOf([3600, 3050, NaN, 3200, 1500, 8000], [2100, 1560, 1500, 2500, 2600, 3000], [2.32, 2.51, 2.4, 2.45, 2.4, 3.3]);

const streamOf = (columns: Record<string, Vector>) => tableToIPC(new Table(columns), "stream");
const issuesOf = (run: () => unknown): InputIssues => {
  try {
    run();
  } catch (error) {
    if (error instanceof InputIssues) return error;
    throw error;
  }
  throw new Error("expected InputIssues");
};
const asNumbers = (column: Float64Array | undefined) => Array.from(column ?? []);

describe("encodeArrowAnswer", () => {
  it("writes every property of OUTPUT_PROPERTIES as float64 that reads back bit for bit, NaN as Arrow null (Apache Arrow columnar format, validity bitmap)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            vp: fc.double({ min: -10, max: 8000 }),
            vs: fc.oneof(fc.double({ min: -10, max: 5000 }), fc.constant(-999.25)),
            rho: fc.double({ min: -1, max: 4 }),
          }),
          { maxLength: 60 },
        ),
        (rows) => {
          const log = elasticOf(rows.map((r) => r.vp), rows.map((r) => r.vs), rows.map((r) => r.rho));
          const table = tableFromIPC(encode(log));
          expect(table.numRows).toBe(rows.length);
          for (const property of OUTPUT_PROPERTIES) {
            const read = table.getChild(property.key);
            expect(String(read?.type)).toBe("Float64");
            const expected = property.column(log);
            expect(read?.nullCount, property.key).toBe(expected.filter(Number.isNaN).length);
            for (let i = 0; i < rows.length; i++) {
              const value = read?.get(i);
              if (Number.isNaN(expected[i])) expect(value).toBeNull();
              else expect(Object.is(value, expected[i]), `${property.key}[${i}]`).toBe(true);
            }
          }
        },
      ),
    );
  });

  it("orders the columns as the JSON answer: depth echo, OUTPUT_PROPERTIES in order, then flags", () => {
    const depth = Float64Array.of(1612.5, 1612.6524, 1612.8048, 1612.9572, 1613.1096, 1613.262);
    const table = tableFromIPC(encode(SAMPLE_LOG(), { depth }));
    expect(table.schema.fields.map((field) => field.name)).toEqual(["depth", ...OUTPUT_PROPERTIES.map((p) => p.key), "flags"]);
    expect(Array.from(table.getChild("depth")?.toArray() ?? [])).toEqual(Array.from(depth));
    expect(table.schema.fields[0].metadata.get("elastilog.unit")).toBe("m");
    expect(table.schema.fields[1].metadata.get("elastilog.unit")).toBe("GPa");
  });

  it("echoes top and base of interval input, with their nulls", () => {
    const top = Float64Array.of(1500, NaN, 1620, 1700, 1750, 1800);
    const base = Float64Array.of(1620, 1650, 1700, 1750, 1800, 1810);
    const table = tableFromIPC(encode(SAMPLE_LOG(), { top, base }));
    expect(table.schema.fields.slice(0, 2).map((field) => field.name)).toEqual(["top", "base"]);
    expect(table.getChild("top")?.toJSON()).toEqual([1500, null, 1620, 1700, 1750, 1800]);
    expect(table.getChild("base")?.nullCount).toBe(0);
  });

  it("sets validity bits least-significant bit first, 1 for a value and 0 for a null (Apache Arrow columnar format, validity bitmaps)", () => {
    const vp = [3600, NaN, 3600, 3600, 3600, 3600, 3600, 3600, 3600, NaN];
    const log = elasticOf(vp, vp.map(() => 2000), vp.map(() => 2.4));
    const data = tableFromIPC(encode(log)).getChild("E")?.data[0];
    expect(data?.nullCount).toBe(2);
    expect(Array.from(data?.nullBitmap?.subarray(0, 2) ?? [])).toEqual([0b11111101, 0b00000001]);
  });

  it("writes flags as uint32 masks whose bit b is the flag FLAG_CODES[b], as documented by elastilog.flag_bits (core/qc-flags)", () => {
    const log = SAMPLE_LOG();
    const table = tableFromIPC(encode(log));
    const flags = table.getChild("flags");
    expect(String(flags?.type)).toBe("Uint32");
    expect(flags?.nullCount).toBe(0);
    expect(Array.from(flags?.toArray() ?? [])).toEqual(Array.from(log.flags));
    const bits: Record<string, string> = JSON.parse(table.schema.metadata.get("elastilog.flag_bits") ?? "{}");
    expect(Object.keys(bits)).toHaveLength(FLAG_CODES.length);
    for (let i = 0; i < log.length; i++) {
      const mask = Number(flags?.get(i));
      const fromMetadata = Object.entries(bits).filter(([bit]) => (mask & (1 << Number(bit))) !== 0).map(([, code]) => code);
      expect(fromMetadata).toEqual(flagCodesOf(log.flags[i]));
    }
    // Physics of each sample: a gap, Vp/Vs = 1.28 < √2, Vs > Vp, Vp and ρ beyond the default ranges (README, common practice).
    expect([2, 3, 4, 5].map((i) => flagCodesOf(Number(flags?.get(i))))).toEqual([
      ["missing"],
      ["vp_vs_below_sqrt2"],
      ["vs_not_below_vp"],
      ["density_out_of_range", "vp_out_of_range"],
    ]);
  });

  it("documents severities under this request's options, units, limits, summary and service version in the schema metadata", () => {
    const strict = SAMPLE_LOG();
    const lenient = elasticOf([3000], [2300], [2.4], { keepNegativePoisson: true });
    const metadata = (log: ElasticLog) => tableFromIPC(encode(log)).schema.metadata;
    expect(JSON.parse(metadata(strict).get("elastilog.flag_severity") ?? "{}")).toMatchObject({ missing: "invalid", vp_vs_below_sqrt2: "invalid", vp_vs_high: "suspect" });
    expect(JSON.parse(metadata(lenient).get("elastilog.flag_severity") ?? "{}")).toMatchObject({ vp_vs_below_sqrt2: "suspect" });
    const written = metadata(strict);
    expect(JSON.parse(written.get("elastilog.units") ?? "{}")).toEqual({ ...UNITS, lambda_rho: "GPa*g/cm3" });
    expect(JSON.parse(written.get("elastilog.summary") ?? "{}")).toEqual(summariseFlags(strict.flags, strict.invalidMask));
    expect(JSON.parse(written.get("elastilog.limits") ?? "{}")).toEqual({
      vp_min_m_s: 1300, vp_max_m_s: 7500, vs_min_m_s: 250, vs_max_m_s: 4500, rho_min_g_cm3: 1, rho_max_g_cm3: 3.1, vp_vs_max: 3,
    });
    const packageJson = JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8"));
    expect(written.get("elastilog.version")).toBe(packageJson.version);
  });

  it("writes an empty answer as a schema with zero rows", () => {
    const table = tableFromIPC(encode(elasticOf([], [], [])));
    expect(table.numRows).toBe(0);
    expect(table.schema.fields.at(-1)?.name).toBe("flags");
  });
});

describe("decodeArrowColumns", () => {
  it("reads float64 columns named as the JSON body, nulls as NaN, for random columns", () => {
    const value = fc.option(fc.double(), { nil: null });
    fc.assert(
      fc.property(fc.array(fc.tuple(value, value), { maxLength: 50 }), (rows) => {
        const dtc = rows.map(([a]) => a);
        const rho = rows.map(([, b]) => b);
        const decoded = decodeArrowColumns(streamOf({ dtc: vectorFromArray(dtc, new Float64()), rho: vectorFromArray(rho, new Float64()) }));
        expect(decoded.samples).toBe(rows.length);
        const same = (read: Float64Array | undefined, given: (number | null)[]) =>
          given.every((v, i) => Object.is(read?.[i], v === null ? NaN : v));
        expect(same(decoded.columns.dtc, dtc)).toBe(true);
        expect(same(decoded.columns.rho, rho)).toBe(true);
      }),
    );
  });

  it("reads every column of the JSON body and a float64 column without nulls as a view on the bytes (zero copy)", () => {
    const values = Object.fromEntries(ARROW_INPUT_COLUMNS.map((name, c) => [name, Float64Array.of(c + 0.5, c + 1.25)]));
    const bytes = tableToIPC(tableFromArrays(values), "stream");
    const decoded = decodeArrowColumns(bytes);
    expect(Object.keys(decoded.columns).sort()).toEqual([...ARROW_INPUT_COLUMNS].sort());
    expect(asNumbers(decoded.columns.base)).toEqual([2.5, 3.25]);
    expect(decoded.columns.vp?.buffer).toBe(bytes.buffer);
  });

  it("concatenates the record batches of a stream in order", () => {
    const batch = (dts: (number | null)[], rho: number[]) =>
      new Table({ dts: vectorFromArray(dts, new Float64()), rho: vectorFromArray(rho, new Float64()) });
    const first = batch([160.5, 171.25], [2.41, 2.43]);
    const second = batch([null], [2.5]);
    const third = batch([150, 151, 152], [2.3, 2.31, 2.32]);
    const bytes = tableToIPC(new Table([...first.batches, ...second.batches, ...third.batches]), "stream");
    expect(tableFromIPC(bytes).batches).toHaveLength(3);
    const decoded = decodeArrowColumns(bytes);
    expect(decoded.samples).toBe(6);
    expect(asNumbers(decoded.columns.dts)).toEqual([160.5, 171.25, NaN, 150, 151, 152]);
    expect(asNumbers(decoded.columns.rho)).toEqual([2.41, 2.43, 2.5, 2.3, 2.31, 2.32]);
  });

  it("converts float32 and every integer type exactly to float64 (IEEE 754 binary32 widening is exact; integers below 2^53 are exact doubles)", () => {
    const float32 = Float32Array.of(0.1, 2.45, 3.4028234663852886e38, -1e-45);
    const cases: [DataType, unknown[]][] = [
      [new Int8(), [-128, 0, 127]],
      [new Int16(), [-32768, 32767, null]],
      [new Int32(), [-2147483648, 2147483647, 7]],
      [new Uint8(), [0, 255, null]],
      [new Uint16(), [65535, 1, 2]],
      [new Uint32(), [4294967295, 0, 3]],
      [new Int64(), [-(2n ** 53n), 2n ** 53n, 2n ** 60n]],
      [new Uint64(), [0n, 2n ** 63n, null]],
    ];
    const decoded = decodeArrowColumns(streamOf({ vp: vectorFromArray(Array.from(float32), new Float32()) }));
    expect(asNumbers(decoded.columns.vp)).toEqual(Array.from(float32));
    expect(decoded.columns.vp?.[0]).toBe(Math.fround(0.1));
    for (const [type, values] of cases) {
      const read = decodeArrowColumns(streamOf({ depth: vectorFromArray(values, type) })).columns.depth;
      expect(asNumbers(read), String(type)).toEqual(values.map((v) => (v === null ? NaN : Number(v))));
    }
  });

  it("converts float16 exactly: 1.5, −2, 65504 (largest binary16) and 2^−24 (smallest binary16 subnormal) (IEEE 754, from memory)", () => {
    const read = decodeArrowColumns(streamOf({ rho: vectorFromArray([1.5, -2, 65504, 2 ** -24, null], new Float16()) })).columns.rho;
    expect(asNumbers(read)).toEqual([1.5, -2, 65504, 2 ** -24, NaN]);
  });

  it("reads a column of Arrow type null (what pyarrow infers for a column of None) as all absent", () => {
    const read = decodeArrowColumns(streamOf({ dts: vectorFromArray([null, null], new Null()), dtc: vectorFromArray([95, 96], new Float64()) }));
    expect(asNumbers(read.columns.dts)).toEqual([NaN, NaN]);
  });

  it("refuses a 64-bit integer that has no exact double, naming its row", () => {
    const error = issuesOf(() => decodeArrowColumns(streamOf({ depth: vectorFromArray([1n, 2n ** 53n + 1n], new Int64()) })));
    expect(error.issues).toEqual([{ field: "depth", index: 1, message: expect.stringContaining("9007199254740993") }]);
  });

  it("refuses columns of other names or types, naming each and what is accepted", () => {
    const bytes = streamOf({
      vp: vectorFromArray(["3200"], new Utf8()),
      gr: vectorFromArray([85.2], new Float64()),
      rho: vectorFromArray([[2.4]], new List(new Field("item", new Float64()))),
    });
    const error = issuesOf(() => decodeArrowColumns(bytes));
    expect(error.issues.map((issue) => issue.field)).toEqual(["vp", "gr", "rho"]);
    expect(error.issues[0].message).toMatch(/Utf8.*expected float64/);
    expect(error.issues[1].message).toMatch(/not a column.*depth, top, base, vp, vs, dtc, dts, rho/);
    expect(error.issues[2].message).toMatch(/List/);
  });

  it("refuses a column given twice", () => {
    const bytes = tableToIPC(tableFromArrays({ dtc: Float64Array.of(90) }), "stream");
    const twice = new Table(new Schema([new Field("dtc", new Float64()), new Field("dtc", new Float64())]), []);
    const withTwo = tableToIPC(twice, "stream");
    expect(decodeArrowColumns(bytes).samples).toBe(1);
    expect(issuesOf(() => decodeArrowColumns(withTwo)).issues).toEqual([{ field: "dtc", message: "is given twice; give each column once" }]);
  });

  it("answers empty, foreign and truncated bodies with an issue on the body, never the library's error", () => {
    const stream = streamOf({ dtc: vectorFromArray([95.5, 88.25], new Float64()) });
    const bodies = [new Uint8Array(0), new TextEncoder().encode('{"dtc":[95.5]}'), new TextEncoder().encode('{"a":1}'), stream.subarray(0, 40), stream.subarray(0, stream.length - 20)];
    for (const body of bodies) {
      const error = issuesOf(() => decodeArrowColumns(body));
      expect(error.issues).toHaveLength(1);
      expect(error.issues[0].field).toBe("body");
      expect(error.issues[0].message).toMatch(/Arrow IPC stream/);
      expect(error.issues[0].message).toMatch(/send /);
      expect(error.issues[0].message).not.toMatch(/Expected to read|Cannot read properties/);
    }
  });

  it("says in its own words that bytes are not an Arrow IPC stream, where the library would say \"Expected to read 2147483632 metadata bytes\"", () => {
    // A message prefix without the continuation 0xFFFFFFFF declares its metadata length itself (pre-1.0 streams,
    // Apache Arrow columnar format, "Encapsulated message format"); 0x7FFFFFF0 = 2147483632 bytes, 12 present.
    const forged = Uint8Array.of(0xf0, 0xff, 0xff, 0x7f, ...new Array(12).fill(0x41));
    expect(() => tableFromIPC(forged)).toThrow(/Expected to read 2147483632 metadata bytes/);
    const [issue] = issuesOf(() => decodeArrowColumns(forged)).issues;
    expect(issue.message).toBe(
      "the body is not an Arrow IPC stream: it does not begin with an Arrow schema message, it begins with the bytes f0 ff ff 7f 41 41 41 41 …; send the columns as one Arrow IPC stream (application/vnd.apache.arrow.stream) and nothing after it",
    );
    expect(issuesOf(() => decodeArrowColumns(new TextEncoder().encode(' {"dtc":[95]}'))).issues[0].message).toMatch(/looks like JSON text \(send JSON with Content-Type: application\/json\)/);
    const cut = streamOf({ dtc: vectorFromArray([95.5, 88.25], new Float64()) }).subarray(0, 100);
    expect(issuesOf(() => decodeArrowColumns(cut)).issues[0].message).toMatch(/^the body is not a whole Arrow IPC stream: it ends inside message 1, .*cut short: send the whole stream$/);
  });

  it("reads the Arrow IPC file format (with footer) like the stream", () => {
    const table = tableFromArrays({ dtc: Float64Array.of(95.5, 88.25) });
    expect(asNumbers(decodeArrowColumns(tableToIPC(table, "file")).columns.dtc)).toEqual([95.5, 88.25]);
  });

  it("reads back the depth echo of an encoded answer bit for bit", () => {
    fc.assert(
      fc.property(fc.array(fc.double(), { maxLength: 40 }), (depths) => {
        const depth = Float64Array.from(depths);
        const log = elasticOf(depths.map(() => 3000), depths.map(() => 1600), depths.map(() => 2.4));
        const answer = tableFromIPC(encode(log, { depth }));
        const echoed = decodeArrowColumns(tableToIPC(new Table({ depth: answer.getChild("depth") as Vector }), "stream")).columns.depth;
        expect(depths.every((v, i) => Object.is(echoed?.[i], v))).toBe(true);
      }),
    );
  });
});

describe("decodeArrowColumns reads exactly one IPC stream (Apache Arrow columnar format, \"IPC Streaming Format\": encapsulated messages, optionally ended by the end-of-stream marker 0xFFFFFFFF 0x00000000)", () => {
  const stream = (dtc: number[]) => streamOf({ dtc: vectorFromArray(dtc, new Float64()), rho: vectorFromArray(dtc.map(() => 2.4), new Float64()) });
  const join = (...parts: Uint8Array[]) => new Uint8Array(Buffer.concat(parts));
  const ascii = (text: string) => new TextEncoder().encode(text);
  const END_OF_STREAM = [0xff, 0xff, 0xff, 0xff, 0, 0, 0, 0];
  /** The stream without its end-of-stream marker, which the format makes optional. */
  const unended = (bytes: Uint8Array) => {
    expect(Array.from(bytes.subarray(-8))).toEqual(END_OF_STREAM);
    return bytes.subarray(0, bytes.length - 8);
  };
  const multiBatch = () => {
    const batch = (dtc: number[]) => new Table({ dtc: vectorFromArray(dtc, new Float64()) });
    return tableToIPC(new Table([...batch([95, 96]).batches, ...batch([97]).batches, ...batch([98, 99, 100]).batches]), "stream");
  };

  it("refuses a second stream after the first, which the library alone would drop without notice", () => {
    const twice = join(stream([95, 96, 97]), stream([98, 99, 100]));
    expect(tableFromIPC(twice).numRows).toBe(3); // what the library reads: the first stream only
    for (const body of [twice, join(unended(stream([95, 96, 97])), stream([98, 99, 100])), join(multiBatch(), multiBatch())]) {
      const issues = issuesOf(() => decodeArrowColumns(body)).issues;
      expect(issues).toEqual([{ field: "body", message: expect.stringMatching(/^the body holds a second Arrow IPC stream from byte \d+, after the end of the first; .*write all record batches into one stream under one schema, and send it alone$/) }]);
    }
  });

  it("refuses bytes after the end-of-stream marker, or after the last message when the marker is absent, naming them", () => {
    const ok = stream([95, 96, 97]);
    expect(issuesOf(() => decodeArrowColumns(join(ok, ascii("JUNKJUNKJUNK")))).issues).toEqual([
      { field: "body", message: `the body has 12 bytes after the end of its Arrow IPC stream, from byte ${ok.length} (4a 55 4e 4b 4a 55 4e 4b …); send the columns as one Arrow IPC stream (application/vnd.apache.arrow.stream) and nothing after it` },
    ]);
    // Zero padding after the marker, and a second marker, are bytes after the stream too.
    for (const extra of [new Uint8Array(8), Uint8Array.from(END_OF_STREAM), ascii("\n")]) {
      expect(issuesOf(() => decodeArrowColumns(join(ok, extra))).issues[0].message).toMatch(new RegExp(`^the body has ${extra.length} bytes after the end of its Arrow IPC stream`));
    }
    const open = unended(ok);
    expect(issuesOf(() => decodeArrowColumns(join(open, ascii("JUNKJUNKJUNK")))).issues[0].message).toMatch(
      new RegExp(`^the body is not a readable Arrow IPC stream: after 2 messages, the bytes from byte ${open.length} \\(4a 55 4e 4b .*\\) are not an Arrow IPC message; send the columns as one Arrow IPC stream`),
    );
    expect(issuesOf(() => decodeArrowColumns(join(multiBatch(), ascii("JUNK")))).issues[0].message).toMatch(/4 bytes after the end of its Arrow IPC stream/);
  });

  it("reads a stream with or without its end-of-stream marker, in one record batch or several", () => {
    for (const body of [stream([95, 96, 97]), unended(stream([95, 96, 97]))]) expect(asNumbers(decodeArrowColumns(body).columns.dtc)).toEqual([95, 96, 97]);
    for (const body of [multiBatch(), unended(multiBatch())]) expect(asNumbers(decodeArrowColumns(body).columns.dtc)).toEqual([95, 96, 97, 98, 99, 100]);
  });

  it("refuses any bytes after a stream, and reads the stream alone (random streams and trailing bytes)", () => {
    fc.assert(
      fc.property(fc.array(fc.double(), { minLength: 1, maxLength: 20 }), fc.boolean(), fc.uint8Array({ minLength: 1, maxLength: 64 }), (dtc, ended, extra) => {
        const body = ended ? stream(dtc) : unended(stream(dtc));
        expect(decodeArrowColumns(body).samples).toBe(dtc.length);
        // An open stream followed by an end-of-stream marker (or the pre-1.0 one, 0x00000000) is one whole stream.
        fc.pre(ended || ![[0, 0, 0, 0], END_OF_STREAM].some((marker) => marker.join() === Array.from(extra).join()));
        const issues = issuesOf(() => decodeArrowColumns(join(body, extra))).issues;
        expect(issues).toHaveLength(1);
        expect(issues[0].field).toBe("body");
        expect(issues[0].message).toMatch(/Arrow IPC stream/);
      }),
      { numRuns: 500 },
    );
  });

  it("refuses an Arrow IPC file with bytes after its closing ARROW1 (Apache Arrow columnar format, \"IPC File Format\")", () => {
    const file = tableToIPC(tableFromArrays({ dtc: Float64Array.of(95.5, 88.25) }), "file");
    expect(Array.from(file.subarray(-6))).toEqual(Array.from(ascii("ARROW1")));
    expect(issuesOf(() => decodeArrowColumns(join(file, ascii("JUNK")))).issues[0].message).toMatch(/^the body begins as an Arrow IPC file but does not end with one: it was cut short or has bytes after it; send/);
  });
});
