import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { build } from "../../helpers/build.js";

/** Two rows of our own demo well (Marram Bank 7). */
const CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1510.0,95,170,2.45\r\n1510.5,96,172,2.44\r\n";

describe("bodies the service cannot read as sent are refused before they are read", () => {
  it.each([
    ["gzip", "/v1/logs", gzipSync(CSV), "text/csv"],
    ["br", "/v1/logs", Buffer.from(CSV), "text/csv"],
    ["gzip", "/v1/elastic", gzipSync('{"dtc":[95],"dts":[170],"rho":[2.45]}'), "application/json"],
  ])("Content-Encoding: %s on POST %s is a 415 problem (RFC 9110 §15.5.16), not bytes read as the file", async (coding, url, payload, type) => {
    const app = await build();
    const response = await app.inject({ method: "POST", url, payload, headers: { "content-type": type, "content-encoding": coding } });
    expect(response.statusCode).toBe(415);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.json().detail).toContain("uncompressed");
  });

  it("Content-Encoding: identity is the body as it is", async () => {
    const app = await build();
    const response = await app.inject({ method: "POST", url: "/v1/logs", payload: CSV, headers: { "content-type": "text/csv", "content-encoding": "identity" } });
    expect(response.statusCode).toBe(200);
  });

  it.each([["/v1/correlations"], ["/v1/correlations/ucs.mcnally1987"], ["/livez"]])("a body on GET %s is a 400 naming the body (RFC 9110 §9.3.1), not ignored", async (url) => {
    const app = await build();
    const response = await app.inject({ method: "GET", url, payload: '{"kind":"ucs"}', headers: { "content-type": "application/json" } });
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toContainEqual({ field: "body", message: "leave the body empty on GET, or use POST" });
  });
});
