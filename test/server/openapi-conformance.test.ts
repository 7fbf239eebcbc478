/**
 * Every answer the service gives matches what openapi.yaml documents for it.
 *
 * Answers are written with plain JSON.stringify (server/app.ts), so nothing else holds them to the document. Here a
 * corpus of real requests goes through the app factory, and for each answer:
 * - the operation is looked up by path template and method (OpenAPI 3.1.0 §4.8.8 Paths Object: a concrete path
 *   before a templated one; §4.8.9 Path Item Object: one field per method);
 * - the response by status code, then its range (4XX), then `default` (§4.8.16 Responses Object);
 * - the media type of the answer's Content-Type among the response's `content` keys, most specific first
 *   (§4.8.14 Media Type Object, §4.8.17 Response Object);
 * - a JSON body is validated against the documented schema with Ajv's JSON Schema 2020-12 build, the dialect of
 *   OpenAPI 3.1 schemas (§4.8.24 Schema Object).
 * A status or media type the operation does not document is a mismatch. Problem answers are also held to the
 * members of RFC 9457 §3.1, and to the headers components.responses lists for their status.
 */
import { readFileSync, readdirSync } from "node:fs";
import type { InjectOptions, LightMyRequestResponse } from "fastify";
import { tableFromArrays, tableToIPC } from "apache-arrow";
import { Ajv2020, type ValidateFunction } from "ajv/dist/2020.js";
import { describe, expect, it } from "vitest";
import { parse } from "yaml";
import type { ServiceConfig } from "../../server/config.js";
import { PROBLEM_KINDS } from "../../server/problems.js";
import { build } from "../helpers/build.js";
import { marramBankLas } from "../helpers/marram-bank-las.js";
import { multipartBody, type FormPart } from "../helpers/multipart.js";

// ---------------------------------------------------------------------------------------------------------------
// The document, whole, in Ajv

interface SchemaHolder {
  schema?: unknown;
}
interface ResponseObject {
  $ref?: string;
  headers?: Record<string, SchemaHolder>;
  content?: Record<string, SchemaHolder>;
}
interface OpenApiDocument {
  openapi: string;
  jsonSchemaDialect?: string;
  paths: Record<string, Record<string, { responses: Record<string, ResponseObject> }>>;
  components: { responses: Record<string, ResponseObject> };
}

const DOCUMENT = parse(readFileSync(new URL("../../openapi.yaml", import.meta.url), "utf8")) as OpenApiDocument;

/** Base URI under which the whole document is added to Ajv: `#/components/...` references resolve inside it. */
const DOCUMENT_ID = "urn:elastilog:openapi.yaml";

/** The fields of the OpenAPI Object (OpenAPI 3.1.0 §4.8.1): not schema keywords, so Ajv is told they are known. */
const OPENAPI_OBJECT_FIELDS = ["openapi", "info", "jsonSchemaDialect", "servers", "paths", "webhooks", "components", "security", "tags", "externalDocs"];

// Strict mode stays on (no `strict: false`): Ajv compiles only the schemas reached by a $ref, and the document's
// OpenAPI-only keywords (`example`) sit in Parameter Objects, never inside a schema; one there would be refused.
const ajv = new Ajv2020({ allErrors: true });
ajv.addVocabulary(OPENAPI_OBJECT_FIELDS);
ajv.addSchema({ ...DOCUMENT, $id: DOCUMENT_ID });

/** A JSON Pointer (RFC 6901 §3–4) as a URI fragment (§6): each segment escaped, then percent-encoded. */
const fragmentOf = (segments: readonly string[]): string =>
  segments.map((segment) => `/${encodeURIComponent(segment.replaceAll("~", "~0").replaceAll("/", "~1"))}`).join("");

const validators = new Map<string, ValidateFunction>();
/** The validator of the schema at `segments` of the document, compiled as a reference into it. */
const validatorAt = (segments: readonly string[]): ValidateFunction => {
  const ref = `${DOCUMENT_ID}#${fragmentOf(segments)}`;
  const known = validators.get(ref);
  if (known !== undefined) return known;
  const validate = ajv.compile({ $ref: ref });
  validators.set(ref, validate);
  return validate;
};

const schemaErrors = (validate: ValidateFunction, where: string): string[] =>
  (validate.errors ?? []).map((error) => `${where}: ${error.instancePath || "(root)"} ${error.message ?? ""} ${JSON.stringify(error.params)} (${error.schemaPath})`);

// ---------------------------------------------------------------------------------------------------------------
// Looking an answer up

const templateRegExp = (template: string): RegExp =>
  new RegExp(`^${template.split(/(\{[^}]+\})/).map((part) => (part.startsWith("{") ? "[^/]+" : part.replace(/[.*+?^${}()|[\]\\]/g, "\\$&"))).join("")}$`);

/** The path template a path matches; a concrete path wins over a templated one (OpenAPI 3.1.0 §4.8.8). */
const pathTemplateOf = (path: string): string | undefined => {
  const templates = Object.keys(DOCUMENT.paths);
  return templates.find((template) => template === path) ?? templates.find((template) => template.includes("{") && templateRegExp(template).test(path));
};

/** Where an answer is documented: the operation's responses, or, for a request no operation takes, components.responses. */
const documentedResponsesOf = (method: string, path: string, noOperation: boolean) => {
  if (noOperation) return { operation: "(no operation)", responses: undefined };
  const template = pathTemplateOf(path);
  const field = method.toLowerCase();
  const operation = template === undefined ? undefined : DOCUMENT.paths[template][field];
  return operation === undefined || template === undefined ? undefined : { operation: `${method} ${template}`, responses: { object: operation.responses, at: ["paths", template, field, "responses"] } };
};

/** A response, following a Reference Object (OpenAPI 3.1.0 §4.8.23) into components.responses. */
const resolveResponse = (response: ResponseObject, at: string[]): { response: ResponseObject; at: string[] } => {
  if (response.$ref === undefined) return { response, at };
  const name = /^#\/components\/responses\/([^/]+)$/.exec(response.$ref)?.[1];
  if (name === undefined) throw new Error(`unexpected response reference ${response.$ref}`);
  return { response: DOCUMENT.components.responses[name], at: ["components", "responses", name] };
};

/** The media type of a Content-Type (RFC 9110 §8.3.1): without parameters, lower case. */
const mediaTypeOf = (contentType: string | undefined): string | undefined => contentType?.split(";")[0].trim().toLowerCase() || undefined;

/** The documented key for a media type: exact, then `type/*`, then `*\/*` (OpenAPI 3.1.0 §4.8.17, content). */
const contentKeyOf = (content: Record<string, SchemaHolder>, mediaType: string): string | undefined => {
  const keys = Object.keys(content);
  const bare = (key: string) => mediaTypeOf(key);
  return keys.find((key) => bare(key) === mediaType) ?? keys.find((key) => bare(key) === `${mediaType.split("/")[0]}/*`) ?? keys.find((key) => bare(key) === "*/*");
};

/** JSON, or a media type with the +json structured syntax suffix (RFC 6839 §3.1). */
const isJsonMediaType = (mediaType: string): boolean => mediaType === "application/json" || mediaType.endsWith("+json");

interface Answer {
  status: number;
  contentType: string | undefined;
  body: string;
}

/**
 * What openapi.yaml says of one answer: where it is documented (`key`) and every mismatch (none when it conforms).
 * A request no operation takes (an unknown path, a method a path does not take) is documented by the problem
 * response of its status in components.responses, which the document keeps for exactly those answers.
 */
const checkAnswer = (request: { method: string; path: string; noOperation: boolean }, answer: Answer): { key: string; mismatches: string[] } => {
  const documented = documentedResponsesOf(request.method, request.path, request.noOperation);
  if (documented === undefined) return { key: `${request.method} ${request.path}`, mismatches: [`no operation ${request.method} ${request.path} in openapi.yaml`] };
  const key = `${documented.operation} ${answer.status}`;
  const found = (() => {
    if (documented.responses === undefined) {
      const name = `Problem${answer.status}`;
      return Object.hasOwn(DOCUMENT.components.responses, name) ? resolveResponse(DOCUMENT.components.responses[name], ["components", "responses", name]) : undefined;
    }
    const { object, at } = documented.responses;
    const status = [String(answer.status), `${String(answer.status)[0]}XX`, "default"].find((candidate) => Object.hasOwn(object, candidate));
    return status === undefined ? undefined : resolveResponse(object[status], [...at, status]);
  })();
  if (found === undefined) return { key, mismatches: [`status ${answer.status} is not documented for ${documented.operation}`] };
  const content = found.response.content ?? {};
  const mediaType = mediaTypeOf(answer.contentType);
  if (mediaType === undefined) {
    return { key, mismatches: Object.keys(content).length === 0 && answer.body === "" ? [] : [`${key}: the answer has no Content-Type; documented: ${Object.keys(content).join(", ") || "no content"}`] };
  }
  const contentKey = contentKeyOf(content, mediaType);
  if (contentKey === undefined) return { key, mismatches: [`media type ${mediaType} is not documented for ${key} (documented: ${Object.keys(content).join(", ") || "no content"})`] };
  if (!isJsonMediaType(mediaType)) return { key, mismatches: [] };
  let body: unknown;
  try {
    body = JSON.parse(answer.body);
  } catch {
    return { key, mismatches: [`${key}: the ${mediaType} body is not JSON (RFC 8259): ${answer.body.slice(0, 80)}`] };
  }
  if (content[contentKey].schema === undefined) return { key, mismatches: [`${key} ${contentKey} documents no schema`] };
  const validate = validatorAt([...found.at, "content", contentKey, "schema"]);
  return { key, mismatches: validate(body) ? [] : schemaErrors(validate, `${key} ${contentKey}`) };
};

// ---------------------------------------------------------------------------------------------------------------
// RFC 9457 problem details

const PROBLEM_MEDIA_TYPE = "application/problem+json";

/** A URI reference (RFC 3986 §4.1): parses against a base, and holds no character RFC 3986 §2 excludes. */
const isUriReference = (value: string, base: string): boolean => {
  if (/[\s<>"{}|\\^`]/.test(value)) return false;
  try {
    new URL(value, base);
    return true;
  } catch {
    return false;
  }
};

/** The members of RFC 9457 §3.1, with the JSON types it gives them. */
const problemMemberMismatches = (body: Record<string, unknown>, status: number, requestUri: string): string[] => {
  const mismatches: string[] = [];
  // §3.1.1: a URI reference, resolved against the request URI when relative ("about:blank" only when absent).
  if (typeof body.type !== "string" || !isUriReference(body.type, requestUri)) mismatches.push(`type ${JSON.stringify(body.type)} is not a URI reference (RFC 9457 §3.1.1)`);
  // §3.1.2: a JSON number, and "generators MUST use the same status code in the actual HTTP response".
  if (body.status !== status) mismatches.push(`status member ${JSON.stringify(body.status)} is not the answer's status ${status} (RFC 9457 §3.1.2)`);
  if (typeof body.title !== "string") mismatches.push(`title ${JSON.stringify(body.title)} is not a string (RFC 9457 §3.1.3)`);
  if (typeof body.detail !== "string" || body.detail.trim() === "") mismatches.push(`detail ${JSON.stringify(body.detail)} is not a string that says something (RFC 9457 §3.1.4)`);
  if (Object.hasOwn(body, "instance") && (typeof body.instance !== "string" || !isUriReference(body.instance, requestUri))) {
    mismatches.push(`instance ${JSON.stringify(body.instance)} is not a URI reference (RFC 9457 §3.1.5)`);
  }
  return mismatches;
};

/** The headers components.responses lists for a problem's status: present, and valid against their schemas (§4.8.21 Header Object). */
const problemHeaderMismatches = (status: number, headers: LightMyRequestResponse["headers"]): string[] => {
  const name = `Problem${status}`;
  const documented = DOCUMENT.components.responses[name]?.headers ?? {};
  return Object.keys(documented).flatMap((header) => {
    const value = headers[header.toLowerCase()];
    if (typeof value !== "string") return [`${name}: header ${header} is missing`];
    const validate = validatorAt(["components", "responses", name, "headers", header, "schema"]);
    const type = (documented[header].schema as { type?: string }).type;
    // Header values are text (RFC 9110 §5.5); an integer schema describes the number the text writes.
    const typed = type === "integer" || type === "number" ? (/^-?\d+(\.\d+)?$/.test(value) ? Number(value) : value) : value;
    return validate(typed) ? [] : schemaErrors(validate, `${name} header ${header}`);
  });
};

// ---------------------------------------------------------------------------------------------------------------
// The corpus

type Request = InjectOptions & { method: string; url: string };

interface Exchange {
  name: string;
  request: Request;
  /** Settings of the app factory for this request (small limits, API keys…). */
  config?: Partial<ServiceConfig>;
  /** Requests sent first on the same app, their answers not checked (to use up a rate-limit allowance). */
  before?: Request[];
  /** Puts the app in a state before the request (a shutdown under way). */
  prepare?: (app: Awaited<ReturnType<typeof build>>) => void;
  /** The answer this request is in the corpus for; a different one would check something else. */
  status: number;
  mediaType: string | undefined;
  /** The request names a path or method no operation has. */
  noOperation?: boolean;
}

const fixture = (folder: string, name: string): Buffer => readFileSync(new URL(`../fixtures/${folder}/${name}`, import.meta.url));
const example = (name: string): Buffer => readFileSync(new URL(`../../examples/${name}`, import.meta.url));

const JSON_TYPE = "application/json";
const ARROW_TYPE = "application/vnd.apache.arrow.stream";

type Body = { payload: string | Buffer; headers: Record<string, string> };
const json = (value: unknown): Body => ({ payload: JSON.stringify(value), headers: { "content-type": JSON_TYPE } });
const raw = (payload: string | Buffer, contentType: string): Body => ({ payload, headers: { "content-type": contentType } });

/** A multipart/form-data body (RFC 7578) of named parts, as `curl -F` sends them. */
const multipart = (parts: FormPart[]): Body => {
  const { body, contentType } = multipartBody(parts);
  return { payload: body, headers: { "content-type": contentType } };
};

const get = (url: string, headers: Record<string, string> = {}): Request => ({ method: "GET", url, headers });
const post = (url: string, body: Body, headers: Record<string, string> = {}): Request => ({ method: "POST", url, payload: body.payload, headers: { ...body.headers, ...headers } });

const ok = (name: string, request: Request, mediaType = JSON_TYPE, extra: Partial<Exchange> = {}): Exchange => ({ name, request, status: 200, mediaType, ...extra });
const problem = (name: string, request: Request, status: number, extra: Partial<Exchange> = {}): Exchange => ({ name, request, status, mediaType: PROBLEM_MEDIA_TYPE, ...extra });

/** Marram Bank 7, a fictional well of our own: a null DTC, a mispicked shear (DTS/DTC below sqrt 2), a fast streak. */
const MARRAM_LAS = marramBankLas(
  { start: "1820.0", stop: "1820.4572", step: "0.1524" },
  "1820.0000 88.4 161.2 2.43",
  "1820.1524 -999.25 158.0 2.47",
  "1820.3048 71.9 190.5 2.58",
  "1820.4572 95.0 120.0 2.40",
);
const MARRAM_CSV = "DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]\r\n1820.0,88.4,161.2,2.43\r\n1820.1524,,158.0,2.47\r\n1820.3048,71.9,190.5,2.58\r\n";
const MARRAM_ZONES = [
  { name: "Marram Sand", top: 1820.0, base: 1820.2 },
  { name: "Marram Shale", top: 1820.2, base: 1821.0, correlations: ["static_e.lacy1997_shale", "ucs.horsrud2001"] },
];

/** The README's columns. */
const COLUMNS = { depth: [2310.0, 2310.1524, 2310.3048], dtc: [88.4, -999.25, 71.9], dts: [161.2, 158.0, 190.5], rho: [2.43, 2.47, 2.58] };

/** Marram Bank 7 over a longer interval: nulls, mispicks and a washout, so that flags, zones and estimates vary. */
const longMarramRows = (count: number) =>
  Array.from({ length: count }, (_, i) => {
    const dtc = i % 97 === 0 ? -999.25 : 70 + ((i * 37) % 50);
    const dts = i % 89 === 0 ? dtc * 1.3 : dtc * (1.6 + ((i * 13) % 40) / 100);
    const rho = i % 211 === 0 ? 1.6 : 2.2 + ((i * 7) % 45) / 100;
    return { depth: 1500 + i * 0.1524, dtc, dts: Math.round(dts * 10) / 10, rho: Math.round(rho * 1000) / 1000 };
  });

/** Over 64 KiB of JSON: parsed, computed and written on a worker thread (server/answer-pool.ts). */
const LARGE_COLUMNS = (() => {
  const rows = longMarramRows(4000);
  return {
    depth: rows.map((row) => Math.round(row.depth * 1e4) / 1e4),
    dtc: rows.map((row) => row.dtc),
    dts: rows.map((row) => row.dts),
    rho: rows.map((row) => row.rho),
    correlations: ["static_e.lacy1997", "ucs.mcnally1987", "brittleness.rickman2008"],
    zones: [
      { name: "Marram Sand", top: 1500, base: 1700 },
      { name: "Marram Shale", top: 1700, base: 2200, correlations: ["static_e.ohen2003", "ucs.horsrud2001_modulus"] },
    ],
  };
})();

/** Over 1 MiB of LAS with a JSON answer: converted on a worker thread (server/logs-task.ts). */
const LARGE_LAS = (() => {
  const rows = longMarramRows(42_000);
  return marramBankLas(
    { start: rows[0].depth.toFixed(4), stop: rows[rows.length - 1].depth.toFixed(4), step: "0.1524" },
    ...rows.map((row) => `${row.depth.toFixed(4)} ${row.dtc} ${row.dts} ${row.rho}`),
  );
})();

const ARROW_BODY = Buffer.from(
  tableToIPC(tableFromArrays({ dtc: Float64Array.from([92.5, 90.1, 88.1]), dts: Float64Array.from([166.0, 170.2, 150.0]), rho: Float64Array.from([2.41, 2.43, 2.45]) }), "stream"),
);

const CSV_FIXTURES = readdirSync(new URL("../fixtures/csv/", import.meta.url)).sort();
const LAS_FIXTURES = readdirSync(new URL("../fixtures/las/", import.meta.url)).filter((name) => name.endsWith(".las")).sort();
/** Reader fixtures with a depth and a gamma-ray curve only: no sonic to convert, so a 422 that says so. */
const LAS_FIXTURES_WITHOUT_SONIC = new Set(["irregular-step.las", "replacement-character.las", "step-mismatch.las"]);

const KEY = { authorization: "Bearer marram-key" };
const POINT = "/v1/elastic?vp=3200&vs=1800&rho=2.45";

const CORPUS: Exchange[] = [
  // GET /v1/elastic, the README's examples first
  ok("README: one sample from slownesses", get("/v1/elastic?dtc=95.2&dts=170.4&rho=2.45")),
  ok("README: velocities in km/s, moduli in Mpsi", get("/v1/elastic?vp=3.2&vs=1.8&rho=2.45&velocity_unit=km/s&modulus_unit=Mpsi")),
  ok("README: a mispicked shear arrival", get("/v1/elastic?dtc=95&dts=120&rho=2.4")),
  ok("README: keep_negative_poisson=true", get("/v1/elastic?dtc=95&dts=120&rho=2.4&keep_negative_poisson=true")),
  ok("README: static modulus and strength", get("/v1/elastic?dtc=92&dts=165&rho=2.38&correlations=static_e.lacy1997_sandstone,ucs.mcnally1987")),
  ok("Vs not below Vp", get("/v1/elastic?vp=3000&vs=3100&rho=2.4")),
  ok("a negative bulk modulus", get("/v1/elastic?vp=3000&vs=2700&rho=2.4")),
  ok("the null value, density out of range", get("/v1/elastic?vp=-999.25&vs=1500&rho=3.4")),
  ok("a density no rock has (density_impossible)", get("/v1/elastic?vp=3200&vs=1800&rho=1e300")),
  ok("a velocity whose square is beyond a double (not_finite)", get("/v1/elastic?vp=1e160&vs=5e159&rho=2.45")),
  ok("a negative slowness (non_positive)", get("/v1/elastic?dtc=-95&dts=170&rho=2.45")),
  ok("every range flag under overridden limits", get(`${POINT}&vp_max_m_s=3000&vs_min_m_s=1900&rho_min_g_cm3=2.5&vp_vs_max=1.5`)),
  ok("us/m, kg/m3, psi, kg/m2/s, null_value", get("/v1/elastic?dtc=312&dts=558&rho=2450&slowness_unit=us/m&density_unit=kg/m3&modulus_unit=psi&impedance_unit=kg/m2/s&null_value=-9999")),
  ok("ft/s, MPa, ft/s*g/cm3", get("/v1/elastic?vp=10500&vs=5900&rho=2.45&velocity_unit=ft/s&modulus_unit=MPa&impedance_unit=ft/s*g/cm3")),
  ok("Pa", get(`${POINT}&modulus_unit=Pa`)),
  ok("vs_from, a static modulus and brittleness", get("/v1/elastic?dtc=95&rho=2.45&vs_from=vs.castagna1985&correlations=static_e.lacy1997,brittleness.rickman2008")),
  ok("rho_from with fill=all, strength and friction angle", get("/v1/elastic?dtc=95&dts=170&rho=2.3&rho_from=density.gardner1974&fill=all&correlations=ucs.horsrud2001,friction_angle.lal1999")),
  ok("outside a correlation's calibration range", get("/v1/elastic?dtc=40&dts=70&rho=2.7&correlations=ucs.mcnally1987,static_e.eissa1988_density")),
  ok("an invalid sample with correlations", get("/v1/elastic?dtc=95&dts=120&rho=2.4&correlations=static_e.lacy1997_sandstone,ucs.bradford1998")),
  ok("the right API key", get(POINT, KEY), JSON_TYPE, { config: { apiKeys: ["marram-key"] } }),
  problem("README: a mistake (no vs)", get("/v1/elastic?vp=3200&rho=2.45"), 400),
  problem("an unknown unit", get(`${POINT}&velocity_unit=mph`), 400),
  problem("an unknown parameter", get(`${POINT}&colour=red`), 400),
  problem("a parameter given twice", get(`${POINT}&vp=3100`), 400),
  problem("reversed limits", get(`${POINT}&vp_min_m_s=8000`), 400),
  problem("an empty correlation list", get(`${POINT}&correlations=`), 400),
  problem("an unknown correlation id", get(`${POINT}&correlations=ucs.nobody2030`), 400),
  problem("a hexadecimal number", get("/v1/elastic?vp=0x10&vs=1800&rho=2.45"), 400),
  problem("fill without vs_from or rho_from", get(`${POINT}&fill=all`), 400),
  problem("a body on GET", { ...get(POINT), payload: "vp=3200", headers: { "content-type": "text/plain" } }, 400),
  problem("Accept: text/csv", get(POINT, { accept: "text/csv" }), 406),
  problem("a Content-Encoding", get(POINT, { "content-encoding": "gzip" }), 415),
  problem("no API key", get(POINT), 401, { config: { apiKeys: ["marram-key"] } }),
  problem("a wrong API key", get(POINT, { authorization: "Bearer nope" }), 401, { config: { apiKeys: ["marram-key"] } }),
  problem("over the rate limit", get(POINT), 429, { config: { rateLimitMax: 1 }, before: [get(POINT)] }),

  // POST /v1/elastic
  ok("README: columns with a null", post("/v1/elastic", json(COLUMNS))),
  ok("README: vs_from fills row 1", post("/v1/elastic", json({ depth: [2310.0, 2310.1524, 2310.3048], dtc: [88.4, 90.1, 91.7], dts: [161.2, null, 166.0], rho: [2.43, 2.41, 2.4], vs_from: "vs.castagna1985" }))),
  ok(
    "units, depth in ft, limits, keep_negative_poisson",
    post(
      "/v1/elastic",
      json({
        depth: [7550, 7550.5, 7551],
        vp: [3.2, 3.0, 3.3],
        vs: [1.8, 2.5, 3.4],
        rho: [2450, 2300, 2600],
        units: { velocity: "km/s", density: "kg/m3", modulus: "Mpsi", impedance: "kg/m2/s", depth: "ft" },
        keep_negative_poisson: true,
        limits: { vp_min_m_s: 1500, vp_max_m_s: 3100, rho_max_g_cm3: 2.5, vp_vs_max: 1.7 },
      }),
    ),
  ),
  ok("us/m, MPa, a null_value of its own", post("/v1/elastic", json({ dtc: [312, -1, 290], dts: [558, 540, -1], rho: [2.45, 2.5, 2.4], units: { slowness: "us/m", modulus: "MPa" }, null_value: -1 }))),
  ok("intervals (top and base) with a zone", post("/v1/elastic", json({ top: [1820, 1820.5, 1821], base: [1820.5, 1821, 1821.5], dtc: [88.4, 90.1, 91.7], dts: [161.2, 163, 166.0], rho: [2.43, 2.41, 2.4], zones: [{ name: "Marram Sand", top: 1820, base: 1822 }] }))),
  ok(
    "zones with their own correlations, a zone without samples, correlation_options",
    post(
      "/v1/elastic",
      json({
        ...COLUMNS,
        depth: [1820.0, 1820.1524, 1820.3048],
        correlations: ["static_e.lacy1997", "brittleness.rickman2008"],
        correlation_options: { "brittleness.rickman2008": { e_min_mpsi: 1, e_max_mpsi: 8, nu_min: 0.15, nu_max: 0.4 } },
        zones: [...MARRAM_ZONES, { name: "Below the log", top: 4000, base: 4100 }],
      }),
    ),
  ),
  ok("rho_from with fill=all", post("/v1/elastic", json({ dtc: [95, 90], dts: [170, 160], rho: [null, 2.4], rho_from: "density.gardner1974", fill: "all" }))),
  ok("every sample invalid", post("/v1/elastic", json({ vp: [null, 3000], vs: [1500, 3100], rho: [2.4, 2.4] }))),
  ok("no samples", post("/v1/elastic", json({ vp: [], vs: [], rho: [] }))),
  ok("4,000 samples with zones and estimates, on a worker thread", post("/v1/elastic", json(LARGE_COLUMNS))),
  ok("an Arrow body, a JSON answer", post("/v1/elastic?modulus_unit=GPa&vp_max_m_s=3400", raw(ARROW_BODY, ARROW_TYPE))),
  ok("README: an Arrow body, an Arrow answer", post("/v1/elastic?modulus_unit=GPa", raw(ARROW_BODY, ARROW_TYPE), { accept: ARROW_TYPE }), ARROW_TYPE),
  ok("a JSON body, an Arrow answer", post("/v1/elastic", json(COLUMNS), { accept: ARROW_TYPE }), ARROW_TYPE),
  problem("no rho", post("/v1/elastic", json({ vp: [3000], vs: [1500] })), 400),
  problem("an unknown field", post("/v1/elastic", json({ ...COLUMNS, colour: "red" })), 400),
  problem("a string in a column", post("/v1/elastic", json({ vp: [3000, "fast"], vs: [1500, 1500], rho: [2.4, 2.4] })), 400),
  problem("columns of different lengths", post("/v1/elastic", json({ vp: [3000, 3100], vs: [1500], rho: [2.4, 2.4] })), 400),
  problem("zones without depth", post("/v1/elastic", json({ vp: [3000], vs: [1500], rho: [2.4], zones: MARRAM_ZONES })), 400),
  problem("malformed JSON", post("/v1/elastic", raw('{"vp": [1, 2', JSON_TYPE)), 400),
  problem("a __proto__ key", post("/v1/elastic", raw('{"vp":[1],"vs":[1],"rho":[1],"__proto__":{"x":1}}', JSON_TYPE)), 400),
  problem("a name given twice", post("/v1/elastic", raw('{"vp":[3000],"vp":[3100],"vs":[1500],"rho":[2.4]}', JSON_TYPE)), 400),
  problem("a query string with a JSON body", post("/v1/elastic?modulus_unit=GPa", json(COLUMNS)), 400),
  problem("options of a correlation the request does not apply", post("/v1/elastic", json({ ...COLUMNS, correlation_options: { "brittleness.rickman2008": { e_min_mpsi: 1 } } })), 400),
  problem("an Arrow body with bytes after its end", post("/v1/elastic", raw(Buffer.concat([ARROW_BODY, Buffer.from("extra")]), ARROW_TYPE)), 400),
  problem("an Arrow body that is not Arrow", post("/v1/elastic", raw(Buffer.from("dtc,dts,rho\n95,170,2.4\n"), ARROW_TYPE)), 400),
  problem("an Arrow body with an option it does not take", post("/v1/elastic?correlations=ucs.mcnally1987", raw(ARROW_BODY, ARROW_TYPE)), 400),
  problem("Accept: text/csv", post("/v1/elastic", json(COLUMNS), { accept: "text/csv" }), 406),
  problem("a body over the byte limit", post("/v1/elastic", json(COLUMNS)), 413, { config: { jsonBodyLimitBytes: 64 } }),
  problem("more samples than MAX_SAMPLES", post("/v1/elastic", json(COLUMNS)), 413, { config: { maxSamples: 2 } }),
  problem("a text/plain body", post("/v1/elastic", raw("vp=1", "text/plain")), 415),
  problem("a gzip body", post("/v1/elastic", json(COLUMNS), { "content-encoding": "gzip" }), 415),

  // POST /v1/logs: the fixtures and the README's whole-well examples
  ...CSV_FIXTURES.map((name) => ok(`fixture csv/${name}`, post("/v1/logs", raw(fixture("csv", name), "text/csv")))),
  ...LAS_FIXTURES.map((name) =>
    LAS_FIXTURES_WITHOUT_SONIC.has(name)
      ? problem(`fixture las/${name}, which has no sonic`, post("/v1/logs", raw(fixture("las", name), "application/x-las")), 422)
      : ok(`fixture las/${name}, Vs and density predicted where absent`, post("/v1/logs?vs_from=vs.castagna1985&rho_from=density.gardner1974", raw(fixture("las", name), "application/x-las"))),
  ),
  ok("README: the demo well, as curl --data-binary sends it", post("/v1/logs", raw(example("demo-well.las"), "application/x-www-form-urlencoded"))),
  ok("README: the demo well with zones.json, multipart", post("/v1/logs", multipart([{ name: "file", filename: "demo-well.las", content: example("demo-well.las") }, { name: "zones", filename: "zones.json", content: example("zones.json") }]))),
  ok("README: zones in the query string", post("/v1/logs?zones=Linnet_Sand:1522.4:1561.8;Sorrel_Shale:1561.8:1640.3", raw(example("demo-well.csv"), "text/csv"))),
  ok("README: LAS out", post("/v1/logs?format=las", raw(example("demo-well.las"), "application/x-www-form-urlencoded")), "application/x-las"),
  ok("README: CSV out by Accept", post("/v1/logs", raw(example("demo-well.las"), "application/x-www-form-urlencoded"), { accept: "text/csv" }), "text/csv"),
  ok("README: NDJSON out", post("/v1/logs?format=ndjson", raw(example("demo-well.las"), "application/x-www-form-urlencoded")), "application/x-ndjson"),
  ok("a file over 1 MiB, on a worker thread", post("/v1/logs?correlations=static_e.lacy1997,ucs.mcnally1987&zones=Upper:1500:3000;Lower:3000:9000", raw(LARGE_LAS, "text/plain"))),
  ok("correlations, units and limits", post("/v1/logs?correlations=static_e.lacy1997_sandstone,ucs.mcnally1987&modulus_unit=Mpsi&impedance_unit=ft/s*g/cm3&velocity_unit=km/s&keep_negative_poisson=true&vp_max_m_s=4000", raw(MARRAM_LAS, "text/plain"))),
  ok("multipart with a zones part carrying correlations", post("/v1/logs", multipart([{ name: "file", filename: "marram-bank-7.csv", content: MARRAM_CSV }, { name: "zones", content: JSON.stringify(MARRAM_ZONES) }]))),
  ok("named curves and units", post("/v1/logs?vp_curve=DTC&vs_curve=DTS&rho_curve=RHOB&depth_curve=DEPT&vp_unit=us/ft&rho_unit=g/cm3&depth_unit=m", raw(MARRAM_CSV, "application/octet-stream"))),
  ok("a unit override that differs from the file's (a warning)", post("/v1/logs?vs_unit=us/m", raw(MARRAM_LAS, "text/plain"))),
  ok("no Content-Type", { method: "POST", url: "/v1/logs", payload: MARRAM_LAS }),
  ok("Windows-1252 declared", post("/v1/logs", raw(Buffer.from(MARRAM_CSV, "latin1"), "text/csv; charset=windows-1252"))),
  ok("CSV out, digits=exact", post("/v1/logs?format=csv&digits=exact", raw(MARRAM_CSV, "text/csv")), "text/csv"),
  ok("LAS out of a CSV file, digits=4", post("/v1/logs?format=las&digits=4", raw(MARRAM_CSV, "text/csv")), "application/x-las"),
  ok("NDJSON out by Accept, multipart", post("/v1/logs", multipart([{ name: "file", filename: "marram-bank-7.las", content: MARRAM_LAS }]), { accept: "application/x-ndjson" }), "application/x-ndjson"),
  ok("JSON by Accept quality values (RFC 9110 §12.5.1)", post("/v1/logs", raw(MARRAM_CSV, "text/csv"), { accept: "text/csv;q=0.5, application/json" })),
  ok("the right API key", post("/v1/logs", raw(MARRAM_CSV, "text/csv"), KEY), JSON_TYPE, { config: { apiKeys: ["marram-key"] } }),
  problem("an unknown format", post("/v1/logs?format=xml", raw(MARRAM_CSV, "text/csv")), 400),
  problem("an unknown parameter", post("/v1/logs?colour=red", raw(MARRAM_CSV, "text/csv")), 400),
  problem("digits with a JSON answer", post("/v1/logs?digits=4", raw(MARRAM_CSV, "text/csv")), 400),
  problem("an empty zone entry", post("/v1/logs?zones=a:1:2;;b:3:4", raw(MARRAM_CSV, "text/csv")), 400),
  problem("zones in the query and as a part", post("/v1/logs?zones=Marram:1820:1821", multipart([{ name: "file", filename: "marram-bank-7.csv", content: MARRAM_CSV }, { name: "zones", content: JSON.stringify(MARRAM_ZONES) }])), 400),
  problem("a zones part that is not JSON", post("/v1/logs", multipart([{ name: "file", filename: "marram-bank-7.csv", content: MARRAM_CSV }, { name: "zones", content: "[{" }])), 400),
  problem("fill without vs_from", post("/v1/logs?fill=all", raw(MARRAM_CSV, "text/csv")), 400),
  problem("Accept: image/png", post("/v1/logs", raw(MARRAM_CSV, "text/csv"), { accept: "image/png" }), 406),
  problem("a file over the byte limit", post("/v1/logs", raw(example("demo-well.las"), "text/plain")), 413, { config: { fileBodyLimitBytes: 1000 } }),
  problem("a file over the byte limit, CSV out", post("/v1/logs?format=csv", raw(example("demo-well.las"), "text/plain")), 413, { config: { fileBodyLimitBytes: 1000 } }),
  problem("more rows than MAX_SAMPLES", post("/v1/logs", raw(MARRAM_CSV, "text/csv")), 413, { config: { maxSamples: 2 } }),
  problem("a JSON body", post("/v1/logs", json({ a: 1 })), 415),
  problem("a charset not read here", post("/v1/logs", raw(MARRAM_CSV, "text/csv; charset=ebcdic")), 415),
  problem("no API key", post("/v1/logs", raw(MARRAM_CSV, "text/csv")), 401, { config: { apiKeys: ["marram-key"] } }),
  problem("a LAS 3.0 file", post("/v1/logs", raw("~VERSION\r\n VERS. 3.0 : CWLS LAS 3.0\r\n", "text/plain")), 422),
  problem("a ragged CSV row", post("/v1/logs", raw("DEPT,DTC,DTS,RHOB\n1,100,200,2.3\n2,100,200\n", "text/csv")), 422),
  problem("an empty body", post("/v1/logs", raw("", "text/plain")), 422),
  problem("an unknown unit", post("/v1/logs", raw("DEPT[m],DTC[usec/furlong],DTS[us/ft],RHOB[g/cm3]\n1,100,200,2.3\n", "text/csv")), 422),
  problem("no shear curve", post("/v1/logs", raw("DEPT[m],DTC[us/ft],RHOB[g/cm3]\n1,100,2.3\n", "text/csv")), 422),
  problem("a named curve that is absent, LAS out", post("/v1/logs?vp_curve=DT4P&format=las", raw(MARRAM_LAS, "text/plain")), 422),

  // GET /v1/correlations and /v1/correlations/{id}
  ok("the catalogue", get("/v1/correlations")),
  ok("filtered, in any case", get("/v1/correlations?kind=UCS&lithology=Shale")),
  ok("a filter that leaves nothing", get("/v1/correlations?kind=vs&lithology=hard_rock")),
  problem("an unknown kind", get("/v1/correlations?kind=porosity"), 400),
  problem("an unknown filter", get("/v1/correlations?author=lacy"), 400),
  problem("Accept: text/html", get("/v1/correlations", { accept: "text/html" }), 406),
  problem("a Content-Encoding", get("/v1/correlations", { "content-encoding": "br" }), 415),
  problem("no API key", get("/v1/correlations"), 401, { config: { apiKeys: ["marram-key"] } }),
  problem("an unknown id", get("/v1/correlations/ucs.nobody2030"), 404),
  problem("a query parameter", get("/v1/correlations/ucs.mcnally1987?lithology=shale"), 400),
  problem("Accept: text/csv", get("/v1/correlations/ucs.mcnally1987", { accept: "text/csv" }), 406),
  problem("a Content-Encoding", get("/v1/correlations/ucs.mcnally1987", { "content-encoding": "gzip" }), 415),

  // Probes, the contract, problem types, metrics
  ok("liveness", get("/livez")),
  ok("liveness with an API key required elsewhere", get("/livez"), JSON_TYPE, { config: { apiKeys: ["marram-key"] } }),
  ok("readiness", get("/readyz")),
  { name: "readiness while shutting down", request: get("/readyz"), status: 503, mediaType: JSON_TYPE, prepare: (app) => (app.shuttingDown = true) },
  problem("an unknown problem type", get("/problems/nonsense"), 404),
  problem("an inherited property name as a problem type", get("/problems/toString"), 404),
  ok("the contract as YAML", get("/openapi.yaml"), "application/yaml"),
  ok("the contract as JSON", get("/openapi.json"), JSON_TYPE),
  ok("metrics", get("/metrics"), "text/plain"),
  problem("metrics without the key METRICS_REQUIRE_AUTH asks for", get("/metrics"), 401, {
    config: { apiKeys: ["marram-key"], metricsRequireAuth: true },
  }),
  problem("a body on GET /livez", { ...get("/livez"), payload: "x", headers: { "content-type": "text/plain" } }, 400),
  problem("a Content-Encoding on GET /problems/{slug}", get("/problems/invalid-request", { "content-encoding": "gzip" }), 415),

  // Requests no operation takes
  problem("an unknown path", get("/v2/elastic"), 404, { noOperation: true }),
  problem("a trailing slash", get("/v1/elastic/?vp=3200&vs=1800&rho=2.45"), 404, { noOperation: true }),
  problem("bad percent-encoding in the path (RFC 3986 §2.1)", get("/v1/elastic%zz?vp=3200"), 400, { noOperation: true }),
  problem("DELETE /v1/elastic", { method: "DELETE", url: "/v1/elastic" }, 405, { noOperation: true }),
  problem("OPTIONS /v1/elastic without CORS", { method: "OPTIONS", url: "/v1/elastic" }, 405, { noOperation: true }),
  problem("PUT /v1/logs", { method: "PUT", url: "/v1/logs", payload: MARRAM_CSV, headers: { "content-type": "text/csv" } }, 405, { noOperation: true }),
  problem("POST /v1/correlations", { method: "POST", url: "/v1/correlations" }, 405, { noOperation: true }),
  problem("POST /livez", { method: "POST", url: "/livez" }, 405, { noOperation: true }),

  // Every correlation's own page, and every problem type's explanation
  ...[...readFileSync(new URL("../../README.md", import.meta.url), "utf8").matchAll(/^\| `([a-z_]+\.[a-z0-9_]+)` \|/gm)].map((match) =>
    ok(`the correlation ${match[1]}`, get(`/v1/correlations/${match[1]}`)),
  ),
  ...Object.keys(PROBLEM_KINDS).map((slug) => ok(`the problem type ${slug}`, get(`/problems/${slug}`))),
];

// ---------------------------------------------------------------------------------------------------------------
// The tests

const answers = new Map<Exchange, Promise<LightMyRequestResponse>>();
/** The answer to an exchange, asked once on a fresh app of its own and reused by every test that looks at it. */
const answerTo = (exchange: Exchange): Promise<LightMyRequestResponse> => {
  let answer = answers.get(exchange);
  if (answer === undefined) {
    answer = (async () => {
      const app = await build({ config: { workerThreads: 1, ...exchange.config } });
      for (const earlier of exchange.before ?? []) await app.inject(earlier);
      exchange.prepare?.(app);
      return app.inject(exchange.request);
    })();
    answers.set(exchange, answer);
  }
  return answer;
};

const pathOf = (url: string): string => url.split("?")[0];
const titleOf = (exchange: Exchange) => [`${exchange.request.method} ${exchange.request.url.length > 80 ? `${exchange.request.url.slice(0, 77)}...` : exchange.request.url}: ${exchange.name}`, exchange] as const;

describe("every answer is documented in openapi.yaml: status, media type, and body against its JSON Schema 2020-12 (OpenAPI 3.1.0 §4.8.16–17)", () => {
  it.each(CORPUS.map(titleOf))("%s", async (_title, exchange) => {
    const response = await answerTo(exchange);
    const contentType = response.headers["content-type"] as string | undefined;
    expect({ status: response.statusCode, mediaType: mediaTypeOf(contentType) }, response.body.slice(0, 300)).toEqual({ status: exchange.status, mediaType: exchange.mediaType });
    const { mismatches } = checkAnswer(
      { method: exchange.request.method, path: pathOf(exchange.request.url), noOperation: exchange.noOperation === true },
      { status: response.statusCode, contentType, body: response.body },
    );
    expect(mismatches).toEqual([]);
  });
});

describe("every problem answer has the members of RFC 9457 §3.1, the headers its status is documented with, and a type that explains it", () => {
  const requestUri = (exchange: Exchange) => `http://127.0.0.1:8080${exchange.request.url}`;
  it.each(CORPUS.filter((exchange) => exchange.mediaType === PROBLEM_MEDIA_TYPE).map(titleOf))("%s", async (_title, exchange) => {
    const response = await answerTo(exchange);
    const body = response.json() as Record<string, unknown>;
    expect(problemMemberMismatches(body, response.statusCode, requestUri(exchange))).toEqual([]);
    // components.responses lists the headers each status carries (RFC 9110 §10.2.1 Allow, §10.2.3 Retry-After; RFC 6750 §3 WWW-Authenticate).
    expect(problemHeaderMismatches(response.statusCode, response.headers)).toEqual([]);
    // RFC 9457 §3.1.1: dereferenced, the type URI documents the problem; §3.1.3: a type's title does not change
    // from occurrence to occurrence. A relative type resolves against the request URI.
    const app = await build({ config: { workerThreads: 1 } });
    const explanation = await app.inject({ url: new URL(body.type as string, requestUri(exchange)).pathname });
    expect(explanation.statusCode).toBe(200);
    expect(explanation.json()).toMatchObject({ type: body.type, title: body.title, status: body.status });
  });
});

describe("the corpus covers openapi.yaml", () => {
  /** Where each exchange's answer is documented, as checkAnswer looks it up. */
  const keys = new Set(
    CORPUS.map((exchange) => {
      const documented = documentedResponsesOf(exchange.request.method, pathOf(exchange.request.url), exchange.noOperation === true);
      return `${documented?.operation ?? "(undocumented)"} ${exchange.status}`;
    }),
  );

  it("asks every operation of every path (OpenAPI 3.1.0 §4.8.8 Paths Object, §4.8.9 Path Item Object)", () => {
    const operations = Object.entries(DOCUMENT.paths).flatMap(([template, item]) => Object.keys(item).map((method) => `${method.toUpperCase()} ${template}`));
    const asked = new Set([...keys].map((key) => key.replace(/ \d+$/, "")));
    expect(operations.filter((operation) => !asked.has(operation))).toEqual([]);
  });

  it("gets each operation's main answers and errors, and the problems of requests no operation takes", () => {
    const wanted = [
      ...[200, 400, 401, 406, 415, 429].map((status) => `GET /v1/elastic ${status}`),
      ...[200, 400, 406, 413, 415].map((status) => `POST /v1/elastic ${status}`),
      ...[200, 400, 401, 406, 413, 415, 422].map((status) => `POST /v1/logs ${status}`),
      ...[200, 400, 401, 406, 415].map((status) => `GET /v1/correlations ${status}`),
      ...[200, 400, 404, 406, 415].map((status) => `GET /v1/correlations/{id} ${status}`),
      ...["GET /livez 200", "GET /readyz 200", "GET /readyz 503", "GET /openapi.yaml 200", "GET /openapi.json 200", "GET /metrics 200"],
      ...["GET /problems/{slug} 200", "GET /problems/{slug} 404"],
      ...["(no operation) 400", "(no operation) 404", "(no operation) 405"],
    ];
    expect(wanted.filter((key) => !keys.has(key))).toEqual([]);
  });
});

describe("the checker", () => {
  it("reads schemas in the dialect of OpenAPI 3.1, JSON Schema 2020-12 (OpenAPI 3.1.0 §4.8.24, §4.8.1 jsonSchemaDialect)", () => {
    expect(DOCUMENT.openapi).toMatch(/^3\.1\./);
    expect(DOCUMENT.jsonSchemaDialect ?? "https://spec.openapis.org/oas/3.1/dialect/base").toBe("https://spec.openapis.org/oas/3.1/dialect/base");
  });

  it("finds a body that breaks its schema, a status and a media type the operation does not document", () => {
    const point = { status: 200, contentType: "application/json; charset=utf-8" };
    const getElastic = { method: "GET", path: "/v1/elastic", noOperation: false };
    expect(checkAnswer(getElastic, { ...point, body: JSON.stringify({ E: 1 }) }).mismatches.length).toBeGreaterThan(0);
    expect(checkAnswer(getElastic, { ...point, status: 422, body: "{}" }).mismatches).toEqual(["status 422 is not documented for GET /v1/elastic"]);
    expect(checkAnswer(getElastic, { ...point, contentType: "text/csv", body: "E\n1\n" }).mismatches).toEqual([
      "media type text/csv is not documented for GET /v1/elastic 200 (documented: application/json)",
    ]);
    expect(checkAnswer({ method: "PATCH", path: "/v1/elastic", noOperation: false }, { ...point, body: "{}" }).mismatches).toEqual(["no operation PATCH /v1/elastic in openapi.yaml"]);
  });
});
