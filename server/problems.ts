/**
 * Every error answer is an RFC 9457 problem document (application/problem+json).
 * Each kind of problem has a stable `type` URI: a path on this service, where
 * `GET /problems/{slug}` explains it (RFC 9457 §3.1.1: a relative URI resolves against the request URI).
 */
export const PROBLEM_MEDIA_TYPE = "application/problem+json";

export const PROBLEM_KINDS = {
  "invalid-request": { status: 400, title: "The request is not valid", fix: "Correct the fields listed in `errors` and send the request again." },
  "malformed-body": { status: 400, title: "The body could not be parsed", fix: "Send well-formed JSON (RFC 8259) with Content-Type application/json." },
  "forbidden-key": {
    status: 400,
    title: "The body contains a forbidden key",
    fix: "Remove keys named __proto__ or constructor from the JSON body; they are refused to protect the service.",
  },
  unauthorized: {
    status: 401,
    title: "Authentication is required",
    fix: "Send a valid API key in the header `Authorization: Bearer <key>`; the operator of this service issues the keys.",
  },
  "not-acceptable": {
    status: 406,
    title: "None of the accepted media types can be produced",
    fix: "Ask for application/json, text/csv or application/x-las in Accept, or use the format query parameter.",
  },
  "not-found": { status: 404, title: "No such resource", fix: "Check the path against /openapi.yaml or /docs." },
  "method-not-allowed": { status: 405, title: "Method not allowed on this path", fix: "Use one of the methods listed in the Allow header." },
  "request-timeout": {
    status: 408,
    title: "The request did not arrive in time",
    fix: "Send the request line, headers and body without pauses; the limits are HEADERS_TIMEOUT_MS and REQUEST_TIMEOUT_MS (see README).",
  },
  "body-too-large": { status: 413, title: "The body is too large", fix: "Send fewer samples per request, or raise the service's body limit (see README, Limits)." },
  "too-many-samples": { status: 413, title: "Too many samples in one request", fix: "Split the well into requests of at most the stated number of samples." },
  "unsupported-media-type": { status: 415, title: "Unsupported content type", fix: "Send the body with one of the content types this endpoint accepts (see /openapi.yaml)." },
  "header-too-large": {
    status: 431,
    title: "The request headers are too large",
    fix: "Send shorter headers (a long query string belongs in a POST body).",
  },
  "unreadable-file": {
    status: 422,
    title: "The well file cannot be read",
    fix: "Correct the file at the line named in the detail (LAS 2.0 of the CWLS, or RFC 4180 CSV with a header row).",
  },
  "unusable-file": {
    status: 422,
    title: "The well file cannot be used as asked",
    fix: "Name the curves with vp_curve, vs_curve, rho_curve, depth_curve, or their units with vp_unit, vs_unit, rho_unit, depth_unit.",
  },
  "rate-limited": {
    status: 429,
    title: "Too many requests from this client",
    fix: "Wait the number of seconds in the Retry-After header before sending the next request; x-ratelimit-limit and x-ratelimit-reset tell the allowance per window.",
  },
  overloaded: {
    status: 503,
    title: "The service is overloaded",
    fix: "Wait the number of seconds in the Retry-After header, then send the request again; fewer samples per request help.",
  },
  "internal-error": { status: 500, title: "Internal error", fix: "This is a fault of the service, not of your request: report it with the request_id." },
} as const;

export type ProblemSlug = keyof typeof PROBLEM_KINDS;

export const problemTypeUri = (slug: ProblemSlug): string => `/problems/${slug}`;

export interface ProblemFieldError {
  /** Dotted path of the field in the request (`body.vp`, `query.modulus_unit`). */
  field: string;
  /** Row of a column, when one element is wrong. */
  index?: number;
  /** 1-based line of an uploaded file, when the problem is on one line. */
  line?: number;
  message: string;
}

export interface ProblemDocument {
  type: string;
  title: string;
  status: number;
  detail: string;
  request_id?: string;
  errors?: ProblemFieldError[];
}

/** An error a route throws on purpose; the error handler turns it into a problem document. */
export class ProblemError extends Error {
  constructor(
    readonly slug: ProblemSlug,
    readonly detail: string,
    readonly errors?: ProblemFieldError[],
    readonly headers: Record<string, string> = {},
  ) {
    super(detail);
    this.name = "ProblemError";
  }

  get statusCode(): number {
    return PROBLEM_KINDS[this.slug].status;
  }
}

export const isProblemError = (error: unknown): error is ProblemError => error instanceof ProblemError;

export const problemDocument = (
  slug: ProblemSlug,
  detail: string,
  extra: { requestId?: string; errors?: ProblemFieldError[] } = {},
): ProblemDocument => {
  const kind = PROBLEM_KINDS[slug];
  return {
    type: problemTypeUri(slug),
    title: kind.title,
    status: kind.status,
    detail,
    ...(extra.requestId === undefined ? {} : { request_id: extra.requestId }),
    ...(extra.errors === undefined ? {} : { errors: extra.errors }),
  };
};

/**
 * A field's path as a request author writes it, the same wherever it was checked: names joined by dots, array
 * positions in brackets (`body.zones[0].name`, `body.correlation_options.brittleness.rickman2008.e_min_mpsi`).
 */
export const fieldPath = (segments: readonly PropertyKey[]): string =>
  segments
    .map((segment, i) => (typeof segment === "number" || /^\d+$/.test(String(segment)) ? `[${String(segment)}]` : `${i === 0 ? "" : "."}${String(segment)}`))
    .join("");

/** The 400 problem for a list of bad fields, worded the same wherever the fields were checked. */
export const invalidFields = (errors: ProblemFieldError[]): ProblemError =>
  new ProblemError(
    "invalid-request",
    `The request has ${errors.length} invalid field${errors.length === 1 ? "" : "s"}: ${errors.map((e) => `${e.field} (${e.message})`).join("; ")}.`,
    errors,
  );

/** The 400 problem for data that core refused (`InputIssues`), with each field under `prefix` (`body`, `query`). */
export const unusableData = (message: string, issues: readonly { field: string; index?: number; message: string }[], prefix: string): ProblemError =>
  new ProblemError(
    "invalid-request",
    `The request's data cannot be used: ${message}.`,
    issues.map((issue) => ({ ...issue, field: issue.field === prefix ? prefix : `${prefix}.${issue.field}` })),
  );

export const UNKNOWN_FIELD_MESSAGE = "unknown field; see /openapi.yaml for the accepted fields (names are lower case)";

/** The 422 problem for a well file a reader refused (`WellFileError`), with the line where there is one, and any hint on the likely cause. */
export const unreadableFile = (error: { code: string; message: string; line?: number }, hint?: string): ProblemError =>
  new ProblemError("unreadable-file", `The well file cannot be read: ${error.message}.${hint === undefined ? "" : ` ${hint}`}`, [
    { field: "body", ...(error.line === undefined ? {} : { line: error.line }), message: `${error.code}: ${error.message}` },
  ]);
