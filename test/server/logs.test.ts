import { readFileSync } from "node:fs";
import { Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { parseCsv, parseLas } from "../../core/index.js";
import { logsJsonResponse } from "../../server/schemas/logs.js";
import { build } from "../helpers/build.js";
import { multipartBody } from "../helpers/multipart.js";


const DEMO_LAS = readFileSync(new URL("../../examples/demo-well.las", import.meta.url));
const DEMO_CSV = readFileSync(new URL("../../examples/demo-well.csv", import.meta.url));
const DEMO_ROWS = parseLas(DEMO_LAS.toString("utf8")).table.columns[0].length;

/** A small well of our own: DEPT in m, DTC and DTS in µs/ft, RHOB in g/cm3. */
const SMALL_CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1000.0,100,200,2.30\r\n1000.5,80,150,2.50\r\n1001.0,,160,2.40\r\n1001.5,95,120,2.40\r\n";

const upload = async (body: Buffer | string | Readable, query = "", headers: Record<string, string> = { "content-type": "text/plain" }, config = {}) => {
  const app = await build({ config });
  return app.inject({ method: "POST", url: `/v1/logs${query}`, payload: body, headers });
};

describe("POST /v1/logs", () => {
  it.each(["text/plain", "text/csv", "application/octet-stream", "application/x-www-form-urlencoded"])(
    "takes the demo LAS file sent as %s, finds DTC, DTS, RHOB and DEPT, and answers one row per input row",
    async (contentType) => {
      const response = await upload(DEMO_LAS, "", { "content-type": contentType });
      expect(response.statusCode).toBe(200);
      const body = logsJsonResponse.parse(response.json());
      expect(body.count).toBe(DEMO_ROWS);
      expect(body.E).toHaveLength(DEMO_ROWS);
      expect(body.depth).toHaveLength(DEMO_ROWS);
      expect(body.input_format).toBe("las");
      expect(body.curves.vp).toMatchObject({ mnemonic: "DTC", measure: "slowness", unit: "us/ft", unit_as_written: "US/F", unit_source: "file" });
      expect(body.curves.vs?.mnemonic).toBe("DTS");
      expect(body.curves.rho).toMatchObject({ mnemonic: "RHOB", unit: "g/cm3" });
      expect(body.curves.depth?.mnemonic).toBe("DEPT");
      expect(body.well).toMatchObject({ name: "KESTREL FLATS 3", null_value: -999.25, las_version: "2.0" });
      expect(body.summary.count).toBe(DEMO_ROWS);
      expect(body.summary.flags.vp_vs_below_sqrt2).toBeGreaterThan(0);
    },
  );

  it("computes the same numbers as /v1/elastic for the same samples (row i of the file is row i of the answer)", async () => {
    const app = await build();
    const fromFile = (await app.inject({ method: "POST", url: "/v1/logs", payload: SMALL_CSV, headers: { "content-type": "text/csv" } })).json();
    const fromColumns = (
      await app.inject({ method: "POST", url: "/v1/elastic", payload: { dtc: [100, 80, null, 95], dts: [200, 150, 160, 120], rho: [2.3, 2.5, 2.4, 2.4] } })
    ).json();
    for (const key of ["E", "nu", "G", "K", "lambda", "M", "vp_vs", "vp", "vs"]) expect(fromFile[key], key).toEqual(fromColumns[key]);
    expect(fromFile.flags).toEqual(fromColumns.flags);
    expect(fromFile.depth).toEqual([1000, 1000.5, 1001, 1001.5]);
  });

  it("takes a multipart upload with one file part and a zones part (curl -F file=@well.las -F zones=…)", async () => {
    const zones = JSON.stringify([{ name: "Upper", top: 1000, base: 1001 }]);
    const { body, contentType } = multipartBody([
      { name: "file", filename: "small.csv", content: SMALL_CSV },
      { name: "zones", content: zones },
    ]);
    const response = await upload(body, "", { "content-type": contentType });
    expect(response.statusCode).toBe(200);
    const answer = response.json();
    expect(answer.count).toBe(4);
    expect(answer.zones).toHaveLength(1);
    // Samples at 1000.0, 1000.5 and 1001.0: a lone zone keeps the sample at its base (no other zone starts there);
    // the one at 1001.0 has no DTC, so it is flagged and not valid.
    expect(answer.zones[0]).toMatchObject({ name: "Upper", count: 3, valid: 2, flagged_fraction: 1 / 3 });
    expect(answer.zones[0].properties.E.mean).toBeCloseTo((answer.E[0] + answer.E[1]) / 2, 12);
    expect(answer.zones[0].properties.E.p50).toBeCloseTo((answer.E[0] + answer.E[1]) / 2, 12);
  });

  it("a well file sent as a plain form field (curl -F file=<well.csv, without @) gets a 400 saying to send it as a file part", async () => {
    const { body, contentType } = multipartBody([{ name: "file", content: SMALL_CSV }]);
    const response = await upload(body, "", { "content-type": contentType });
    expect(response.statusCode).toBe(400);
    expect(response.json().detail).toContain("-F file=@well.las");
  });

  it("refuses zones given both in the query and as a part (400), instead of answering one set and dropping the other", async () => {
    const { body, contentType } = multipartBody([
      { name: "file", filename: "small.csv", content: SMALL_CSV },
      { name: "zones", content: JSON.stringify([{ name: "Upper", top: 1000, base: 1001 }]) },
    ]);
    const response = await upload(body, "?zones=Lower:1001:1002", { "content-type": contentType });
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toContainEqual({ field: "query.zones", message: expect.stringContaining("zones part") });
  });

  it("takes the zones as a file part too (curl -F zones=@zones.json), and refuses a second well file", async () => {
    const zones = JSON.stringify([{ name: "Upper", top: 1000, base: 1001 }]);
    const asFile = multipartBody([
      { name: "file", filename: "small.csv", content: SMALL_CSV },
      { name: "zones", filename: "zones.json", content: zones },
    ]);
    const response = await upload(asFile.body, "", { "content-type": asFile.contentType });
    expect(response.statusCode).toBe(200);
    expect(response.json().zones[0].name).toBe("Upper");
    const twoWells = multipartBody([
      { name: "file", filename: "a.csv", content: SMALL_CSV },
      { name: "other", filename: "b.csv", content: SMALL_CSV },
    ]);
    const refused = await upload(twoWells.body, "", { "content-type": twoWells.contentType });
    expect(refused.statusCode).toBe(400);
    expect(refused.json().detail).toContain("one well file");
  });

  it("answers CSV (RFC 4180) for Accept: text/csv: the input columns, then EL_* columns with units, one record per input row", async () => {
    const response = await upload(SMALL_CSV, "", { "content-type": "text/csv", accept: "text/csv" });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^text\/csv/);
    expect(response.body.endsWith("\r\n")).toBe(true);
    const table = parseCsv(response.body).table;
    expect(table.columns[0]).toHaveLength(4);
    expect(table.curves.map((c) => c.mnemonic).slice(0, 6)).toEqual(["DEPT", "DTC", "DTS", "RHOB", "EL_E", "EL_NU"]);
    expect(table.curves.find((c) => c.mnemonic === "EL_E")?.unit).toBe("GPa");
    const e = table.columns[table.curves.findIndex((c) => c.mnemonic === "EL_E")];
    expect(Number.isNaN(e[2])).toBe(true); // the row with no DTC: an empty cell, still present
    const qc = table.columns[table.curves.findIndex((c) => c.mnemonic === "EL_QC")];
    expect(Array.from(qc)).toEqual([0, 0, 1, 32]); // bit 0 missing; bit 5 vp_vs_below_sqrt2 (DTS/DTC = 1.26)
  });

  it("LAS in → LAS out → read again: original curves equal, computed curves appended, same rows, options and QC bits documented", async () => {
    const response = await upload(DEMO_LAS, "?format=las", { "content-type": "text/plain", accept: "application/json" });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^application\/x-las/);
    const original = parseLas(DEMO_LAS.toString("utf8"));
    const written = parseLas(response.body);
    expect(written.table.columns[0]).toHaveLength(DEMO_ROWS);
    original.table.curves.forEach((curve, c) => {
      expect(written.table.curves[c]).toEqual(curve);
      expect(written.table.columns[c]).toEqual(original.table.columns[c]);
    });
    const names = written.table.curves.map((c) => c.mnemonic);
    for (const name of ["EL_E", "EL_NU", "EL_G", "EL_K", "EL_LAMBDA", "EL_M", "EL_VPVS", "EL_QC"]) expect(names).toContain(name);
    expect(written.well.nullValue).toBe(-999.25);
    expect(written.well.wellName).toBe("KESTREL FLATS 3");
    expect(response.body).toContain("EL_VERSION");
    expect(response.body).toMatch(/bit 5 \(value 32\) vp_vs_below_sqrt2/);
  });

  it("a CSV file can be answered as LAS, with the depth as the index", async () => {
    const response = await upload(DEMO_CSV, "?format=las", { "content-type": "text/csv" });
    expect(response.statusCode).toBe(200);
    const written = parseLas(response.body);
    expect(written.table.curves[0].mnemonic).toBe("DEPT");
    expect(written.table.columns[0]).toHaveLength(parseCsv(DEMO_CSV.toString("utf8")).table.columns[0].length);
  });

  it("writes LAS in ASCII (CWLS LAS 2.0: \"files written in ASCII\"), with estimates, gap fills and their citations", async () => {
    const query = "?format=las&correlations=static_e.lacy1997,ucs.mcnally1987,friction_angle.lal1999,brittleness.rickman2008,ucs.militzer1973&vs_from=vs.greenberg1992_limestone&rho_from=density.gardner1974";
    for (const [file, type] of [[DEMO_LAS, "text/plain"], [DEMO_CSV, "text/csv"]] as const) {
      const response = await upload(file, query, { "content-type": type });
      expect(response.statusCode).toBe(200);
      expect(response.rawPayload.every((byte) => byte < 0x80)).toBe(true);
      // The spelled-out symbols: a middle dot, a minus sign, a squared Vp, an en dash and degrees, an umlaut.
      expect(response.body).toContain("Vs = -0.05508*Vp^2 + 1.01677*Vp - 1.03049");
      expect(response.body).toContain("0-90 deg");
      expect(response.body).toContain("Beitrage");
    }
  });

  it("the answers of a file fed in 7-byte chunks equal those of the whole file (chunks split numbers and CRLF pairs)", async () => {
    const app = await build();
    for (const format of ["json", "csv", "las"]) {
      const whole = await app.inject({ method: "POST", url: `/v1/logs?format=${format}`, payload: DEMO_LAS, headers: { "content-type": "text/plain" } });
      const pieces = Array.from({ length: Math.ceil(DEMO_LAS.length / 7) }, (_, i) => DEMO_LAS.subarray(i * 7, i * 7 + 7));
      const chunked = await app.inject({ method: "POST", url: `/v1/logs?format=${format}`, payload: Readable.from(pieces), headers: { "content-type": "text/plain" } });
      expect(chunked.statusCode).toBe(200);
      expect(chunked.body.replace(/"request_id":"[^"]+"/, "")).toBe(whole.body.replace(/"request_id":"[^"]+"/, ""));
    }
  });

  it("a curve without a unit is read in the usual unit of its measure, with a warning; vp_unit overrides", async () => {
    const csv = "DEPTH,DT,DTS,RHOB\n1,100,200,2.3\n";
    const assumed = (await upload(csv)).json();
    expect(assumed.curves.vp).toMatchObject({ mnemonic: "DT", unit: "us/ft", unit_source: "assumed" });
    expect(assumed.warnings.map((w: { message: string }) => w.message).join(" ")).toContain("curve DT (vp) has no unit; read as us/ft");
    const given = (await upload(csv, "?vp_unit=US/M&vs_unit=us/m")).json();
    expect(given.curves.vp).toMatchObject({ unit: "us/m", unit_source: "query" });
    expect(given.vp[0]).toBe(10000);
  });

  it("curves can be named explicitly", async () => {
    const csv = "MD[m],P_SONIC[us/ft],S_SONIC[us/ft],DENS[g/cm3]\n1,100,200,2.3\n";
    const response = await upload(csv, "?vp_curve=p_sonic&vs_curve=S_SONIC&rho_curve=DENS&depth_curve=MD");
    expect(response.statusCode).toBe(200);
    expect(response.json().curves.vp.mnemonic).toBe("P_SONIC");
  });

  it.each([
    ["an unknown unit", "DEPT[m],DTC[usec/furlong],DTS[us/ft],RHOB[g/cm3]\n1,100,200,2.3\n", "", 422, "/problems/unusable-file", "usec/furlong"],
    ["no shear curve", "DEPT[m],DTC[us/ft],RHOB[g/cm3]\n1,100,2.3\n", "", 422, "/problems/unusable-file", "vs_curve"],
    ["a named curve that is absent", SMALL_CSV, "?vp_curve=DT4P", 422, "/problems/unusable-file", "DT4P"],
    ["a bad unit override", SMALL_CSV, "?rho_unit=furlongs", 400, "/problems/invalid-request", "g/cm3"],
    ["a LAS 3.0 file", "~VERSION\r\n VERS. 3.0 : CWLS LAS 3.0\r\n", "", 422, "/problems/unreadable-file", "line 2"],
    ["a header-only LAS file", "~V\n VERS. 2.0 :\n WRAP. NO :\n~C\n DEPT.M :\n", "", 422, "/problems/unreadable-file", "~A"],
    ["a ragged CSV row", "DEPT,DTC,DTS,RHOB\n1,100,200,2.3\n2,100,200\n", "", 422, "/problems/unreadable-file", "line 3"],
    ["an empty body", "", "", 422, "/problems/unreadable-file", "no well data"],
    ["zones text that is not name:top:base", SMALL_CSV, "?zones=Upper:1000", 400, "/problems/invalid-request", "name:top:base"],
    ["zones with CSV output", SMALL_CSV, "?zones=Upper:1000:1001&format=csv", 400, "/problems/invalid-request", "format=json"],
    ["a zone whose base is above its top", SMALL_CSV, "?zones=Upper:1001:1000", 400, "/problems/invalid-request", "deeper than the top"],
  ])("%s is a problem document (%s)", async (_name, body, query, status, type, words) => {
    const response = await upload(body, query);
    expect(response.statusCode).toBe(status);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.json()).toMatchObject({ type, status });
    expect(JSON.stringify(response.json())).toContain(words);
  });

  it("names the line of a bad number in the file (errors[].line)", async () => {
    const response = await upload("DEPT,DTC,DTS,RHOB\n1,100,200,2.3\n2,abc,200,2.3\n");
    expect(response.json().errors).toEqual([expect.objectContaining({ field: "body", line: 3 })]);
  });

  it("refuses JSON bodies (415), unwritable Accept values (406), oversize files and too many rows (413)", async () => {
    expect((await upload('{"a":1}', "", { "content-type": "application/json" })).statusCode).toBe(415);
    const notAcceptable = await upload(SMALL_CSV, "", { "content-type": "text/csv", accept: "image/png" });
    expect(notAcceptable.statusCode).toBe(406);
    expect(notAcceptable.json().type).toBe("/problems/not-acceptable");
    const large = await upload(DEMO_LAS, "", { "content-type": "text/plain" }, { fileBodyLimitBytes: 1000 });
    expect(large.statusCode).toBe(413);
    expect(large.json().detail).toContain("1000 bytes");
    // A multipart file part over the limit gets the same answer, whether the file is read whole (JSON) or streamed (CSV).
    const { body, contentType } = multipartBody([{ name: "file", filename: "well.las", content: DEMO_LAS }]);
    for (const format of ["json", "csv"]) {
      const part = await upload(body, `?format=${format}`, { "content-type": contentType }, { fileBodyLimitBytes: 1000 });
      expect(part.statusCode, format).toBe(413);
      expect(part.json().detail, format).toBe(
        "The file part is larger than this endpoint's limit of 1000 bytes. Split the well, or ask the operator to raise FILE_BODY_LIMIT_BYTES.",
      );
    }
    const rows = await upload(SMALL_CSV, "", { "content-type": "text/plain" }, { maxSamples: 3 });
    expect(rows.statusCode).toBe(413);
    expect(rows.json().type).toBe("/problems/too-many-samples");
  });

  it("Accept negotiation follows RFC 9110 quality values; format= wins over Accept", async () => {
    const app = await build();
    const send = (headers: Record<string, string>, query = "") =>
      app.inject({ method: "POST", url: `/v1/logs${query}`, payload: SMALL_CSV, headers: { "content-type": "text/csv", ...headers } });
    expect((await send({ accept: "application/x-las;q=0.9, text/csv;q=0.5" })).headers["content-type"]).toMatch(/x-las/);
    expect((await send({ accept: "text/*" })).headers["content-type"]).toMatch(/text\/csv/);
    expect((await send({ accept: "*/*" })).headers["content-type"]).toMatch(/application\/json/);
    expect((await send({ accept: "text/csv" }, "?format=json")).headers["content-type"]).toMatch(/application\/json/);
  });
});

describe("POST /v1/elastic with zones", () => {
  it("summarises each zone per property; a zone without valid samples reports nulls, not zeros", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/elastic",
      payload: {
        depth: [1500, 1510, 1520, 1530, 1540],
        vp: [3000, 3200, 3400, null, 3000],
        vs: [1500, 1600, 1700, 1800, 1500],
        rho: [2.4, 2.45, 2.5, 2.5, 2.4],
        zones: [
          { name: "Upper", top: 1500, base: 1525 },
          { name: "Gap", top: 1528, base: 1535 },
          { name: "Overlap", top: 1515, base: 1545 },
          { name: "Below", top: 2000, base: 2100 },
        ],
      },
    });
    expect(response.statusCode).toBe(200);
    const [upper, gap, overlap, below] = response.json().zones;
    expect(upper).toMatchObject({ count: 3, valid: 3, flagged_fraction: 0 });
    // ν = 1/3 for every sample with Vp/Vs = 2 (Rock Physics Handbook, table 2.2.1)
    expect(upper.properties.nu).toMatchObject({ count: 3, valid: 3 });
    expect(upper.properties.nu.mean).toBeCloseTo(1 / 3, 12);
    expect(gap).toMatchObject({ count: 1, valid: 0, flagged_fraction: 1 });
    expect(gap.properties.E).toMatchObject({ valid: 0, mean: null, min: null, p10: null, p50: null, p90: null, max: null });
    expect(overlap.count).toBe(3);
    expect(below).toMatchObject({ count: 0, valid: 0, flagged_fraction: null });
  });

  it("places intervals (top/base input) by their midpoints", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/elastic",
      payload: { top: [1500, 1600], base: [1600, 1700], vp: [3000, 4000], vs: [1500, 2000], rho: [2.4, 2.6], zones: [{ name: "A", top: 1500, base: 1600 }] },
    });
    expect(response.json().zones[0].count).toBe(1);
  });

  it("zones without depth are a 400 naming body.zones", async () => {
    const app = await build();
    const response = await app.inject({ method: "POST", url: "/v1/elastic", payload: { vp: [3000], vs: [1500], rho: [2.4], zones: [{ name: "A", top: 1, base: 2 }] } });
    expect(response.statusCode).toBe(400);
    expect(response.json().errors[0].field).toBe("body.zones");
  });
});

describe("NDJSON answers", () => {
  it("format=ndjson (or Accept: application/x-ndjson) gives one JSON object per input row, in order, with flags by code", async () => {
    const response = await upload(SMALL_CSV, "", { "content-type": "text/csv", accept: "application/x-ndjson" });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^application\/x-ndjson/);
    const lines = response.body.trimEnd().split("\n").map((line) => JSON.parse(line));
    expect(lines).toHaveLength(4);
    expect(lines.map((line) => line.index)).toEqual([0, 1, 2, 3]);
    expect(lines[0].depth).toBe(1000);
    expect(lines[0].nu).toBeCloseTo(1 / 3, 14);
    expect(lines[2]).toMatchObject({ E: null, flags: ["missing"] });
    expect(lines[3].flags).toEqual(["vp_vs_below_sqrt2"]);
  });
});
