import { describe, expect, it } from "vitest";
import { readConfig } from "../../server/config.js";
import { build } from "../helpers/build.js";

describe("operations wired into the app", () => {
  it("with API_KEYS, /v1/* needs the bearer key (401 problem with a Bearer challenge, RFC 6750) and the probes stay open", async () => {
    const app = await build({ config: { apiKeys: ["kestrel-key-1"] } });
    const refused = await app.inject({ url: "/v1/elastic?vp=3000&vs=1500&rho=2.4" });
    expect(refused.statusCode).toBe(401);
    expect(refused.headers["www-authenticate"]).toMatch(/^Bearer realm="elastilog"/);
    expect(refused.json().type).toBe("/problems/unauthorized");
    const allowed = await app.inject({ url: "/v1/elastic?vp=3000&vs=1500&rho=2.4", headers: { authorization: "Bearer kestrel-key-1" } });
    expect(allowed.statusCode).toBe(200);
    expect((await app.inject({ url: "/livez" })).statusCode).toBe(200);
    expect((await app.inject({ url: "/readyz" })).statusCode).toBe(200);
  });

  it("/metrics counts requests by route and status, samples converted and flags raised by code (Prometheus text format)", async () => {
    const app = await build();
    await app.inject({ method: "POST", url: "/v1/elastic", payload: { vp: [3000, 2000, null], vs: [1500, 2100, 1500], rho: [2.4, 2.4, 2.4] } });
    const text = (await app.inject({ url: "/metrics" })).body;
    expect(text).toMatch(/elastilog_samples_converted_total 3\b/);
    expect(text).toMatch(/elastilog_qc_flags_raised_total\{code="missing"\} 1\b/);
    expect(text).toMatch(/elastilog_qc_flags_raised_total\{code="vs_not_below_vp"\} 1\b/);
    expect(text).toMatch(/elastilog_http_requests_total\{method="POST",route="\/v1\/elastic",status_code="200"\} 1\b/);
    expect(text).toMatch(/nodejs_eventloop_lag_seconds/);
  });

  it("CORS is off by default and answers listed origins only", async () => {
    const closed = await build();
    const none = await closed.inject({ url: "/livez", headers: { origin: "https://logs.example" } });
    expect(none.headers["access-control-allow-origin"]).toBeUndefined();
    const open = await build({ config: { corsOrigins: ["https://logs.example"] } });
    const listed = await open.inject({ url: "/livez", headers: { origin: "https://logs.example" } });
    expect(listed.headers["access-control-allow-origin"]).toBe("https://logs.example");
  });

  it("reads API_KEYS, CORS_ORIGINS, METRICS_REQUIRE_AUTH and the load-shedding limits from the environment", () => {
    const config = readConfig({
      API_KEYS: " a1, b2 ,,",
      CORS_ORIGINS: "https://logs.example",
      METRICS_REQUIRE_AUTH: "true",
      MAX_EVENT_LOOP_DELAY_MS: "250",
      MAX_EVENT_LOOP_UTILIZATION: "0.9",
      RETRY_AFTER_SECONDS: "7",
    });
    expect(config).toMatchObject({
      apiKeys: ["a1", "b2"],
      corsOrigins: ["https://logs.example"],
      metricsRequireAuth: true,
      maxEventLoopDelayMs: 250,
      maxEventLoopUtilization: 0.9,
      retryAfterSeconds: 7,
    });
    expect(() => readConfig({ MAX_EVENT_LOOP_UTILIZATION: "2" })).toThrow(/fraction from 0 to 1/);
  });

  it("rate limiting is off by default: many /v1/ requests from one client pass, without rate-limit headers", async () => {
    const app = await build();
    for (let i = 0; i < 25; i++) {
      const answer = await app.inject({ url: "/v1/elastic?vp=3000&vs=1500&rho=2.4" });
      expect(answer.statusCode).toBe(200);
      expect(answer.headers["x-ratelimit-limit"]).toBeUndefined();
    }
  });

  it("with RATE_LIMIT_MAX, /v1/* answers 429 problem+json with Retry-After over the limit, the probes stay open, and CORS headers reach the 429", async () => {
    const origin = "https://logs.example";
    const app = await build({ config: { rateLimitMax: 2, rateLimitWindowMs: 30_000, corsOrigins: [origin] } });
    const point = { url: "/v1/elastic?vp=3000&vs=1500&rho=2.4", headers: { origin } };
    expect((await app.inject(point)).statusCode).toBe(200);
    expect((await app.inject({ method: "POST", url: "/v1/elastic", payload: { vp: [3000], vs: [1500], rho: [2.4] } })).statusCode).toBe(200);
    const refused = await app.inject(point);
    expect(refused.statusCode).toBe(429);
    expect(refused.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(Number(refused.headers["retry-after"])).toBeGreaterThanOrEqual(1);
    expect(refused.headers["access-control-allow-origin"]).toBe(origin);
    expect(refused.json()).toMatchObject({ type: "/problems/rate-limited", status: 429, request_id: refused.headers["x-request-id"] });
    for (const url of ["/livez", "/readyz", "/metrics", "/openapi.yaml", "/problems/rate-limited"]) {
      expect((await app.inject({ url })).statusCode, url).toBe(200);
    }
    const metrics = (await app.inject({ url: "/metrics" })).body;
    expect(metrics).toMatch(/elastilog_http_requests_total\{method="GET",route="\/v1\/elastic",status_code="429"\} 1\b/);
  });

  it("reads RATE_LIMIT_MAX and RATE_LIMIT_WINDOW_MS (default: off, 60 s windows) and refuses a limit that is not a whole number", () => {
    expect(readConfig({})).toMatchObject({ rateLimitMax: 0, rateLimitWindowMs: 60_000 });
    expect(readConfig({ RATE_LIMIT_MAX: "100", RATE_LIMIT_WINDOW_MS: "1000" })).toMatchObject({ rateLimitMax: 100, rateLimitWindowMs: 1000 });
    expect(() => readConfig({ RATE_LIMIT_MAX: "ten" })).toThrow(/RATE_LIMIT_MAX must be a whole number of requests, got "ten"/);
    expect(() => readConfig({ RATE_LIMIT_WINDOW_MS: "1.5" })).toThrow(/RATE_LIMIT_WINDOW_MS must be a whole number of milliseconds/);
  });

  it("the HTML reference at /docs carries a Content-Security-Policy", async () => {
    const app = await build();
    const docs = await app.inject({ url: "/docs/" });
    expect(docs.headers["content-security-policy"]).toContain("frame-ancestors 'none'");
    expect(docs.headers["x-content-type-options"]).toBe("nosniff");
  });
});
