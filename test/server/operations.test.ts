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

  it("the HTML reference at /docs carries a Content-Security-Policy", async () => {
    const app = await build();
    const docs = await app.inject({ url: "/docs/" });
    expect(docs.headers["content-security-policy"]).toContain("frame-ancestors 'none'");
    expect(docs.headers["x-content-type-options"]).toBe("nosniff");
  });
});
