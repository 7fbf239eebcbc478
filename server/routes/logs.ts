import { Readable } from "node:stream";
import multipart from "@fastify/multipart";
import { errorCodes, type FastifyInstance, type FastifyReply, type FastifyRequest } from "fastify";
import type { ZodTypeProvider } from "fastify-type-provider-zod";
import { z } from "zod";
import { RAW_FILE_TYPES } from "../schemas/logs.js";
import { checkZones, isInputIssues, type Zone } from "../../core/index.js";
import { convertLogs, type ZoneWithList } from "../logs-task.js";
import { sendAnswer } from "../answer-pool.js";
import { convertWellStream } from "../well-stream.js";
import { declaredEncoding } from "../well-upload.js";
import { negotiateMediaType } from "../media-negotiation.js";
import { fieldPath, invalidFields, isProblemError, PROBLEM_MEDIA_TYPE, ProblemError } from "../problems.js";
import { parseJsonText } from "../json-text.js";
import { logsJsonResponse, logsQuery, type LogsQuery } from "../schemas/logs.js";
import { commonProblemResponses, problemSchema } from "../schemas/problem.js";
import { parseZonesText, zoneList } from "../schemas/zones.js";

export interface LogsRouteOptions {
  fileBodyLimitBytes: number;
  maxSamples: number;
}

/** Content types curl and scripts send a raw file with; the body is read as a stream, whatever the label. */

const MEDIA_TYPES = { json: "application/json", csv: "text/csv", las: "application/x-las", ndjson: "application/x-ndjson" } as const;
const CONTENT_TYPES: Record<Exclude<Format, "json">, string> = {
  csv: "text/csv; charset=utf-8; header=present",
  las: "application/x-las; charset=utf-8",
  ndjson: "application/x-ndjson; charset=utf-8",
};
type Format = keyof typeof MEDIA_TYPES;


const chooseFormat = (query: LogsQuery, accept: string | undefined): Format => {
  if (query.format !== undefined) return query.format;
  const chosen = negotiateMediaType(accept, Object.values(MEDIA_TYPES));
  if (chosen === undefined) {
    throw new ProblemError("not-acceptable", `Accept "${accept}" names no format this endpoint writes: application/json, text/csv, application/x-las or application/x-ndjson (or use format=json|csv|las|ndjson).`);
  }
  return (Object.keys(MEDIA_TYPES) as Format[]).find((format) => MEDIA_TYPES[format] === chosen) as Format;
};

const zonesFromQuery = (text: string | undefined): Zone[] | undefined => {
  if (text === undefined) return undefined;
  const parsed = parseZonesText(text);
  if ("error" in parsed) throw new ProblemError("invalid-request", `zones: ${parsed.error}.`, [{ field: "query.zones", message: parsed.error }]);
  // Limits are checked here, so that a problem names the query, where these zones came from.
  try {
    checkZones(parsed.zones);
  } catch (error) {
    if (!isInputIssues(error)) throw error;
    throw invalidFields(error.issues.map((issue) => ({ field: `query.${issue.field}`, message: issue.message })));
  }
  return parsed.zones;
};

/** What Windows editors put before a UTF-8 file's text; a JSON parser may ignore it (RFC 8259 §8.1). */
const BYTE_ORDER_MARK = "\uFEFF";
const ZONES_SHAPE = "expected a JSON array of {name, top, base}";

/** A zones part, read as a JSON body is: a syntax error by line and column, a name given twice refused. */
const zonesFromPart = (value: unknown): ZoneWithList[] => {
  const sent = String(value);
  const text = sent.startsWith(BYTE_ORDER_MARK) ? sent.slice(1) : sent;
  if (text.trim() === "") {
    throw new ProblemError("invalid-request", "The zones part is empty: send a JSON array of {name, top, base}, or leave the part out.", [
      { field: "body.zones", message: `is empty; ${ZONES_SHAPE}` },
    ]);
  }
  let json: unknown;
  try {
    json = parseJsonText(text);
  } catch (error) {
    if (isInputIssues(error)) {
      // Paths of names given twice start at the part's own value (`[0].name`).
      throw invalidFields(error.issues.map((issue) => ({ field: `body.zones${issue.field.startsWith("[") ? "" : "."}${issue.field}`, message: issue.message })));
    }
    if (!isProblemError(error)) throw error;
    throw new ProblemError(error.slug, `In the zones part: ${error.detail}`, [{ field: "body.zones", message: ZONES_SHAPE }]);
  }
  const result = zoneList.safeParse(json);
  if (!result.success) {
    throw new ProblemError(
      "invalid-request",
      "The zones part is not a list of {name, top, base}.",
      result.error.issues.map((issue) => ({
        field: fieldPath(["body", "zones", ...issue.path]),
        message: issue.message,
      })),
    );
  }
  return result.data;
};

/** busboy's own errors (no boundary, a body cut before its closing boundary) are a malformed request, not a fault. */
const multipartProblem = (error: unknown): unknown => {
  const status = (error as { statusCode?: number }).statusCode;
  if (error instanceof ProblemError || (status !== undefined && status < 500)) return error;
  return new ProblemError(
    "malformed-body",
    `The multipart/form-data body could not be read (${(error as Error).message.replace(/\.$/, "")}): let the client write the body and its Content-Type with the boundary, as curl -F file=@well.las does, or send the file itself as the body.`,
  );
};

/** What a multipart upload may hold, as said by both readers of it (with zones for JSON, as a stream otherwise). */
const UPLOAD_PROBLEMS = {
  unknownField: (name: string) =>
    new ProblemError(
      "invalid-request",
      name === "file"
        ? 'The well file came as a plain form field, not as a file part: send it with a filename, as curl -F file=@well.las does (the @ makes it a file part).'
        : `Unknown form field "${name}": send one file part and optionally a zones part.`,
    ),
  severalFiles: () => new ProblemError("invalid-request", "Send one well file per request; this upload has several file parts."),
  noFile: () => new ProblemError("invalid-request", "The multipart upload has no file part: use curl -F file=@well.las."),
  fileTooLarge: (byteLimit: number) =>
    new ProblemError("body-too-large", `The file part is larger than this endpoint's limit of ${byteLimit} bytes. Split the well, or ask the operator to raise FILE_BODY_LIMIT_BYTES.`),
};

const ZONES_NEED_JSON = "Zone statistics are part of the JSON answer: ask for format=json, or leave zones out for CSV, LAS and NDJSON.";

/** The well file and zones of a multipart upload: exactly one file part, optionally a `zones` part. */
const readMultipart = async (request: FastifyRequest, byteLimit: number): Promise<{ chunks: Buffer[]; zones?: ZoneWithList[] }> => {
  try {
    return await readMultipartParts(request, byteLimit);
  } catch (error) {
    throw multipartProblem(error);
  }
};

/** The bytes of the one file part of a multipart upload as they arrive, for an answer without zones. */
async function* multipartFile(request: FastifyRequest, byteLimit: number): AsyncGenerator<Buffer> {
  let seen = false;
  try {
    for await (const part of request.parts()) {
      if (part.fieldname === "zones") {
        throw new ProblemError("invalid-request", ZONES_NEED_JSON, [{ field: "body.zones", message: "zones need format=json" }]);
      }
      if (part.type !== "file") throw UPLOAD_PROBLEMS.unknownField(part.fieldname);
      if (seen) throw UPLOAD_PROBLEMS.severalFiles();
      seen = true;
      for await (const chunk of part.file) yield chunk as Buffer;
      if (part.file.truncated) throw UPLOAD_PROBLEMS.fileTooLarge(byteLimit);
    }
  } catch (error) {
    throw multipartProblem(error);
  }
  if (!seen) throw UPLOAD_PROBLEMS.noFile();
}

/**
 * Output held before the answer starts: a problem found in the file within it still gets its 422 answer. Beyond it
 * the answer is streamed, and a problem found later can only cut the answer short (the client sees an incomplete
 * transfer, and the service logs why).
 */
export const HELD_ANSWER_BYTES = 8 * 1024 * 1024;

const streamAnswer = async (request: FastifyRequest, reply: FastifyReply, pieces: AsyncGenerator<Buffer>, contentType: string) => {
  const head: Buffer[] = [];
  let size = 0;
  while (size < HELD_ANSWER_BYTES) {
    const next = await pieces.next();
    if (next.done) return reply.type(contentType).send(Buffer.concat(head));
    head.push(next.value);
    size += next.value.length;
  }
  async function* rest(): AsyncGenerator<Buffer> {
    while (head.length > 0) yield head.shift() as Buffer;
    try {
      yield* pieces;
    } catch (error) {
      const problem = error instanceof ProblemError ? { slug: error.slug, detail: error.detail } : undefined;
      // The response is destroyed, so no "request completed" line follows: this line says what that one would.
      request.log.warn(
        { method: request.method, url: request.url, status: reply.statusCode, ms: Math.round(reply.elapsedTime * 10) / 10, problem },
        "answer cut short: the file failed after streaming had begun",
      );
      request.server.elasticMetrics.recordCutShort(request.routeOptions.url ?? request.url);
      throw error;
    }
  }
  // The type provider types reply bodies from the JSON schema; a stream of text is sent as it is.
  return reply.type(contentType).send(Readable.from(rest()) as unknown as string);
};

const readMultipartParts = async (request: FastifyRequest, byteLimit: number): Promise<{ chunks: Buffer[]; zones?: ZoneWithList[] }> => {
  let file: Buffer[] | undefined;
  let zones: ZoneWithList[] | undefined;
  for await (const part of request.parts()) {
    if (part.type === "file" && part.fieldname === "zones") {
      zones = zonesFromPart((await part.toBuffer()).toString("utf8"));
    } else if (part.type === "file") {
      if (file !== undefined) throw UPLOAD_PROBLEMS.severalFiles();
      file = await readBytes(part.file, byteLimit);
      if (part.file.truncated) throw UPLOAD_PROBLEMS.fileTooLarge(byteLimit);
    } else if (part.fieldname === "zones") {
      zones = zonesFromPart(part.value);
    } else {
      throw UPLOAD_PROBLEMS.unknownField(part.fieldname);
    }
  }
  if (file === undefined) throw UPLOAD_PROBLEMS.noFile();
  return { chunks: file, zones };
};

/**
 * The request's body as the content-type parser left it; a POST with no body at all (no Content-Length, no
 * Transfer-Encoding) never reaches a parser, and is read as an empty file, which is answered as one.
 */
const bodyStream = (body: unknown): Readable => (body instanceof Readable ? body : Readable.from([]));

/** The bytes of a body or file part, refusing more than `byteLimit` (413) without reading further. */
const readBytes = async (stream: Readable, byteLimit: number): Promise<Buffer[]> => {
  const chunks: Buffer[] = [];
  let bytes = 0;
  for await (const chunk of stream) {
    bytes += (chunk as Buffer).length;
    if (bytes > byteLimit) {
      stream.destroy();
      throw new ProblemError(
        "body-too-large",
        `The file is larger than this endpoint's limit of ${byteLimit} bytes. Split the well, or ask the operator to raise FILE_BODY_LIMIT_BYTES.`,
      );
    }
    chunks.push(chunk as Buffer);
  }
  return chunks;
};

/** Files up to this size are converted on the event loop; larger ones on a worker thread. */
const INLINE_FILE_BYTES = 1024 * 1024;

export default async function logsRoutes(instance: FastifyInstance, options: LogsRouteOptions): Promise<void> {
  const app = instance.withTypeProvider<ZodTypeProvider>();
  app.removeAllContentTypeParsers();
  app.addContentTypeParser(RAW_FILE_TYPES, (_request, payload, done) => done(null, payload));
  // A body sent without any Content-Type (a script posting a file's bytes as they are) is the file too;
  // a Content-Type that names something else stays a 415.
  app.addContentTypeParser("*", (request, payload, done) => {
    if (request.headers["content-type"] === undefined) done(null, payload);
    else done(new errorCodes.FST_ERR_CTP_INVALID_MEDIA_TYPE(), undefined);
  });
  await app.register(multipart, {
    // Two files at most: the well, and the zones sent as a file (curl -F zones=@zones.json).
    limits: { fileSize: options.fileBodyLimitBytes, files: 2, fields: 4, parts: 6 },
  });

  app.post(
    "/v1/logs",
    {
      config: { accepts: [...RAW_FILE_TYPES, "multipart/form-data"] },
      schema: {
        tags: ["wells"],
        summary: "Convert a whole well: a LAS 2.0 or CSV file in, JSON, CSV or LAS out.",
        description: [
          "The body is the file itself (LAS 2.0 of the CWLS, or RFC 4180 CSV with a header row such as DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]),",
          "sent with any of the content types " + RAW_FILE_TYPES.join(", ") + ", or as the file part of a multipart/form-data upload.",
          "The format is recognised from the content (a LAS file begins with ~V after optional # comments).",
          "Text is UTF-8 unless the content type declares charset= (UTF-8, US-ASCII, ISO-8859-1, Windows-1252); a file whose first bytes are not UTF-8 is read as Windows-1252, with a warning.",
          "Curves are detected from common mnemonics and units unless named; units are read from the file unless overridden.",
          "Every input row gives one output row, in input order. JSON answers add header facts, the curve mapping, warnings and zone statistics.",
          "Dynamic (log-derived) moduli are estimates, to be calibrated against core tests before engineering use.",
        ].join(" "),
        querystring: logsQuery,
        consumes: [...RAW_FILE_TYPES, "multipart/form-data"],
        response: {
          200: {
            description: "The converted well.",
            content: {
              "application/json": { schema: logsJsonResponse },
              "text/csv": { schema: z.string().meta({ description: "RFC 4180 CSV: the input columns, then EL_* computed columns and the EL_QC flag bit mask, header NAME[unit]." }) },
              "application/x-las": { schema: z.string().meta({ description: "LAS 2.0: the input header and curves kept, EL_* curves appended, options in ~Parameter, EL_QC bits in ~Other." }) },
              "application/x-ndjson": { schema: z.string().meta({ description: "One JSON object per sample and line: index, depth, every property (null where invalid), derived estimates by id, and flags (codes)." }) },
            },
          },
          ...commonProblemResponses,
          422: { description: "The file cannot be read (the line is named) or its curves cannot be used as asked.", content: { [PROBLEM_MEDIA_TYPE]: { schema: problemSchema } } },
        },
      },
    },
    async (request, reply) => {
      const query = request.query;
      const format = chooseFormat(query, request.headers.accept);
      // A multipart upload's file part is read as UTF-8, or as Windows-1252 when its first bytes are not UTF-8.
      const encoding = request.isMultipart() ? undefined : declaredEncoding(request.headers["content-type"]);
      let zones: ZoneWithList[] | undefined = zonesFromQuery(query.zones);
      if (query.digits !== undefined && (format === "json" || format === "ndjson")) {
        throw new ProblemError("invalid-request", `digits sets how CSV and LAS answers write computed values; ${format.toUpperCase()} answers always carry full doubles.`, [
          { field: "query.digits", message: `not available with format ${format}` },
        ]);
      }
      if (format !== "json") {
        if (zones !== undefined) throw new ProblemError("invalid-request", ZONES_NEED_JSON, [{ field: "query.zones", message: `not available with format ${format}` }]);
        const source = request.isMultipart() ? multipartFile(request, options.fileBodyLimitBytes) : bodyStream(request.body);
        const task = { query, format, maxSamples: options.maxSamples, byteLimit: options.fileBodyLimitBytes, encoding };
        const pieces = convertWellStream(source, task, (summary) => app.elasticMetrics.recordConversion(summary.count, summary.flags));
        return streamAnswer(request, reply, pieces, CONTENT_TYPES[format]);
      }
      let chunks: Buffer[];
      if (request.isMultipart()) {
        const upload = await readMultipart(request, options.fileBodyLimitBytes);
        chunks = upload.chunks;
        if (upload.zones !== undefined && zones !== undefined) {
          throw new ProblemError("invalid-request", "Zones are given twice, in the query string and as a zones part of the upload: send them one way only.", [
            { field: "query.zones", message: "leave it out when the upload has a zones part, or drop the part" },
          ]);
        }
        zones = upload.zones ?? zones;
      } else {
        chunks = await readBytes(bodyStream(request.body), options.fileBodyLimitBytes);
      }
      const task = { chunks, query, zones, maxSamples: options.maxSamples, encoding };
      const bytes = chunks.reduce((sum, chunk) => sum + chunk.length, 0);
      const answer = bytes <= INLINE_FILE_BYTES ? await convertLogs(task) : await app.answerPool.logs(task);
      app.elasticMetrics.recordConversion(answer.summary.count, answer.summary.flags);
      return sendAnswer(reply, answer, app.answerPool);
    },
  );
}
