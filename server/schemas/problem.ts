import { z } from "zod";
import { PROBLEM_KINDS, PROBLEM_MEDIA_TYPE, problemTypeUri, type ProblemSlug } from "../problems.js";

/** Every kind of problem, by status. */
const SLUGS = (Object.keys(PROBLEM_KINDS) as ProblemSlug[]).sort((a, b) => PROBLEM_KINDS[a].status - PROBLEM_KINDS[b].status);

/** Every problem type URI with its status and title, as a Markdown table for the document's readers. */
const typeTable = [
  "| type | status | title |",
  "| --- | --- | --- |",
  ...SLUGS.map((slug) => `| ${problemTypeUri(slug)} | ${PROBLEM_KINDS[slug].status} | ${PROBLEM_KINDS[slug].title} |`),
].join("\n");

export const problemSchema = z
  .object({
    type: z.enum(SLUGS.map(problemTypeUri)).meta({
      description: `URI of the kind of problem (relative: it resolves against the request URI, RFC 9457 §3.1.1); GET it for what it means and how to fix the request. Every type this service answers:\n\n${typeTable}`,
      examples: ["/problems/invalid-request"],
    }),
    title: z.string(),
    status: z.int(),
    detail: z.string().meta({ description: "What is wrong with this request and what to change." }),
    request_id: z.string().optional(),
    errors: z
      .array(
        z.object({
          field: z.string(),
          index: z.int().optional().meta({ description: "Row of a column, when one element is wrong." }),
          line: z.int().optional().meta({ description: "1-based line of an uploaded file, when the problem is on one line." }),
          message: z.string(),
        }),
      )
      .optional()
      .meta({ description: "One entry per bad field (and row, for a column element)." }),
  })
  .meta({ id: "Problem", description: "RFC 9457 problem details." });

type ProblemStatus = (typeof PROBLEM_KINDS)[ProblemSlug]["status"];

/** What each status means here; a kind of problem with a new status does not compile until it is described. */
const STATUS_MEANINGS: Record<ProblemStatus, string> = {
  400: "The request is not valid: the `errors` list names each bad field and row.",
  401: "An API key is required (only when the service runs with API_KEYS): send Authorization: Bearer <key>; WWW-Authenticate says why.",
  404: "No such path.",
  405: "The path does not take this method; the Allow header lists the methods it takes.",
  406: "None of the media types in Accept can be produced.",
  408: "The request line, headers or body did not arrive in time; the connection is closed.",
  413: "The body, or the number of samples, is over the limit.",
  415: "The body's content type, or a content coding named in Content-Encoding, is not accepted here.",
  422: "The file cannot be read (the line is named) or its curves cannot be used as asked.",
  429: "Too many requests from this client in the window (only when the service runs with RATE_LIMIT_MAX); wait the seconds in Retry-After.",
  431: "The request headers are too large.",
  500: "A fault of the service (never caused by input); quote request_id when reporting it.",
  503: "The service is overloaded or shutting down; retry after the seconds in Retry-After.",
};

const describeStatus = (status: ProblemStatus): string => {
  const types = SLUGS.filter((slug) => PROBLEM_KINDS[slug].status === status).map((slug) => `\`${problemTypeUri(slug)}\``);
  return `${STATUS_MEANINGS[status]} Problem type${types.length > 1 ? "s" : ""}: ${types.join(", ")}.`;
};

/** The problem response of one status, with the problem types that carry it. */
export const problemResponse = (status: ProblemStatus) => ({
  description: describeStatus(status),
  content: { [PROBLEM_MEDIA_TYPE]: { schema: problemSchema } },
});

/**
 * The error answers any `/v1/` request may get, whatever it asks: refused (a Content-Encoding this service does not
 * decode is a 415 on every path, plugins/body-framing.ts), late, too large in its headers, or a fault.
 */
export const requestProblemResponses = {
  401: problemResponse(401),
  408: problemResponse(408),
  415: problemResponse(415),
  429: problemResponse(429),
  431: problemResponse(431),
  500: problemResponse(500),
  503: problemResponse(503),
} as const;

/**
 * The error answers a request outside `/v1/` may get (probes, metrics, the contract, problem types): a body
 * where none is read (400) or a Content-Encoding (415, both plugins/body-framing.ts), late (408), too large in
 * its headers (431), or a fault (500).
 */
export const pathProblemResponses = {
  400: problemResponse(400),
  408: problemResponse(408),
  415: problemResponse(415),
  431: problemResponse(431),
  500: problemResponse(500),
} as const;

/** The error answers of a `/v1/` operation that takes data: those of any request, and those of its query or body. */
export const commonProblemResponses = {
  400: problemResponse(400),
  406: problemResponse(406),
  413: problemResponse(413),
  ...requestProblemResponses,
} as const;

const header = (description: string, schema: object) => ({ description, schema });
// A function, not a shared object: the YAML writer would turn a shared object into an anchor and an alias.
const retryAfter = () => header("Seconds to wait before sending the request again (RFC 9110 §10.2.3).", { type: "integer", minimum: 1 });

/** Headers a problem of each status carries, for `components.responses` (the zod transform keeps none on routes). */
const STATUS_HEADERS: Partial<Record<ProblemStatus, Record<string, ReturnType<typeof header>>>> = {
  401: { "WWW-Authenticate": header('The Bearer challenge, with error="invalid_token" for a wrong key (RFC 6750 §3).', { type: "string" }) },
  405: { Allow: header("The methods this path takes (RFC 9110 §10.2.1).", { type: "string" }) },
  429: {
    "Retry-After": retryAfter(),
    "x-ratelimit-limit": header("Requests a client may send per window.", { type: "integer", minimum: 1 }),
    "x-ratelimit-remaining": header("Requests left in the current window (0 here).", { type: "integer", minimum: 0 }),
    "x-ratelimit-reset": header("Seconds until the current window ends.", { type: "integer", minimum: 0 }),
  },
  503: { "Retry-After": retryAfter() },
};

/**
 * `components.responses` of the OpenAPI document: one problem response per status any request may get,
 * including those that belong to no operation (405 for a method a path does not take) — generated from
 * PROBLEM_KINDS, so the document lists every problem type. `schemaRef` points at the Problem schema.
 */
export const problemResponseComponents = (schemaRef: string) =>
  Object.fromEntries(
    [...new Set(SLUGS.map((slug) => PROBLEM_KINDS[slug].status))].map((status) => [
      `Problem${status}`,
      {
        description: describeStatus(status),
        ...(STATUS_HEADERS[status] && { headers: STATUS_HEADERS[status] }),
        content: { [PROBLEM_MEDIA_TYPE]: { schema: { $ref: schemaRef } } },
      },
    ]),
  );
