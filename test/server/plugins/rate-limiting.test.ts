import type { FastifyInstance, InjectOptions } from "fastify";
import { afterEach, describe, expect, it, vi } from "vitest";
import { authentication } from "../../../server/plugins/authentication.js";
import { rateLimiting, type RateLimitingOptions } from "../../../server/plugins/rate-limiting.js";
import { problemSchema } from "../../../server/schemas/problem.js";
import { bareApp } from "./bare-app.js";

const KEY = "rate-key-one-0123456789";
const OTHER_KEY = "rate-key-two-9876543210";
const bearer = (token: string) => ({ authorization: `Bearer ${token}` });

/** As app.ts orders them: authentication first, so the limiter sees the accepted key. */
const limited = (options: RateLimitingOptions, apiKeys: string[] = []) =>
  bareApp(async (app) => {
    await app.register(authentication, { apiKeys });
    await app.register(rateLimiting, options);
  });

/** Status codes of `count` identical requests, sent one after another. */
const statuses = async (app: FastifyInstance, count: number, request: InjectOptions) => {
  const codes: number[] = [];
  for (let i = 0; i < count; i++) codes.push((await app.inject(request)).statusCode);
  return codes;
};

afterEach(() => {
  vi.useRealTimers();
});

describe("per-client rate limiting (@fastify/rate-limit)", () => {
  it("over the limit a request gets a 429 problem with Retry-After (RFC 6585 §4; RFC 9110 §10.2.3: delay in seconds)", async () => {
    const app = await limited({ maxRequests: 2, windowMs: 60_000 });
    const allowed = [await app.inject({ url: "/v1/elastic" }), await app.inject({ url: "/v1/elastic" })];
    expect(allowed.map((r) => r.statusCode)).toEqual([200, 200]);
    // @fastify/rate-limit documentation: x-ratelimit-limit and x-ratelimit-remaining on every limited answer.
    expect(allowed.map((r) => [r.headers["x-ratelimit-limit"], r.headers["x-ratelimit-remaining"]])).toEqual([
      ["2", "1"],
      ["2", "0"],
    ]);
    const refused = await app.inject({ method: "POST", url: "/v1/elastic", payload: {} });
    expect(refused.statusCode).toBe(429);
    expect(refused.headers["content-type"]).toMatch(/^application\/problem\+json/);
    const retryAfter = Number(refused.headers["retry-after"]);
    expect(Number.isInteger(retryAfter) && retryAfter >= 1 && retryAfter <= 60).toBe(true);
    expect(refused.headers["x-ratelimit-limit"]).toBe("2");
    expect(refused.headers["x-ratelimit-remaining"]).toBe("0");
    expect(refused.headers["x-ratelimit-reset"]).toBe(String(retryAfter));
    const body = problemSchema.parse(refused.json());
    expect(body).toMatchObject({ type: "/problems/rate-limited", status: 429, title: "Too many requests from this client" });
    expect(body.detail).toContain(`More than 2 requests in 60 s from this client address; wait ${retryAfter} s`);
  });

  it("client addresses are counted separately, and an IPv6 client by its /64 (the plugin's default keyGenerator)", async () => {
    const app = await limited({ maxRequests: 1, windowMs: 60_000 });
    expect(await statuses(app, 2, { url: "/v1/elastic", remoteAddress: "192.0.2.10" })).toEqual([200, 429]);
    expect(await statuses(app, 2, { url: "/v1/elastic", remoteAddress: "192.0.2.11" })).toEqual([200, 429]);
    // RFC 3849 documentation prefix: two hosts of one /64 share a count, another /64 has its own.
    expect((await app.inject({ url: "/v1/elastic", remoteAddress: "2001:db8:0:1::a" })).statusCode).toBe(200);
    expect((await app.inject({ url: "/v1/elastic", remoteAddress: "2001:db8:0:1::b" })).statusCode).toBe(429);
    expect((await app.inject({ url: "/v1/elastic", remoteAddress: "2001:db8:0:2::a" })).statusCode).toBe(200);
  });

  it("with API keys each key is counted separately, whatever address it comes from", async () => {
    const app = await limited({ maxRequests: 2, windowMs: 60_000 }, [KEY, OTHER_KEY]);
    const fromKey = (token: string, remoteAddress: string) => ({ url: "/v1/elastic", headers: bearer(token), remoteAddress });
    expect(await statuses(app, 2, fromKey(KEY, "192.0.2.10"))).toEqual([200, 200]);
    expect((await app.inject(fromKey(KEY, "198.51.100.7"))).statusCode).toBe(429);
    expect(await statuses(app, 3, fromKey(OTHER_KEY, "192.0.2.10"))).toEqual([200, 200, 429]);
    const refused = await app.inject(fromKey(KEY, "192.0.2.10"));
    expect(refused.json().detail).toContain("from this API key");
    for (const secret of [KEY, OTHER_KEY]) expect(refused.body).not.toContain(secret);
  });

  it("authentication runs first: a request without a valid key is a 401 and is not counted", async () => {
    const app = await limited({ maxRequests: 1, windowMs: 60_000 }, [KEY]);
    expect(await statuses(app, 3, { url: "/v1/elastic", headers: bearer("not-the-key") })).toEqual([401, 401, 401]);
    expect(await statuses(app, 2, { url: "/v1/elastic", headers: bearer(KEY) })).toEqual([200, 429]);
    expect((await app.inject({ url: "/v1/elastic" })).statusCode).toBe(401);
  });

  it("probes, /metrics, the contract and problem pages are never limited", async () => {
    const app = await limited({ maxRequests: 1, windowMs: 60_000 });
    expect(await statuses(app, 2, { url: "/v1/elastic" })).toEqual([200, 429]);
    for (const url of ["/livez", "/readyz", "/metrics", "/openapi.json", "/problems/rate-limited"]) {
      const answers = await statuses(app, 5, { url });
      expect(answers, url).toEqual([200, 200, 200, 200, 200]);
      expect((await app.inject({ url })).headers["x-ratelimit-limit"], url).toBeUndefined();
    }
  });

  it("a path the router decodes to /v1/ counts against the same client", async () => {
    const app = await limited({ maxRequests: 1, windowMs: 60_000 });
    expect((await app.inject({ url: "/%76%31/elastic" })).statusCode).toBe(200);
    expect((await app.inject({ url: "/v1/elastic" })).statusCode).toBe(429);
  });

  it("once the window has passed the client is counted afresh (fixed windows, per the plugin's LocalStore)", async () => {
    vi.useFakeTimers({ toFake: ["Date"] });
    const app = await limited({ maxRequests: 1, windowMs: 10_000 });
    expect(await statuses(app, 2, { url: "/v1/elastic" })).toEqual([200, 429]);
    vi.setSystemTime(Date.now() + 10_001);
    expect(await statuses(app, 2, { url: "/v1/elastic" })).toEqual([200, 429]);
  });

  it("with a limit of 0 nothing is limited and no rate-limit header is sent", async () => {
    const app = await limited({ maxRequests: 0, windowMs: 60_000 });
    const answers = await statuses(app, 20, { url: "/v1/elastic" });
    expect(answers.every((status) => status === 200)).toBe(true);
    expect((await app.inject({ url: "/v1/elastic" })).headers["x-ratelimit-limit"]).toBeUndefined();
  });

  it("refuses to start unless authentication is registered first, since a request's key is known only after it", async () => {
    await expect(bareApp((app) => app.register(rateLimiting, { maxRequests: 5, windowMs: 1000 }))).rejects.toThrow(/elastilog-authentication/);
  });

  it.each([
    ["a window of 0 ms", { maxRequests: 5, windowMs: 0 }, "RATE_LIMIT_WINDOW_MS"],
    ["a negative limit", { maxRequests: -1, windowMs: 1000 }, "whole number of requests"],
    ["a fractional limit", { maxRequests: 1.5, windowMs: 1000 }, "whole number of requests"],
  ])("refuses to start with %s", async (_name, options, words) => {
    await expect(limited(options)).rejects.toThrow(words);
  });
});
