/**
 * POST /v1/elastic reads exactly one Arrow IPC stream per body, on the event loop and on the worker threads (bodies
 * over 64 KiB): a second stream or bytes after the stream are a 400 problem, never dropped without notice. Source:
 * Apache Arrow columnar format, "IPC Streaming Format" (encapsulated messages, optionally ended by the end-of-stream
 * marker 0xFFFFFFFF 0x00000000); problems as RFC 9457 documents.
 */
import { Float64, Table, tableFromIPC, tableToIPC, vectorFromArray } from "apache-arrow";
import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

const ARROW = "application/vnd.apache.arrow.stream";

/** Rows of a fictional well of our own, as one stream of `batches` record batches. */
const streamOf = (rows: number, batches = 1): Buffer => {
  const column = (values: number[], from: number, to: number) => vectorFromArray(Array.from({ length: to - from }, (_, i) => values[(from + i) % values.length]), new Float64());
  const parts = Array.from({ length: batches }, (_, b) => {
    const [from, to] = [Math.floor((b * rows) / batches), Math.floor(((b + 1) * rows) / batches)];
    return new Table({ dtc: column([95, 88.4, 101.2], from, to), dts: column([170, 161.5, 182.9], from, to), rho: column([2.4, 2.45, 2.38], from, to) });
  });
  return Buffer.from(tableToIPC(new Table(parts.flatMap((part) => part.batches)), "stream"));
};

const post = async (payload: Buffer) => {
  const app = await build();
  return app.inject({ method: "POST", url: "/v1/elastic", payload, headers: { "content-type": ARROW } });
};

const expectBodyProblem = async (payload: Buffer, message: RegExp) => {
  const response = await post(payload);
  expect(response.statusCode).toBe(400);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/); // RFC 9457, section 3
  const problem = response.json();
  expect(problem.type).toBe("/problems/invalid-request");
  expect(problem.errors).toEqual([{ field: "body", message: expect.stringMatching(message) }]);
};

describe("one Arrow IPC stream per body of POST /v1/elastic (Apache Arrow columnar format, IPC Streaming Format)", () => {
  for (const [size, rows] of [["a small body", 3], ["a body over 64 KiB (worker thread)", 4000]] as const) {
    it(`refuses two streams one after the other in ${size}, where only the first would be read`, async () => {
      const one = streamOf(rows);
      expect(one.length > 64 * 1024).toBe(rows > 3);
      expect(tableFromIPC(Buffer.concat([one, one])).numRows).toBe(rows); // the library alone reads the first
      await expectBodyProblem(Buffer.concat([one, one]), /^the body holds a second Arrow IPC stream from byte \d+, after the end of the first; .*write all record batches into one stream/);
    });

    it(`refuses bytes after the stream in ${size}, saying what they are`, async () => {
      await expectBodyProblem(Buffer.concat([streamOf(rows), Buffer.from("JUNKJUNKJUNK")]), /^the body has 12 bytes after the end of its Arrow IPC stream, from byte \d+ \(4a 55 4e 4b/);
    });

    it(`still answers one stream of several record batches in ${size}, every row`, async () => {
      const response = await post(streamOf(rows, 3));
      expect(response.statusCode).toBe(200);
      expect(response.json().E).toHaveLength(rows);
    });
  }

  it("answers text sent as Arrow with a problem in plain words, not the Arrow library's message", async () => {
    await expectBodyProblem(Buffer.from("not arrow at all"), /^the body is not an Arrow IPC stream: it does not begin with an Arrow schema message, it begins with the bytes 6e 6f 74 20/);
  });
});
