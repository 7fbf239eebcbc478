import { describe, expect, it } from "vitest";
import { CORRELATIONS, parseCsv, parseLas } from "../../core/index.js";
import { correlationList } from "../../server/schemas/correlations.js";
import { elasticColumnsResponse, elasticPointResponse } from "../../server/schemas/elastic.js";
import { build } from "../helpers/build.js";
import { relativeError } from "../helpers/elastic.js";

const PSI = 6894.757293168362; // Pa (NIST SP 811)

const get = async (query: string) => {
  const app = await build();
  const response = await app.inject({ url: query });
  return { response, body: response.json() };
};

const post = async (payload: object) => {
  const app = await build();
  const response = await app.inject({ method: "POST", url: "/v1/elastic", payload });
  return { response, body: response.json() };
};

describe("GET /v1/correlations", () => {
  it.each([["/v1/correlations"], ["/v1/correlations/ucs.mcnally1987"]])("%s answers 406 (RFC 9110 §12.5.1) to an Accept that names no JSON, and JSON to */*", async (url) => {
    const app = await build();
    const refused = await app.inject({ url, headers: { accept: "image/png" } });
    expect(refused.statusCode).toBe(406);
    expect(refused.headers["content-type"]).toMatch(/^application\/problem\+json/);
    const answered = await app.inject({ url, headers: { accept: "*/*" } });
    expect(answered.statusCode).toBe(200);
  });

  it("lists every catalogue entry with citation, formula, units, empirical: true and the caution", async () => {
    const { response, body } = await get("/v1/correlations");
    expect(response.statusCode).toBe(200);
    correlationList.parse(body);
    expect(body.count).toBe(CORRELATIONS.length);
    for (const entry of body.correlations) {
      expect(entry.id).toMatch(/^(static_e|ucs|friction_angle|vs|density|brittleness)\.[a-z]+[0-9]{4}(_[a-z0-9]+)?$/);
      expect(entry.empirical).toBe(true);
      expect(entry.citation.authors.length).toBeGreaterThan(0);
    }
    expect(body.caution).toMatch(/licensed professionals/);
  });

  it("filters by kind and lithology, and answers one entry by id (404 problem for an unknown id)", async () => {
    const shaleUcs = (await get("/v1/correlations?kind=ucs&lithology=shale")).body;
    // Every UCS correlation that applies to a shale: its own, the clastic group's and any rock's (the catalogue has only shale ones).
    expect(shaleUcs.correlations.every((c: { kind: string; lithology: string }) => c.kind === "ucs" && ["shale", "clastic", "any"].includes(c.lithology))).toBe(true);
    expect(shaleUcs.count).toBeGreaterThan(0);
    const one = (await get("/v1/correlations/ucs.mcnally1987")).body;
    expect(one).toMatchObject({ id: "ucs.mcnally1987", kind: "ucs", output_unit: "MPa", empirical: true });
    const missing = await get("/v1/correlations/ucs.nobody2099");
    expect(missing.response.statusCode).toBe(404);
    expect(missing.body.type).toBe("/problems/not-found");
    expect((await get("/v1/correlations?kind=porosity")).response.statusCode).toBe(400);
  });
});

describe("applying correlations", () => {
  // DTC 100 µs/ft → Vp 3048 m/s; DTS 180 µs/ft → Vs 1693.33 m/s; ρ 2.40 g/cm3.
  const SAMPLE = "dtc=100&dts=180&rho=2.4";

  it("GET derives values by the published formulas (Lacy 1997 sandstone in Mpsi; McNally 1987), labelled empirical with their source", async () => {
    const { body } = await get(`/v1/elastic?${SAMPLE}&correlations=static_e.lacy1997_sandstone,ucs.mcnally1987`);
    elasticPointResponse.parse(body);
    const edMpsi = (body.E * 1e9) / (PSI * 1e6);
    const esGpa = ((0.0293 * edMpsi ** 2 + 0.4533 * edMpsi) * PSI * 1e6) / 1e9; // Lacy (1997), SPE 38716, sandstone
    expect(relativeError(body.derived["static_e.lacy1997_sandstone"].value, esGpa)).toBeLessThan(1e-12);
    // McNally (1987), via Chang, Zoback & Khaksar (2006): UCS = 1200·exp(−0.036·Δt) = 1200·e^−3.6 = 32.788 MPa
    expect(body.derived["ucs.mcnally1987"].value).toBeCloseTo(1200 * Math.exp(-3.6), 9);
    expect(body.derived["ucs.mcnally1987"]).toMatchObject({ kind: "ucs", unit: "MPa", empirical: true, source: expect.stringContaining("McNally") });
    expect(body.caution).toMatch(/calibrate against core tests/);
  });

  it("the same rock in GPa and in Mpsi gives the same static E through a Mpsi correlation (unit pitfall pinned)", async () => {
    const gpa = (await get(`/v1/elastic?${SAMPLE}&correlations=static_e.lacy1997`)).body;
    const mpsi = (await get(`/v1/elastic?${SAMPLE}&modulus_unit=Mpsi&correlations=static_e.lacy1997`)).body;
    expect(mpsi.derived["static_e.lacy1997"].value).toBe(gpa.derived["static_e.lacy1997"].value);
    expect(relativeError(mpsi.E * PSI * 1e-3, gpa.E)).toBeLessThan(1e-12);
  });

  it("a strength correlation taking a static modulus uses the static_e of the same list (Bradford et al. 1998 on Lacy 1997)", async () => {
    const { body } = await get(`/v1/elastic?${SAMPLE}&correlations=static_e.lacy1997_sandstone,ucs.bradford1998`);
    const es = body.derived["static_e.lacy1997_sandstone"].value;
    expect(body.derived["ucs.bradford1998"].value).toBeCloseTo(2.28 + 4.1089 * es, 9); // UCS = 2.28 + 4.1089·E (GPa → MPa)
  });

  it("an input outside the calibration range keeps its value and raises outside_calibration (suspect)", async () => {
    // Wang (2000) soft rock is fitted to Ed below 15 GPa; this sample has Ed ≈ 21 GPa.
    const { body } = await get(`/v1/elastic?dtc=80&dts=140&rho=2.5&correlations=static_e.wang2000_soft`);
    expect(body.E).toBeGreaterThan(15);
    expect(body.derived["static_e.wang2000_soft"]).toMatchObject({ outside_calibration: true });
    expect(body.derived["static_e.wang2000_soft"].value).toBeCloseTo(0.4145 * body.E - 1.0593, 9);
    expect(body.flags).toContainEqual(expect.objectContaining({ code: "outside_calibration", severity: "suspect" }));
    expect(body.valid).toBe(true);
  });

  it("an invalid sample gives null estimates for correlations on its moduli", async () => {
    const { body } = await get(`/v1/elastic?dtc=100&dts=95&rho=2.4&correlations=static_e.lacy1997`);
    expect(body.derived["static_e.lacy1997"].value).toBeNull();
  });

  it.each([
    ["/v1/elastic?dtc=100&dts=180&rho=2.4&correlations=ucs.nobody2099", "query.correlations", "known: static_e.lacy1997"],
    ["/v1/elastic?dtc=100&dts=180&rho=2.4&correlations=ucs.bradford1998", "query.correlations", "static_e"],
    ["/v1/elastic?dtc=100&rho=2.4&vs_from=density.gardner1974", "query.vs_from", "vs.castagna1985"],
  ])("%s is a 400 problem naming %s", async (url, field, words) => {
    const { response, body } = await get(url);
    expect(response.statusCode).toBe(400);
    expect(body.errors).toContainEqual({ field, message: expect.stringContaining(words) });
  });

  it("correlation options change the result and bad ones are named (Rickman et al. 2008 bounds)", async () => {
    const columns = { dtc: [80], dts: [140], rho: [2.5], correlations: ["static_e.lacy1997", "brittleness.rickman2008"] };
    const standard = (await post(columns)).body.derived["brittleness.rickman2008"].values[0];
    const widened = (await post({ ...columns, correlation_options: { "brittleness.rickman2008": { e_max_mpsi: 12 } } })).body;
    expect(widened.derived["brittleness.rickman2008"].values[0]).toBeLessThan(standard);
    const bad = await post({ ...columns, correlation_options: { "brittleness.rickman2008": { e_maximum: 12 } } });
    expect(bad.response.statusCode).toBe(400);
    expect(bad.body.errors[0].field).toBe("body.correlation_options.brittleness.rickman2008.e_maximum");
  });

  it("per-zone lists apply to their zone's samples only; other samples get null", async () => {
    const { body } = await post({
      depth: [1000, 1001, 1002, 1003],
      dtc: [90, 92, 70, 72],
      dts: [160, 165, 130, 131],
      rho: [2.3, 2.32, 2.6, 2.62],
      zones: [
        { name: "Sand", top: 1000, base: 1002, correlations: ["ucs.mcnally1987"] },
        { name: "Lime", top: 1002, base: 1003.5, correlations: ["ucs.militzer1973"] },
      ],
    });
    elasticColumnsResponse.parse(body);
    expect(body.derived["ucs.mcnally1987"].values.map((v: number | null) => v === null)).toEqual([false, false, true, true]);
    expect(body.derived["ucs.militzer1973"].values.map((v: number | null) => v === null)).toEqual([true, true, false, false]);
    // Militzer & Stoll (1973), via Chang et al. (2006): UCS = (7682/Δt)^1.82 / 145 MPa
    expect(body.derived["ucs.militzer1973"].values[2]).toBeCloseTo((7682 / 70) ** 1.82 / 145, 9);
  });
});

describe("gap filling (vs_from, rho_from)", () => {
  const depth = Array.from({ length: 10 }, (_, i) => 1500 + i * 0.5);
  const dtc = [88, 90, 92, 95, 97, 99, 96, 93, 91, 89];
  const dts = [160, 162, 165, 170, 172, 175, 171, 168, 164, 161];
  const rho = [2.35, 2.36, 2.38, 2.4, 2.41, 2.42, 2.4, 2.39, 2.37, 2.36];

  it("a well with its shear removed over an interval comes back with Vs filled only there, flagged, and all else unchanged", async () => {
    const complete = (await post({ depth, dtc, dts, rho })).body;
    const gapped = dts.map((value, i) => (i >= 3 && i <= 5 ? null : value));
    const { body } = await post({ depth, dtc, dts: gapped, rho, vs_from: "vs.castagna1985" });
    expect(body.filled).toEqual({ vs: 3, rho: 0 });
    for (let i = 0; i < 10; i++) {
      const inGap = i >= 3 && i <= 5;
      if (inGap) {
        // Castagna et al. (1985) mudrock line: Vp = 1.16·Vs + 1.36 km/s → Vs = (Vp − 1.36)/1.16
        const vp = 304800 / dtc[i] / 1000;
        expect(body.vs[i]).toBeCloseTo(((vp - 1.36) / 1.16) * 1000, 9);
        expect(body.flags).toContainEqual({ index: i, code: "estimated_vs", severity: "suspect" });
      } else {
        for (const key of ["E", "nu", "G", "K", "vs"]) expect(body[key][i], `${key}[${i}]`).toBe(complete[key][i]);
        expect(body.flags.some((f: { index: number }) => f.index === i)).toBe(false);
      }
    }
  });

  it("fill=all replaces the whole curve; without vs_from the gap stays invalid", async () => {
    const all = (await post({ dtc, dts, rho, vs_from: "vs.castagna1985", fill: "all" })).body;
    expect(all.filled.vs).toBe(10);
    const none = (await post({ dtc, dts: dts.map((v, i) => (i === 0 ? null : v)), rho })).body;
    expect(none.E[0]).toBeNull();
  });

  it("a Vs that vs_from predicts at zero or below (Castagna et al. 1985, Vs = 0.8621·Vp − 1172.4 m/s, below Vp ≈ 1360 m/s) is flagged non_positive and not returned", async () => {
    // DTC 300 µs/ft is Vp = 1016 m/s: the mudrock line gives 0.8621·1016 − 1172.4 ≈ −296.5 m/s.
    const { body } = await post({ dtc: [300], dts: [null], rho: [2.1], vs_from: "vs.castagna1985" });
    expect(body.vs).toEqual([null]);
    expect(body.E).toEqual([null]);
    const codes = body.flags.map((flag: { code: string }) => flag.code);
    expect(codes).toEqual(expect.arrayContaining(["estimated_vs", "non_positive"]));
    expect(codes).not.toContain("negative_bulk_modulus");
  });

  it("fill without vs_from or rho_from is a 400 naming fill, not an option that silently does nothing", async () => {
    const { response, body } = await post({ dtc, dts, rho, vs_from: undefined, fill: "all" });
    expect(response.statusCode).toBe(400);
    expect(body.errors).toContainEqual({ field: "body.fill", message: "give vs_from or rho_from with it, or leave fill out" });
  });

  it("rho_from predicts density from Vp with Gardner et al. (1974), ρ = 0.31·Vp^0.25 (Vp in m/s)", async () => {
    const { body } = await post({ dtc: [100], dts: [180], vs_from: undefined, rho_from: "density.gardner1974" });
    expect(body.filled).toEqual({ vs: 0, rho: 1 });
    const rhoGardner = 0.31 * 3048 ** 0.25;
    expect(body.G[0]).toBeCloseTo((rhoGardner * 1000 * (304800 / 180) ** 2) / 1e9, 9);
    expect(body.flags).toContainEqual({ index: 0, code: "estimated_rho", severity: "suspect" });
    // The predicted density is returned as the density used, in g/cm3, so the estimate can be seen and checked.
    expect(body.rho[0]).toBeCloseTo(rhoGardner, 12);
  });
});

describe("correlations on whole wells", () => {
  const CSV = "DEPT[m],DTC[us/ft],RHOB[g/cm3]\r\n1000,100,2.4\r\n1000.5,90,2.45\r\n";

  it("a file without a shear log converts with vs_from, says so, and writes derived curves in CSV with their units", async () => {
    const app = await build();
    const json = await app.inject({ method: "POST", url: "/v1/logs?vs_from=vs.castagna1985&correlations=ucs.mcnally1987", payload: CSV, headers: { "content-type": "text/csv" } });
    expect(json.statusCode).toBe(200);
    expect(json.json().curves.vs).toBeUndefined();
    expect(json.json().warnings[0].message).toContain("vs.castagna1985");
    expect(json.json().caution).toBeDefined();
    const csv = await app.inject({ method: "POST", url: "/v1/logs?format=csv&vs_from=vs.castagna1985&correlations=ucs.mcnally1987", payload: CSV, headers: { "content-type": "text/csv" } });
    const table = parseCsv(csv.body).table;
    const column = table.curves.findIndex((c) => c.mnemonic === "EL_UCS_MCNALLY1987");
    expect(table.curves[column].unit).toBe("MPa");
    // CSV answers write computed values to 8 significant digits by default (toPrecision(8), ECMA-262).
    expect(table.columns[column][0]).toBe(Number((1200 * Math.exp(-3.6)).toPrecision(8)));
  });

  it("LAS output carries each derived curve with its citation in the description and the caution in ~Other", async () => {
    const app = await build();
    const response = await app.inject({ method: "POST", url: "/v1/logs?format=las&vs_from=vs.castagna1985&correlations=ucs.mcnally1987", payload: CSV, headers: { "content-type": "text/csv" } });
    const document = parseLas(response.body);
    const curve = document.table.curves.find((c) => c.mnemonic === "EL_UCS_MCNALLY1987");
    expect(curve?.description).toContain("McNally");
    expect(response.body).toMatch(/empirical estimates/i);
  });
});
