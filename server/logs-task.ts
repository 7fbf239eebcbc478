import { isInputIssues, isWellFileError, summariseFlags, type Zone } from "../core/index.js";
import { deriveProperties } from "./derived-request.js";
import { optionsFromQuery } from "./elastic-request.js";
import { splitAtColumns, type AnswerParts } from "./elastic-columns.js";
import { logsAnswer } from "./logs-answer.js";
import { ProblemError, unreadableFile, unusableData } from "./problems.js";
import { correlationIdsOf } from "./schemas/correlations.js";
import type { LogsQuery } from "./schemas/logs.js";
import { convertWell, type ConversionOptions } from "./well-conversion.js";
import { readWellFile, type FileEncoding } from "./well-upload.js";

export type ZoneWithList = Zone & { correlations?: string[] };

export interface LogsTask {
  /** The file's bytes as received. */
  chunks: Uint8Array[];
  query: LogsQuery;
  zones: ZoneWithList[] | undefined;
  maxSamples: number;
  /** The encoding the request declared (`charset=`); undefined: found from the bytes. */
  encoding?: FileEncoding;
}

export type LogsResult = AnswerParts;

/** The options of a file conversion, from the query. */
export const conversionOptions = (query: LogsQuery): ConversionOptions => ({
  curves: { vp: query.vp_curve, vs: query.vs_curve, rho: query.rho_curve, depth: query.depth_curve },
  units: { vp: query.vp_unit, vs: query.vs_unit, rho: query.rho_unit, depth: query.depth_unit },
  nullValue: query.null_value,
  ...optionsFromQuery(query),
});

/** The correlation ids of `correlations=` (validated by its schema: no empty or repeated entry). */
export const correlationIds = (query: LogsQuery): string[] | undefined => (query.correlations === undefined ? undefined : correlationIdsOf(query.correlations));

/**
 * `POST /v1/logs` with a JSON answer, from the file's bytes: read, detect curves, compute, derive, summarise zones.
 * Pure and thread-safe; runs on the event loop for small files and on a worker for large ones. CSV, LAS and NDJSON
 * answers are streamed instead (`server/well-stream.ts`). Every problem with the request is thrown as a ProblemError.
 */
export const convertLogs = async (task: LogsTask): Promise<LogsResult> => {
  const { query, zones } = task;
  try {
    const file = await readWellFile(task.chunks, { encoding: task.encoding, nullValue: query.null_value });
    const rows = file.table.columns[0]?.length ?? 0;
    if (rows > task.maxSamples) {
      throw new ProblemError("too-many-samples", `The file has ${rows} samples; at most ${task.maxSamples} are accepted in one request. Split the well.`);
    }
    const conversion = convertWell(file, conversionOptions(query));
    const { log } = conversion;
    const derived = deriveProperties(log, { correlations: correlationIds(query), zones, depth: conversion.depth }, "query");
    const summary = summariseFlags(log.flags, log.invalidMask);
    return { ...splitAtColumns(logsAnswer(conversion, zones, derived)), summary };
  } catch (error) {
    throw asFileProblem(error);
  }
};

/** What core throws while a file is read and converted, as the problem it is for the client; anything else as it is. */
export const asFileProblem = (error: unknown): unknown => {
  if (isWellFileError(error)) return unreadableFile(error);
  if (isInputIssues(error)) return unusableData(error.message, error.issues, "body");
  return error;
};
