import { readFileSync } from "node:fs";
import { Validator } from "@seriousme/openapi-schema-validator";
import { describe, expect, it } from "vitest";
import { parse } from "yaml";
import { FLAG_CODES } from "../../core/index.js";
import { generateOpenApiYaml } from "../../server/openapi-document.js";
import { PROBLEM_KINDS, problemTypeUri, type ProblemSlug } from "../../server/problems.js";
import { build } from "../helpers/build.js";
import { multipartBody } from "../helpers/multipart.js";

const committed = readFileSync(new URL("../../openapi.yaml", import.meta.url), "utf8");

describe("openapi.yaml", () => {
  it("is exactly what the routes' zod schemas produce (run `npm run openapi` after changing a route or schema)", async () => {
    expect(await generateOpenApiYaml()).toBe(committed);
  });

  it("is a valid OpenAPI 3.1 document (OpenAPI Initiative JSON schema, via @seriousme/openapi-schema-validator)", async () => {
    const result = await new Validator().validate(parse(committed));
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
    expect(parse(committed).openapi).toBe("3.1.0");
  });

  it("describes every endpoint, unit option, flag code, and error response with problem+json", () => {
    const document = parse(committed);
    expect(Object.keys(document.paths).sort()).toEqual(
      ["/livez", "/readyz", "/openapi.yaml", "/openapi.json", "/problems/{slug}", "/v1/elastic", "/v1/logs", "/v1/correlations", "/v1/correlations/{id}", "/metrics"].sort(),
    );
    const text = JSON.stringify(document);
    for (const code of FLAG_CODES) expect(text).toContain(code);
    for (const unit of ["m/s", "km/s", "ft/s", "us/ft", "us/m", "g/cm3", "kg/m3", "GPa", "MPa", "Pa", "psi", "Mpsi"]) {
      expect(text).toContain(`"${unit}"`);
    }
    for (const operation of [document.paths["/v1/elastic"].get, document.paths["/v1/elastic"].post]) {
      for (const status of ["400", "413", "415", "500"]) {
        expect(operation.responses[status].content).toHaveProperty(["application/problem+json"]);
      }
    }
    expect(Object.keys(PROBLEM_KINDS).length).toBeGreaterThan(5);
  });

  it("lists every problem type URI: in the Problem schema's type, and under components.responses by status (RFC 9457 §3.1.1 type)", () => {
    const document = parse(committed);
    const typeSchema = document.components.schemas.Problem.properties.type;
    const slugs = Object.keys(PROBLEM_KINDS) as ProblemSlug[];
    expect([...typeSchema.enum].sort()).toEqual(slugs.map(problemTypeUri).sort());
    for (const slug of slugs) {
      const { status, title } = PROBLEM_KINDS[slug];
      expect(committed, slug).toContain(`/problems/${slug}`);
      expect(typeSchema.description, slug).toContain(`| ${problemTypeUri(slug)} | ${status} | ${title} |`);
      const response = document.components.responses[`Problem${status}`];
      expect(response.description, slug).toContain(`\`${problemTypeUri(slug)}\``);
      expect(response.content["application/problem+json"].schema).toEqual({ $ref: "#/components/schemas/Problem" });
    }
    // RFC 9110 §10.2.3 and §10.2.1, RFC 6750 §3: the headers that tell a client what to do next.
    expect(Object.keys(document.components.responses.Problem429.headers)).toEqual(["Retry-After", "x-ratelimit-limit", "x-ratelimit-remaining", "x-ratelimit-reset"]);
    expect(Object.keys(document.components.responses.Problem503.headers)).toEqual(["Retry-After"]);
    expect(Object.keys(document.components.responses.Problem405.headers)).toEqual(["Allow"]);
    expect(Object.keys(document.components.responses.Problem401.headers)).toEqual(["WWW-Authenticate"]);
  });

  it("documents the statuses any /v1/ request may get as problem+json on every /v1/ operation", () => {
    const document = parse(committed);
    const operations = Object.entries(document.paths as Record<string, Record<string, { responses: Record<string, { content?: object }> }>>)
      .filter(([path]) => path.startsWith("/v1/"))
      .flatMap(([path, methods]) => Object.entries(methods).map(([method, operation]) => [`${method} ${path}`, operation] as const));
    expect(operations.length).toBeGreaterThanOrEqual(5);
    for (const [name, operation] of operations) {
      for (const status of ["401", "408", "429", "431", "500", "503"]) {
        expect(operation.responses[status]?.content, `${name} ${status}`).toHaveProperty(["application/problem+json"]);
      }
    }
    for (const operation of [document.paths["/v1/elastic"].get, document.paths["/v1/elastic"].post, document.paths["/v1/logs"].post]) {
      for (const status of ["400", "406", "413", "415"]) expect(operation.responses[status].content).toHaveProperty(["application/problem+json"]);
    }
  });

  it("documents the request body of POST /v1/logs under exactly the content types the route reads (OpenAPI 3.1 §4.8.13 Request Body Object)", async () => {
    const document = parse(committed);
    const body = document.paths["/v1/logs"].post.requestBody;
    expect(body.required).toBe(true);
    expect(body.content["multipart/form-data"].schema.required).toEqual(["file"]);
    expect(Object.keys(body.content["multipart/form-data"].schema.properties).sort()).toEqual(["file", "zones"]);
    const app = await build();
    // Two rows of our own demo well (Marram Bank 7).
    const csv = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1510.0,95,170,2.45\r\n1510.5,96,172,2.44\r\n";
    for (const type of Object.keys(body.content)) {
      const upload = type === "multipart/form-data" ? multipartBody([{ name: "file", filename: "marram-bank-7.csv", content: csv }]) : { body: csv, contentType: type };
      const response = await app.inject({ method: "POST", url: "/v1/logs", payload: upload.body, headers: { "content-type": upload.contentType } });
      expect(response.statusCode, type).toBe(200);
      expect(response.json().count, type).toBe(2);
    }
    const undocumented = await app.inject({ method: "POST", url: "/v1/logs", payload: csv, headers: { "content-type": "application/pdf" } });
    expect(undocumented.statusCode).toBe(415);
  });

  it("is served at /openapi.yaml and /openapi.json, and /docs renders an interactive reference", async () => {
    const app = await build();
    const yaml = await app.inject({ url: "/openapi.yaml" });
    expect(yaml.statusCode).toBe(200);
    expect(yaml.body).toBe(committed);
    expect((await app.inject({ url: "/openapi.json" })).json()).toEqual(parse(committed));
    const docs = await app.inject({ url: "/docs/" });
    expect(docs.statusCode).toBe(200);
    expect(docs.headers["content-type"]).toMatch(/text\/html/);
  });
});
