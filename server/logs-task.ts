import { Readable } from "node:stream";
import { isInputIssues, isWellFileError, summariseFlags, type Zone } from "../core/index.js";
import { deriveProperties } from "./derived-request.js";
import { optionsFromQuery } from "./elastic-request.js";
import { splitAtColumns, type AnswerParts } from "./elastic-columns.js";
import { logsAnswer } from "./logs-answer.js";
import { ProblemError, unreadableFile, unusableData } from "./problems.js";
import type { LogsQuery } from "./schemas/logs.js";
import { convertWell } from "./well-conversion.js";
import { csvChunks, lasChunks, ndjsonChunks } from "./well-output.js";
import { readWellFile } from "./well-upload.js";

export type ZoneWithList = Zone & { correlations?: string[] };
export type LogsFormat = "json" | "csv" | "las" | "ndjson";

export interface LogsTask {
  /** The file's bytes as received. */
  chunks: Uint8Array[];
  query: LogsQuery;
  zones: ZoneWithList[] | undefined;
  format: LogsFormat;
  maxSamples: number;
}

export type LogsResult = { kind: "json"; answer: AnswerParts } | { kind: "text"; pieces: Uint8Array[]; summary: AnswerParts["summary"] };

/** Text chunks gathered into buffers of about 1 MiB, so a big file crosses between threads as a few transfers. */
const gather = (chunks: Iterable<string>): Uint8Array[] => {
  const pieces: Uint8Array[] = [];
  let pending: string[] = [];
  let size = 0;
  for (const chunk of chunks) {
    pending.push(chunk);
    size += chunk.length;
    if (size >= 1 << 20) {
      pieces.push(Buffer.from(pending.join(""), "utf8"));
      pending = [];
      size = 0;
    }
  }
  if (pending.length > 0) pieces.push(Buffer.from(pending.join(""), "utf8"));
  return pieces;
};

/**
 * `POST /v1/logs` from the file's bytes to the answer: read, detect curves, compute, derive, write.
 * Pure and thread-safe; runs on the event loop for small files and on a worker for large ones.
 * Every problem with the request is thrown as a ProblemError.
 */
export const convertLogs = async (task: LogsTask): Promise<LogsResult> => {
  const { query, zones, format } = task;
  try {
    const file = await readWellFile(Readable.from(task.chunks));
    const rows = file.table.columns[0]?.length ?? 0;
    if (rows > task.maxSamples) {
      throw new ProblemError("too-many-samples", `The file has ${rows} samples; at most ${task.maxSamples} are accepted in one request. Split the well.`);
    }
    const conversion = convertWell(file, {
      curves: { vp: query.vp_curve, vs: query.vs_curve, rho: query.rho_curve, depth: query.depth_curve },
      units: { vp: query.vp_unit, vs: query.vs_unit, rho: query.rho_unit, depth: query.depth_unit },
      nullValue: query.null_value,
      ...optionsFromQuery(query),
    });
    const { log } = conversion;
    const ids = query.correlations?.split(",").map((id) => id.trim()).filter((id) => id !== "");
    const derived = deriveProperties(log, { correlations: ids, zones, depth: conversion.depth }, "query");
    const summary = summariseFlags(log.flags, log.invalidMask);
    if (format === "json") return { kind: "json", answer: { ...splitAtColumns(logsAnswer(conversion, zones, derived)), summary } };
    if (zones !== undefined) {
      throw new ProblemError("invalid-request", "Zone statistics are part of the JSON answer: ask for format=json, or leave zones out for CSV, LAS and NDJSON.", [
        { field: "query.zones", message: `not available with format ${format}` },
      ]);
    }
    const writers = { csv: csvChunks, las: lasChunks, ndjson: ndjsonChunks };
    return { kind: "text", pieces: gather(writers[format](conversion, derived)), summary };
  } catch (error) {
    if (isWellFileError(error)) throw unreadableFile(error);
    if (isInputIssues(error)) throw unusableData(error.message, error.issues, "body");
    throw error;
  }
};
