import { availableParallelism } from "node:os";

/** Settings read once from the environment; every limit has a documented default (README, "Limits"). */
export interface ServiceConfig {
  port: number;
  host: string;
  logLevel: string;
  /** Largest JSON request body, bytes. */
  jsonBodyLimitBytes: number;
  /** Largest uploaded well file (LAS or CSV), bytes; files are read as a stream, so this bounds time, not memory. */
  fileBodyLimitBytes: number;
  /** Most samples (rows) one request may carry. */
  maxSamples: number;
  /** Whole request (headers and body) must arrive within this, ms. */
  requestTimeoutMs: number;
  /** Idle keep-alive connections are closed after this, ms. */
  keepAliveTimeoutMs: number;
  /** Request headers must arrive within this, ms. */
  headersTimeoutMs: number;
  /** A socket with no activity at all is closed after this, ms. */
  connectionTimeoutMs: number;
  /** How long in-flight requests may run after SIGTERM/SIGINT, ms. */
  shutdownGraceMs: number;
  /** Bearer keys accepted on /v1/*; empty: no authentication. */
  apiKeys: string[];
  /** Also require a key for /metrics. */
  metricsRequireAuth: boolean;
  /** Origins allowed by CORS; empty: CORS off. */
  corsOrigins: string[];
  /** Load shedding: refuse new work above these (0 disables each). */
  maxEventLoopDelayMs: number;
  maxHeapUsedBytes: number;
  maxRssBytes: number;
  /** Share of time the event loop is busy, 0 to 1. */
  maxEventLoopUtilization: number;
  /** Seconds a refused client is asked to wait. */
  retryAfterSeconds: number;
  /** Requests one client (API key, else address) may send to /v1/* per window; 0: no rate limiting. */
  rateLimitMax: number;
  /** Length of the rate-limit window, ms. */
  rateLimitWindowMs: number;
  /** Worker threads for large answers (parsing, computing and writing); default: one per CPU. */
  workerThreads: number;
}

export const DEFAULT_CONFIG: Readonly<ServiceConfig> = Object.freeze({
  port: 8080,
  host: "127.0.0.1",
  logLevel: "info",
  jsonBodyLimitBytes: 256 * 1024 * 1024,
  fileBodyLimitBytes: 1024 * 1024 * 1024,
  maxSamples: 5_000_000,
  requestTimeoutMs: 120_000,
  keepAliveTimeoutMs: 72_000,
  headersTimeoutMs: 20_000,
  connectionTimeoutMs: 130_000,
  shutdownGraceMs: 25_000,
  apiKeys: [],
  metricsRequireAuth: false,
  corsOrigins: [],
  maxEventLoopDelayMs: 1000,
  maxHeapUsedBytes: 0,
  maxRssBytes: 0,
  maxEventLoopUtilization: 0,
  retryAfterSeconds: 5,
  rateLimitMax: 0,
  rateLimitWindowMs: 60_000,
  // One per core; the workers run at a lower scheduling priority (server/workers/answer-worker.ts), so the event
  // loop still gets a core first when probes and small requests arrive while a whole well converts.
  workerThreads: Math.max(1, availableParallelism()),
});

type WholeNumberSetting = Exclude<keyof ServiceConfig, "host" | "logLevel" | "apiKeys" | "metricsRequireAuth" | "corsOrigins" | "maxEventLoopUtilization">;

const ENV_NAMES: Record<WholeNumberSetting, string> = {
  port: "PORT",
  jsonBodyLimitBytes: "JSON_BODY_LIMIT_BYTES",
  fileBodyLimitBytes: "FILE_BODY_LIMIT_BYTES",
  maxSamples: "MAX_SAMPLES",
  requestTimeoutMs: "REQUEST_TIMEOUT_MS",
  keepAliveTimeoutMs: "KEEP_ALIVE_TIMEOUT_MS",
  headersTimeoutMs: "HEADERS_TIMEOUT_MS",
  connectionTimeoutMs: "CONNECTION_TIMEOUT_MS",
  shutdownGraceMs: "SHUTDOWN_GRACE_MS",
  maxEventLoopDelayMs: "MAX_EVENT_LOOP_DELAY_MS",
  maxHeapUsedBytes: "MAX_HEAP_USED_BYTES",
  maxRssBytes: "MAX_RSS_BYTES",
  retryAfterSeconds: "RETRY_AFTER_SECONDS",
  rateLimitMax: "RATE_LIMIT_MAX",
  rateLimitWindowMs: "RATE_LIMIT_WINDOW_MS",
  workerThreads: "WORKER_THREADS",
};

/** A comma-separated list, trimmed, without empty entries. */
const list = (raw: string | undefined): string[] => (raw ?? "").split(",").map((item) => item.trim()).filter((item) => item !== "");

const UNIT_WORDS: [RegExp, string][] = [
  [/Ms$/, "milliseconds"],
  [/Bytes$/, "bytes"],
  [/Seconds$/, "seconds"],
  [/^port$/, "port"],
  [/Threads$/, "threads"],
  [/^rateLimitMax$/, "requests"],
];

/** Reads the configuration from environment variables, refusing values that are not whole non-negative numbers. */
export const readConfig = (env: NodeJS.ProcessEnv = process.env): ServiceConfig => {
  const config: ServiceConfig = { ...DEFAULT_CONFIG };
  for (const [key, name] of Object.entries(ENV_NAMES) as [keyof typeof ENV_NAMES, string][]) {
    const raw = env[name];
    if (raw === undefined || raw === "") continue;
    const value = Number(raw);
    if (!Number.isSafeInteger(value) || value < 0) {
      const unit = UNIT_WORDS.find(([pattern]) => pattern.test(key))?.[1] ?? "samples";
      throw new Error(`${name} must be a whole number of ${unit}, got "${raw}"`);
    }
    config[key] = value;
  }
  if (env.MAX_EVENT_LOOP_UTILIZATION) {
    const utilisation = Number(env.MAX_EVENT_LOOP_UTILIZATION);
    if (!(utilisation >= 0 && utilisation <= 1)) {
      throw new Error(`MAX_EVENT_LOOP_UTILIZATION must be a fraction from 0 to 1, got "${env.MAX_EVENT_LOOP_UTILIZATION}"`);
    }
    config.maxEventLoopUtilization = utilisation;
  }
  config.apiKeys = list(env.API_KEYS);
  config.corsOrigins = list(env.CORS_ORIGINS);
  config.metricsRequireAuth = /^(1|true|yes)$/i.test(env.METRICS_REQUIRE_AUTH ?? "");
  if (env.HOST) config.host = env.HOST;
  if (env.LOG_LEVEL) config.logLevel = env.LOG_LEVEL;
  return config;
};
