import { once } from "node:events";
import { connect, type Socket } from "node:net";
import { setTimeout as sleep } from "node:timers/promises";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { withinBound } from "./answer-checks.js";
import { forkProbeService, getFresh, type ProbeService } from "./service-process.js";
import { demoLasCut, demoLasRepeated, lasSampleCount } from "./well-texts.js";

const ABORTS = 8;
/** Loose on purpose: a leak of the aborted bodies (about 10 MB of columns each) would exceed it, a collector's whim would not. */
const HEAP_SLACK_BYTES = 50 * 1024 * 1024;

let service: ProbeService;
let base: string;

beforeAll(async () => {
  service = await forkProbeService("warn");
  base = service.base;
});

afterAll(async () => {
  await service.stop();
});

/** POST /v1/logs?format=las with a small demo well; resolves with status and body. */
const convert = async (file: string): Promise<{ status: number; body: string }> => {
  const response = await withinBound(
    fetch(`${base}/v1/logs?format=las`, { method: "POST", headers: { "content-type": "application/x-las" }, body: file }),
    30_000,
    "a conversion",
  );
  return { status: response.status, body: await response.text() };
};

/**
 * Sends the head of a POST /v1/logs declaring the whole file's length, then half the file, then drops the
 * connection: with a FIN (`destroy`) or a TCP reset (`resetAndDestroy`), as a killed client or a broken
 * network would.
 */
const abortHalfway = async (file: Buffer, reset: boolean): Promise<void> => {
  const { port } = new URL(base);
  const socket: Socket = connect(Number(port), "127.0.0.1");
  await withinBound(once(socket, "connect"), 10_000, "connecting");
  socket.on("error", () => undefined);
  socket.write(`POST /v1/logs HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nContent-Type: application/x-las\r\nContent-Length: ${file.length}\r\n\r\n`);
  const half = file.subarray(0, Math.floor(file.length / 2));
  if (!socket.write(half)) await withinBound(once(socket, "drain"), 30_000, "sending half the file");
  await sleep(200);
  if (reset) socket.resetAndDestroy();
  else socket.destroy();
};

describe("a client that aborts an upload halfway (issue 5, checks)", () => {
  it(
    "leaves the service answering /livez and converting, with its heap back near the baseline (within 50 MB, loose on purpose)",
    async () => {
      const small = demoLasCut(30);
      expect((await convert(small)).status).toBe(200);
      const baseline = await service.memory();

      const large = Buffer.from(demoLasRepeated(400_000));
      for (let i = 0; i < ABORTS; i++) await abortHalfway(large, i % 2 === 1);

      const live = await getFresh(`${base}/livez`);
      expect(live.status).toBe(200);
      const converted = await convert(small);
      expect(converted.status).toBe(200);
      expect(lasSampleCount(converted.body)).toBe(30);
      const after = await service.memory();
      expect(after.heapUsedBytes - baseline.heapUsedBytes, `heap ${baseline.heapUsedBytes} → ${after.heapUsedBytes} bytes`).toBeLessThan(HEAP_SLACK_BYTES);
      expect(after.arrayBuffersBytes - baseline.arrayBuffersBytes, `array buffers ${baseline.arrayBuffersBytes} → ${after.arrayBuffersBytes} bytes`).toBeLessThan(HEAP_SLACK_BYTES);
    },
    120_000,
  );

  it("does not log the aborted uploads as unhandled errors: the client left, nothing failed in the service", async () => {
    await abortHalfway(Buffer.from(demoLasRepeated(50_000)), false);
    await sleep(500);
    expect(service.logged()).not.toMatch(/"msg":"unhandled error"/);
  });
});
