import { describe, expect, it } from "vitest";
import { crossOrigin, type CrossOriginOptions } from "../../../server/plugins/cross-origin.js";
import { bareApp } from "./bare-app.js";

const LISTED = "https://logs.example";
const ALSO_LISTED = "http://127.0.0.1:5173";
const UNLISTED = "https://elsewhere.example";

const withOrigins = (options: CrossOriginOptions) => bareApp((app) => app.register(crossOrigin, options));

const preflight = (origin: string) => ({
  method: "OPTIONS" as const,
  url: "/v1/elastic",
  headers: { origin, "access-control-request-method": "POST", "access-control-request-headers": "content-type, authorization" },
});

describe("CORS for listed origins (Fetch standard, CORS protocol)", () => {
  it("a listed origin gets its own origin back, x-request-id, Retry-After and the rate-limit headers exposed, and Vary: Origin", async () => {
    const app = await withOrigins({ allowedOrigins: [LISTED, ALSO_LISTED] });
    for (const origin of [LISTED, ALSO_LISTED]) {
      const response = await app.inject({ url: "/v1/elastic", headers: { origin } });
      expect(response.statusCode).toBe(200);
      expect(response.headers["access-control-allow-origin"]).toBe(origin);
      // Fetch standard: Retry-After is not a CORS-safelisted response-header name, so a page sees it only when exposed.
      expect(response.headers["access-control-expose-headers"]).toBe("x-request-id, retry-after, x-ratelimit-limit, x-ratelimit-remaining, x-ratelimit-reset");
      expect(response.headers.vary).toMatch(/\bOrigin\b/i);
      expect(response.headers["access-control-allow-credentials"]).toBeUndefined();
    }
  });

  it("a listed origin's preflight is answered 204 with GET, POST, OPTIONS and the three request headers", async () => {
    const app = await withOrigins({ allowedOrigins: [LISTED] });
    const response = await app.inject(preflight(LISTED));
    expect(response.statusCode).toBe(204);
    expect(response.headers["access-control-allow-origin"]).toBe(LISTED);
    expect(response.headers["access-control-allow-methods"]).toBe("GET, POST, OPTIONS");
    expect(response.headers["access-control-allow-headers"]).toBe("content-type, authorization, x-request-id");
    expect(response.headers["access-control-max-age"]).toBe("600");
  });

  it("an unlisted origin, or one that only starts like a listed one, gets no Access-Control-Allow-Origin", async () => {
    const app = await withOrigins({ allowedOrigins: [LISTED] });
    for (const origin of [UNLISTED, `${LISTED}.attacker.example`, "https://LOGS.example", "null"]) {
      const simple = await app.inject({ url: "/v1/elastic", headers: { origin } });
      expect(simple.headers["access-control-allow-origin"], origin).toBeUndefined();
      expect((await app.inject(preflight(origin))).headers["access-control-allow-origin"], origin).toBeUndefined();
    }
  });

  it("by default no CORS header is sent and a preflight finds no route (a 404 problem)", async () => {
    const app = await withOrigins({ allowedOrigins: [] });
    const simple = await app.inject({ url: "/v1/elastic", headers: { origin: LISTED } });
    expect(Object.keys(simple.headers).filter((name) => name.startsWith("access-control-"))).toEqual([]);
    const response = await app.inject(preflight(LISTED));
    expect(response.statusCode).toBe(404);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
  });

  it("an OPTIONS request without Origin is not answered with a text/plain error", async () => {
    const app = await withOrigins({ allowedOrigins: [LISTED] });
    const response = await app.inject({ method: "OPTIONS", url: "/v1/elastic" });
    expect(response.statusCode).toBe(204);
    expect(response.headers["access-control-allow-origin"]).toBeUndefined();
  });

  it.each([["https://logs.example/"], ["logs.example"], ["*"], ["https://logs.example/path"]])(
    "refuses to start with %s, which is not a serialised origin (RFC 6454 §6.2)",
    async (origin) => {
      await expect(withOrigins({ allowedOrigins: [LISTED, origin] })).rejects.toThrow("not an origin");
    },
  );
});
