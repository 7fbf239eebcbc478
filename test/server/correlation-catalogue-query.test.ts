import { describe, expect, it } from "vitest";
import { correlationDescription, correlationList } from "../../server/schemas/correlations.js";
import { problemSchema } from "../../server/schemas/problem.js";
import { build } from "../helpers/build.js";

const get = async (url: string) => {
  const app = await build();
  const response = await app.inject({ url });
  return { response, body: response.json() };
};

/** An RFC 9457 problem of the invalid-request kind (server/problems.ts). */
const expectInvalid = (response: { statusCode: number; headers: Record<string, unknown> }, body: unknown) => {
  expect(response.statusCode).toBe(400);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
  return problemSchema.parse(body);
};

describe("GET /v1/correlations/{id} query parameters", () => {
  it("an unknown query parameter is a 400 naming it, as the list endpoint answers (it was ignored with a 200)", async () => {
    const { response, body } = await get("/v1/correlations/ucs.mcnally1987?foo=1");
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([{ field: "query.foo", message: expect.stringContaining("unknown field") }]);
    const list = await get("/v1/correlations?foo=1");
    expect(expectInvalid(list.response, list.body).errors).toEqual(problem.errors);
  });

  it("without a query it still answers the entry (McNally 1987: UCS = 1200·exp(−0.036·Δt))", async () => {
    const { response, body } = await get("/v1/correlations/ucs.mcnally1987");
    expect(response.statusCode).toBe(200);
    expect(correlationDescription.parse(body).formula).toContain("1200·exp(−0.036·Δt)");
  });
});

describe("GET /v1/correlations filters in any case", () => {
  it.each([
    ["kind=UCS", "kind=ucs"],
    ["kind=Static_E", "kind=static_e"],
    ["lithology=Shale", "lithology=shale"],
    ["kind=Ucs&lithology=SHALE", "kind=ucs&lithology=shale"],
  ])("%s answers what %s answers", async (given, lower) => {
    const mixed = await get(`/v1/correlations?${given}`);
    expect(mixed.response.statusCode).toBe(200);
    const expected = (await get(`/v1/correlations?${lower}`)).body;
    expect(correlationList.parse(mixed.body)).toEqual(expected);
    expect(expected.count).toBeGreaterThan(0);
  });

  it("a value that is no kind in any case is still a 400 listing the documented lower-case values", async () => {
    const { response, body } = await get("/v1/correlations?kind=Porosity");
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([{ field: "query.kind", message: expect.stringContaining('"static_e"') }]);
  });
});
