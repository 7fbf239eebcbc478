import swagger from "@fastify/swagger";
import type { FastifyInstance } from "fastify";
import { describe, expect, it } from "vitest";
import { referencePages } from "../../../server/plugins/reference-pages.js";
import { securityHeaders } from "../../../server/plugins/security-headers.js";
import { bareApp } from "./bare-app.js";

/** The app with the API reference at /docs, registered as server/app.ts does. */
const withDocs = () =>
  bareApp(async (app) => {
    await app.register(securityHeaders);
    await app.register(swagger, { openapi: { openapi: "3.1.0", info: { title: "elastilog", version: "0.0.0" } } });
    await app.register(referencePages);
  });

/** Directive name → its source list (CSP Level 3, §2.2: `;`-separated directives, space-separated values). */
const directivesOf = (policy: string): Map<string, string[]> =>
  new Map(
    policy
      .split(";")
      .map((part) => part.trim().split(/\s+/))
      .filter(([name]) => name !== "")
      .map(([name, ...values]) => [name.toLowerCase(), values]),
  );

const fetchFromPage = async (app: FastifyInstance, page: string, reference: string) => {
  const url = new URL(reference, `http://127.0.0.1${page}`);
  expect(url.origin, reference).toBe("http://127.0.0.1");
  return app.inject({ url: url.pathname + url.search });
};

describe("security headers on the HTML API reference (@fastify/helmet)", () => {
  it.each([["/docs"], ["/docs/"]])("%s is HTML with nosniff, no referrer, no framing and a Content-Security-Policy", async (page) => {
    const app = await withDocs();
    const response = await app.inject({ url: page });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^text\/html/);
    expect(response.headers["x-content-type-options"]).toBe("nosniff");
    expect(response.headers["referrer-policy"]).toBe("no-referrer");
    expect(response.headers["x-frame-options"]).toBe("DENY");
    expect(response.headers["strict-transport-security"]).toBeUndefined();
    const policy = directivesOf(String(response.headers["content-security-policy"]));
    expect(policy.get("frame-ancestors")).toEqual(["'none'"]);
    expect(policy.get("script-src")).toEqual(["'self'"]);
    expect(policy.get("script-src-attr")).toEqual(["'none'"]);
    expect(policy.get("object-src")).toEqual(["'none'"]);
    expect(policy.get("default-src")).toEqual(["'self'"]);
    expect(policy.has("upgrade-insecure-requests")).toBe(false);
  });

  it("the page runs under its policy: no inline script or handler, and every script and style sheet it names is served from this origin with its own media type", async () => {
    const app = await withDocs();
    const html = (await app.inject({ url: "/docs/" })).body;
    expect(html).not.toMatch(/<style[\s>]/i);
    expect(html).not.toMatch(/\son[a-z]+\s*=/i);
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attributes, body] of scripts) {
      expect(body.trim(), "an inline script is blocked by script-src 'self'").toBe("");
      const source = /\ssrc="([^"]+)"/.exec(attributes)?.[1] as string;
      const script = await fetchFromPage(app, "/docs/", source);
      expect(script.statusCode, source).toBe(200);
      expect(script.headers["content-type"], source).toMatch(/^(application|text)\/javascript/);
    }
    const sheets = [...html.matchAll(/<link\b[^>]*rel="stylesheet"[^>]*href="([^"]+)"/gi)].map((m) => m[1]);
    expect(sheets.length).toBeGreaterThan(0);
    for (const sheet of sheets) {
      const css = await fetchFromPage(app, "/docs/", sheet);
      expect(css.statusCode, sheet).toBe(200);
      expect(css.headers["content-type"], sheet).toMatch(/^text\/css/);
      for (const [, target] of css.body.matchAll(/url\(\s*["']?([^"')\s]+)/g)) {
        expect(target.startsWith("data:") || !/^[a-z]+:/i.test(target), `${sheet}: ${target.slice(0, 40)}`).toBe(true);
      }
    }
  });

  it("the contract the page loads (./json) comes from this origin, as connect-src 'self' requires", async () => {
    const app = await withDocs();
    const initializer = (await app.inject({ url: "/docs/static/swagger-initializer.js" })).body;
    expect(initializer).toContain("resolveUrl('./json')");
    const contract = await fetchFromPage(app, "/docs/", "./json");
    expect(contract.statusCode).toBe(200);
    expect(contract.json()).toMatchObject({ openapi: "3.1.0" });
  });

  it("a JSON answer keeps its body and media type and gets only nosniff (the page headers are for HTML)", async () => {
    const app = await withDocs();
    const response = await app.inject({ url: "/v1/elastic" });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^application\/json/);
    expect(response.json()).toEqual({ E: 20 });
    expect(response.headers["x-content-type-options"]).toBe("nosniff");
    expect(response.headers["content-security-policy"]).toBeUndefined();
  });
});
