import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/**
 * `curl -X POST <url>` with nothing else sends no body, no Content-Length and no Content-Type: Fastify then runs
 * no body parser at all. Such a request is a client's mistake, so it gets a problem answer that says what to send
 * (RFC 9457 problem details), never a 500.
 */
describe("a POST with no body at all", () => {
  it.each([["json"], ["csv"], ["las"], ["ndjson"]])("to /v1/logs (answer as %s) is read as an empty file: 422 that asks for a LAS or CSV file, not 500", async (format) => {
    const app = await build();
    const response = await app.inject({ method: "POST", url: `/v1/logs?format=${format}` });
    expect(response.statusCode).toBe(422);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.json().detail).toBe("The body holds no well data: send a LAS 2.0 or CSV file as the request body.");
  });

  it("to /v1/elastic is read as an empty body: 400 that asks for a JSON object, not 500", async () => {
    const app = await build();
    for (const headers of [{}, { accept: "application/vnd.apache.arrow.stream" }]) {
      const response = await app.inject({ method: "POST", url: "/v1/elastic", headers });
      expect(response.statusCode).toBe(400);
      expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(response.json().detail).toBe("The body is empty; send a JSON object (see /openapi.yaml).");
    }
  });
});
