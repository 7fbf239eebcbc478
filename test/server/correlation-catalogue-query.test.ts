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

const listed = async (query: string): Promise<{ id: string; lithology: string }[]> => {
  const { response, body } = await get(`/v1/correlations?${query}`);
  expect(response.statusCode).toBe(200);
  return correlationList.parse(body).correlations;
};

describe("GET /v1/correlations?lithology= lists every correlation that applies to the rock", () => {
  it("limestone gets the carbonate UCS correlations (Militzer 1973, Golubev 1976) beside its own, not the dolomite one", async () => {
    const ids = (await listed("kind=ucs&lithology=limestone")).map((c) => c.id);
    expect(ids).toEqual(["ucs.militzer1973", "ucs.golubev1976", "ucs.chang2006_limestone"]);
  });

  it("sandstone gets those fitted to any rock and to clastic rocks (Gardner 1974, Castagna 1985), in any case", async () => {
    const entries = await listed("lithology=Sandstone");
    const ids = entries.map((c) => c.id);
    expect(ids).toEqual(expect.arrayContaining(["density.gardner1974", "vs.castagna1985", "static_e.lacy1997", "static_e.lacy1997_sandstone", "ucs.mcnally1987"]));
    expect(new Set(entries.map((c) => c.lithology))).toEqual(new Set(["any", "clastic", "sandstone", "hard_rock", "soft_rock"]));
  });

  it("a group gets its own and any rock's, not its members' alone (carbonate: no limestone-only or dolomite-only entry)", async () => {
    const entries = await listed("lithology=carbonate");
    expect(new Set(entries.map((c) => c.lithology))).toEqual(new Set(["carbonate", "any", "hard_rock", "soft_rock"]));
    expect(entries.map((c) => c.id)).toEqual(expect.arrayContaining(["ucs.militzer1973", "ucs.golubev1976", "density.gardner1974"]));
  });

  it("says the rule in the query parameter's description (the source of openapi.yaml)", async () => {
    const app = await build();
    await app.ready();
    const document = app.swagger() as { paths: Record<string, { get: { parameters: { name: string; description?: string }[] } }> };
    const parameter = document.paths["/v1/correlations"].get.parameters.find((p) => p.name === "lithology");
    expect(parameter?.description).toMatch(/sandstone and shale are clastic; limestone and dolomite are carbonate/);
    expect(parameter?.description).toMatch(/not those fitted to one of its members alone/);
  });
});

describe("the catalogue's input quantities", () => {
  it("are unit-free names of the API's own, the unit beside them (McNally 1987 takes Δt in µs/ft; Lacy 1997 Ed in Mpsi; Eissa & Kazi 1988 ρ in g/cm3)", async () => {
    const inputsOf = async (id: string) => correlationDescription.parse((await get(`/v1/correlations/${id}`)).body).inputs.map(({ quantity, symbol, unit }) => ({ quantity, symbol, unit }));
    expect(await inputsOf("ucs.mcnally1987")).toEqual([{ quantity: "vp", symbol: "Δt", unit: "us/ft" }]);
    expect((await inputsOf("static_e.lacy1997"))[0]).toEqual({ quantity: "dynamic_youngs_modulus", symbol: "Ed", unit: "Mpsi" });
    expect(await inputsOf("static_e.eissa1988_density")).toContainEqual(expect.objectContaining({ quantity: "bulk_density", unit: "g/cm3" }));
    expect(await inputsOf("brittleness.rickman2008")).toEqual([
      expect.objectContaining({ quantity: "static_youngs_modulus", unit: "Mpsi" }),
      expect.objectContaining({ quantity: "poissons_ratio", unit: "1" }),
    ]);
  });

  it("never carry a unit in their name, in any entry", async () => {
    const quantities = new Set((await listed("")).flatMap((c) => (c as unknown as { inputs: { quantity: string }[] }).inputs.map((input) => input.quantity)));
    expect([...quantities].sort()).toEqual(["bulk_density", "dynamic_youngs_modulus", "poissons_ratio", "static_youngs_modulus", "vp"]);
    for (const quantity of quantities) expect(quantity).toMatch(/^[a-z_]+$/);
  });
});
