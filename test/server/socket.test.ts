import { connect } from "node:net";
import type { FastifyInstance } from "fastify";
import { request } from "undici";
import { afterEach, describe, expect, it } from "vitest";
import { buildApp } from "../../server/app.js";

let app: FastifyInstance | undefined;
afterEach(async () => {
  await app?.close();
  app = undefined;
});

const listen = async (): Promise<string> => {
  app = await buildApp({ logger: false });
  return app.listen({ port: 0, host: "127.0.0.1" });
};

describe("over a real socket (undici client)", () => {
  it("GET /v1/elastic answers JSON and echoes an incoming x-request-id", async () => {
    const base = await listen();
    const response = await request(`${base}/v1/elastic?dtc=100&dts=200&rho=2.3`, { headers: { "x-request-id": "qc-run-42" } });
    expect(response.statusCode).toBe(200);
    expect(response.headers["x-request-id"]).toBe("qc-run-42");
    const body = (await response.body.json()) as { vp: number; nu: number };
    expect(body.vp).toBe(3048);
    expect(body.nu).toBeCloseTo(1 / 3, 14);
  });

  it("POST /v1/elastic over the wire gives the columns; a request without an id gets a generated one", async () => {
    const base = await listen();
    const response = await request(`${base}/v1/elastic`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ vp: [3000, null], vs: [1500, 1500], rho: [2.45, 2.45] }),
    });
    expect(response.statusCode).toBe(200);
    expect(response.headers["x-request-id"]).toMatch(/^[0-9a-f-]{36}$/);
    const body = (await response.body.json()) as { E: (number | null)[] };
    expect(body.E[0]).toBeCloseTo(14.7, 12);
    expect(body.E[1]).toBeNull();
  });

  it("an x-request-id with unsafe characters is replaced, not echoed", async () => {
    const base = await listen();
    const response = await request(`${base}/livez`, { headers: { "x-request-id": "bad id with spaces" } });
    await response.body.text();
    expect(response.headers["x-request-id"]).not.toBe("bad id with spaces");
  });

  it("a request line longer than Node accepts gets a 431 problem (RFC 6585 §5) with a request_id and what to do instead", async () => {
    const base = new URL(await listen());
    const answer = await new Promise<string>((resolve, reject) => {
      const socket = connect(Number(base.port), base.hostname, () => {
        socket.write(`GET /v1/elastic?dtc=${"9".repeat(20_000)} HTTP/1.1\r\nHost: x\r\n\r\n`);
      });
      let text = "";
      socket.on("data", (chunk) => (text += chunk.toString("latin1")));
      socket.on("close", () => resolve(text));
      socket.on("error", reject);
    });
    expect(answer).toMatch(/^HTTP\/1\.1 431 /);
    expect(answer).toMatch(/content-type: application\/problem\+json/i);
    const body = JSON.parse(answer.slice(answer.indexOf("\r\n\r\n") + 4)) as { type: string; detail: string; request_id?: string };
    expect(body.type).toBe("/problems/header-too-large");
    expect(body.detail).toContain("POST body");
    expect(body.request_id).toMatch(/^[0-9a-f-]{36}$/);
  });
});
