import { buildApp } from "./app.js";
import { readConfig } from "./config.js";

/** Starts the service on HOST:PORT and shuts it down gracefully on SIGTERM or SIGINT. */
const config = readConfig();
const app = await buildApp({ config });

let stopping = false;
const shutdown = async (signal: string) => {
  if (stopping) return;
  stopping = true;
  app.shuttingDown = true;
  app.log.info({ signal, grace_ms: config.shutdownGraceMs }, "shutting down: no new work, finishing requests in flight");
  const deadline = setTimeout(() => {
    app.log.error("requests still running after the grace period; exiting anyway");
    process.exit(1);
  }, config.shutdownGraceMs);
  deadline.unref();
  await app.close();
  app.log.info("stopped");
  process.exit(0);
};
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));

try {
  await app.listen({ port: config.port, host: config.host });
} catch (error) {
  app.log.error({ err: error }, "could not start listening");
  process.exit(1);
}
