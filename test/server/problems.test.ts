import { describe, expect, it } from "vitest";
import { buildApp } from "../../server/app.js";
import { PROBLEM_KINDS } from "../../server/problems.js";
import { problemSchema } from "../../server/schemas/problem.js";
import { build } from "../helpers/build.js";

const raw = async (method: "GET" | "POST", url: string, payload?: string, contentType?: string) => {
  const app = await build();
  return app.inject({ method, url, payload, headers: contentType ? { "content-type": contentType } : {} });
};

describe("problem details (RFC 9457)", () => {
  it.each([
    ["malformed JSON", "POST", "/v1/elastic", '{"vp": [1, 2', "application/json", 400, "/problems/malformed-body", "not valid JSON"],
    ["an empty JSON body", "POST", "/v1/elastic", "", "application/json", 400, "/problems/malformed-body", "empty"],
    ["a __proto__ key", "POST", "/v1/elastic", '{"vp":[1],"vs":[1],"rho":[1],"__proto__":{"x":1}}', "application/json", 400, "/problems/forbidden-key", "__proto__"],
    ["a constructor key", "POST", "/v1/elastic", '{"vp":[1],"vs":[1],"rho":[1],"constructor":{"prototype":{"x":1}}}', "application/json", 400, "/problems/forbidden-key", "constructor"],
    ["a text/plain body", "POST", "/v1/elastic", "vp=1", "text/plain", 415, "/problems/unsupported-media-type", "application/json"],
    ["an unknown path", "GET", "/v2/elastic", undefined, undefined, 404, "/problems/not-found", "/docs"],
  ] as const)("%s gives the right status and problem type, as application/problem+json, without a stack trace", async (_name, method, url, payload, type, status, problemType, words) => {
    const response = await raw(method, url, payload, type);
    expect(response.statusCode).toBe(status);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    const body = problemSchema.parse(response.json());
    expect(body).toMatchObject({ type: problemType, status, detail: expect.stringContaining(words) });
    expect(response.body).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it("NaN or Infinity in a JSON body (as Python's json.dumps writes them) is a 400 that gives their place and says to write null (RFC 8259 §6)", async () => {
    const response = await raw("POST", "/v1/elastic", '{"dtc": [95, 96],\n "dts": [170, NaN], "rho": [2.4, 2.4]}', "application/json");
    expect(response.statusCode).toBe(400);
    expect(response.json().detail).toContain("line 2, column 15");
    expect(response.json().detail).toContain("NaN is not a JSON number (RFC 8259 §6): write null");
  });

  it("the JSON syntax error names the line and column", async () => {
    const response = await raw("POST", "/v1/elastic", '{"vp": [1],\n "vs": [1 "rho": [2]}', "application/json");
    expect(response.json().detail).toContain("line 2, column");
  });

  it.each([
    // Node 20's JSON.parse words these without "position N" ("Unexpected token ']', …"): the place is found by a scan (RFC 8259 grammar).
    ["a trailing comma in an array", '{"dtc":[90,],"dts":[160],"rho":[2.4]}', "line 1, column 12"],
    ["a trailing comma on its own line", '{"dtc": [90,\n  91,\n],\n "dts": [160, 161], "rho": [2.4, 2.4]}', "line 3, column 1"],
    ["a misspelt literal", '{"dtc": [90],\n "dts": [160], "rho": [2.4],\n "keep_negative_poisson": ture}', "line 3, column 28"],
    ["a text cut short", '{"dtc": [90],\n "dts": [16', "line 2, column 12"],
    // CR LF (a Windows editor) is one line break; a lone CR (an old Mac editor) is one too.
    ["a trailing comma after CR LF line breaks", '{"dtc": [90,\r\n  91,\r\n],\r\n "dts": [160, 161], "rho": [2.4, 2.4]}', "line 3, column 1"],
    ["a trailing comma after lone CR line breaks", '{"dtc": [90,\r  91,\r],\r "dts": [160, 161], "rho": [2.4, 2.4]}', "line 3, column 1"],
  ])("the JSON syntax error of %s names the line and column of the offending character", async (_name, body, place) => {
    const response = await raw("POST", "/v1/elastic", body, "application/json");
    expect(response.statusCode).toBe(400);
    expect(response.json()).toMatchObject({ type: "/problems/malformed-body", detail: expect.stringContaining(`The body is not valid JSON (at ${place}): `) });
  });

  it("every problem type URI resolves to an explanation (RFC 9457 §3.1.1)", async () => {
    const app = await build();
    for (const [slug, kind] of Object.entries(PROBLEM_KINDS)) {
      const response = await app.inject({ url: `/problems/${slug}` });
      expect(response.statusCode).toBe(200);
      expect(response.json()).toMatchObject({ type: `/problems/${slug}`, status: kind.status, how_to_fix: kind.fix });
    }
    expect((await app.inject({ url: "/problems/nonsense" })).statusCode).toBe(404);
    expect((await app.inject({ url: "/problems/toString" })).statusCode).toBe(404);
  });

  it("an unexpected fault is a 500 problem with the request id and without internals", async () => {
    const fresh = await buildApp({ logger: false });
    fresh.get("/fault-for-test", async () => {
      throw new Error("secret internal detail");
    });
    const response = await fresh.inject({ url: "/fault-for-test", headers: { "x-request-id": "abc-123" } });
    expect(response.statusCode).toBe(500);
    expect(response.json()).toMatchObject({ type: "/problems/internal-error", request_id: "abc-123" });
    expect(response.body).not.toContain("secret internal detail");
    await fresh.close();
  });
});

describe("405 Method Not Allowed (RFC 9110 §15.5.6)", () => {
  it("a known path with another method is a 405 problem with an Allow header; an unknown path stays 404", async () => {
    const app = await build();
    const wrong = await app.inject({ method: "DELETE", url: "/v1/elastic" });
    expect(wrong.statusCode).toBe(405);
    expect(wrong.headers.allow).toBe("GET, HEAD, POST");
    expect(wrong.json()).toMatchObject({ type: "/problems/method-not-allowed", status: 405 });
    const parametric = await app.inject({ method: "POST", url: "/v1/correlations/ucs.mcnally1987" });
    expect(parametric.statusCode).toBe(405);
    expect((await app.inject({ method: "DELETE", url: "/v1/nothing" })).statusCode).toBe(404);
  });
});

describe("errors met while routing (Fastify's frameworkErrors)", () => {
  it.each([["/v1/%zz"], ["/v1/correlations/%zz"], ["/problems/%E0%A4%A"]])(
    "%s, not valid percent-encoding (RFC 3986 §2.1), is a 400 problem that says how to write a literal %%",
    async (url) => {
      const response = await raw("GET", url);
      expect(response.statusCode).toBe(400);
      expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
      const body = problemSchema.parse(response.json());
      expect(body).toMatchObject({ type: "/problems/invalid-request", detail: expect.stringContaining("%25") });
      expect(body.request_id).toEqual(expect.any(String));
    },
  );

  it("a path parameter longer than any name (Fastify's limit of 100 characters) is a 404 problem, not Fastify's own JSON", async () => {
    const response = await raw("GET", `/problems/${"x".repeat(150)}`);
    expect(response.statusCode).toBe(404);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(problemSchema.parse(response.json())).toMatchObject({ type: "/problems/not-found" });
  });
});

describe("the static files of /docs", () => {
  it("a file that does not exist under /docs/static/ is a 404 problem, not a 405 (the route takes GET)", async () => {
    const response = await raw("GET", "/docs/static/no-such-sheet.css");
    expect(response.statusCode).toBe(404);
    expect(problemSchema.parse(response.json())).toMatchObject({ type: "/problems/not-found" });
  });

  it("a path that climbs out of the folder (RFC 3986 §5.2.4 dot segments, sent as they are) is a 404 problem, with no library wording", async () => {
    const response = await raw("GET", "/docs/static/..%2F..%2Fopenapi.yaml");
    expect(response.statusCode).toBe(404);
    expect(response.json().detail).not.toBe("Forbidden");
  });
});

describe("field paths in errors are written as a request author writes them", () => {
  it("array positions in brackets, names joined by dots (as the checks of correlation options write them)", async () => {
    const app = await build();
    const post = (payload: object) => app.inject({ method: "POST", url: "/v1/elastic", payload });
    const zones = await post({ depth: [1, 2], dtc: [95, 96], dts: [170, 171], rho: [2.4, 2.4], zones: [{ name: 5, top: 1, base: 2 }] });
    expect(zones.json().errors.map((e: { field: string }) => e.field)).toContain("body.zones[0].name");
    const options = await post({ dtc: [95], dts: [170], rho: [2.4], correlation_options: { "brittleness.rickman2008": { e_min_mpsi: "one" } } });
    expect(options.json().errors.map((e: { field: string }) => e.field)).toContain("body.correlation_options.brittleness.rickman2008.e_min_mpsi");
  });
});
