import { createHash } from "node:crypto";
import type { FastifyRequest } from "fastify";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { authentication, matchesOneOf, type AuthenticationOptions } from "../../../server/plugins/authentication.js";
import { problemSchema } from "../../../server/schemas/problem.js";
import { bareApp } from "./bare-app.js";

const KEY = "k3y-Alpha.7_~+/ZZ==";
const OTHER_KEY = "second-key-0123456789";

const withKeys = (options: AuthenticationOptions) => bareApp((app) => app.register(authentication, options));
const bearer = (token: string) => ({ authorization: `Bearer ${token}` });

/**
 * Captures pino's output in memory, with the redaction server/app.ts configures and a request serializer
 * that logs every header: the careless change the redaction must survive.
 */
const capturedLogger = () => {
  const lines: string[] = [];
  const stream = { write: (line: string) => void lines.push(line) };
  const serializers = { req: (request: FastifyRequest) => ({ method: request.method, url: request.url, headers: request.headers }) };
  return { lines, logger: { level: "trace", stream, serializers, redact: ["req.headers.authorization"] } };
};

describe("authentication with API keys (RFC 6750 bearer tokens)", () => {
  it("a /v1/ request without Authorization is a 401 problem with a Bearer challenge and no error code (RFC 6750 §3.1)", async () => {
    const app = await withKeys({ apiKeys: [KEY] });
    const response = await app.inject({ url: "/v1/elastic?vp=3200&vs=1800&rho=2.45" });
    expect(response.statusCode).toBe(401);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(response.headers["www-authenticate"]).toBe('Bearer realm="elastilog"');
    const body = problemSchema.parse(response.json());
    expect(body).toMatchObject({ type: "/problems/unauthorized", status: 401, detail: expect.stringContaining("Authorization: Bearer") });
  });

  it.each([
    ["another scheme", `Basic ${Buffer.from(`user:${KEY}`).toString("base64")}`],
    ["the key without a scheme", KEY],
  ])("%s is a 401 asking for the Bearer scheme (RFC 6750 §3.1: no error code for an unsupported method)", async (_name, header) => {
    const app = await withKeys({ apiKeys: [KEY] });
    const response = await app.inject({ url: "/v1/elastic", headers: { authorization: header } });
    expect(response.statusCode).toBe(401);
    expect(response.headers["www-authenticate"]).toBe('Bearer realm="elastilog"');
    expect(response.json().detail).toContain("Bearer");
  });

  it.each([
    ["a wrong key", "Bearer not-the-key"],
    ["the key with its first character changed", `Bearer x${KEY.slice(1)}`],
    ["a prefix of the key", `Bearer ${KEY.slice(0, 5)}`],
    ["the key with a suffix", `Bearer ${KEY}x`],
    ["a token outside the b64token syntax", "Bearer key with spaces"],
    ["the scheme without a token", "Bearer"],
    ["the scheme and spaces without a token", "Bearer   "],
  ])("%s is a 401 with error=\"invalid_token\" (RFC 6750 §3 and §3.1)", async (_name, header) => {
    const app = await withKeys({ apiKeys: [KEY] });
    const response = await app.inject({ method: "POST", url: "/v1/elastic", headers: { authorization: header }, payload: { vp: [3200] } });
    expect(response.statusCode).toBe(401);
    expect(response.headers["www-authenticate"]).toBe('Bearer realm="elastilog", error="invalid_token"');
    expect(response.json()).toMatchObject({ type: "/problems/unauthorized", status: 401 });
  });

  it("the right key passes, on GET and POST, with the scheme in any letter case (RFC 7235 §2.1: the scheme is case-insensitive)", async () => {
    const app = await withKeys({ apiKeys: [KEY] });
    expect((await app.inject({ url: "/v1/elastic", headers: bearer(KEY) })).statusCode).toBe(200);
    expect((await app.inject({ method: "POST", url: "/v1/elastic", headers: bearer(KEY), payload: {} })).statusCode).toBe(200);
    expect((await app.inject({ url: "/v1/elastic", headers: { authorization: `bearer ${KEY}` } })).statusCode).toBe(200);
  });

  it("with several keys each one passes and any other is refused", async () => {
    const app = await withKeys({ apiKeys: [KEY, OTHER_KEY] });
    expect((await app.inject({ url: "/v1/elastic", headers: bearer(KEY) })).statusCode).toBe(200);
    expect((await app.inject({ url: "/v1/elastic", headers: bearer(OTHER_KEY) })).statusCode).toBe(200);
    expect((await app.inject({ url: "/v1/elastic", headers: bearer(`${KEY},${OTHER_KEY}`) })).statusCode).toBe(401);
  });

  it("a percent-encoded path that the router decodes to /v1/ still needs the key", async () => {
    const app = await withKeys({ apiKeys: [KEY] });
    expect((await app.inject({ url: "/%76%31/elastic" })).statusCode).toBe(401);
    expect((await app.inject({ url: "/v1/%65lastic" })).statusCode).toBe(401);
    expect((await app.inject({ url: "/%76%31/elastic", headers: bearer(KEY) })).statusCode).toBe(200);
  });

  it("an unknown /v1/ path needs the key too, so a caller without one learns nothing about which paths exist", async () => {
    const app = await withKeys({ apiKeys: [KEY] });
    expect((await app.inject({ url: "/v1/nothing-here" })).statusCode).toBe(401);
    expect((await app.inject({ url: "/v1/nothing-here", headers: bearer(KEY) })).statusCode).toBe(404);
  });

  it("probes, the contract, problem pages, CORS preflights and (by default) /metrics stay open", async () => {
    const app = await withKeys({ apiKeys: [KEY] });
    for (const url of ["/livez", "/readyz", "/openapi.json", "/problems/unauthorized", "/metrics"]) {
      expect((await app.inject({ url })).statusCode, url).toBe(200);
    }
    const preflight = await app.inject({ method: "OPTIONS", url: "/v1/elastic", headers: { origin: "https://logs.example" } });
    expect(preflight.statusCode).not.toBe(401);
  });

  it("with metricsRequireAuth, /metrics needs the key as well", async () => {
    const app = await withKeys({ apiKeys: [KEY], metricsRequireAuth: true });
    expect((await app.inject({ url: "/metrics" })).statusCode).toBe(401);
    expect((await app.inject({ url: "/metrics", headers: bearer(KEY) })).statusCode).toBe(200);
    expect((await app.inject({ url: "/livez" })).statusCode).toBe(200);
  });

  it("without keys nothing is checked", async () => {
    const app = await withKeys({ apiKeys: [] });
    expect((await app.inject({ url: "/v1/elastic" })).statusCode).toBe(200);
    expect((await app.inject({ url: "/v1/elastic", headers: bearer("anything") })).statusCode).toBe(200);
  });

  it.each([
    ["an empty key (a stray comma in API_KEYS)", { apiKeys: [KEY, ""] }, "b64token"],
    ["a key with a space", { apiKeys: ["two words"] }, "b64token"],
    ["metricsRequireAuth without any key", { apiKeys: [], metricsRequireAuth: true }, "API_KEYS is empty"],
  ])("refuses to start with %s", async (_name, options, words) => {
    await expect(withKeys(options)).rejects.toThrow(words);
  });

  it("neither the right nor a wrong key appears in the logs or in the answer (pino redaction of req.headers.authorization)", async () => {
    const { lines, logger } = capturedLogger();
    const wrongKey = "wrong-key-that-must-not-leak";
    const app = await bareApp((instance) => instance.register(authentication, { apiKeys: [KEY] }), { logger });
    const answers = [
      await app.inject({ url: "/v1/elastic", headers: bearer(KEY) }),
      await app.inject({ url: "/v1/elastic", headers: bearer(wrongKey) }),
      await app.inject({ url: "/v1/nothing", headers: bearer(wrongKey) }),
    ];
    expect(answers.map((a) => a.statusCode)).toEqual([200, 401, 401]);
    const text = lines.join("");
    expect(text).toContain('"authorization":"[Redacted]"');
    for (const secret of [KEY, wrongKey]) {
      expect(text).not.toContain(secret);
      for (const answer of answers) expect(answer.body).not.toContain(secret);
    }
  });
});

describe("matchesOneOf (constant-time comparison of SHA-256 digests)", () => {
  const digest = (text: string) => createHash("sha256").update(text, "utf8").digest();

  it("accepts exactly the configured keys, for random keys and candidates", () => {
    fc.assert(
      fc.property(fc.array(fc.string({ minLength: 1 }), { minLength: 1, maxLength: 4 }), fc.string(), (keys, candidate) => {
        const digests = keys.map(digest);
        for (const key of keys) expect(matchesOneOf(key, digests)).toBe(true);
        expect(matchesOneOf(candidate, digests)).toBe(keys.includes(candidate));
      }),
    );
  });
});
