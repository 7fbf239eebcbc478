/**
 * POST /v1/logs on what a robustness probe found: a NULL depth, a LAS answer sent back in, one curve for two roles,
 * a unit override, a CSV row of units, NaN in LAS data and a short row in a WRAP NO file. Data from our own fictional
 * wells (Marram Bank 7, and the demo well Kestrel Flats 3 of examples/).
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { isItemSection, parseCsv, parseLas } from "../../core/index.js";
import { build } from "../helpers/build.js";
import { marramBankLas } from "../helpers/marram-bank-las.js";

const post = async (payload: string, query = "") => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs${query}`, payload, headers: { "content-type": "text/plain" } });
};

const CSV = "DEPT,DTC,DTS,RHOB\n1,90,160,2.4\n-999.25,90,160,2.4\n3,90,160,2.4\n";

/** Marram Bank 7 as LAS 2.0: samples from line 16. */
const lasWith = (...rows: string[]): string => marramBankLas({ start: "1", stop: "3", step: "1" }, ...rows);
const LAS = lasWith("1 90 160 2.4", "-999.25 90 160 2.4", "3 90 160 2.4");

describe("a depth equal to the null value is absent (CWLS LAS 2.0, ~Well NULL; the request's null_value, default -999.25)", () => {
  it.each([
    ["CSV", CSV],
    ["LAS", LAS],
  ])("%s in, JSON out: the depth is null, the row in no zone, and no index check reads it as a depth", async (_, body) => {
    const json = (await post(body, "?zones=a:-1000:4")).json();
    expect(json.depth).toEqual([1, null, 3]);
    expect(json.zones[0].count).toBe(2);
    expect(json.count).toBe(3);
    expect(json.warnings.map((warning: { message: string }) => warning.message).join("\n")).not.toMatch(/STEP says|changes by/);
  });

  it("CSV out: an empty cell, as other absent values are (RFC 4180 rows stay aligned)", async () => {
    const response = await post(CSV, "?format=csv");
    const table = parseCsv(response.body).table;
    expect(table.columns[0]).toEqual(new Float64Array([1, NaN, 3]));
    expect(response.body.split("\r\n")[2].startsWith(",90,")).toBe(true);
  });

  it("LAS out, from LAS and from CSV: written as the null value, which reads back as -999.25", async () => {
    for (const body of [LAS, CSV]) {
      const back = parseLas((await post(body, "?format=las")).body);
      expect(back.table.columns[0]).toEqual(new Float64Array([1, -999.25, 3]));
      expect(back.well.nullValue).toBe(-999.25);
    }
  });

  it("NDJSON out: depth null", async () => {
    const lines = (await post(CSV, "?format=ndjson")).body.trim().split("\n").map((line) => JSON.parse(line));
    expect(lines.map((line) => line.depth)).toEqual([1, null, 3]);
  });

  it("the request's null_value is the one that marks an absent depth", async () => {
    const body = CSV.replace("-999.25", "-9999");
    expect((await post(body, "?null_value=-9999")).json().depth).toEqual([1, null, 3]);
    expect((await post(body)).json().depth).toEqual([1, -9999, 3]);
  });
});

/** The first `count` cells of each data record of a CSV answer (RFC 4180: CRLF ends every record; no quoted cells here). */
const csvCells = (body: string, count: number): string[][] =>
  body
    .split("\r\n")
    .slice(1, -1)
    .map((record) => record.split(",").slice(0, count));

/** The first `count` values of each ~A line of a LAS answer, as written (WRAP NO: one sample per line). */
const lasTokens = (body: string, count: number): string[][] => {
  const lines = body.split("\r\n");
  return lines.slice(lines.indexOf("~A") + 1, -1).map((line) => line.trim().split(/\s+/).slice(0, count));
};

/** Marram Bank 7 with a NULL of its own, -9999 (the helper's file says -999.25). */
const withFileNull = (las: string): string => {
  expect(las).toContain("NULL. -999.25 :");
  return las.replace("NULL. -999.25 :", "NULL. -9999 :");
};

// CWLS LAS 2.0: the ~W NULL item is the value that stands for an absent sample, and a LAS answer declares its own.
// RFC 4180 has no way to declare a null value: a CSV answer leaves the field of an absent value empty (RFC 4180 §2
// allows empty fields), for an echoed input value as for a computed one, so a CSV reader never takes a NULL for data.
describe("an absent input value is written as every absent value of the answer is: an empty cell in CSV, the answer's NULL in LAS", () => {
  it("LAS in, CSV out: the file's NULL, however it is written, is an empty cell; present values are echoed as read", async () => {
    const response = await post(lasWith("1 90 -999.25 2.4", "2 90.50 160 -999.2500", "3 -999.25 160 2.40"), "?format=csv");
    expect(response.statusCode).toBe(200);
    expect(csvCells(response.body, 4)).toEqual([
      ["1", "90", "", "2.4"],
      ["2", "90.5", "160", ""],
      ["3", "", "160", "2.4"],
    ]);
  });

  it("the demo well as CSV: the first row's DTS, -999.25 in the LAS file, is an empty cell like the moduli it leaves uncomputed", async () => {
    const demo = readFileSync(new URL("../../examples/demo-well.las", import.meta.url), "utf8");
    const first = (await post(demo, "?format=csv")).body.split("\r\n")[1];
    expect(first.startsWith("1450,100.53,,2.507,100.52,,")).toBe(true);
    expect(first).not.toContain("-999.25");
  });

  it("CSV in, CSV out: NA, NaN, null, -, an empty cell and the null value (default -999.25) all come back as empty cells", async () => {
    const response = await post("DEPT,DTC,DTS,RHOB,GR\n1,90,NA,2.4,-999.25\n2,90,160,,NaN\n3,-,null,2.4,\n", "?format=csv");
    expect(response.statusCode).toBe(200);
    expect(csvCells(response.body, 5)).toEqual([
      ["1", "90", "", "2.4", ""],
      ["2", "90", "160", "", ""],
      ["3", "", "", "2.4", ""],
    ]);
  });

  it("the request's null_value decides what is absent: its value is an empty cell, and -999.25 is then a value, echoed as read", async () => {
    const response = await post("DEPT,DTC,DTS,RHOB\n1,90,-9999,2.4\n2,90,-999.25,2.4\n", "?format=csv&null_value=-9999");
    expect(csvCells(response.body, 4)).toEqual([
      ["1", "90", "", "2.4"],
      ["2", "90", "-999.25", "2.4"],
    ]);
  });

  it("LAS in, LAS out under null_value: NaN and the null value are written as the NULL the answer declares; the file's own NULL is then a value", async () => {
    const file = withFileNull(lasWith("1 90 -9999 2.4", "2 NaN 160 2.4", "3 90 160 -999.2500"));
    const response = await post(file, "?format=las&null_value=-999.25");
    expect(response.statusCode).toBe(200);
    expect(parseLas(response.body).well.nullValue).toBe(-999.25);
    expect(lasTokens(response.body, 5)).toEqual([
      ["1", "90", "-9999", "2.4", "-999.25"],
      ["2", "-999.25", "160", "2.4", "-999.25"],
      ["3", "90", "160", "-999.25", "-999.25"],
    ]);
  });

  it("CSV in, LAS out: an absent cell is written as the NULL the answer declares, the default -999.25 or the request's null_value", async () => {
    const body = "DEPT,DTC,DTS,RHOB\n1,90,NA,2.4\n2,90,160,-999.25\n";
    const usual = (await post(body, "?format=las")).body;
    expect(parseLas(usual).well.nullValue).toBe(-999.25);
    expect(lasTokens(usual, 4)).toEqual([
      ["1", "90", "-999.25", "2.4"],
      ["2", "90", "160", "-999.25"],
    ]);
    const own = (await post(body, "?format=las&null_value=-9999")).body;
    expect(parseLas(own).well.nullValue).toBe(-9999);
    expect(lasTokens(own, 4)).toEqual([
      ["1", "90", "-9999", "2.4"],
      ["2", "90", "160", "-999.25"],
    ]);
  });

  it("a null_value that overrides a different NULL declared by the file is a warning, in the JSON warnings and in the LAS answer's ~Other", async () => {
    const file = withFileNull(lasWith("1 90 -9999 2.4", "2 90 160 2.4", "3 90 160 -999.25"));
    const message = "null_value -999.25 overrides the NULL -9999 that the file declares: a sample of -9999 is read as a value, and -999.25 marks an absent sample";
    const json = (await post(file, "?null_value=-999.25")).json();
    expect(json.warnings).toContainEqual({ message });
    expect(json.well.null_value).toBe(-999.25);
    // Read as a value, a slowness of -9999 is no rock's; -999.25 is absent.
    expect(json.flags).toEqual([
      { index: 0, code: "non_positive", severity: "invalid" },
      { index: 2, code: "missing", severity: "invalid" },
    ]);
    expect((await post(file, "?format=las&null_value=-999.25")).body).toContain(`  ${message}\r\n`);
  });

  it("no such warning when null_value says what the file says, when the query gives none, or when the file (CSV) declares none", async () => {
    const file = withFileNull(lasWith("1 90 -9999 2.4", "2 90 160 2.4", "3 90 160 2.4"));
    for (const [body, query] of [
      [file, "?null_value=-9999.0"],
      [file, ""],
      ["DEPT,DTC,DTS,RHOB\n1,90,160,2.4\n", "?null_value=-9999"],
    ]) {
      const json = (await post(body, query)).json();
      expect(JSON.stringify(json.warnings), query).not.toContain("overrides the NULL");
    }
  });
});

describe("a LAS answer sent back in: the input's ~Parameter items named like the service's are renamed, none dropped", () => {
  it("the second answer of the demo well has each parameter once, the first answer's kept as _2 with its original name noted", async () => {
    const demo = readFileSync(new URL("../../examples/demo-well.las", import.meta.url), "utf8");
    const once = await post(demo, "?format=las");
    expect(once.statusCode).toBe(200);
    const twice = await post(once.body, "?format=las&keep_negative_poisson=true");
    expect(twice.statusCode).toBe(200);
    const back = parseLas(twice.body);
    const items = back.sections.flatMap((section) => (isItemSection(section) && section.kind === "parameter" ? section.items : []));
    const names = items.map((item) => item.mnemonic.toUpperCase());
    expect(new Set(names).size).toBe(names.length);
    const first = parseLas(once.body).sections.flatMap((section) => (isItemSection(section) && section.kind === "parameter" ? section.items : []));
    // Every item of the first answer, then the service's own again.
    expect(items).toHaveLength(first.length + first.filter((item) => item.mnemonic.startsWith("EL_")).length);
    const byName = new Map(items.map((item) => [item.mnemonic, item]));
    expect(byName.get("EL_NEG_PR")?.value).toBe("KEEP");
    expect(byName.get("EL_NEG_PR_2")).toMatchObject({ value: "INVALID", description: 'VP/VS BELOW SQRT2 HANDLING; INPUT NAME "EL_NEG_PR"' });
    expect(byName.get("EL_VERSION_2")?.description).toContain('INPUT NAME "EL_VERSION"');
    expect(byName.get("EKB")?.value).toBe("312.40");
    // ~Other keeps the input's lines (the first answer's QC legend among them) as they are.
    expect(twice.body.split("EL_QC is a bit mask").length - 1).toBe(2);
  });
});

describe("one curve for two roles is refused (422 unusable-file)", () => {
  it("vp_curve=DTC&vs_curve=DTC names both roles", async () => {
    const response = await post(CSV, "?vp_curve=DTC&vs_curve=DTC");
    expect(response.statusCode).toBe(422);
    const problem = response.json();
    expect(problem.type).toBe("/problems/unusable-file");
    expect(problem.errors).toEqual([
      { field: "query.vs_curve", message: expect.stringMatching(/curve DTC is named for two roles.*vp_curve.*vs_curve/) },
    ]);
  });
});

describe("a unit override of a unit the file gives is a warning", () => {
  it("vp_unit=m/s on DTC.US/F is used, and said in the JSON warnings and in the LAS answer's ~Other", async () => {
    const json = (await post(LAS, "?vp_unit=m/s")).json();
    expect(json.vp).toEqual([90, 90, 90]);
    expect(json.warnings).toContainEqual({
      message: "vp_unit m/s overrides the unit US/F that the file gives curve DTC; the curve is read as a velocity, not a slowness",
    });
    expect((await post(LAS, "?vp_unit=m/s&format=las")).body).toContain("vp_unit m/s overrides the unit US/F that the file gives curve DTC");
  });

  it("an override that says what the file says, or a curve without a unit, gives no such warning", async () => {
    const same = (await post(LAS, "?vp_unit=us/ft&rho_unit=G/C3")).json();
    expect(JSON.stringify(same.warnings)).not.toContain("overrides");
    const bare = (await post("DEPT,DTC,DTS,RHOB\n1,90,160,2.4\n", "?rho_unit=kg/m3")).json();
    expect(JSON.stringify(bare.warnings)).not.toContain("overrides");
  });
});

describe("a CSV with a row of units under its header", () => {
  it("is a 422 that says the row looks like units and shows the header that carries them", async () => {
    const response = await post("DEPT,DTC,DTS,RHOB\nm,us/ft,us/ft,g/cm3\n1,90,160,2.4\n");
    expect(response.statusCode).toBe(422);
    const problem = response.json();
    expect(problem.type).toBe("/problems/unreadable-file");
    expect(problem.errors[0].line).toBe(2);
    expect(problem.detail).toContain("it looks like a row of units");
    expect(problem.detail).toContain("DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]");
  });
});

describe("NaN in LAS data is an absent value, with a warning (LAS 2.0 marks absent values with the ~Well NULL; from memory)", () => {
  it("reads NaN as absent (missing flag) and warns once", async () => {
    const response = await post(lasWith("1 90 160 2.4", "2 NaN 160 2.4", "3 90 nan 2.4"));
    expect(response.statusCode).toBe(200);
    const json = response.json();
    expect(json.vp[1]).toBeNull();
    expect(json.vs[2]).toBeNull();
    expect(json.flags).toEqual([
      { index: 1, code: "missing", severity: "invalid" },
      { index: 2, code: "missing", severity: "invalid" },
    ]);
    expect(json.warnings.filter((warning: { message: string }) => warning.message.startsWith("NaN in ~A"))).toEqual([
      { line: 17, message: "NaN in ~A read as an absent value (and 1 more); LAS 2.0 marks an absent value with the ~Well NULL value instead" },
    ]);
  });

  it("other words in ~A stay a 422", async () => {
    const response = await post(lasWith("1 90 160 2.4", "2 N/A 160 2.4"));
    expect(response.statusCode).toBe(422);
    expect(response.json().errors[0]).toMatchObject({ line: 17 });
  });
});

describe("a short row in a WRAP NO file (CWLS LAS 2.0, ~V WRAP NO: one line per depth step)", () => {
  it.each([
    ["the first row", lasWith("1 90 160", "2 90 160 2.4", "3 90 160 2.4"), 16],
    ["a later row", lasWith("1 90 160 2.4", "2 90 160", "3 90 160 2.4"), 17],
  ])("%s is named with its count of values, not as wrapped data", async (_, body, line) => {
    const response = await post(body);
    expect(response.statusCode).toBe(422);
    const problem = response.json();
    expect(problem.errors[0]).toMatchObject({ line });
    expect(problem.detail).toBe(`The well file cannot be read: line ${line}: 3 values on a data line but ~Curve describes 4 curves (the file says WRAP NO).`);
  });
});
