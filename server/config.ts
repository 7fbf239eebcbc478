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
});

const ENV_NAMES: Record<Exclude<keyof ServiceConfig, "host" | "logLevel">, string> = {
  port: "PORT",
  jsonBodyLimitBytes: "JSON_BODY_LIMIT_BYTES",
  fileBodyLimitBytes: "FILE_BODY_LIMIT_BYTES",
  maxSamples: "MAX_SAMPLES",
  requestTimeoutMs: "REQUEST_TIMEOUT_MS",
  keepAliveTimeoutMs: "KEEP_ALIVE_TIMEOUT_MS",
  headersTimeoutMs: "HEADERS_TIMEOUT_MS",
  connectionTimeoutMs: "CONNECTION_TIMEOUT_MS",
  shutdownGraceMs: "SHUTDOWN_GRACE_MS",
};

/** Reads the configuration from environment variables, refusing values that are not whole non-negative numbers. */
export const readConfig = (env: NodeJS.ProcessEnv = process.env): ServiceConfig => {
  const config: ServiceConfig = { ...DEFAULT_CONFIG };
  for (const [key, name] of Object.entries(ENV_NAMES) as [keyof typeof ENV_NAMES, string][]) {
    const raw = env[name];
    if (raw === undefined || raw === "") continue;
    const value = Number(raw);
    if (!Number.isSafeInteger(value) || value < 0) {
      throw new Error(`${name} must be a whole number of ${key === "port" ? "port" : key.endsWith("Ms") ? "milliseconds" : key.endsWith("Bytes") ? "bytes" : "samples"}, got "${raw}"`);
    }
    config[key] = value;
  }
  if (env.HOST) config.host = env.HOST;
  if (env.LOG_LEVEL) config.logLevel = env.LOG_LEVEL;
  return config;
};
