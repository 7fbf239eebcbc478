/**
 * Curve names in converted files: any input name gives a LAS file the service reads back, no answer repeats a
 * column name, and LAS files that hide a sample in a comment or hold none are refused. The data are a small well
 * of our own, Sandpiper Reach 1.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseCsv, parseLas } from "../../core/index.js";
import { OUTPUT_PROPERTIES } from "../../server/output-properties.js";
import { build } from "../helpers/build.js";

/** The computed curves of a LAS or CSV answer: every property and the QC bit mask. */
const COMPUTED = OUTPUT_PROPERTIES.length + 1;

const post = async (body: string, query: string) => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs${query}`, payload: body, headers: { "content-type": "text/plain" } });
};

/** A LAS mnemonic the line grammar can carry (CWLS LAS 2.0, Appendix 1 Part 3; from memory): printable ASCII, no dot, colon or blank, no leading ~ or #. */
const isValidMnemonic = (name: string): boolean => /^[^~#.:][^.:]*$/.test(name) && /^[\x21-\x7e]+$/.test(name);

const allDifferent = (names: readonly string[]): boolean => new Set(names.map((name) => name.toUpperCase())).size === names.length;

/** The keys of one NDJSON line as written, repeats included (JSON.parse would keep only the last of a repeated key). */
const rawKeys = (line: string): string[] => [...line.matchAll(/[{,]("(?:[^"\\]|\\.)*"):/g)].map((match) => JSON.parse(match[1]) as string);

/** RFC 4180 §2 rules 5–7: a quoted field, its quotes doubled. */
const csvField = (text: string): string => `"${text.replaceAll('"', '""')}"`;

const SANDPIPER = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]";
const ROWS = ["1000,95,170,2.40", "1000.5,92,165,2.45", "1001,90,160,2.47"];

describe("CSV to LAS with column names LAS cannot carry as they are", () => {
  it.each(["GR.RAW", "GR x", "A B", "GR[a b]", "~GR", "#GR", "GR:RAW", "\u0394GR", "EL.E"])(
    "a column named %j gives a LAS file read back with every curve, row and value, the name made a valid mnemonic and kept in the description (CWLS LAS 2.0, Appendix 1 Part 3)",
    async (name) => {
      const body = `${SANDPIPER},${csvField(name)}\n${ROWS.map((row, i) => `${row},${50 + i}`).join("\n")}\n`;
      const response = await post(body, "?format=las");
      expect(response.statusCode).toBe(200);
      const input = parseCsv(body).table;
      const back = parseLas(response.body);
      expect(back.table.curves).toHaveLength(input.curves.length + COMPUTED);
      expect(back.table.columns.slice(0, input.curves.length)).toEqual(input.columns);
      const names = back.table.curves.map((curve) => curve.mnemonic);
      expect(names.every(isValidMnemonic)).toBe(true);
      expect(allDifferent(names)).toBe(true);
      const extra = back.table.curves[4];
      const original = input.curves[4];
      if (extra.mnemonic !== original.mnemonic) expect(extra.description).toContain(`INPUT NAME ${JSON.stringify(original.mnemonic).replaceAll(":", "\\u003a")}`);
      if (extra.unit !== original.unit) expect(extra.description).toContain(`INPUT UNIT ${JSON.stringify(original.unit)}`);
      expect(back.table.curves.find((curve) => curve.mnemonic === "EL_E")?.description).toBe("DYNAMIC YOUNGS MODULUS");
    },
  );

  it("any column names (unicode, dots, colons, blanks, ~, #, quotes, empty) give a LAS file the service reads back with the same curves and values (property)", async () => {
    const app = await build();
    const tricky = fc.constantFrom(".", ":", " ", "~", "#", "\t", "\n", '"', ",", ";", "[", "]", "(", ")", "\u00b5", "\u00a0", "\u2028", "a", "1", "_");
    const name = fc.oneof(fc.string({ maxLength: 10 }), fc.string({ unit: "grapheme", maxLength: 6 }), fc.string({ unit: tricky, maxLength: 8 }));
    await fc.assert(
      fc.asyncProperty(fc.array(name, { minLength: 1, maxLength: 4 }), async (names) => {
        const body = `${SANDPIPER},${names.map(csvField).join(",")}\r\n${ROWS.map((row, r) => `${row},${names.map((_, c) => r * 10 + c).join(",")}`).join("\r\n")}\r\n`;
        const response = await app.inject({
          method: "POST",
          url: "/v1/logs?format=las&vp_curve=DTC&vs_curve=DTS&rho_curve=RHOB&depth_curve=DEPT",
          payload: body,
          headers: { "content-type": "text/csv" },
        });
        expect(response.statusCode, response.body).toBe(200);
        const input = parseCsv(body).table;
        const back = parseLas(response.body);
        expect(back.table.curves).toHaveLength(input.curves.length + COMPUTED);
        expect(back.table.columns.slice(0, input.curves.length)).toEqual(input.columns);
        expect(allDifferent(back.table.curves.map((curve) => curve.mnemonic))).toBe(true);
        expect(back.warnings).toEqual([]);
      }),
      { numRuns: 60 },
    );
  });
});

describe("input curves named like the service's output curves", () => {
  /** A file that already holds EL_E and EL_QC, as a file the service wrote would. */
  const ECHOED = `${SANDPIPER},EL_E[GPa],EL_QC\n${ROWS.map((row, i) => `${row},${12.5 + i},${i}`).join("\n")}\n`;

  it("CSV answers name every column once: the input's EL_E and EL_QC become EL_E:2 and EL_QC:2, values kept (RFC 4180 header record; ours)", async () => {
    const response = await post(ECHOED, "?format=csv");
    expect(response.statusCode).toBe(200);
    const header = response.body.slice(0, response.body.indexOf("\r\n")).split(",").map((cell) => cell.replace(/\[.*\]$/, ""));
    expect(allDifferent(header)).toBe(true);
    expect(header.slice(0, 6)).toEqual(["DEPT", "DTC", "DTS", "RHOB", "EL_E:2", "EL_QC:2"]);
    expect(header.filter((name) => name === "EL_E" || name === "EL_QC")).toHaveLength(2);
    const table = parseCsv(response.body).table;
    const column = (name: string) => Array.from(table.columns[table.curves.findIndex((curve) => curve.mnemonic === name)]);
    expect(column("EL_E:2")).toEqual([12.5, 13.5, 14.5]);
    expect(column("EL_QC:2")).toEqual([0, 1, 2]);
    const json = (await post(ECHOED, "?format=json")).json();
    expect(column("EL_E")).toEqual(json.E.map((e: number) => Number(e.toPrecision(8))));
  });

  it("LAS answers too: EL_E_2 and EL_QC_2 (a LAS mnemonic holds no colon), the original name in the description (CWLS LAS 2.0, Appendix 1 Part 3)", async () => {
    const response = await post(ECHOED, "?format=las");
    expect(response.statusCode).toBe(200);
    const back = parseLas(response.body);
    const names = back.table.curves.map((curve) => curve.mnemonic);
    expect(allDifferent(names)).toBe(true);
    expect(back.warnings).toEqual([]);
    expect(back.table.curves.slice(4, 6)).toEqual([
      { mnemonic: "EL_E_2", unit: "GPa", description: 'INPUT NAME "EL_E"' },
      { mnemonic: "EL_QC_2", unit: "", description: 'INPUT NAME "EL_QC"' },
    ]);
    expect(Array.from(back.table.columns[4])).toEqual([12.5, 13.5, 14.5]);
    expect(back.table.curves.find((curve) => curve.mnemonic === "EL_E")?.description).toBe("DYNAMIC YOUNGS MODULUS");
  });

  it("a LAS file with its own EL_E and a repeated DT: LAS and CSV answers name every column once, ~Parameter names the curve used as written", async () => {
    const las = [
      "~Version",
      " VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
      " WRAP. NO  : ONE LINE PER DEPTH STEP",
      "~Well",
      " STRT.M 1000 : START DEPTH",
      " STOP.M 1001 : STOP DEPTH",
      " STEP.M 0.5  : STEP",
      " NULL.  -999.25 : NULL VALUE",
      " WELL.  SANDPIPER REACH 1 : WELL",
      "~Curve",
      " DEPT.M    : DEPTH",
      " DT  .US/F : SONIC, FIRST PASS",
      " DT  .US/F : SONIC, REPEAT PASS",
      " DTS .US/F : SHEAR SONIC",
      " RHOB.G/C3 : BULK DENSITY",
      " EL_E.GPA  : FROM AN EARLIER RUN",
      "~A",
      " 1000   95 96 170 2.40 12.5",
      " 1000.5 92 93 165 2.45 13.5",
      " 1001   90 91 160 2.47 14.5",
      "",
    ].join("\n");
    const asLas = await post(las, "?format=las&vp_curve=DT:2");
    expect(asLas.statusCode).toBe(200);
    const back = parseLas(asLas.body);
    expect(back.warnings).toEqual([]);
    expect(back.table.curves.slice(0, 6).map((curve) => curve.mnemonic)).toEqual(["DEPT", "DT", "DT_2", "DTS", "RHOB", "EL_E_2"]);
    expect(back.table.curves[2].description).toBe('SONIC, REPEAT PASS; INPUT NAME "DT"');
    expect(allDifferent(back.table.curves.map((curve) => curve.mnemonic))).toBe(true);
    expect(asLas.body).toMatch(/EL_VP_FROM *\. +DT_2 us\/ft +:/);
    const asCsv = await post(las, "?format=csv");
    const header = asCsv.body.slice(0, asCsv.body.indexOf("\r\n")).split(",").map((cell) => cell.replace(/\[.*\]$/, ""));
    expect(header.slice(0, 6)).toEqual(["DEPT", "DT", "DT:2", "DTS", "RHOB", "EL_E:2"]);
    expect(allDifferent(header)).toBe(true);
  });

  it("NDJSON answers repeat no key on any line (RFC 8259 §4: names within an object should be unique)", async () => {
    const response = await post(ECHOED, "?format=ndjson&correlations=ucs.mcnally1987,static_e.eissa1988");
    expect(response.statusCode).toBe(200);
    const lines = response.body.trimEnd().split("\n");
    expect(lines).toHaveLength(3);
    for (const line of lines) {
      const keys = rawKeys(line);
      expect(new Set(keys).size).toBe(keys.length);
      expect(keys).toEqual(expect.arrayContaining(["index", "depth", "E", "ucs.mcnally1987", "static_e.eissa1988", "flags"]));
    }
  });
});

describe("LAS files whose ~A hides or lacks samples", () => {
  const header = [
    "~Version",
    " VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
    " WRAP. NO  : ONE LINE PER DEPTH STEP",
    "~Well",
    " NULL. -999.25 : NULL VALUE",
    " WELL. SANDPIPER REACH 1 : WELL",
    "~Curve",
    " DEPT.M    : DEPTH",
    " DTC .US/F : COMPRESSIONAL SLOWNESS",
    " DTS .US/F : SHEAR SLOWNESS",
    " RHOB.G/C3 : BULK DENSITY",
    "~A",
  ];
  const lasWith = (...rows: string[]) => [...header, ...rows, ""].join("\r\n");

  it.each(["json", "csv", "las", "ndjson"])(
    "a # line among four samples is a 422 naming its line and saying to delete it or move it above ~A, not a row silently dropped (%s; CWLS LAS 2.0: comments only above ~A, from memory)",
    async (format) => {
      const response = await post(lasWith(" 1000 95 170 2.40", "# 1000.5 92 165 2.45", " 1001 90 160 2.47", " 1001.5 88 158 2.50"), `?format=${format}`);
      expect(response.statusCode).toBe(422);
      expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
      const problem = response.json();
      expect(problem).toMatchObject({ type: "/problems/unreadable-file", status: 422, errors: [{ field: "body", line: 14 }] });
      expect(problem.detail).toMatch(/line 14: a # comment line inside ~A.*delete the line.*move the comment above ~A/);
    },
  );

  it("a CSV file with a # row in its data is a 422 too: the formats agree (RFC 4180: every record after the header is data)", async () => {
    const response = await post(`${SANDPIPER}\n${ROWS[0]}\n# ${ROWS[1]}\n${ROWS[2]}\n`, "?format=json");
    expect(response.statusCode).toBe(422);
    expect(response.json().type).toBe("/problems/unreadable-file");
  });

  it.each(["json", "csv", "las", "ndjson"])(
    "an ~A with no data rows is a 422 saying so, as a header-only CSV file is (%s; README: a header-only file is a 422)",
    async (format) => {
      for (const body of [lasWith(), lasWith("", "   ")]) {
        const response = await post(body, `?format=${format}`);
        expect(response.statusCode).toBe(422);
        const problem = response.json();
        expect(problem).toMatchObject({ type: "/problems/unreadable-file", errors: [{ field: "body", line: 12 }] });
        expect(problem.detail).toContain("the ~A section holds no data rows");
      }
      const csv = await post(`${SANDPIPER}\n`, `?format=${format}`);
      expect(csv.statusCode).toBe(422);
      expect(csv.json().detail).toContain("no data rows");
    },
  );
});
