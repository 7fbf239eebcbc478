import { buildApp } from "../../server/app.js";

/**
 * The service built as in main.ts, run as a child process with --expose-gc (see aborted-upload.test.ts):
 * it reports its address over IPC, and on "memory" collects garbage and reports its memory use.
 */
const app = await buildApp({ logger: { level: process.env.LOG_LEVEL ?? "silent" } });
const address = await app.listen({ port: 0, host: "127.0.0.1" });
process.send?.({ address });

process.on("message", (message) => {
  if (message !== "memory") return;
  globalThis.gc?.();
  globalThis.gc?.();
  const usage = process.memoryUsage();
  process.send?.({
    heapUsedBytes: usage.heapUsed,
    arrayBuffersBytes: usage.arrayBuffers,
    rssBytes: usage.rss,
    peakRssBytes: process.resourceUsage().maxRSS * 1024,
  });
});
process.on("disconnect", () => void app.close().then(() => process.exit(0)));
