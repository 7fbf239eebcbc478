import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FLAG_CODES, type FlagCode } from "../../../core/index.js";
import { metrics } from "../../../server/plugins/metrics.js";
import { bareApp } from "./bare-app.js";

interface Sample {
  name: string;
  labels: Record<string, string>;
  value: number;
}

/**
 * Reads the Prometheus text exposition format 0.0.4 (prometheus.io, "Exposition formats"): `# HELP` and `# TYPE`
 * lines, then one sample a line, `name{label="value",...} number`. Fails on any line that is neither.
 */
const parseExposition = (text: string): { samples: Sample[]; types: Map<string, string> } => {
  const samples: Sample[] = [];
  const types = new Map<string, string>();
  for (const line of text.split("\n")) {
    if (line === "" || line.startsWith("# HELP ")) continue;
    const type = /^# TYPE ([a-zA-Z_:][a-zA-Z0-9_:]*) (counter|gauge|histogram|summary|untyped)$/.exec(line);
    if (type) {
      types.set(type[1], type[2]);
      continue;
    }
    const sample = /^([a-zA-Z_:][a-zA-Z0-9_:]*)(?:\{(.*)\})? (\S+)$/.exec(line);
    if (!sample) throw new Error(`not a line of the exposition format: ${line}`);
    const labels: Record<string, string> = {};
    for (const [, key, value] of (sample[2] ?? "").matchAll(/([a-zA-Z_][a-zA-Z0-9_]*)="((?:[^"\\]|\\.)*)",?/g)) labels[key] = value;
    samples.push({ name: sample[1], labels, value: Number(sample[3]) });
  }
  return { samples, types };
};

const valueOf = (samples: Sample[], name: string, labels: Record<string, string> = {}): number | undefined =>
  samples.find((s) => s.name === name && Object.entries(labels).every(([key, value]) => s.labels[key] === value))?.value;

const withMetrics = () => bareApp((app) => app.register(metrics));

const scrape = async (app: Awaited<ReturnType<typeof withMetrics>>) => {
  const response = await app.inject({ url: "/metrics" });
  expect(response.statusCode).toBe(200);
  return { response, ...parseExposition(response.body) };
};

describe("metrics in the Prometheus text exposition format", () => {
  it("answers /metrics as text/plain version 0.0.4, every sample of a declared metric family (Prometheus exposition format)", async () => {
    const app = await withMetrics();
    const { response, samples, types } = await scrape(app);
    expect(response.headers["content-type"]).toMatch(/^text\/plain; version=0\.0\.4/);
    expect(samples.length).toBeGreaterThan(0);
    for (const sample of samples) {
      const family = sample.name.replace(/_(bucket|sum|count)$/, "");
      expect(types.has(sample.name) || types.get(family) === "histogram", sample.name).toBe(true);
    }
  });

  it("counts requests by method, route pattern and status code, and their durations in a histogram of the same labels", async () => {
    const app = await withMetrics();
    for (let i = 0; i < 3; i++) await app.inject({ url: `/v1/elastic?dtc=${90 + i}&dts=170&rho=2.45` });
    await app.inject({ method: "POST", url: "/v1/elastic", payload: {} });
    await app.inject({ url: "/problems/not-found" });
    const { samples, types } = await scrape(app);
    const get = { method: "GET", route: "/v1/elastic", status_code: "200" };
    expect(types.get("elastilog_http_requests_total")).toBe("counter");
    expect(types.get("elastilog_http_request_duration_seconds")).toBe("histogram");
    expect(valueOf(samples, "elastilog_http_requests_total", get)).toBe(3);
    expect(valueOf(samples, "elastilog_http_requests_total", { method: "POST", route: "/v1/elastic", status_code: "200" })).toBe(1);
    expect(valueOf(samples, "elastilog_http_requests_total", { route: "/problems/:slug" })).toBe(1);
    expect(valueOf(samples, "elastilog_http_request_duration_seconds_count", get)).toBe(3);
    expect(valueOf(samples, "elastilog_http_request_duration_seconds_bucket", { ...get, le: "+Inf" })).toBe(3);
    expect(valueOf(samples, "elastilog_http_request_duration_seconds_sum", get)).toBeGreaterThan(0);
  });

  it("labels requests that match no route 'unmatched' and never with the raw URL, so scanners cannot grow the series", async () => {
    const app = await withMetrics();
    for (const path of ["/wp-admin/a", "/.env", "/v1/elastic/extra"]) await app.inject({ url: path });
    const { response, samples } = await scrape(app);
    expect(valueOf(samples, "elastilog_http_requests_total", { method: "GET", route: "unmatched", status_code: "404" })).toBe(3);
    expect(response.body).not.toContain("wp-admin");
    expect(response.body).not.toContain(".env");
  });

  it("the samples converted and the samples flagged per QC code add up over random conversions", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(
          fc.record({
            samples: fc.nat(2_000_000),
            flags: fc.dictionary(fc.constantFrom(...FLAG_CODES), fc.nat(1000)) as fc.Arbitrary<Partial<Record<FlagCode, number>>>,
          }),
          { maxLength: 8 },
        ),
        async (conversions) => {
          const app = await withMetrics();
          for (const conversion of conversions) app.elasticMetrics.recordConversion(conversion.samples, conversion.flags);
          const { samples } = await scrape(app);
          const total = conversions.reduce((sum, c) => sum + c.samples, 0);
          expect(valueOf(samples, "elastilog_samples_converted_total")).toBe(total);
          for (const code of FLAG_CODES) {
            const raised = conversions.reduce((sum, c) => sum + (c.flags[code] ?? 0), 0);
            expect(valueOf(samples, "elastilog_qc_flags_raised_total", { code }), code).toBe(raised);
          }
          await app.close();
        },
      ),
      { numRuns: 25 },
    );
  });

  it("every QC flag code has its series from the start, at zero, and no other code appears", async () => {
    const { samples } = await scrape(await withMetrics());
    const flagged = samples.filter((s) => s.name === "elastilog_qc_flags_raised_total");
    expect(flagged.map((s) => s.labels.code).sort()).toEqual([...FLAG_CODES].sort());
    expect(flagged.every((s) => s.value === 0)).toBe(true);
  });

  it("keeps prom-client's process metrics: event-loop delay, resident memory, heap", async () => {
    const { samples } = await scrape(await withMetrics());
    for (const name of ["nodejs_eventloop_lag_p99_seconds", "nodejs_eventloop_lag_max_seconds", "process_resident_memory_bytes", "nodejs_heap_size_used_bytes"]) {
      expect(valueOf(samples, name), name).toBeGreaterThanOrEqual(0);
    }
  });

  it("two apps in one process keep separate counts (one registry per app)", async () => {
    const first = await withMetrics();
    const second = await withMetrics();
    await first.inject({ url: "/livez" });
    first.elasticMetrics.recordConversion(10, {});
    const { samples } = await scrape(second);
    expect(valueOf(samples, "elastilog_http_requests_total", { route: "/livez" })).toBeUndefined();
    expect(valueOf(samples, "elastilog_samples_converted_total")).toBe(0);
  });
});
