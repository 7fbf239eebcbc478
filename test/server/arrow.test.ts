import { Float64, tableFromIPC, tableToIPC, Table, vectorFromArray } from "apache-arrow";
import { describe, expect, it } from "vitest";
import { FLAG_CODES } from "../../core/index.js";
import { build } from "../helpers/build.js";

const ARROW = "application/vnd.apache.arrow.stream";

/** Columns of a fictional well with gaps (nulls) and a mispicked shear sample. */
const COLUMNS = {
  depth: [2100, 2100.1524, 2100.3048, 2100.4572, 2100.6096],
  dtc: [92.5, null, 88.1, 95.0, 79.9],
  dts: [166.0, 170.2, 120.0, 171.4, 143.3],
  rho: [2.41, 2.43, 2.45, null, 2.52],
};

const arrowBody = (columns: Record<string, (number | null)[]>): Buffer =>
  Buffer.from(tableToIPC(new Table(Object.fromEntries(Object.entries(columns).map(([name, values]) => [name, vectorFromArray(values, new Float64())]))), "stream"));

describe("Apache Arrow IPC on POST /v1/elastic", () => {
  it("the same columns posted as JSON and as Arrow give identical results, bit for bit, nulls and flags included", async () => {
    const app = await build();
    const json = (await app.inject({ method: "POST", url: "/v1/elastic", payload: COLUMNS })).json();
    const response = await app.inject({ method: "POST", url: "/v1/elastic", payload: arrowBody(COLUMNS), headers: { "content-type": ARROW, accept: ARROW } });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toBe(ARROW);
    const table = tableFromIPC(response.rawPayload);
    expect(table.numRows).toBe(5);
    for (const key of ["depth", "E", "nu", "G", "K", "lambda", "M", "vp_vs", "p_impedance", "s_impedance", "lambda_rho", "mu_rho", "vp", "vs"]) {
      const column = table.getChild(key);
      expect(column, key).not.toBeNull();
      const values = Array.from({ length: 5 }, (_, i) => column?.get(i) ?? null);
      values.forEach((value, i) => expect(Object.is(value, json[key][i]), `${key}[${i}]: ${value} vs ${json[key][i]}`).toBe(true));
    }
    const masks = Array.from(table.getChild("flags")?.toArray() as Uint32Array);
    const fromJson = [0, 0, 0, 0, 0];
    for (const flag of json.flags) fromJson[flag.index] |= 1 << FLAG_CODES.indexOf(flag.code);
    expect(masks).toEqual(fromJson);
    const bits = JSON.parse(table.schema.metadata.get("elastilog.flag_bits") ?? "{}");
    expect(bits["0"]).toBe("missing");
    expect(JSON.parse(table.schema.metadata.get("elastilog.summary") ?? "{}")).toEqual(json.summary);
  });

  it("an Arrow body takes its options from the query string and may be answered in JSON", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/elastic?modulus_unit=Mpsi&slowness_unit=us/ft&keep_negative_poisson=true",
      payload: arrowBody(COLUMNS),
      headers: { "content-type": ARROW, accept: "application/json" },
    });
    expect(response.statusCode).toBe(200);
    const answer = response.json();
    expect(answer.units.modulus).toBe("Mpsi");
    expect(answer.nu[2]).toBeLessThan(0); // DTS/DTC = 1.36 < √2, kept with keep_negative_poisson
  });

  it("refuses bad Arrow bytes, unknown column names, query options with a JSON body, and unwritable Accept values", async () => {
    const app = await build();
    const garbage = await app.inject({ method: "POST", url: "/v1/elastic", payload: Buffer.from("not arrow at all"), headers: { "content-type": ARROW } });
    expect(garbage.statusCode).toBe(400);
    expect(garbage.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(garbage.json().errors[0].field).toBe("body");
    const unknown = await app.inject({ method: "POST", url: "/v1/elastic", payload: arrowBody({ ...COLUMNS, VP: [1, 2, 3, 4, 5] }), headers: { "content-type": ARROW } });
    expect(unknown.statusCode).toBe(400);
    expect(JSON.stringify(unknown.json().errors)).toContain("VP");
    const mixed = await app.inject({ method: "POST", url: "/v1/elastic?modulus_unit=MPa", payload: COLUMNS });
    expect(mixed.statusCode).toBe(400);
    const png = await app.inject({ method: "POST", url: "/v1/elastic", payload: COLUMNS, headers: { accept: "image/png" } });
    expect(png.statusCode).toBe(406);
  });

  it("refuses correlations and zones in the query of an Arrow body with a 400 that says they are answered in JSON only, from a JSON body", async () => {
    const app = await build();
    const send = (query: string) =>
      app.inject({ method: "POST", url: `/v1/elastic${query}`, payload: arrowBody(COLUMNS), headers: { "content-type": ARROW, accept: "application/json" } });
    const correlations = await send("?correlations=ucs.mcnally1987");
    expect(correlations.statusCode).toBe(400);
    expect(correlations.headers["content-type"]).toMatch(/^application\/problem\+json/);
    const problem = correlations.json();
    expect(problem.detail).toMatch(/answered in JSON only/);
    expect(problem.detail).toMatch(/JSON body \(Content-Type: application\/json\)/);
    expect(problem.detail).not.toMatch(/unknown field/);
    expect(problem.errors).toEqual([{ field: "query.correlations", message: expect.stringContaining("JSON only") }]);
    const both = await send("?zones=A:2100:2101&modulus_unit=GPa&correlation_options=x");
    expect(both.statusCode).toBe(400);
    expect(both.json().errors.map((error: { field: string }) => error.field)).toEqual(["query.correlation_options", "query.zones"]);
    // Anything else unknown is still an unknown field.
    const other = await send("?colour=blue");
    expect(other.statusCode).toBe(400);
    expect(other.json().errors).toEqual([{ field: "query.colour", message: expect.stringContaining("unknown field") }]);
  });

  it("tells a JSON body with correlations in the query to leave the query string empty, before checking its names", async () => {
    const app = await build();
    const response = await app.inject({ method: "POST", url: "/v1/elastic?correlations=ucs.mcnally1987", payload: COLUMNS });
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toEqual([{ field: "query", message: "leave the query string empty with a JSON body" }]);
  });
});
