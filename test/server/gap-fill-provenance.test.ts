import { describe, expect, it } from "vitest";
import { CAUTION } from "../../server/derived-answer.js";
import { build } from "../helpers/build.js";
import { marramBankLas } from "../helpers/marram-bank-las.js";

/** Two samples of our fictional well Marram Bank 7; the second has no shear slowness (a gap to fill). */
const WELL = marramBankLas({ start: "1500.0", stop: "1500.5", step: "0.5" }, "1500.0 92 165 2.38", "1500.5 95 -999.25 -999.25");

const logs = async (query: string, accept = "application/json") => {
  const app = await build();
  return app.inject({ method: "POST", url: `/v1/logs${query}`, payload: WELL, headers: { "content-type": "text/plain", accept } });
};

// Castagna, Batzle & Eastwood (1985), Geophysics 50(4); Gardner, Gardner & Gregory (1974), Geophysics 39(6).
describe("an answer whose Vs or density was predicted says by which correlation, and carries the caution", () => {
  it("GET /v1/elastic with vs_from names the correlation, its formula and source, and adds the caution", async () => {
    const app = await build();
    const response = await app.inject({ method: "GET", url: "/v1/elastic?dtc=92&rho=2.38&vs_from=vs.castagna1985" });
    const body = response.json();
    expect(body.fill_correlations.vs).toMatchObject({ id: "vs.castagna1985", kind: "vs", empirical: true, fill: "nulls" });
    expect(body.fill_correlations.vs.source).toContain("Castagna");
    expect(body.caution).toBe(CAUTION);
    expect(body.flags.map((flag: { code: string }) => flag.code)).toContain("estimated_vs");
  });

  it("POST /v1/logs as JSON names both fills and counts the samples they filled", async () => {
    const body = (await logs("?vs_from=vs.castagna1985&rho_from=density.gardner1974")).json();
    expect(body.filled).toEqual({ vs: 1, rho: 1 });
    expect(body.fill_correlations.vs.id).toBe("vs.castagna1985");
    expect(body.fill_correlations.rho).toMatchObject({ id: "density.gardner1974", kind: "density", fill: "nulls" });
    expect(body.fill_correlations.rho.source).toContain("Gardner");
    expect(body.caution).toBe(CAUTION);
  });

  it("an answer without gap filling or correlations has neither", async () => {
    const body = (await logs("")).json();
    expect(body).not.toHaveProperty("fill_correlations");
    expect(body).not.toHaveProperty("caution");
  });

  it("POST /v1/logs as LAS: EL_VS_FROM names the curve read and the correlation that filled its gaps; ~Other cites it, with the caution", async () => {
    const text = (await logs("?vs_from=vs.castagna1985&format=las", "text/plain")).body;
    expect(text).toMatch(/^ EL_VS_FROM *\. *DTS us\/ft; GAPS PREDICTED BY vs\.castagna1985 *:/im);
    const other = text.slice(text.indexOf("~O"), text.indexOf("~A"));
    expect(other).toContain("Vs predicted by vs.castagna1985");
    expect(other).toContain("Castagna");
    expect(other).toContain(CAUTION);
  });
});
