import { Readable } from "node:stream";
import type { FastifyInstance } from "fastify";
import { z } from "zod";
import { validatorCompiler, type ZodTypeProvider } from "fastify-type-provider-zod";
import { computeElasticLog, summariseFlags } from "../../core/index.js";
import { derivedPointAnswer, empiricalParts, gapFillAnswer } from "../derived-answer.js";
import { deriveProperties } from "../derived-request.js";
import { pointAnswer } from "../elastic-answer.js";
import { pointRequest } from "../elastic-request.js";
import { installRawBodyParser } from "../plugins/json-body.js";
import { sendAnswer, socketSized } from "../answer-pool.js";
import { ARROW_STREAM_MEDIA_TYPE } from "../arrow-codec.js";
import { prepareColumnsAnswer, type ColumnsBody } from "../elastic-columns.js";
import { negotiateMediaType, requireJsonAnswer } from "../media-negotiation.js";
import { ProblemError } from "../problems.js";
import {
  JSON_BODY_ONLY_FIELDS,
  elasticArrowQuery,
  elasticColumnsBody,
  elasticColumnsResponse,
  elasticPointQuery,
  elasticPointResponse,
} from "../schemas/elastic.js";
import { correlationIdsOf } from "../schemas/correlations.js";
import { commonProblemResponses } from "../schemas/problem.js";

export interface ElasticRouteOptions {
  maxSamples: number;
}

/** Bodies up to this size (about 1,500 samples) are parsed and computed on the event loop; larger ones on a worker. */
const INLINE_BODY_BYTES = 64 * 1024;
const JSON_MEDIA_TYPE = "application/json";

const DESCRIPTION = [
  "Dynamic elastic properties from sonic velocities or slownesses and bulk density, with exact isotropic relations",
  "(G = rho*Vs^2, M = rho*Vp^2, lambda = M - 2G, K = M - 4G/3, nu = (Vp^2 - 2Vs^2)/(2(Vp^2 - Vs^2)), E = 2G(1 + nu)).",
  "Every sample is screened: impossible inputs are flagged invalid and get null moduli; implausible ones are flagged suspect.",
  "These are dynamic (log-derived) values: estimates, to be calibrated against core tests before engineering use.",
].join(" ");

/** Whether a POST body is an Arrow IPC stream (its options then come from the query string). */
const isArrowBody = (headers: { "content-type"?: string }): boolean =>
  headers["content-type"]?.toLowerCase().startsWith(ARROW_STREAM_MEDIA_TYPE) === true;

/**
 * What is wrong with the query string of a POST before its schema is checked: a JSON body carries its options
 * itself, and an Arrow body has no place for correlations, correlation_options or zones, which are answered in
 * JSON only (the schema would call them unknown fields, which says nothing of where they belong).
 */
const columnsQueryProblem = (headers: { "content-type"?: string }, query: object): ProblemError | undefined => {
  const names = Object.keys(query);
  if (!isArrowBody(headers)) {
    return names.length === 0
      ? undefined
      : new ProblemError("invalid-request", "Query parameters are the options of an Arrow body; a JSON body carries its options itself (units, null_value, limits, correlations, zones…).", [
          { field: "query", message: "leave the query string empty with a JSON body" },
        ]);
  }
  const jsonOnly = JSON_BODY_ONLY_FIELDS.filter((name) => names.includes(name));
  if (jsonOnly.length === 0) return undefined;
  return new ProblemError(
    "invalid-request",
    `Correlations and zones are answered in JSON only, and an Arrow body carries columns only: send the columns as a JSON body (Content-Type: application/json) with ${jsonOnly.join(", ")} among its fields. The query string of an Arrow body takes its units, null_value, keep_negative_poisson, vs_from, rho_from, fill and the plausibility limits.`,
    jsonOnly.map((name) => ({ field: `query.${name}`, message: "is a field of a JSON body, not an option of an Arrow body: correlations and zones are answered in JSON only" })),
  );
};

export default async function elasticRoutes(instance: FastifyInstance, options: ElasticRouteOptions): Promise<void> {
  const app = instance.withTypeProvider<ZodTypeProvider>();
  // Content-type parsers are encapsulated per plugin: here only JSON is accepted, anything else is a 415.
  app.removeAllContentTypeParsers();
  installRawBodyParser(app, [JSON_MEDIA_TYPE, ARROW_STREAM_MEDIA_TYPE]);

  app.get(
    "/v1/elastic",
    {
      schema: {
        tags: ["elastic"],
        summary: "Elastic properties of one sample (made for a one-line curl during log QC).",
        description: DESCRIPTION,
        querystring: elasticPointQuery,
        response: { 200: elasticPointResponse, ...commonProblemResponses },
      },
    },
    async (request) => {
      requireJsonAnswer(request.headers.accept);
      const query = request.query;
      const core = pointRequest(query);
      const log = computeElasticLog(core);
      app.elasticMetrics.recordConversion(log.length, summariseFlags(log.flags, log.invalidMask).flags);
      const ids = query.correlations === undefined ? undefined : correlationIdsOf(query.correlations);
      const derived = deriveProperties(log, { correlations: ids }, "query");
      const answer = pointAnswer(log, core, {
        velocity: query.velocity_unit,
        slowness: query.slowness_unit,
        density: query.density_unit,
        modulus: query.modulus_unit,
        impedance: query.impedance_unit,
      });
      return { ...answer, ...empiricalParts(gapFillAnswer(core), derived && derivedPointAnswer(derived)) };
    },
  );

  app.post(
    "/v1/elastic",
    {
      schema: {
        tags: ["elastic"],
        summary: "Elastic properties of many samples or intervals, as columns.",
        description: `${DESCRIPTION} Columns of equal length; the answer has one value per input row, in input order, nothing dropped.`,
        body: elasticColumnsBody,
        querystring: elasticArrowQuery,
        consumes: [JSON_MEDIA_TYPE, ARROW_STREAM_MEDIA_TYPE],
        response: {
          200: {
            description: "The columns, as JSON, or as an Arrow IPC stream when Accept asks for application/vnd.apache.arrow.stream.",
            content: {
              [JSON_MEDIA_TYPE]: { schema: elasticColumnsResponse },
              [ARROW_STREAM_MEDIA_TYPE]: {
                schema: z.string().meta({
                  description:
                    "Arrow IPC stream: depth/top/base echoed, every property as float64 (nulls where invalid, unit in field metadata elastilog.unit), and flags, a uint32 bit mask per sample; schema metadata elastilog.flag_bits maps bit to code, elastilog.flag_severity, elastilog.units, elastilog.limits, elastilog.summary, elastilog.version.",
                }),
              },
            },
          },
          ...commonProblemResponses,
        },
      },
      config: { accepts: [JSON_MEDIA_TYPE, ARROW_STREAM_MEDIA_TYPE] },
      // Before the query's schema, so that a JSON-only field in an Arrow request is told where it belongs.
      preValidation: (request, _reply, done) => done(columnsQueryProblem(request.headers, request.query as object)),
      // The body schema documents the contract; the body is validated with it in prepareColumnsAnswer, on a
      // worker thread when large, so a big body is parsed and checked off the event loop.
      validatorCompiler: ({ httpPart, schema }) => (httpPart === "body" ? (data: unknown) => ({ value: data }) : validatorCompiler({ schema } as never)),
    },
    async (request, reply) => {
      // A POST with no body at all never reaches the body parser: it is read as an empty body, and answered as one.
      const bytes = (request.body as unknown as Buffer | null | undefined) ?? Buffer.alloc(0);
      const format = negotiateMediaType(request.headers.accept, [JSON_MEDIA_TYPE, ARROW_STREAM_MEDIA_TYPE]);
      if (format === undefined) {
        throw new ProblemError("not-acceptable", `Accept "${request.headers.accept}" names no format this endpoint writes: application/json or ${ARROW_STREAM_MEDIA_TYPE}.`);
      }
      const arrow = isArrowBody(request.headers);
      const body: ColumnsBody = arrow ? { kind: "arrow", bytes, query: request.query } : { kind: "json", bytes };
      const answerFormat = format === ARROW_STREAM_MEDIA_TYPE ? "arrow" : "json";
      const answer =
        bytes.length <= INLINE_BODY_BYTES
          ? prepareColumnsAnswer(body, options.maxSamples, answerFormat)
          : await app.answerPool.prepare(body, options.maxSamples, answerFormat);
      app.elasticMetrics.recordConversion(answer.summary.count, answer.summary.flags);
      if (answer.kind === "arrow") {
        const pieces = answer.pieces.flatMap((piece) => [...socketSized(piece)]);
        // The type provider types reply bodies from the JSON schema; bytes are sent as they are.
        return reply.type(ARROW_STREAM_MEDIA_TYPE).send((pieces.length === 1 ? pieces[0] : Readable.from(pieces)) as unknown as string);
      }
      return sendAnswer(reply, answer, app.answerPool);
    },
  );
}
