import type { FastifyInstance } from "fastify";
import fp from "fastify-plugin";
import { Counter, Histogram, Registry, collectDefaultMetrics } from "prom-client";
import { z } from "zod";
import { FLAG_CODES, type FlagCode } from "../../core/index.js";
import { pathProblemResponses, problemResponse } from "../schemas/problem.js";

/** What routes report after a conversion; exposed as `app.elasticMetrics`. */
export interface ElasticMetrics {
  /** Counts the samples of one converted request and, per QC flag code, the samples that carry it (a `FlagSummary.flags`). */
  recordConversion(samples: number, flagCounts: Partial<Record<FlagCode, number>>): void;
  /**
   * Counts a streamed answer cut short by a problem found after it had begun: such a response is destroyed, so it
   * never reaches the request counter and histogram (Fastify runs no onResponse hook for it).
   */
  recordCutShort(route: string): void;
}

declare module "fastify" {
  interface FastifyInstance {
    elasticMetrics: ElasticMetrics;
  }
}

export const METRICS_PATH = "/metrics";

/** Route label of requests that matched no route: the raw URL would give every scanner's probe its own series. */
const UNMATCHED_ROUTE = "unmatched";

/** Seconds; up to a minute, since a whole well of a million samples takes seconds, not milliseconds. */
const DURATION_BUCKETS_SECONDS = [0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30, 60];
const HTTP_LABELS = ["method", "route", "status_code"] as const;

/**
 * Prometheus metrics for one app: requests by method, route pattern and status, their duration, samples
 * converted, samples flagged per QC code, and prom-client's process metrics (memory, CPU, event-loop delay).
 * Each app has its own registry, so two apps in one process (tests) never share counts.
 */
async function metricsPlugin(app: FastifyInstance): Promise<void> {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry });
  const requests = new Counter({
    name: "elastilog_http_requests_total",
    help: "HTTP requests answered, by method, route pattern and status code.",
    labelNames: HTTP_LABELS,
    registers: [registry],
  });
  const durations = new Histogram({
    name: "elastilog_http_request_duration_seconds",
    help: "Time from receiving a request to the end of its answer, by method, route pattern and status code.",
    labelNames: HTTP_LABELS,
    buckets: DURATION_BUCKETS_SECONDS,
    registers: [registry],
  });
  const samples = new Counter({
    name: "elastilog_samples_converted_total",
    help: "Depth samples converted to elastic properties.",
    registers: [registry],
  });
  const flagged = new Counter({
    name: "elastilog_qc_flags_raised_total",
    help: "Samples carrying each QC flag code, over all conversions.",
    labelNames: ["code"],
    registers: [registry],
  });
  const cutShort = new Counter({
    name: "elastilog_answers_cut_short_total",
    help: "Streamed answers cut short, by route pattern: the file failed after the answer had begun (the client saw an incomplete transfer).",
    labelNames: ["route"],
    registers: [registry],
  });
  // Every code gets its series at zero, so a rate over a code that has not been raised yet is 0, not absent.
  for (const code of FLAG_CODES) flagged.labels(code).inc(0);

  app.decorate("elasticMetrics", {
    recordConversion(sampleCount: number, flagCounts: Partial<Record<FlagCode, number>>): void {
      samples.inc(sampleCount);
      for (const code of FLAG_CODES) {
        const count = flagCounts[code];
        if (count !== undefined && count > 0) flagged.labels(code).inc(count);
      }
    },
    recordCutShort(route: string): void {
      cutShort.labels(route).inc();
    },
  });

  app.addHook("onResponse", (request, reply, done) => {
    const labels = {
      method: request.method,
      route: request.routeOptions.url ?? UNMATCHED_ROUTE,
      status_code: String(reply.statusCode),
    };
    requests.inc(labels);
    durations.observe(labels, reply.elapsedTime / 1000);
    done();
  });

  app.get(
    METRICS_PATH,
    {
      schema: {
        tags: ["operations"],
        summary: "Metrics of this process in the Prometheus text exposition format.",
        response: {
          200: {
            description: "The metrics, in the Prometheus text exposition format 0.0.4.",
            content: { "text/plain": { schema: z.string().meta({ description: "Prometheus text exposition format 0.0.4." }) } },
          },
          // 401 only when METRICS_REQUIRE_AUTH asks for an API key here.
          401: problemResponse(401),
          ...pathProblemResponses,
        },
      },
    },
    async (_request, reply) => reply.type(registry.contentType).send(await registry.metrics()),
  );
}

export const metrics = fp(metricsPlugin, { fastify: "5.x", name: "elastilog-metrics" });
