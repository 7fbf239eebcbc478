import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { DEFAULT_CONFIG, readConfig } from "../../server/config.js";
import { SERVICE_VERSION } from "../../server/version.js";
import { build } from "../helpers/build.js";

describe("configuration", () => {
  it("defaults to 127.0.0.1:8080 and reads PORT, HOST and the limits from the environment", () => {
    expect(readConfig({})).toEqual(DEFAULT_CONFIG);
    expect(DEFAULT_CONFIG).toMatchObject({ port: 8080, host: "127.0.0.1" });
    expect(readConfig({ PORT: "9000", HOST: "0.0.0.0", MAX_SAMPLES: "10", JSON_BODY_LIMIT_BYTES: "2048" })).toMatchObject({
      port: 9000,
      host: "0.0.0.0",
      maxSamples: 10,
      jsonBodyLimitBytes: 2048,
    });
  });

  it("refuses a limit that is not a whole non-negative number, naming the variable", () => {
    expect(() => readConfig({ MAX_SAMPLES: "lots" })).toThrow(/MAX_SAMPLES must be a whole number of samples, got "lots"/);
    expect(() => readConfig({ REQUEST_TIMEOUT_MS: "-1" })).toThrow(/REQUEST_TIMEOUT_MS .* milliseconds/);
  });

  it("the service version equals package.json's", () => {
    const pkg = JSON.parse(readFileSync(new URL("../../package.json", import.meta.url), "utf8"));
    expect(SERVICE_VERSION).toBe(pkg.version);
  });

  it("/livez is ok; /readyz turns 503 once a shutdown starts", async () => {
    const app = await build();
    expect((await app.inject({ url: "/livez" })).json()).toEqual({ status: "ok" });
    expect((await app.inject({ url: "/readyz" })).statusCode).toBe(200);
    app.shuttingDown = true;
    const ready = await app.inject({ url: "/readyz" });
    expect(ready.statusCode).toBe(503);
    expect(ready.json()).toEqual({ status: "shutting_down" });
  });

  it("sets the server's header timeout from the configuration", async () => {
    const app = await build({ config: { headersTimeoutMs: 1234 } });
    expect(app.server.headersTimeout).toBe(1234);
  });
});
