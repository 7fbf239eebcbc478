import { Readable } from "node:stream";
import multipart from "@fastify/multipart";
import type { FastifyInstance, FastifyRequest } from "fastify";
import type { ZodTypeProvider } from "fastify-type-provider-zod";
import { z } from "zod";
import { summariseFlags, withDefaultLimits, type Zone } from "../../core/index.js";
import { gapFills } from "../derived-answer.js";
import { deriveProperties } from "../derived-request.js";
import { logsAnswer } from "../logs-answer.js";
import { sendAnswer } from "../answer-pool.js";
import { splitAtColumns } from "../elastic-columns.js";
import { negotiateMediaType } from "../media-negotiation.js";
import { PROBLEM_MEDIA_TYPE, ProblemError } from "../problems.js";
import { toPlausibilityLimits } from "../schemas/limits.js";
import { logsJsonResponse, logsQuery, type LogsQuery } from "../schemas/logs.js";
import { commonProblemResponses, problemSchema } from "../schemas/problem.js";
import { parseZonesText, zoneList } from "../schemas/zones.js";
import { convertWell, type WellConversion } from "../well-conversion.js";
import { csvChunks, lasChunks } from "../well-output.js";
import { readWellFile, type WellFile } from "../well-upload.js";

export interface LogsRouteOptions {
  fileBodyLimitBytes: number;
  maxSamples: number;
}

/** Content types curl and scripts send a raw file with; the body is read as a stream, whatever the label. */
export const RAW_FILE_TYPES = ["text/plain", "text/csv", "application/octet-stream", "application/x-www-form-urlencoded", "application/x-las"];

const MEDIA_TYPES = { json: "application/json", csv: "text/csv", las: "application/x-las" } as const;
type Format = keyof typeof MEDIA_TYPES;
type ZoneWithList = Zone & { correlations?: string[] };

const chooseFormat = (query: LogsQuery, accept: string | undefined): Format => {
  if (query.format !== undefined) return query.format;
  const chosen = negotiateMediaType(accept, Object.values(MEDIA_TYPES));
  if (chosen === undefined) {
    throw new ProblemError("not-acceptable", `Accept "${accept}" names no format this endpoint writes: application/json, text/csv or application/x-las (or use format=json|csv|las).`);
  }
  return (Object.keys(MEDIA_TYPES) as Format[]).find((format) => MEDIA_TYPES[format] === chosen) as Format;
};

const zonesFromQuery = (text: string | undefined): Zone[] | undefined => {
  if (text === undefined) return undefined;
  const parsed = parseZonesText(text);
  if ("error" in parsed) throw new ProblemError("invalid-request", `zones: ${parsed.error}.`, [{ field: "query.zones", message: parsed.error }]);
  return parsed.zones;
};

const zonesFromPart = (value: unknown): ZoneWithList[] => {
  let json: unknown;
  try {
    json = JSON.parse(String(value));
  } catch {
    throw new ProblemError("invalid-request", "The zones part is not JSON.", [{ field: "body.zones", message: "expected a JSON array of {name, top, base}" }]);
  }
  const result = zoneList.safeParse(json);
  if (!result.success) {
    throw new ProblemError(
      "invalid-request",
      "The zones part is not a list of {name, top, base}.",
      result.error.issues.map((issue) => ({ field: ["body", "zones", ...issue.path].join("."), message: issue.message })),
    );
  }
  return result.data;
};

/** The well file and zones of a multipart upload: exactly one file part, optionally a `zones` part. */
const readMultipart = async (request: FastifyRequest, byteLimit: number): Promise<{ file: WellFile; zones?: ZoneWithList[] }> => {
  let file: WellFile | undefined;
  let zones: ZoneWithList[] | undefined;
  for await (const part of request.parts()) {
    if (part.type === "file" && part.fieldname === "zones") {
      zones = zonesFromPart((await part.toBuffer()).toString("utf8"));
    } else if (part.type === "file") {
      if (file !== undefined) throw new ProblemError("invalid-request", "Send one well file per request; this upload has several file parts.");
      file = await readWellFile(part.file, byteLimit);
      if (part.file.truncated) throw new ProblemError("body-too-large", `The file part is larger than the limit of ${byteLimit} bytes.`);
    } else if (part.fieldname === "zones") {
      zones = zonesFromPart(part.value);
    } else {
      throw new ProblemError("invalid-request", `Unknown form field "${part.fieldname}": send one file part and optionally a zones part.`);
    }
  }
  if (file === undefined) throw new ProblemError("invalid-request", "The multipart upload has no file part: use curl -F file=@well.las.");
  return { file, zones };
};

export default async function logsRoutes(instance: FastifyInstance, options: LogsRouteOptions): Promise<void> {
  const app = instance.withTypeProvider<ZodTypeProvider>();
  app.removeAllContentTypeParsers();
  app.addContentTypeParser(RAW_FILE_TYPES, (_request, payload, done) => done(null, payload));
  await app.register(multipart, {
    // Two files at most: the well, and the zones sent as a file (curl -F zones=@zones.json).
    limits: { fileSize: options.fileBodyLimitBytes, files: 2, fields: 4, parts: 6 },
  });

  app.post(
    "/v1/logs",
    {
      schema: {
        tags: ["wells"],
        summary: "Convert a whole well: a LAS 2.0 or CSV file in, JSON, CSV or LAS out.",
        description: [
          "The body is the file itself (LAS 2.0 of the CWLS, or RFC 4180 CSV with a header row such as DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]),",
          "sent with any of the content types " + RAW_FILE_TYPES.join(", ") + ", or as the file part of a multipart/form-data upload.",
          "The format is recognised from the content (a LAS file begins with ~V after optional # comments).",
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
      let zones: ZoneWithList[] | undefined = zonesFromQuery(query.zones);
      let file: WellFile;
      if (request.isMultipart()) {
        const upload = await readMultipart(request, options.fileBodyLimitBytes);
        file = upload.file;
        zones = upload.zones ?? zones;
      } else {
        file = await readWellFile(request.body as Readable, options.fileBodyLimitBytes);
      }
      const rows = file.table.columns[0]?.length ?? 0;
      if (rows > options.maxSamples) {
        throw new ProblemError("too-many-samples", `The file has ${rows} samples; at most ${options.maxSamples} are accepted in one request. Split the well.`);
      }
      const conversion: WellConversion = convertWell(file, {
        curves: { vp: query.vp_curve, vs: query.vs_curve, rho: query.rho_curve, depth: query.depth_curve },
        units: { vp: query.vp_unit, vs: query.vs_unit, rho: query.rho_unit, depth: query.depth_unit },
        nullValue: query.null_value,
        keepNegativePoisson: query.keep_negative_poisson,
        limits: withDefaultLimits(toPlausibilityLimits(query)),
        modulusUnit: query.modulus_unit,
        velocityUnit: query.velocity_unit,
        impedanceUnit: query.impedance_unit,
        ...gapFills(query, "query"),
      });
      const { log } = conversion;
      const ids = query.correlations?.split(",").map((id) => id.trim()).filter((id) => id !== "");
      const derived = deriveProperties(conversion.log, { correlations: ids, zones, depth: conversion.depth }, "query");
      const summary = summariseFlags(log.flags, log.invalidMask);
      app.elasticMetrics.recordConversion(summary.count, summary.flags);
      if (format === "json") {
        return sendAnswer(reply, { ...splitAtColumns(logsAnswer(conversion, zones, derived)), summary }, app.answerPool);
      }
      if (zones !== undefined) {
        throw new ProblemError("invalid-request", "Zone statistics are part of the JSON answer: ask for format=json, or leave zones out for CSV and LAS.", [
          { field: "query.zones", message: `not available with format ${format}` },
        ]);
      }
      const chunks = Readable.from(format === "csv" ? csvChunks(conversion, derived) : lasChunks(conversion, derived));
      // The type provider types reply bodies from the JSON schema; a stream of text is sent as it is.
      return reply.type(format === "csv" ? "text/csv; charset=utf-8; header=present" : "application/x-las; charset=utf-8").send(chunks as unknown as string);
    },
  );
}
