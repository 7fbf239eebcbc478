import underPressure from "@fastify/under-pressure";
import type { FastifyInstance, FastifyRequest } from "fastify";
import fp from "fastify-plugin";
import { ProblemError, type ProblemSlug } from "../problems.js";
import { METRICS_PATH } from "./metrics.js";

export interface LoadSheddingOptions {
  /** Mean event-loop delay over one sampling interval above which requests are refused, ms; 0 disables. */
  maxEventLoopDelayMs: number;
  /** V8 heap in use above which requests are refused, bytes; 0 disables. */
  maxHeapUsedBytes: number;
  /** Resident set size above which requests are refused, bytes; 0 disables. */
  maxRssBytes: number;
  /** Share of time the event loop was busy (0 to 1) above which requests are refused; 0 disables. */
  maxEventLoopUtilization: number;
  /** Sent in `Retry-After` with every refusal, seconds. */
  retryAfterSeconds: number;
  /** How often the pressure is measured, ms; under-pressure's default (1000) unless given. */
  sampleIntervalMs?: number;
}

const OVERLOADED: ProblemSlug = "overloaded";

/**
 * Never refused: a refused liveness probe gets a busy pod restarted, which loses its work and moves its load
 * to the others; a refused readiness probe takes every busy pod out of the load balancer at once; and
 * /metrics is what shows the pressure.
 */
const NEVER_SHED = new Set(["/livez", "/readyz", METRICS_PATH]);

const MEASURES: Record<string, string> = {
  [underPressure.TYPE_EVENT_LOOP_DELAY]: "event-loop delay",
  [underPressure.TYPE_HEAP_USED_BYTES]: "heap in use",
  [underPressure.TYPE_RSS_BYTES]: "resident memory",
  [underPressure.TYPE_EVENT_LOOP_UTILIZATION]: "event-loop utilisation",
};

/**
 * Refuses new work with a 503 problem and `Retry-After` while the process is over one of its limits
 * (@fastify/under-pressure measures them), so the requests it has accepted finish instead of everyone slowing down.
 */
async function loadSheddingPlugin(app: FastifyInstance, options: LoadSheddingOptions): Promise<void> {
  const { maxEventLoopUtilization, retryAfterSeconds } = options;
  if (!(maxEventLoopUtilization >= 0 && maxEventLoopUtilization <= 1)) {
    throw new Error(`the event-loop utilisation limit is a share between 0 and 1, got ${maxEventLoopUtilization}`);
  }
  if (!(Number.isSafeInteger(retryAfterSeconds) && retryAfterSeconds > 0)) {
    throw new Error(`Retry-After must be a whole number of seconds above 0, got ${retryAfterSeconds}`);
  }
  await app.register(underPressure, {
    maxEventLoopDelay: options.maxEventLoopDelayMs,
    maxHeapUsedBytes: options.maxHeapUsedBytes,
    maxRssBytes: options.maxRssBytes,
    maxEventLoopUtilization,
    sampleInterval: options.sampleIntervalMs,
    exposeStatusRoute: false,
    pressureHandler: async (request: FastifyRequest, _reply, type) => {
      if (NEVER_SHED.has(request.routeOptions.url ?? "")) return;
      throw new ProblemError(
        OVERLOADED,
        `The service is overloaded (${MEASURES[type] ?? type} above its limit) and refuses new work for now; retry after ${retryAfterSeconds} s.`,
        undefined,
        { "retry-after": String(retryAfterSeconds) },
      );
    },
  });
}

export const loadShedding = fp(loadSheddingPlugin, { fastify: "5.x", name: "elastilog-load-shedding" });
