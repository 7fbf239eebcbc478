/**
 * Bodies of POST /v1/elastic are read into one buffer as they arrive: with a Content-Length (RFC 9110 §8.6) or in
 * the chunked transfer coding (RFC 9112 §7.1), the same answer; over the limit, a 413 problem either way.
 */
import { Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { request } from "undici";
import { build } from "../helpers/build.js";

/** Kestrel Flats 3, a fictional well of our own: three samples of a sand. */
const BODY = JSON.stringify({ dtc: [88.5, 90.1, 86.2], dts: [152.3, 155.0, 149.8], rho: [2.31, 2.29, 2.33] });

const serve = async (config = {}) => {
  const app = await build({ config });
  return app.listen({ port: 0, host: "127.0.0.1" });
};

const post = (base: string, body: string | Readable) =>
  request(`${base}/v1/elastic`, { method: "POST", headers: { "content-type": "application/json" }, body });

describe("reading a JSON body", () => {
  it("gives the same answer with a Content-Length and in chunks of 7 bytes without one", async () => {
    const base = await serve();
    const whole = await post(base, BODY);
    const pieces = Array.from({ length: Math.ceil(BODY.length / 7) }, (_, i) => Buffer.from(BODY.slice(i * 7, i * 7 + 7)));
    const chunked = await post(base, Readable.from(pieces));
    expect(chunked.statusCode).toBe(200);
    const [a, b] = [await whole.body.json(), await chunked.body.json()] as { E: number[]; request_id: string }[];
    expect(b.E).toEqual(a.E);
    expect(a.E).toHaveLength(3);
  });

  it("refuses a body over the limit with a 413 problem, whether its length is declared or only seen while it arrives", async () => {
    expect(BODY.length).toBeGreaterThan(50);
    const base = await serve({ jsonBodyLimitBytes: 50 });
    for (const body of [BODY, Readable.from([Buffer.from(BODY.slice(0, 30)), Buffer.from(BODY.slice(30))])]) {
      const answer = await post(base, body);
      expect(answer.statusCode).toBe(413);
      expect(answer.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(((await answer.body.json()) as { type: string }).type).toBe("/problems/body-too-large");
    }
  });
});
