/**
 * The README's single-sample examples show the service's answers: each GET whose answer the README prints in full
 * must get exactly that answer, digit for digit, and the Mpsi example the E it quotes. A README that drifts from
 * the service misleads the reader who checks a value by hand.
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

const README = readFileSync(new URL("../../README.md", import.meta.url), "utf8");
const HOST = "http://127.0.0.1:8080";

/** A `curl -s '<url>'` block followed by a ```json block holding one whole JSON object. */
const printed = [...README.matchAll(/```sh\ncurl -s '([^']+)'\n```\n\n```json\n(\{[^\n]*\})\n```/g)].map(([, url, json]) => ({ url: url.slice(HOST.length), json }));
const printedAnswers = printed.filter(({ json }) => !json.includes("…"));
/** Answers printed in part (`…` for what is left out): the numbers they do print. */
const abridgedAnswers = printed.filter(({ json }) => json.includes("…"));

describe("README examples", () => {
  it("finds at least one printed single-sample answer", () => {
    expect(printedAnswers.length).toBeGreaterThan(0);
  });

  it.each(printedAnswers.map((example) => [example.url, example] as const))("GET %s answers what the README prints", async (_url, example) => {
    const app = await build();
    const response = await app.inject({ method: "GET", url: example.url });
    expect(response.statusCode).toBe(200);
    expect(response.body).toBe(example.json);
  });

  it.each(abridgedAnswers.map((example) => [example.url, example] as const))("GET %s answers every number the README prints of it", async (_url, example) => {
    const app = await build();
    const response = await app.inject({ method: "GET", url: example.url });
    const numbers = [...example.json.matchAll(/"([a-z_A-Z]+)":(-?[0-9][0-9.e+-]*)/g)].map(([, key, value]) => `"${key}":${value}`);
    expect(numbers.length).toBeGreaterThan(0);
    for (const pair of numbers) expect(response.body).toContain(pair);
  });

  it("the Mpsi example quotes the E the service answers", async () => {
    const quoted = /modulus_unit=Mpsi'\n```\n\nanswers `"E":([0-9.]+),"nu":([0-9.]+),/.exec(README);
    expect(quoted).not.toBeNull();
    const app = await build();
    const answer = (await app.inject({ method: "GET", url: "/v1/elastic?vp=3.2&vs=1.8&rho=2.45&velocity_unit=km/s&modulus_unit=Mpsi" })).json();
    expect(String(answer.E)).toBe(quoted?.[1]);
    expect(String(answer.nu)).toBe(quoted?.[2]);
  });
});
