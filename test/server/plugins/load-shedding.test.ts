import type { FastifyInstance } from "fastify";
import { describe, expect, it } from "vitest";
import { loadShedding, type LoadSheddingOptions } from "../../../server/plugins/load-shedding.js";
import { problemSchema } from "../../../server/schemas/problem.js";
import { bareApp } from "./bare-app.js";

const OFF: LoadSheddingOptions = { maxEventLoopDelayMs: 0, maxHeapUsedBytes: 0, maxRssBytes: 0, maxEventLoopUtilization: 0, retryAfterSeconds: 7 };

const withLimits = (limits: Partial<LoadSheddingOptions>) => bareApp((app) => app.register(loadShedding, { ...OFF, ...limits }));

/** Waits, a bounded number of 10 ms turns, until under-pressure's next measurement has seen the condition. */
const untilMeasured = async (condition: () => boolean) => {
  for (let turn = 0; turn < 500 && !condition(); turn++) await new Promise((resolve) => setTimeout(resolve, 10));
  expect(condition()).toBe(true);
};

/** Keeps the event loop busy, once it is turning (a block before its first turn is not in the delay histogram). */
const blockEventLoop = async (milliseconds: number) => {
  await new Promise((resolve) => setTimeout(resolve, 50));
  const end = performance.now() + milliseconds;
  while (performance.now() < end);
};

const expectOverloaded = async (app: FastifyInstance, measure: string) => {
  const response = await app.inject({ url: "/v1/elastic?dtc=95&dts=170&rho=2.45" });
  expect(response.statusCode).toBe(503);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
  expect(response.headers["retry-after"]).toBe("7");
  const body = problemSchema.parse(response.json());
  expect(body).toMatchObject({ type: "/problems/overloaded", status: 503, detail: expect.stringContaining(measure) });
  expect(body.detail).toContain("retry after 7 s");
};

describe("load shedding (@fastify/under-pressure)", () => {
  it("over the heap limit, new work gets a 503 problem with Retry-After (RFC 9110 §10.2.3: seconds to wait)", async () => {
    const app = await withLimits({ maxHeapUsedBytes: 1, sampleIntervalMs: 10 });
    await untilMeasured(() => app.isUnderPressure());
    await expectOverloaded(app, "heap in use");
  });

  it("over the resident-memory limit, new work gets a 503 problem", async () => {
    const app = await withLimits({ maxRssBytes: 1, sampleIntervalMs: 10 });
    await untilMeasured(() => app.isUnderPressure());
    await expectOverloaded(app, "resident memory");
  });

  it("after the event loop was blocked past the delay limit, new work gets a 503 problem", async () => {
    const app = await withLimits({ maxEventLoopDelayMs: 1, sampleIntervalMs: 1000 });
    await blockEventLoop(300);
    await untilMeasured(() => app.memoryUsage().eventLoopDelay > 1);
    await expectOverloaded(app, "event-loop delay");
  });

  it("probes and /metrics are answered even under pressure", async () => {
    const app = await withLimits({ maxHeapUsedBytes: 1, sampleIntervalMs: 10 });
    await untilMeasured(() => app.isUnderPressure());
    for (const url of ["/livez", "/readyz", "/metrics"]) expect((await app.inject({ url })).statusCode, url).toBe(200);
    expect((await app.inject({ url: "/openapi.json" })).statusCode).toBe(503);
  });

  it("with every limit at 0 nothing is ever refused, and no status route is added", async () => {
    const app = await withLimits({ sampleIntervalMs: 10 });
    await blockEventLoop(50);
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(app.isUnderPressure()).toBe(false);
    expect((await app.inject({ url: "/v1/elastic" })).statusCode).toBe(200);
    expect((await app.inject({ url: "/status" })).statusCode).toBe(404);
  });

  it.each([
    ["an event-loop utilisation above 1", { maxEventLoopUtilization: 1.5 }, "between 0 and 1"],
    ["a Retry-After of 0 s", { retryAfterSeconds: 0 }, "Retry-After"],
    ["a fractional Retry-After", { retryAfterSeconds: 2.5 }, "Retry-After"],
  ])("refuses to start with %s", async (_name, limits, words) => {
    await expect(withLimits(limits)).rejects.toThrow(words);
  });
});
