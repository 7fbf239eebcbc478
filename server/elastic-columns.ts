import { randomUUID } from "node:crypto";
import type { z } from "zod";
import { computeElasticLog, isInputIssues, summariseFlags, type FlagSummary } from "../core/index.js";
import { decodeArrowColumns, encodeArrowAnswer } from "./arrow-codec.js";
import { deriveProperties } from "./derived-request.js";
import { answerExtras, columnsAnswer } from "./elastic-answer.js";
import { columnsRequest, intervalMidpoints } from "./elastic-request.js";
import { parseJsonBody } from "./json-text.js";
import { fieldPath, invalidFields, ProblemError, UNKNOWN_FIELD_MESSAGE, unusableData, type ProblemFieldError } from "./problems.js";
import { elasticColumnFields, elasticColumnsBody, type ElasticArrowQuery } from "./schemas/elastic.js";
import { limitFields } from "./schemas/limits.js";

/**
 * An answer split for serialising in parallel: `parts` is the answer's JSON text cut where each large
 * column goes (column i between parts i and i+1), so columns can be written on other threads and the
 * pieces sent one after the other without joining them.
 */
export interface AnswerParts {
  parts: string[];
  columns: Float64Array[];
  summary: FlagSummary;
}

/** A prepared answer of `POST /v1/elastic`: JSON cut at its columns, or a whole Arrow IPC stream. */
export type PreparedAnswer = ({ kind: "json" } & AnswerParts) | { kind: "arrow"; pieces: Uint8Array[]; summary: FlagSummary };

/** The body as sent: JSON text, or an Arrow IPC stream of columns with the other options in the query string. */
export type ColumnsBody = { kind: "json"; bytes: Uint8Array } | { kind: "arrow"; bytes: Uint8Array; query: ElasticArrowQuery };

/** An Arrow body's columns with its query options, in the shape of a JSON body, for the same validation. */
const bodyFromArrow = (bytes: Uint8Array, query: ElasticArrowQuery): unknown => {
  const { columns } = decodeArrowColumns(bytes);
  const units = Object.fromEntries(
    (["velocity", "slowness", "density", "modulus", "depth", "impedance"] as const)
      .map((unit) => [unit, query[`${unit}_unit`]])
      .filter(([, value]) => value !== undefined),
  );
  const limits = Object.fromEntries(Object.keys(limitFields).flatMap((key) => (query[key as keyof typeof limitFields] === undefined ? [] : [[key, query[key as keyof typeof limitFields]]])));
  return {
    ...columns,
    units,
    limits,
    ...(query.null_value !== undefined && { null_value: query.null_value }),
    ...(query.keep_negative_poisson !== undefined && { keep_negative_poisson: query.keep_negative_poisson }),
    ...(query.vs_from !== undefined && { vs_from: query.vs_from }),
    ...(query.rho_from !== undefined && { rho_from: query.rho_from }),
    ...(query.fill !== undefined && { fill: query.fill }),
  };
};

/** Zod's issues in the request's own field names, worded as the app's error handler words them. */
const fieldErrors = (error: z.ZodError): ProblemFieldError[] =>
  error.issues.flatMap((issue) => {
    const path = ["body", ...issue.path];
    return issue.code === "unrecognized_keys"
      ? issue.keys.map((key) => ({ field: fieldPath([...path, key]), message: UNKNOWN_FIELD_MESSAGE }))
      : [{ field: fieldPath(path), message: issue.message }];
  });

/** Every Float64Array reachable through plain objects (not arrays) of the answer, in JSON order. */
export const splitAtColumns = (answer: object): Pick<AnswerParts, "parts" | "columns"> => {
  const marker = randomUUID();
  const columns: Float64Array[] = [];
  const visit = (value: object) => {
    for (const child of Object.values(value)) {
      if (child instanceof Float64Array) {
        const index = columns.push(child) - 1;
        // JSON.stringify calls toJSON: the column is written as a marker string, replaced by its text later.
        Object.defineProperty(child, "toJSON", { value: () => `${marker}:${index}`, configurable: true });
      } else if (child !== null && typeof child === "object" && !Array.isArray(child)) visit(child);
    }
  };
  visit(answer);
  const parts = JSON.stringify(answer).split(new RegExp(`"${marker}:\\d+"`));
  return { parts, columns };
};

/**
 * `POST /v1/elastic` from the raw body to the answer: parse (secure JSON, or Arrow), validate with the route's
 * zod schema, compute, derive, and shape the answer as JSON parts or an Arrow stream. Pure and thread-safe:
 * it runs on the event loop for small bodies and on a worker thread for large ones. Throws ProblemError for
 * anything wrong with the request.
 */
export const prepareColumnsAnswer = (input: ColumnsBody, maxSamples: number, format: "json" | "arrow"): PreparedAnswer => {
  let raw: unknown;
  try {
    raw =
      input.kind === "json"
        ? parseJsonBody(input.bytes, elasticColumnFields)
        : bodyFromArrow(input.bytes, input.query);
  } catch (error) {
    if (isInputIssues(error)) throw unusableData(error.message, error.issues, "body");
    throw error;
  }
  const parsed = elasticColumnsBody.safeParse(raw);
  if (!parsed.success) throw invalidFields(fieldErrors(parsed.error));
  const body = parsed.data;
  const samples = [body.vp, body.dtc, body.rho].find((c) => c !== undefined)?.length ?? 0;
  if (samples > maxSamples) {
    throw new ProblemError(
      "too-many-samples",
      `The request has ${samples} samples; at most ${maxSamples} are accepted in one request. Split the well into several requests.`,
    );
  }
  try {
    const request = columnsRequest(body);
    const log = computeElasticLog(request.core);
    const depth = request.depth ?? (request.top && intervalMidpoints(request.top, request.base as Float64Array));
    const derived = deriveProperties(
      log,
      { correlations: body.correlations, options: body.correlation_options, zones: body.zones, depth, gapFillIds: [body.vs_from, body.rho_from] },
      "body",
    );
    if (format === "arrow") {
      if (derived || body.zones) {
        throw new ProblemError("not-acceptable", "Correlations and zones are answered in JSON only: ask for application/json, or leave them out for an Arrow answer.");
      }
      // Straight to Arrow: the JSON answer's list of flagged samples would be built for nothing.
      const summary = summariseFlags(log.flags, log.invalidMask);
      return { kind: "arrow", pieces: encodeArrowAnswer(log, request.core, body.units, request, summary), summary };
    }
    const answer = columnsAnswer(log, request.core, body.units, request);
    const full = { ...answer, ...answerExtras(log, request.core, body.zones, depth, derived) };
    return { kind: "json", ...splitAtColumns(full), summary: answer.summary };
  } catch (error) {
    if (isInputIssues(error)) throw unusableData(error.message, error.issues, "body");
    throw error;
  }
};
