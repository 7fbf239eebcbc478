import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/** A three-row CSV of our own demo well (Marram Bank 7), enough for the query options to be read. */
const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1510.0,95,170,2.45\r\n1510.5,96,172,2.44\r\n1511.0,97,174,2.43\r\n";

const logs = async (query: string) => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs?${query}`, payload: CSV, headers: { "content-type": "text/csv" } });
};

const point = async (query: string) => {
  const app = await build();
  return app.inject({ url: `/v1/elastic?dtc=95&dts=170&rho=2.45&${query}` });
};

describe("lists and repeated parameters in query strings: what was asked is what is answered", () => {
  it.each([
    ["correlations=", "is empty"],
    ["correlations=static_e.lacy1997_sandstone,,ucs.mcnally1987", "has an empty entry"],
    ["correlations=ucs.mcnally1987,ucs.mcnally1987", "names ucs.mcnally1987 twice"],
  ])("GET /v1/elastic?%s is a 400 naming query.correlations", async (query, words) => {
    const response = await point(query);
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toContainEqual({ field: "query.correlations", message: expect.stringContaining(words) });
  });

  it.each([
    ["correlations=", "query.correlations", "is empty"],
    ["correlations=a,,b", "query.correlations", "has an empty entry"],
    ["zones=", "query.zones", "is empty"],
    ["zones=%20", "query.zones", "is empty"],
    ["format=csv&format=las", "query.format", 'is given 2 times ("csv", "las"): give it once'],
  ])("POST /v1/logs?%s is a 400 naming %s", async (query, field, words) => {
    const response = await logs(query);
    expect(response.statusCode).toBe(400);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.json().errors).toContainEqual({ field, message: expect.stringContaining(words) });
  });

  it("a correlation id given twice in a JSON body is a 400 too", async () => {
    const app = await build();
    const response = await app.inject({
      method: "POST",
      url: "/v1/elastic",
      payload: { dtc: [95], dts: [170], rho: [2.45], correlations: ["ucs.mcnally1987", "ucs.mcnally1987"] },
    });
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toContainEqual({ field: "body.correlations", message: expect.stringContaining("twice") });
  });

  it("a well-formed list still works, spaces after commas allowed", async () => {
    const response = await point("correlations=static_e.lacy1997_sandstone,%20ucs.mcnally1987");
    expect(response.statusCode).toBe(200);
    expect(Object.keys(response.json().derived)).toEqual(["static_e.lacy1997_sandstone", "ucs.mcnally1987"]);
  });
});
