import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from "fastify";
import { hasZodFastifySchemaValidationErrors } from "fastify-type-provider-zod";
import { isInputIssues } from "../../core/index.js";
import {
  PROBLEM_MEDIA_TYPE,
  UNKNOWN_FIELD_MESSAGE,
  fieldPath,
  invalidFields,
  isProblemError,
  unusableData,
  problemDocument,
  type ProblemFieldError,
  type ProblemSlug,
} from "../problems.js";

const send = (
  reply: FastifyReply,
  slug: ProblemSlug,
  detail: string,
  errors?: ProblemFieldError[],
  headers: Record<string, string> = {},
) => {
  const body = problemDocument(slug, detail, { requestId: reply.request.id, errors });
  return reply.code(body.status).headers(headers).type(PROBLEM_MEDIA_TYPE).send(body);
};

/** The detail of every 404 this app writes itself: what was asked for, and where the endpoints are listed. */
const notFoundDetail = (method: string, path: string, why = ""): string => `There is no ${method} ${path}${why}. The endpoints are listed at /docs and /openapi.yaml.`;

const CONTEXT_NAMES: Record<string, string> = { querystring: "query", body: "body", params: "path", headers: "header" };

/** A query parameter sent more than once arrives as an array; whatever its schema says, that is what to fix. */
const repeatedParameterMessage = (query: unknown, name: string | undefined): string | undefined => {
  const value = name === undefined ? undefined : (query as Record<string, unknown> | undefined)?.[name];
  return Array.isArray(value) ? `is given ${value.length} times (${value.map((v) => JSON.stringify(v)).join(", ")}): give it once` : undefined;
};

/** Zod issues, as Fastify hands them over, in the request's own field names. */
const validationErrors = (error: FastifyError, request: FastifyRequest): ProblemFieldError[] => {
  const context = CONTEXT_NAMES[error.validationContext ?? "body"] ?? "body";
  return (error.validation ?? []).flatMap((issue) => {
    // JSON Pointer segments (RFC 6901 §4: ~1 is "/", ~0 is "~").
    const names = issue.instancePath.split("/").filter(Boolean).map((name) => name.replaceAll("~1", "/").replaceAll("~0", "~"));
    const path = [context, ...names];
    const keys = (issue.params as { keys?: string[] }).keys;
    const repeated = context === "query" && names.length === 1 ? repeatedParameterMessage(request.query, names[0]) : undefined;
    return keys === undefined
      ? [{ field: fieldPath(path), message: repeated ?? issue.message ?? "is not valid" }]
      : keys.map((key) => ({ field: fieldPath([...path, key]), message: UNKNOWN_FIELD_MESSAGE }));
  });
};

/** Fastify's own error codes that are a client's fault, and how to word them. */
const FASTIFY_CODES: Record<string, ProblemSlug> = {
  FST_ERR_CTP_BODY_TOO_LARGE: "body-too-large",
  FST_ERR_CTP_INVALID_MEDIA_TYPE: "unsupported-media-type",
  FST_ERR_CTP_INVALID_CONTENT_LENGTH: "malformed-body",
  FST_REQ_FILE_TOO_LARGE: "body-too-large",
  FST_FILES_LIMIT: "invalid-request",
  FST_PARTS_LIMIT: "invalid-request",
  FST_FIELDS_LIMIT: "invalid-request",
  FST_INVALID_MULTIPART_CONTENT_TYPE: "malformed-body",
};

/** Clearer words for @fastify/multipart's limits than its own terse messages. */
const MULTIPART_DETAILS: Record<string, string> = {
  FST_FILES_LIMIT: "The upload has too many file parts: send one well file (and optionally a zones part).",
  FST_PARTS_LIMIT: "The upload has too many parts: send one well file and optionally a zones part.",
  FST_FIELDS_LIMIT: "The upload has too many form fields: send one well file and optionally a zones part.",
};

/**
 * One error handler and one not-found handler for the whole app: every failure becomes an RFC 9457
 * problem document, and nothing internal (stack, file paths) is ever sent.
 */
export const installProblemHandlers = (
  app: FastifyInstance,
  limits: { bodyLimitBytes: number },
  methodsOf: (path: string) => string[] = () => [],
): void => {
  app.setErrorHandler((error: FastifyError, request: FastifyRequest, reply: FastifyReply) => {
    if (isProblemError(error)) return send(reply, error.slug, error.detail, error.errors, error.headers);
    if (hasZodFastifySchemaValidationErrors(error)) {
      const problem = invalidFields(validationErrors(error, request));
      return send(reply, problem.slug, problem.detail, problem.errors);
    }
    if (error.code === "ECONNRESET" || request.raw.aborted || request.raw.socket?.destroyed) {
      // The client went away mid-request (an aborted upload): nothing failed here and nobody is left to answer.
      request.log.info({ code: error.code }, "client closed the connection before the answer");
      return reply;
    }
    if (isInputIssues(error)) {
      const problem = unusableData(error.message, error.issues, "body");
      return send(reply, problem.slug, problem.detail, problem.errors);
    }
    const slug = error.code === undefined ? undefined : FASTIFY_CODES[error.code];
    if (slug === "unsupported-media-type") {
      const given = request.headers["content-type"] ?? "none";
      const accepted = (request.routeOptions.config as { accepts?: readonly string[] } | undefined)?.accepts;
      return send(
        reply,
        slug,
        `${request.method} ${request.routeOptions.url ?? request.url} does not accept the content type "${given}"; send ${accepted?.join(", ") ?? "one of the types listed in /openapi.yaml"}.`,
      );
    }
    if (slug === "body-too-large") {
      return send(reply, slug, `The body is larger than this endpoint's limit of ${limits.bodyLimitBytes} bytes. Send fewer samples per request, or ask the operator to raise JSON_BODY_LIMIT_BYTES.`);
    }
    if (slug !== undefined) return send(reply, slug, MULTIPART_DETAILS[error.code] ?? error.message);
    if (error.statusCode === 403 || error.statusCode === 404) {
      // The static files of /docs refuse a path that climbs out of their folder (403): there is nothing there to name.
      return send(reply, "not-found", notFoundDetail(request.method, request.url.split("?")[0]));
    }
    if (error.statusCode !== undefined && error.statusCode >= 400 && error.statusCode < 500) {
      request.log.info({ err: error }, "client error without a dedicated problem type");
      return send(reply, "invalid-request", error.message);
    }
    request.log.error({ err: error }, "unhandled error");
    return send(reply, "internal-error", `The service failed to answer this request; quote request_id ${request.id} when reporting it.`);
  });

  app.setNotFoundHandler((request, reply) => {
    const path = request.url.split("?")[0];
    const allowed = methodsOf(path);
    // A route that takes this method but found nothing (a missing file under /docs/static/*) is a 404, not a 405.
    if (allowed.length > 0 && !allowed.includes(request.method)) {
      return send(reply, "method-not-allowed", `${path} does not take ${request.method}; it takes ${allowed.join(", ")}.`, undefined, {
        allow: allowed.join(", "),
      });
    }
    return send(reply, "not-found", notFoundDetail(request.method, path));
  });
};

/**
 * Fastify's `frameworkErrors`: what its router meets before any hook runs, answered as problems like everything
 * else (its default is a JSON body of its own). A path that is not valid percent-encoding (RFC 3986 §2.1: `%`
 * and two hexadecimal digits, the bytes UTF-8) is the client's to fix; an over-long path parameter names nothing here.
 */
export const answerFrameworkError = (error: FastifyError, request: FastifyRequest, reply: FastifyReply) => {
  const path = request.url.split("?")[0];
  if (error.code === "FST_ERR_MAX_PARAM_LENGTH") {
    return send(reply, "not-found", notFoundDetail(request.method, path, ": a path segment is longer than any name here"));
  }
  return send(
    reply,
    "invalid-request",
    `The path ${JSON.stringify(path)} is not valid percent-encoding: each % must be followed by two hexadecimal digits, and the bytes must be UTF-8 (RFC 3986 §2.1); write a literal % as %25.`,
    [{ field: "path", message: "is not valid percent-encoding (RFC 3986 §2.1)" }],
  );
};
