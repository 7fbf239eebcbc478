import { once } from "node:events";
import type { AddressInfo } from "node:net";
import { connect } from "node:net";
import { setTimeout as sleep } from "node:timers/promises";
import type { FastifyInstance } from "fastify";
import { afterEach, describe, expect, it } from "vitest";
import { buildApp } from "../../server/app.js";

const HEADERS_TIMEOUT_MS = 1_000;
const BYTE_PAUSE_MS = 200;
/** The client gives up after this many header bytes (6 s at one byte per 200 ms): long past the 1 s header timeout. */
const MAX_BYTES = 30;

let app: FastifyInstance | undefined;

afterEach(async () => {
  await app?.close();
  app = undefined;
});

/**
 * Listens on 127.0.0.1 with a 1 s header timeout. Node looks for connections past their header timeout on a
 * timer of its own (connectionsCheckingInterval, 30 s by default,
 * https://nodejs.org/api/http.html#httpcreateserveroptions-requestlistener), which the app must shorten for this to hold.
 */
const listen = async (): Promise<number> => {
  app = await buildApp({ logger: false, config: { headersTimeoutMs: HEADERS_TIMEOUT_MS } });
  await app.listen({ port: 0, host: "127.0.0.1" });
  return (app.server.address() as AddressInfo).port;
};

/** Sends a request line and a header, then one more header byte every 200 ms, never ending the headers; stops after MAX_BYTES. */
const trickleHeaders = async (port: number): Promise<{ bytesSent: number; cutOff: boolean; answer: string }> => {
  const socket = connect(port, "127.0.0.1");
  await once(socket, "connect");
  let answer = "";
  let cutOff = false;
  socket.on("data", (chunk: Buffer) => (answer += chunk.toString("latin1")));
  socket.on("end", () => (cutOff = true));
  socket.on("close", () => (cutOff = true));
  socket.on("error", () => undefined);
  socket.write("GET /livez HTTP/1.1\r\nHost: 127.0.0.1\r\nX-Trickle: ");
  let bytesSent = 0;
  while (!cutOff && bytesSent < MAX_BYTES) {
    await sleep(BYTE_PAUSE_MS);
    if (cutOff) break;
    socket.write("a");
    bytesSent++;
  }
  const result = { bytesSent, cutOff, answer };
  socket.destroy();
  return result;
};

describe("a client that trickles its headers (issue 5, checks: cut off by the header timeout)", () => {
  it("is cut off by the header timeout (1 s) long before it has trickled 6 s of header bytes, with a 408 or nothing", async () => {
    const port = await listen();
    const { bytesSent, cutOff, answer } = await trickleHeaders(port);
    expect(cutOff, `still connected after ${bytesSent} header bytes at one per ${BYTE_PAUSE_MS} ms`).toBe(true);
    expect(bytesSent).toBeLessThan(MAX_BYTES);
    expect(answer === "" || answer.startsWith("HTTP/1.1 408 "), answer).toBe(true);
  }, 20_000);

  it("when answered, gets a 408 as an RFC 9457 problem document like every other error (issue 5, item 1)", async () => {
    const port = await listen();
    const { answer } = await trickleHeaders(port);
    expect(answer).toMatch(/^HTTP\/1\.1 408 /);
    expect(answer).toMatch(/\r\ncontent-type: application\/problem\+json/i);
    const problem = JSON.parse(answer.slice(answer.indexOf("\r\n\r\n") + 4)) as Record<string, unknown>;
    expect(problem).toMatchObject({ status: 408, type: expect.any(String), title: expect.any(String), detail: expect.any(String) });
  }, 20_000);
});
